using Temperance.Tests.Infrastructure;
using static Temperance.Rules.FixProperties;

namespace Temperance.Tests.Rules;

/// <summary>SAMP001: temperature above the ceiling for the call's task, with every inference signal and fix shape.</summary>
public class SAMP001Tests
{
    // ---- signals -------------------------------------------------------------------------------------------------

    [Fact]
    public async Task JsonSchemaResponseFormat_HotTemperature_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System;
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo() => new ChatCompletionOptions
                {
                    {|#0:Temperature = 0.9f|},
                    ResponseFormat = ChatResponseFormat.CreateJsonSchemaFormat("cargo", BinaryData.FromString("{}")),
                };
            }
            """,
            Verify.Diagnostic("SAMP001").WithLocation(0).WithMessage(
                "Temperature 0.9 is above the ceiling 0.3 for task 'extraction' (task from the method name 'ExtractCargo' and the JSON-schema response format (ChatResponseFormat.CreateJsonSchemaFormat(\"cargo\", BinaryDat…); ceiling from temperance.task.extraction.max_temperature)"));
    }

    [Fact]
    public async Task SystemPromptLabelAsOneOf_Triggers_AndTheMessageQuotesIt()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            class Returns
            {
                Task<ChatResponse> Handle(IChatClient client, string note)
                {
                    var options = new ChatOptions { {|#0:Temperature = 0.8f|} };
                    return client.GetResponseAsync(new[]
                    {
                        new ChatMessage(ChatRole.System, "Label the return reason as one of: damaged, late, wrong-size, other."),
                        new ChatMessage(ChatRole.User, note),
                    }, options);
                }
            }
            """,
            Verify.Diagnostic("SAMP001").WithLocation(0).WithMessage(
                "Temperature 0.8 is above the ceiling 0.3 for task 'classification' (task from the prompt text 'Label the return reason as one of: damaged, late…'; ceiling from temperance.task.classification.max_temperature)"));
    }

    [Fact]
    public async Task MethodName_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Berths
            {
                ChatCompletionOptions TranslateBerthNotice() => new ChatCompletionOptions { {|SAMP001:Temperature = 0.9f|} };
            }
            """);
    }

    [Fact]
    public async Task Annotation_Triggers_AndBeatsEverythingElse()
    {
        // The team declares the attribute itself; the method name says "Summarize", the annotation says evaluation.
        await Verify.AnalyzerAsync("""
            using System;
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            [AttributeUsage(AttributeTargets.Method | AttributeTargets.Class)]
            sealed class LlmTaskAttribute : Attribute { public LlmTaskAttribute(string kind) { } }

            class Reviews
            {
                [LlmTask("evaluation")]
                // An evaluation task must also be seeded (SAMP003).
                OpenAIPromptExecutionSettings SummarizeAndGrade() => {|SAMP003:new OpenAIPromptExecutionSettings { {|SAMP001:Temperature = 0.3|} }|};
            }
            """);
    }

    [Fact]
    public async Task EditorConfigTask_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using OllamaSharp.Models;

            class Manifests
            {
                RequestOptions Options() => new RequestOptions { {|SAMP001:Temperature = 0.7f|} };
            }
            """, "temperance.task = extraction\n");
    }

    [Fact]
    public async Task EditorConfigTask_BeatsTheResponseShape()
    {
        // The folder says creative (no ceiling); the JSON format alone would have said extraction.
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Posters
            {
                ChatOptions Options() => new ChatOptions { Temperature = 1.1f, ResponseFormat = ChatResponseFormat.Json };
            }
            """, "temperance.task = creative\n");
    }

    [Fact]
    public async Task StructuredOutputCall_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            record Booking(string Guest, int Nights);

            class Reservations
            {
                async Task<Booking> ExtractBooking(IChatClient client, string email)
                {
                    var options = new ChatOptions { {|SAMP001:Temperature = 0.9f|} };
                    return (await client.GetResponseAsync<Booking>(email, options)).Result;
                }
            }
            """);
    }

    [Fact]
    public async Task LLamaSharpGrammar_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using LLama.Sampling;

            class Gate
            {
                DefaultSamplingPipeline ClassifyGate() => new DefaultSamplingPipeline { {|SAMP001:Temperature = 0.6f|}, Grammar = new Grammar("root ::= \"open\" | \"closed\"", "root") };
            }
            """);
    }

    [Fact]
    public async Task OllamaJsonFormat_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using OllamaSharp.Models;
            using OllamaSharp.Models.Chat;

            class Gate
            {
                ChatRequest ExtractGateReading() => new ChatRequest { Model = "llama3.2", Format = "json", Options = new RequestOptions { {|SAMP001:Temperature = 0.9f|} } };
            }
            """);
    }

    [Fact]
    public async Task OnnxGuidance_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.ML.OnnxRuntimeGenAI;

            class Gate
            {
                void ExtractGateLog(Model model)
                {
                    var p = new GeneratorParams(model);
                    p.SetGuidance("json_schema", "{}");
                    {|SAMP001:p.SetSearchOption("temperature", 0.9)|};
                    using var generator = new Generator(model, p);
                }
            }
            """);
    }

    // ---- silence ---------------------------------------------------------------------------------------------------

    [Fact]
    public async Task ChatCreativeAndSummaryCalls_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Desk
            {
                ChatCompletionOptions ChatWithPassenger() => new ChatCompletionOptions { Temperature = 0.9f };
                ChatCompletionOptions WritePoemForNewsletter() => new ChatCompletionOptions { Temperature = 1.2f };
                ChatCompletionOptions SummarizeIncidentLog() => new ChatCompletionOptions { Temperature = 0.7f };
                ChatCompletionOptions SummarizeWithDefault() => new ChatCompletionOptions { TopP = 0.9f };
            }
            """);
    }

    [Fact]
    public async Task PromptOutranksTheMethodName_Triggers()
    {
        // Method name says translation, the prompt says classification: the prompt text is the stronger evidence.
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            class Mixed
            {
                Task<ChatResponse> TranslateNotice(IChatClient client, string text) =>
                    client.GetResponseAsync("Classify this notice as urgent or routine: " + text, new ChatOptions { {|SAMP001:Temperature = 0.9f|} });
            }
            """);
    }

    [Fact]
    public async Task PromptsThatDisagree_DoNotTrigger()
    {
        // One prompt says classification, the other translation: no task, no warning.
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            class Mixed
            {
                Task<ChatResponse> Notice(IChatClient client, string text) =>
                    client.GetResponseAsync(new[]
                    {
                        new ChatMessage(ChatRole.System, "Classify this notice as urgent or routine."),
                        new ChatMessage(ChatRole.User, "Translate it to Dutch first: " + text),
                    }, new ChatOptions { Temperature = 0.9f });
            }
            """);
    }

    [Fact]
    public async Task TemperatureAtOrBelowTheCeiling_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo() => new ChatCompletionOptions { Temperature = 0.3f };
                ChatCompletionOptions ExtractCrew() => new ChatCompletionOptions { Temperature = 0f };
            }
            """);
    }

    [Fact]
    public async Task UnknownTemperature_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo(float t) => new ChatCompletionOptions { Temperature = t };
            }
            """);
    }

    [Fact]
    public async Task ReasoningModel_IsNotAskedForATemperature()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            class Manifests
            {
                async Task<string> ExtractCargo(string text)
                {
                    var client = new ChatClient("o3-mini", new ApiKeyCredential("key"));
                    ChatCompletion result = await client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(text) });
                    return result.Content[0].Text;
                }
            }
            """);
    }

    [Fact]
    public async Task ChatOptionsWithoutTemperature_DoesNotTrigger_BecauseClientMiddlewareMaySetIt()
    {
        // An IChatClient pipeline (ConfigureOptions) can fill an unset temperature, so unset is not known to be 1.
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            class Manifests
            {
                Task<ChatResponse> ExtractCargo(IChatClient client, string text) => client.GetResponseAsync(text, new ChatOptions { ModelId = "gpt-4o-mini" });
            }
            """);
    }

    [Fact]
    public async Task OllamaWithoutTemperature_DoesNotTrigger_BecauseTheModelfileMaySetIt()
    {
        await Verify.AnalyzerAsync("""
            using OllamaSharp.Models;

            class Manifests
            {
                RequestOptions ExtractCargo() => new RequestOptions { TopK = 20 };
            }
            """);
    }

    [Fact]
    public async Task HotExtremeValue_IsSAMP009Only()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo() => new ChatCompletionOptions { {|SAMP009:Temperature = 1.8f|} };
            }
            """);
    }

    // ---- unset temperatures and every fix shape -------------------------------------------------------------------

    [Fact]
    public async Task Unset_AddsTheMemberToTheInitializer()
    {
        await Verify.FixAsync("""
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            class Manifests
            {
                OpenAIPromptExecutionSettings ExtractCargo() => {|SAMP001:new OpenAIPromptExecutionSettings { MaxTokens = 200 }|};
            }
            """, """
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            class Manifests
            {
                OpenAIPromptExecutionSettings ExtractCargo() => new OpenAIPromptExecutionSettings { MaxTokens = 200, Temperature = 0.0 };
            }
            """);
    }

    [Fact]
    public async Task Unset_MultilineInitializer_KeepsOneMemberPerLine()
    {
        await Verify.FixAsync("""
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo() => {|SAMP001:new ChatCompletionOptions
                {
                    TopP = 1f, // explicit default
                    MaxOutputTokenCount = 300,
                }|};
            }
            """, """
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo() => new ChatCompletionOptions
                {
                    TopP = 1f, // explicit default
                    MaxOutputTokenCount = 300,
                    Temperature = 0.0f,
                };
            }
            """);
    }

    [Fact]
    public async Task Unset_CreatesAnInitializer_ForAMutatedLocal()
    {
        await Verify.FixAsync("""
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo()
                {
                    var options = {|SAMP001:new ChatCompletionOptions()|};
                    options.MaxOutputTokenCount = 300;
                    return options;
                }
            }
            """, """
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo()
                {
                    var options = new ChatCompletionOptions { Temperature = 0.0f };
                    options.MaxOutputTokenCount = 300;
                    return options;
                }
            }
            """);
    }

    [Fact]
    public async Task Unset_LLamaSharpContainer_AddsANestedPipeline()
    {
        await Verify.FixAsync("""
            using LLama.Common;

            class Manifests
            {
                InferenceParams ExtractCargo() => {|SAMP001:new InferenceParams { MaxTokens = 128 }|};
            }
            """, """
            using LLama.Common;

            class Manifests
            {
                InferenceParams ExtractCargo() => new InferenceParams { MaxTokens = 128, SamplingPipeline = new LLama.Sampling.DefaultSamplingPipeline { Temperature = 0.0f } };
            }
            """);
    }

    [Fact]
    public async Task NoOptionsPassed_AddsAnOptionsArgument()
    {
        await Verify.FixAsync("""
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            class Manifests
            {
                Task<System.ClientModel.ClientResult<ChatCompletion>> ExtractCargo(ChatClient client, List<ChatMessage> messages) =>
                    {|SAMP001:client.CompleteChatAsync(messages)|};
            }
            """, """
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            class Manifests
            {
                Task<System.ClientModel.ClientResult<ChatCompletion>> ExtractCargo(ChatClient client, List<ChatMessage> messages) =>
                    client.CompleteChatAsync(messages, options: new ChatCompletionOptions { Temperature = 0.0f });
            }
            """);
    }

    [Fact]
    public async Task NoOptionsPassed_ParamsOverload_TriggersWithoutAFix()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using OpenAI.Chat;

            class Manifests
            {
                Task<System.ClientModel.ClientResult<ChatCompletion>> ExtractCargo(ChatClient client, string text) =>
                    {|SAMP001:client.CompleteChatAsync(new UserChatMessage(text))|};
            }
            """);
    }

    [Fact]
    public async Task Known_FixSetsTheTaskValue_WithTheMembersType()
    {
        await Verify.FixAsync("""
            using Microsoft.Extensions.AI;

            class Berths
            {
                ChatOptions TranslateBerthNotice() => new ChatOptions { {|SAMP001:Temperature = /* keep */ 0.9f|} };
            }
            """, """
            using Microsoft.Extensions.AI;

            class Berths
            {
                ChatOptions TranslateBerthNotice() => new ChatOptions { Temperature = /* keep */ 0.2f };
            }
            """);
    }

    [Fact]
    public async Task FixAll_AddsTheMemberEverywhere()
    {
        var test = new TemperanceTest("""
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo() => {|SAMP001:new ChatCompletionOptions { TopP = 1f }|};
                ChatCompletionOptions ExtractCrew() => {|SAMP001:new ChatCompletionOptions()|};
            }
            """, fixedSource: """
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo() => new ChatCompletionOptions { TopP = 1f, Temperature = 0.0f };
                ChatCompletionOptions ExtractCrew() => new ChatCompletionOptions { Temperature = 0.0f };
            }
            """);
        test.CodeActionEquivalenceKey = PrimaryKey;
        test.NumberOfFixAllIterations = 1;
        await test.RunAsync();
    }

    [Fact]
    public async Task TeamCeilingOverride_IsHonoured()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Manifests
            {
                ChatCompletionOptions ExtractCargo() => new ChatCompletionOptions { Temperature = 0.5f };
            }
            """, "temperance.task.extraction.max_temperature = 0.6\n");
    }
}
