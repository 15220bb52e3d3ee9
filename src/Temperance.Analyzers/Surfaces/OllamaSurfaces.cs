using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>OllamaSharp: sampling in <c>RequestOptions</c>, model and format on the chat/generate request.</summary>
    internal static class OllamaSurfaces
    {
        public static SurfaceDefinition[] All() => new[]
        {
            new SurfaceDefinition("OllamaSharp.Models.RequestOptions", Providers.Ollama)
                .OpenAIShape()
                .Map("TopK", Setting.TopK)
                .Map("MinP", Setting.MinP)
                .Map("Seed", Setting.Seed)
                .Map("RepeatPenalty", Setting.RepetitionPenalty)
                .Sends("OllamaSharp.Chat", "SendAsync", "SendAsAsync"),
            new SurfaceDefinition("OllamaSharp.Models.Chat.ChatRequest", Providers.Ollama) { ModelMember = "Model", ResponseFormatMember = "Format" }
                .Nested("Options")
                .Sends("OllamaSharp.IOllamaApiClient", "ChatAsync"),
            new SurfaceDefinition("OllamaSharp.Models.GenerateRequest", Providers.Ollama) { ModelMember = "Model", ResponseFormatMember = "Format" }
                .Nested("Options")
                .Sends("OllamaSharp.IOllamaApiClient", "GenerateAsync"),
        };
    }
}
