using System.ClientModel;
using Microsoft.Extensions.AI;
using OpenAI.Chat;

namespace HarbourDesk;

/// <summary>Settings that fight, do nothing, or never reach the model (SAMP004, SAMP006, SAMP007).</summary>
public static class Tuning
{
    // SAMP004: temperature and top-p both changed.
    public static ChatCompletionOptions DeparturesBoard() => new ChatCompletionOptions { Temperature = 0.6f, TopP = 0.85f };

    // SAMP006 (Info): at temperature 0 top-k does nothing.
    public static ChatOptions SeatMap() => new ChatOptions { Temperature = 0f, TopK = 20 };

    // SAMP007: the OpenAI adapter of Microsoft.Extensions.AI never reads TopK.
    public static Task<ChatResponse> CabinUpgrade(string question)
    {
        IChatClient client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("demo-key")).AsIChatClient();
        return client.GetResponseAsync(question, new ChatOptions { TopK = 10 });
    }

    // SAMP007: reasoning models accept only the default temperature.
    public static ChatOptions RoutePlanner() => new ChatOptions { ModelId = "o4-mini", Temperature = 0.3f };
}
