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
                .Key("temperature", Setting.Temperature)
                .Key("top_p", Setting.TopP)
                .Key("top_k", Setting.TopK)
                .Key("random_seed", Setting.Seed)
                .Key("repetition_penalty", Setting.RepetitionPenalty)
                .Key("do_sample", Setting.DoSample)
                .Sends("Microsoft.ML.OnnxRuntimeGenAI.Generator", SendSite.Constructor),
        };
    }
}
