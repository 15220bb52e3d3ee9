using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>Models run in-process: LLamaSharp's sampling pipeline and ONNX Runtime GenAI's search options.</summary>
    internal static class LocalRuntimeSurfaces
    {
        public static SurfaceDefinition[] All() => new[]
        {
            new SurfaceDefinition("LLama.Sampling.DefaultSamplingPipeline", Providers.LLamaSharp) { ResponseFormatMember = "Grammar" }
                .OpenAIShape()
                .Map("TopK", Setting.TopK)
                .Map("MinP", Setting.MinP)
                .Map("Seed", Setting.Seed)
                .Map("RepeatPenalty", Setting.RepetitionPenalty)
                .Sends("LLama.Batched.ConversationExtensions", "Sample"),
            new SurfaceDefinition("LLama.Common.InferenceParams", Providers.LLamaSharp)
                .Nested("SamplingPipeline", "LLama.Sampling.DefaultSamplingPipeline")
                .Sends("LLama.Abstractions.ILLamaExecutor", "InferAsync")
                .Sends("LLama.ChatSession", "ChatAsync", "RegenerateAssistantMessageAsync"),
            // Everything goes through string keys; these are the ones the managed assembly itself uses.
            new SurfaceDefinition("Microsoft.ML.OnnxRuntimeGenAI.GeneratorParams", Providers.OnnxGenAI) { KeyedMethod = "SetSearchOption", ShapeMethod = "SetGuidance" }
                .TradeNameKeys(Setting.Temperature, Setting.TopP, Setting.TopK, Setting.RepetitionPenalty, Setting.DoSample)
                .Key("random_seed", Setting.Seed)
                .Sends("Microsoft.ML.OnnxRuntimeGenAI.Generator", SendSite.Constructor),
        };
    }
}
