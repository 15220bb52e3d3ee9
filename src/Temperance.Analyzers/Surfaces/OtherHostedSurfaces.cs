using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>Azure.AI.Inference, Betalgo.Ranul.OpenAI and Anthropic.</summary>
    internal static class OtherHostedSurfaces
    {
        public static SurfaceDefinition[] All() => new[]
        {
            // Azure AI model inference spells top-p NucleusSamplingFactor.
            new SurfaceDefinition("Azure.AI.Inference.ChatCompletionsOptions", Providers.AzureInference) { ModelMember = "Model", ResponseFormatMember = "ResponseFormat" }
                .OpenAIShape("NucleusSamplingFactor")
                .Map("Seed", Setting.Seed)
                .Sends("Azure.AI.Inference.ChatCompletionsClient", "Complete", "CompleteAsync", "CompleteStreaming", "CompleteStreamingAsync"),
            // Betalgo speaks the OpenAI wire format, including n (candidate count).
            new SurfaceDefinition("Betalgo.Ranul.OpenAI.ObjectModels.RequestModels.ChatCompletionCreateRequest", Providers.OpenAI) { ModelMember = "Model", ResponseFormatMember = "ResponseFormat" }
                .OpenAIShape()
                .Map("Seed", Setting.Seed)
                .Map("N", Setting.Candidates)
                .Mode("ReasoningEffort", Modes.ReasoningEffort)
                .Sends("Betalgo.Ranul.OpenAI.Interfaces.IChatCompletionService", "CreateCompletion", "CreateCompletionAsStream")
                .Sends("Betalgo.Ranul.OpenAI.Interfaces.IChatCompletionServiceExtension", "Create"),
            // Anthropic 13.x has no sampling members (an empty member map); the request is still recognised (model, structured output).
            new SurfaceDefinition("Anthropic.Models.Messages.MessageCreateParams", Providers.Anthropic) { ModelMember = "Model", ResponseFormatMember = "OutputConfig" }
                .Sends("Anthropic.Services.IMessageService", "Create", "CreateStreaming"),
            new SurfaceDefinition("Anthropic.Models.Beta.Messages.MessageCreateParams", Providers.Anthropic) { ModelMember = "Model", ResponseFormatMember = "OutputConfig" }
                .Sends("Anthropic.Services.Beta.IMessageService", "Create", "CreateStreaming"),
        };
    }
}
