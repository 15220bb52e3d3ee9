using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>Semantic Kernel execution settings: typed OpenAI settings and the string-keyed ExtensionData.</summary>
    internal static class SemanticKernelSurfaces
    {
        public static SurfaceDefinition[] All() => new[]
        {
            WithExtensionData(new SurfaceDefinition("Microsoft.SemanticKernel.PromptExecutionSettings", Providers.Generic) { ModelMember = "ModelId" })
                .Sends("Microsoft.SemanticKernel.ChatCompletion.IChatCompletionService", "GetChatMessageContentsAsync", "GetStreamingChatMessageContentsAsync")
                .Sends("Microsoft.SemanticKernel.ChatCompletion.ChatCompletionServiceExtensions", "GetChatMessageContentAsync", "GetStreamingChatMessageContentsAsync")
                .Sends("Microsoft.SemanticKernel.TextGeneration.ITextGenerationService", "GetTextContentsAsync", "GetStreamingTextContentsAsync")
                .Sends("Microsoft.SemanticKernel.TextGeneration.TextGenerationExtensions", "GetTextContentAsync")
                // The kernel route: settings ride in KernelArguments (a carrier the value flow follows) or in a prompt function.
                .Sends("Microsoft.SemanticKernel.KernelExtensions", "InvokePromptAsync", "InvokePromptStreamingAsync", "CreateFunctionFromPrompt")
                .Sends("Microsoft.SemanticKernel.Kernel", "InvokeAsync", "InvokeStreamingAsync")
                .Sends("Microsoft.SemanticKernel.KernelFunction", "InvokeAsync", "InvokeStreamingAsync")
                .Sends("Microsoft.SemanticKernel.KernelFunctionFactory", "CreateFromPrompt"),
            WithExtensionData(new SurfaceDefinition("Microsoft.SemanticKernel.Connectors.OpenAI.OpenAIPromptExecutionSettings", Providers.OpenAI)
                {
                    ModelMember = "ModelId",
                    ResponseFormatMember = "ResponseFormat",
                }
                .OpenAIShape()
                .Map("Seed", Setting.Seed)
                .Mode("ReasoningEffort", Modes.ReasoningEffort)),
        };

        // Keys SK's ToChatOptions reads from ExtensionData, case-insensitively.
        private static SurfaceDefinition WithExtensionData(SurfaceDefinition surface)
        {
            surface.BagMember = "ExtensionData";
            return surface.TradeNameKeys(Setting.Temperature, Setting.TopP, Setting.TopK, Setting.Seed, Setting.FrequencyPenalty, Setting.PresencePenalty);
        }
    }
}
