using System.Net.Http.Json;
using Azure.AI.Inference;
using Betalgo.Ranul.OpenAI.ObjectModels.RequestModels;
using Microsoft.Extensions.AI;
using Microsoft.SemanticKernel.Connectors.OpenAI;
using OllamaSharp.Models;
using OllamaSharp.Models.Chat;
using OpenAI.Chat;

namespace HarbourDesk;

/// <summary>
/// Harbour Desk answers questions about ferry crossings: timetables, lost luggage, and the occasional poem for the
/// captain's newsletter. Each method below builds the request one team member wrote; several are wrong on purpose.
/// No model is called: building the project is the demo.
/// </summary>
public static class Program
{
    private const float NewsletterMood = 1.8f;

    public static void Main()
    {
        Console.WriteLine("Harbour Desk demo: run `dotnet build samples/HarbourDesk` to see Temperance's warnings.");
        _ = TimetableOptions();
        _ = LostLuggageOptions();
        _ = NewsletterOptions();
        _ = OnboardMenuSettings();
        _ = LocalFaqRequest();
        _ = WeatherNoticeOptions();
        _ = TaglineRequest();
    }

    // SAMP005: OpenAI's top_p is a probability mass in [0, 1].
    public static ChatCompletionOptions TimetableOptions() => new ChatCompletionOptions { Temperature = 0.2f, TopP = 1.3f };

    // Fine: low temperature for a lookup-style answer.
    public static ChatOptions LostLuggageOptions() => new ChatOptions { Temperature = 0.1f, ModelId = "gpt-4o-mini" };

    // SAMP009: 1.8 is accepted by some providers, but output at that temperature degrades toward noise.
    public static ChatOptions NewsletterOptions() => new ChatOptions { Temperature = NewsletterMood };

    // SAMP005: Semantic Kernel's OpenAI settings, temperature above OpenAI's maximum of 2.
    public static OpenAIPromptExecutionSettings OnboardMenuSettings() => new OpenAIPromptExecutionSettings { Temperature = 2.4, MaxTokens = 300 };

    // SAMP009 inside Ollama's nested RequestOptions.
    public static ChatRequest LocalFaqRequest() => new ChatRequest
    {
        Model = "llama3.2",
        Options = new RequestOptions { Temperature = 2.2f, TopK = 40 },
    };

    // SAMP005: Azure AI model inference accepts temperature in [0, 1] only.
    public static ChatCompletionsOptions WeatherNoticeOptions() => new ChatCompletionsOptions { Model = "phi-4", Temperature = 1.2f };

    // SAMP005: at least one candidate.
    public static ChatCompletionCreateRequest TaglineRequest() => new ChatCompletionCreateRequest { Model = "gpt-4o-mini", N = 0, Temperature = 0.9f };

    // SAMP009 on a hand-built JSON payload sent with HttpClient.
    public static Task<HttpResponseMessage> SendRaw(HttpClient http, string question) =>
        http.PostAsJsonAsync("v1/chat/completions", new { model = "gpt-4o-mini", temperature = 1.7, messages = new[] { new { role = "user", content = question } } });
}
