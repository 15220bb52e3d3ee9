using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Rules;

/// <summary>SAMP007: settings a model family rejects or an IChatClient adapter silently drops.</summary>
public class SAMP007Tests
{
    [Fact]
    public async Task ReasoningModelFromTheClient_RejectsTemperature()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Collections.Generic;
            using OpenAI.Chat;

            class Planner
            {
                void A(List<ChatMessage> messages)
                {
                    var chat = new ChatClient("o3-mini", new ApiKeyCredential("key"));
                    var options = new ChatCompletionOptions { {|#0:Temperature = 0.2f|} };
                    chat.CompleteChat(messages, options);
                }
            }
            """,
            Verify.Diagnostic("SAMP007").WithLocation(0).WithMessage(
                "Temperature is rejected by model 'o3-mini' (family 'openai_reasoning', temperance.model.openai_reasoning.match)"));
    }

    [Fact]
    public async Task ReasoningModelOnTheOptions_AndOnARawPayload_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            class Planner
            {
                ChatOptions A() => new ChatOptions { ModelId = "gpt-5-mini", {|SAMP007:TopP = 0.5f|} };
                Task<HttpResponseMessage> B(HttpClient http) => http.PostAsJsonAsync("v1/chat/completions", new { model = "o1", {|SAMP007:temperature = 0.3|}, messages = new[] { new { role = "user", content = "Plan the crossing." } } });
            }
            """);
    }

    [Fact]
    public async Task ReasoningModelWithTheDefaultValue_AndOtherModels_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Planner
            {
                ChatOptions DefaultValue() => new ChatOptions { ModelId = "o3", Temperature = 1f };
                ChatOptions NotAFamilyMember() => new ChatOptions { ModelId = "o30-vision", Temperature = 0.2f };
                ChatOptions ChatVariant() => new ChatOptions { ModelId = "gpt-5-chat-latest", Temperature = 0.2f }; // temperance.model.openai_reasoning.except
                ChatOptions Chat() => new ChatOptions { ModelId = "gpt-4o", Temperature = 0.2f };
            }
            """);
    }

    [Fact]
    public async Task OpenAIAdapter_DropsTopK_AndBagKeys()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;

            class Concierge
            {
                Task<ChatResponse> A(string prompt)
                {
                    IChatClient client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("key")).AsIChatClient();
                    var options = new ChatOptions
                    {
                        {|#0:TopK = 20|},
                        AdditionalProperties = new AdditionalPropertiesDictionary { {|SAMP007:["min_p"] = 0.05|} },
                    };
                    return client.GetResponseAsync(prompt, options);
                }
            }
            """,
            Verify.Diagnostic("SAMP007").WithLocation(0).WithMessage(
                "TopK is silently dropped by the OpenAI chat adapter (AsIChatClient) (temperance.adapter.openai_chat.drops)"));
    }

    [Fact]
    public async Task AnthropicAdapter_DropsTemperature()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Anthropic;
            using Microsoft.Extensions.AI;

            class Claims
            {
                Task<ChatResponse> A(AnthropicClient anthropic, string prompt)
                {
                    var client = anthropic.AsIChatClient("claude-sonnet-4-5");
                    return client.GetResponseAsync(prompt, new ChatOptions { {|SAMP007:Temperature = 0.2f|} });
                }
            }
            """);
    }

    [Fact]
    public async Task AdapterThatReadsTheSetting_AndUnseenClients_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OllamaSharp;

            class Concierge
            {
                Task<ChatResponse> Ollama(string prompt)
                {
                    IChatClient client = new OllamaApiClient(new Uri("http://localhost:11434"), "llama3.2");
                    return client.GetResponseAsync(prompt, new ChatOptions { TopK = 20 });
                }

                Task<ChatResponse> Injected(IChatClient client, string prompt) => client.GetResponseAsync(prompt, new ChatOptions { TopK = 20 });
            }
            """);
    }

    [Fact]
    public async Task Fix_RemovesTheDroppedMember()
    {
        await Verify.FixAsync("""
            using System.Threading.Tasks;
            using Anthropic;
            using Microsoft.Extensions.AI;

            class Claims
            {
                Task<ChatResponse> A(AnthropicClient anthropic, string prompt)
                {
                    var client = anthropic.AsIChatClient("claude-sonnet-4-5");
                    var options = new ChatOptions { MaxOutputTokens = 500, {|SAMP007:Seed = 4|} };
                    return client.GetResponseAsync(prompt, options);
                }
            }
            """, """
            using System.Threading.Tasks;
            using Anthropic;
            using Microsoft.Extensions.AI;

            class Claims
            {
                Task<ChatResponse> A(AnthropicClient anthropic, string prompt)
                {
                    var client = anthropic.AsIChatClient("claude-sonnet-4-5");
                    var options = new ChatOptions { MaxOutputTokens = 500 };
                    return client.GetResponseAsync(prompt, options);
                }
            }
            """);
    }

    [Fact]
    public async Task TeamModelFamily_IsHonoured()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Planner
            {
                ChatOptions A() => new ChatOptions { ModelId = "harbour-reasoner-2", {|SAMP007:Temperature = 0.4f|} };
            }
            """, "temperance.model.harbour_reasoner.match = harbour-reasoner\ntemperance.model.harbour_reasoner.rejects = temperature\n");
    }
}
