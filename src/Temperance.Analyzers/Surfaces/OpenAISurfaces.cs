using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>OpenAI 2.x (and Azure.AI.OpenAI, which uses the same option types).</summary>
    internal static class OpenAISurfaces
    {
        // An assistant's settings are stored with it and used by every run; creating or changing one is the send.
        private const string AssistantClient = "OpenAI.Assistants.AssistantClient";
        private static readonly string[] AssistantSends =
        {
            "CreateAssistant", "CreateAssistantAsync", "ModifyAssistant", "ModifyAssistantAsync", "CreateRun", "CreateRunAsync",
            "CreateRunStreaming", "CreateRunStreamingAsync", "CreateThreadAndRun", "CreateThreadAndRunAsync", "CreateThreadAndRunStreaming", "CreateThreadAndRunStreamingAsync",
        };

        public static SurfaceDefinition[] All() => new[]
        {
            new SurfaceDefinition("OpenAI.Chat.ChatCompletionOptions", Providers.OpenAI) { ResponseFormatMember = "ResponseFormat" }
                .OpenAIShape()
                .Map("Seed", Setting.Seed)
                .Mode("ReasoningEffortLevel", Modes.ReasoningEffort)
                .Sends("OpenAI.Chat.ChatClient", "CompleteChat", "CompleteChatAsync", "CompleteChatStreaming", "CompleteChatStreamingAsync"),
            // Responses API: no seed, no penalties; the model sits on the options.
            new SurfaceDefinition("OpenAI.Responses.CreateResponseOptions", Providers.OpenAI) { ModelMember = "Model", ResponseFormatMember = "TextOptions" }
                .Map("Temperature", Setting.Temperature)
                .Map("TopP", Setting.TopP)
                .Mode("ReasoningOptions.ReasoningEffortLevel", Modes.ReasoningEffort)
                .Sends("OpenAI.Responses.ResponsesClient", "CreateResponse", "CreateResponseAsync", "CreateResponseStreaming", "CreateResponseStreamingAsync"),
            // Assistants spell top-p as NucleusSamplingFactor.
            new SurfaceDefinition("OpenAI.Assistants.AssistantCreationOptions", Providers.OpenAI) { ResponseFormatMember = "ResponseFormat" }
                .Map("Temperature", Setting.Temperature)
                .Map("NucleusSamplingFactor", Setting.TopP)
                .Sends(AssistantClient, AssistantSends),
            new SurfaceDefinition("OpenAI.Assistants.AssistantModificationOptions", Providers.OpenAI) { ResponseFormatMember = "ResponseFormat" }
                .Map("Temperature", Setting.Temperature)
                .Map("NucleusSamplingFactor", Setting.TopP)
                .Sends(AssistantClient, AssistantSends),
            new SurfaceDefinition("OpenAI.Assistants.RunCreationOptions", Providers.OpenAI) { ResponseFormatMember = "ResponseFormat" }
                .Map("Temperature", Setting.Temperature)
                .Map("NucleusSamplingFactor", Setting.TopP)
                .Sends(AssistantClient, AssistantSends),
        };
    }
}
