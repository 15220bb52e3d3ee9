using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Rules;

/// <summary>
/// The model capability table (rules/temperance.globalconfig, "models"): each family row and mode condition on the real
/// SDKs. Sources are cited next to each row in the table; the case each test stands for is named in the test.
/// </summary>
public class ModelCapabilityTests
{
    private const string OpenAIUsings = """
        #pragma warning disable OPENAI001 // reasoning effort and the Responses API are [Experimental] in OpenAI 2.x
        using System.ClientModel;
        using System.Collections.Generic;
        using OpenAI.Chat;

        """;

    // ---- OpenAI GPT-5.1 and later: sampling only at reasoning effort none (OpenAI GPT-5.2 guide) ----------------------

    [Fact]
    public async Task Gpt51_EffortNone_TakesTemperature_DoesNotTrigger()
    {
        // Regression: this was a false SAMP007 when every gpt-5 model counted as rejecting temperature.
        await Verify.AnalyzerAsync(OpenAIUsings + """
            class HarbourPlanner
            {
                void Plan(List<ChatMessage> messages)
                {
                    var chat = new ChatClient("gpt-5.1", new ApiKeyCredential("key"));
                    var options = new ChatCompletionOptions { ReasoningEffortLevel = ChatReasoningEffortLevel.None, Temperature = 0.2f };
                    chat.CompleteChat(messages, options);
                }
            }
            """);
    }

    [Fact]
    public async Task Gpt51_NoEffortWritten_DefaultsToNone_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync(OpenAIUsings + """
            class HarbourPlanner
            {
                void Plan(List<ChatMessage> messages)
                {
                    var chat = new ChatClient("gpt-5.2-mini", new ApiKeyCredential("key"));
                    chat.CompleteChat(messages, new ChatCompletionOptions { Temperature = 0.2f });
                }
            }
            """);
    }

    [Fact]
    public async Task Gpt51_EffortLow_RejectsTemperature_NamingTheEffort()
    {
        await Verify.AnalyzerAsync(OpenAIUsings + """
            class HarbourPlanner
            {
                void Plan(List<ChatMessage> messages)
                {
                    var chat = new ChatClient("gpt-5.1", new ApiKeyCredential("key"));
                    var options = new ChatCompletionOptions { ReasoningEffortLevel = ChatReasoningEffortLevel.Low, {|#0:Temperature = 0.2f|} };
                    chat.CompleteChat(messages, options);
                }
            }
            """,
            Verify.Diagnostic("SAMP007").WithLocation(0).WithMessage(
                "Temperature is rejected by model 'gpt-5.1' (reasoning effort 'low' from ReasoningEffortLevel = ChatReasoningEffortLevel.Low; only effort 'none' takes it, temperance.model.openai_effort.reasoning_rejects)"));
    }

    [Fact]
    public async Task ResponsesApi_EffortMedium_RejectsTopP()
    {
        await Verify.AnalyzerAsync("""
            #pragma warning disable OPENAI001
            using OpenAI.Responses;

            class HarbourPlanner
            {
                CreateResponseOptions Options() => new CreateResponseOptions
                {
                    Model = "gpt-5.2",
                    ReasoningOptions = new ResponseReasoningOptions { ReasoningEffortLevel = ResponseReasoningEffortLevel.Medium },
                    {|SAMP007:TopP = 0.5f|},
                };
            }
            """);
    }

    [Fact]
    public async Task OSeries_RejectsPenalties_ButTakesTheirDefault()
    {
        // frequency/presence penalties: community reports only (see the table's source comment).
        await Verify.AnalyzerAsync(OpenAIUsings + """
            class HarbourPlanner
            {
                void Plan(List<ChatMessage> messages)
                {
                    var chat = new ChatClient("o3", new ApiKeyCredential("key"));
                    chat.CompleteChat(messages, new ChatCompletionOptions { {|SAMP007:FrequencyPenalty = 0.5f|}, PresencePenalty = 0f });
                }
            }
            """);
    }

    [Fact]
    public async Task ReasoningEffortFromASettingsMember_IsUnknown_DoesNotTrigger()
    {
        // Regression (review): a static member of another type is not a constant effort name; the effort is Unknown.
        await Verify.AnalyzerAsync(OpenAIUsings + """
            static class PlannerSettings
            {
                public static ChatReasoningEffortLevel Effort { get; set; } = ChatReasoningEffortLevel.None;
                public static readonly ChatReasoningEffortLevel Configured = new ChatReasoningEffortLevel(System.Environment.GetEnvironmentVariable("EFFORT") ?? "none");
            }

            class HarbourPlanner
            {
                void Plan(List<ChatMessage> messages)
                {
                    var chat = new ChatClient("gpt-5.1", new ApiKeyCredential("key"));
                    chat.CompleteChat(messages, new ChatCompletionOptions { ReasoningEffortLevel = PlannerSettings.Effort, Temperature = 0.2f });
                    chat.CompleteChat(messages, new ChatCompletionOptions { ReasoningEffortLevel = PlannerSettings.Configured, Temperature = 0.2f });
                }
            }
            """);
    }

    [Fact]
    public async Task Gemini3_NegativeTemperature_IsOutOfRange_AndTheFixWritesTheAdvisedValue()
    {
        // One mistake, one warning: SAMP005 stands for SAMP010, and its fix does not clamp to 0 (which SAMP010 would flag).
        await Verify.FixAsync("""
            using Microsoft.Extensions.AI;

            class CargoManifest
            {
                ChatOptions Options() => new ChatOptions { ModelId = "gemini-3-pro-preview", {|SAMP005:Temperature = -0.5f|} };
            }
            """, """
            using Microsoft.Extensions.AI;

            class CargoManifest
            {
                ChatOptions Options() => new ChatOptions { ModelId = "gemini-3-pro-preview", Temperature = 1.0f };
            }
            """);
    }

    [Fact]
    public async Task RejectedTemperatureOutOfRange_IsOneFinding_TheRejection()
    {
        // One mistake, one warning: the model takes no temperature, so the fix removes it rather than clamping it.
        await Verify.AnalyzerAsync(OpenAIUsings + """
            class HarbourPlanner
            {
                void Plan(List<ChatMessage> messages)
                {
                    var chat = new ChatClient("o3", new ApiKeyCredential("key"));
                    chat.CompleteChat(messages, new ChatCompletionOptions { {|SAMP007:Temperature = 3f|} });
                }
            }
            """);
    }

    [Fact]
    public async Task OpenAIClientPointedAtOllama_IsJudgedOnOllamasRange_AnOtherAddressOnOpenAIs()
    {
        // Ollama sets no maximum temperature, so 2.5 is extreme (SAMP009) there; at OpenAI it is out of range (SAMP005).
        await Verify.AnalyzerAsync(OpenAIUsings + """
            using System;
            using OpenAI;

            class HarbourPlanner
            {
                void Local(List<ChatMessage> messages)
                {
                    var client = new OpenAIClient(new ApiKeyCredential("ollama"), new OpenAIClientOptions { Endpoint = new Uri("http://localhost:11434/v1") });
                    client.GetChatClient("llama3.2").CompleteChat(messages, new ChatCompletionOptions { {|SAMP009:Temperature = 2.5f|} });
                }

                void Hosted(List<ChatMessage> messages)
                {
                    var options = new OpenAIClientOptions { Endpoint = new Uri("https://gateway.harbour.example/v1") };
                    var client = new OpenAIClient(new ApiKeyCredential("key"), options);
                    client.GetChatClient("gpt-4o-mini").CompleteChat(messages, new ChatCompletionOptions { {|SAMP005:Temperature = 2.5f|} });
                }
            }
            """);
    }

    // ---- precision: the same requests in test code that never reaches a model stay silent, their live twins fire ----

    [Fact]
    public async Task EffortRejection_SentToASubstitute_DoesNotTrigger_ItsLiveTwinDoes()
    {
        await Verify.AnalyzerAsync("""
            #pragma warning disable OPENAI001
            using System.Threading.Tasks;
            using NSubstitute;
            using OpenAI.Responses;
            using Xunit;

            public class PlannerTests
            {
                [Fact]
                public async Task Plan_AsksTheClient()
                {
                    var client = Substitute.For<ResponsesClient>();
                    var options = new CreateResponseOptions
                    {
                        Model = "gpt-5.2",
                        ReasoningOptions = new ResponseReasoningOptions { ReasoningEffortLevel = ResponseReasoningEffortLevel.Medium },
                        TopP = 0.5f,
                    };
                    await client.CreateResponseAsync(options);
                }
            }

            public class Planner
            {
                public Task Plan(ResponsesClient client) => client.CreateResponseAsync(new CreateResponseOptions
                {
                    Model = "gpt-5.2",
                    ReasoningOptions = new ResponseReasoningOptions { ReasoningEffortLevel = ResponseReasoningEffortLevel.Medium },
                    {|SAMP007:TopP = 0.5f|},
                });
            }
            """);
    }

    [Fact]
    public async Task PublisherAdvice_InASerialisationTest_DoesNotTrigger_ItsLiveTwinDoes()
    {
        await Verify.AnalyzerAsync("""
            using System.Text.Json;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class ManifestOptionsTests
            {
                [Fact]
                public void Options_RoundTrip()
                {
                    var options = new ChatOptions { ModelId = "gemini-3-pro-preview", Temperature = 0.2f };
                    Assert.Contains("0.2", JsonSerializer.Serialize(options));
                }
            }

            public class CargoManifest
            {
                public Task<ChatResponse> Read(IChatClient client, string text) =>
                    client.GetResponseAsync(text, new ChatOptions { ModelId = "gemini-3-pro-preview", {|SAMP010:Temperature = 0.2f|} });
            }
            """);
    }

    // ---- raw payloads: the provider and family come from the model id ----------------------------------------------

    private const string PayloadUsings = """
        using System.Net.Http;
        using System.Net.Http.Json;
        using System.Threading.Tasks;

        """;

    [Fact]
    public async Task Payload_OpenAIModel_OutOfOpenAIsRange_IsSAMP005_NotExtreme()
    {
        await Verify.AnalyzerAsync(PayloadUsings + """
            class TideDigest
            {
                Task<HttpResponseMessage> Send(HttpClient http) =>
                    http.PostAsJsonAsync("v1/chat/completions", new { model = "gpt-4o-mini", {|#0:temperature = 2.8|}, messages = new[] { new { role = "user", content = "Summarise the tide table." } } });
            }
            """,
            Verify.Diagnostic("SAMP005").WithLocation(0).WithMessage(
                "\"temperature\" = 2.8 is outside the range [0, 2] that openai accepts for temperature (rules table: temperance.provider.openai.temperature.max)"));
    }

    [Fact]
    public async Task Payload_ClaudeSonnet45_TemperatureAndTopPTogether_IsRejected_NotStyleAdvice()
    {
        await Verify.AnalyzerAsync(PayloadUsings + """
            class TideDigest
            {
                Task<HttpResponseMessage> Send(HttpClient http) =>
                    http.PostAsJsonAsync("v1/messages", new { model = "claude-sonnet-4-5-20250929", max_tokens = 400, temperature = 0.2, {|#0:top_p = 0.9|}, messages = new[] { new { role = "user", content = "Summarise the tide table." } } });
            }
            """,
            Verify.Diagnostic("SAMP007").WithLocation(0).WithMessage(
                "\"top_p\" together with \"temperature\" is rejected by model 'claude-sonnet-4-5-20250929' (family 'anthropic_one_of' takes only one of temperature, top_p, temperance.model.anthropic_one_of.exclusive)"));
    }

    [Fact]
    public async Task Payload_ClaudeAfterOpus46_RejectsTemperatureOtherThanOne()
    {
        await Verify.AnalyzerAsync(PayloadUsings + """
            class TideDigest
            {
                Task<HttpResponseMessage> Cool(HttpClient http) =>
                    http.PostAsJsonAsync("v1/messages", new { model = "claude-opus-4-7", max_tokens = 400, {|SAMP007:temperature = 0.3|}, messages = new[] { new { role = "user", content = "Plan the berths." } } });

                Task<HttpResponseMessage> Default(HttpClient http) =>
                    http.PostAsJsonAsync("v1/messages", new { model = "claude-opus-4-7", max_tokens = 400, temperature = 1.0, messages = new[] { new { role = "user", content = "Plan the berths." } } });
            }
            """);
    }

    [Fact]
    public async Task Payload_ExtendedThinking_RejectsTemperature_NamingTheMode()
    {
        await Verify.AnalyzerAsync(PayloadUsings + """
            class TideDigest
            {
                Task<HttpResponseMessage> Send(HttpClient http) =>
                    http.PostAsJsonAsync("v1/messages", new
                    {
                        model = "claude-3-7-sonnet-latest",
                        max_tokens = 4000,
                        thinking = new { type = "enabled", budget_tokens = 2000 },
                        {|#0:temperature = 0.5|},
                        messages = new[] { new { role = "user", content = "Plan the berths." } },
                    });
            }
            """,
            Verify.Diagnostic("SAMP007").WithLocation(0).WithMessage(
                "\"temperature\" is rejected by model 'claude-3-7-sonnet-latest' (extended thinking is on (thinking = new { type = \"enabled\", budget_tokens = 2000 }), temperance.model.anthropic.thinking_rejects)"));
    }

    [Fact]
    public async Task DictionaryPayload_ExtendedThinking_RejectsTemperature()
    {
        await Verify.AnalyzerAsync(PayloadUsings + """
            using System.Collections.Generic;

            class TideDigest
            {
                Task<HttpResponseMessage> Send(HttpClient http)
                {
                    var payload = new Dictionary<string, object>
                    {
                        ["model"] = "claude-3-7-sonnet-latest",
                        ["max_tokens"] = 4000,
                        ["thinking"] = new Dictionary<string, object> { ["type"] = "enabled", ["budget_tokens"] = 2000 },
                        {|SAMP007:["temperature"] = 0.5|},
                        ["messages"] = new object[0],
                    };
                    return http.PostAsJsonAsync("v1/messages", payload);
                }
            }
            """);
    }

    // ---- deployment names mapped in .editorconfig ------------------------------------------------------------------

    private const string Deployment = OpenAIUsings + """
        class HarbourPlanner
        {
            void Plan(Azure.AI.OpenAI.AzureOpenAIClient azure, List<ChatMessage> messages)
            {
                var chat = azure.GetChatClient("extractor-prod");
                chat.CompleteChat(messages, new ChatCompletionOptions { TEMPERATURE });
            }
        }
        """;

    [Fact]
    public async Task DeploymentMappedToAReasoningModel_GetsItsFindings()
    {
        await Verify.AnalyzerAsync(Deployment.Replace("TEMPERATURE", "{|#0:Temperature = 0.2f|}"), "temperance.deployment.extractor-prod = o3-mini\n",
            Verify.Diagnostic("SAMP007").WithLocation(0).WithMessage(
                "Temperature is rejected by model 'o3-mini' ('extractor-prod' mapped by temperance.deployment.extractor-prod) (family 'openai_reasoning', temperance.model.openai_reasoning.match)"));
    }

    [Fact]
    public async Task UnknownDeployment_GetsNoModelFinding()
    {
        await Verify.AnalyzerAsync(Deployment.Replace("TEMPERATURE", "Temperature = 0.2f"));
    }

    // ---- Gemini 3: the publisher advises keeping temperature 1.0 (Vertex AI Gemini 3 prompting guide) ------------------

    [Fact]
    public async Task Gemini3_ExtractionTask_NoCeilingFinding_OnlyThePublishersAdvice()
    {
        // SAMP001 would push the temperature down for an extraction; for Gemini 3 that is advice against the publisher's.
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class CargoManifest
            {
                ChatOptions Options() => new ChatOptions { ModelId = "gemini-3-pro-preview", {|SAMP010:Temperature = 0.9f|} };
                ChatOptions AtOne() => new ChatOptions { ModelId = "gemini-3-pro-preview", Temperature = 1.0f };
                ChatOptions OlderGemini() => new ChatOptions { ModelId = "gemini-2.5-flash", Temperature = 0.2f };
            }
            """, "temperance.task = extraction\n");
    }

    [Fact]
    public async Task ExactTest_OnAModelWithoutTemperature_GivesGuidance_NotATemperature()
    {
        await Verify.AnalyzerAsync("""
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            public class BerthTests
            {
                private readonly ChatClient chat = new ChatClient("o3-mini", "key");

                [Fact]
                public async Task Berth_IsStable()
                {
                    ChatCompletion completion = await {|#0:chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Which berth for the ferry?") })|};
                    Assert.Equal("Berth 4", completion.Content[0].Text);
                }
            }
            """,
            Verify.Diagnostic("SAMP002").WithLocation(0).WithMessage(
                "The test compares this model output exactly (Assert.Equal in 'Berth_IsStable') but sampling is random (temperature unset, so openai's default 1 applies; model 'o3-mini' takes no temperature, so compare tolerantly (parse the answer and check its fields, a schema or a semantic check) or replay a recorded response); the test passes or fails by chance"));
    }
}
