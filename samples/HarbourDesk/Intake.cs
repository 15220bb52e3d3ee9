using System.ClientModel;
using ChatCompletionCreateRequest = Betalgo.Ranul.OpenAI.ObjectModels.RequestModels.ChatCompletionCreateRequest;
using Microsoft.SemanticKernel.Connectors.OpenAI;
using OpenAI.Chat;

namespace HarbourDesk;

/// <summary>Declared by the team itself: Temperance recognises any attribute named LlmTaskAttribute.</summary>
[AttributeUsage(AttributeTargets.Method | AttributeTargets.Class)]
public sealed class LlmTaskAttribute(string kind) : Attribute
{
    public string Kind { get; } = kind;
}

/// <summary>Each request here shows one way Temperance learns what a call is for (SAMP001).</summary>
public static class Intake
{
    // Response shape with a name that agrees: a JSON schema and "Extract…" mean extraction; 0.9 is above its ceiling of 0.3.
    public static ChatCompletionOptions ExtractLuggageClaimOptions() => new ChatCompletionOptions
    {
        Temperature = 0.9f,
        ResponseFormat = ChatResponseFormat.CreateJsonSchemaFormat("luggage_claim", BinaryData.FromString("""{"type":"object"}""")),
    };

    // Prompt text: "Label … as one of" means classification; no options are passed, so OpenAI's default of 1 applies.
    public static async Task<string> RouteComplaint(ChatClient chat, string complaint)
    {
        var messages = new List<ChatMessage>
        {
            new SystemChatMessage("Label the complaint as one of: delay, cabin, catering, staff, other. Reply with the label only."),
            new UserChatMessage(complaint),
        };
        ChatCompletion completion = await chat.CompleteChatAsync(messages);
        return completion.Content[0].Text;
    }

    // Method name: a leading task verb ("Translate…") names the task; ceiling 0.7.
    public static OpenAIPromptExecutionSettings TranslateSailingNotice() => new OpenAIPromptExecutionSettings { Temperature = 0.8 };

    // Silent: a JSON schema alone is not extraction (a cafe menu suggestion comes back as JSON too).
    public static ChatCompletionOptions SuggestCafeMenuOptions() => new ChatCompletionOptions
    {
        Temperature = 0.9f,
        ResponseFormat = ChatResponseFormat.CreateJsonSchemaFormat("cafe_menu", BinaryData.FromString("""{"type":"object"}""")),
    };

    // Annotation: the strongest signal. An LLM judge grading agents' replies.
    [LlmTask("evaluation")]
    public static ChatCompletionOptions ReplyQualityOptions() => new ChatCompletionOptions { Temperature = 0.6f };

    // SAMP008: three identical candidates.
    public static ChatCompletionCreateRequest TaglineCandidates() => new ChatCompletionCreateRequest { Model = "gpt-4o-mini", Temperature = 0f, N = 3 };

    // Silent: a reasoning model is not asked for a temperature.
    public static Task<ClientResult<ChatCompletion>> ExtractFareRules(string text) =>
        new ChatClient("o3-mini", new ApiKeyCredential("demo-key")).CompleteChatAsync(new List<ChatMessage> { new UserChatMessage(text) });
}

