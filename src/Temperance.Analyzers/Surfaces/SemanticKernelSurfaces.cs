using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>Semantic Kernel execution settings: typed OpenAI settings and the string-keyed ExtensionData.</summary>
    internal static class SemanticKernelSurfaces
    {
        public static SurfaceDefinition[] All() => new[]
        {
            WithExtensionData(new SurfaceDefinition("Microsoft.SemanticKernel.PromptExecutionSettings", Providers.Generic) { ModelMember = "ModelId" }),
            WithExtensionData(new SurfaceDefinition("Microsoft.SemanticKernel.Connectors.OpenAI.OpenAIPromptExecutionSettings", Providers.OpenAI)
                {
                    ModelMember = "ModelId",
                    ResponseFormatMember = "ResponseFormat",
                }
                .OpenAIShape()
                .Map("Seed", Setting.Seed)),
        };

        // Keys SK's ToChatOptions reads from ExtensionData, case-insensitively.
        private static SurfaceDefinition WithExtensionData(SurfaceDefinition surface)
        {
            surface.BagMember = "ExtensionData";
            return surface
                .Key("temperature", Setting.Temperature)
                .Key("top_p", Setting.TopP)
                .Key("top_k", Setting.TopK)
                .Key("seed", Setting.Seed)
                .Key("frequency_penalty", Setting.FrequencyPenalty)
                .Key("presence_penalty", Setting.PresencePenalty);
        }
    }
}
