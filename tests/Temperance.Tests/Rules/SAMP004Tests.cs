using Temperance.Tests.Infrastructure;
using static Temperance.Rules.FixProperties;

namespace Temperance.Tests.Rules;

/// <summary>SAMP004: temperature and top-p both moved away from the provider's defaults.</summary>
public class SAMP004Tests
{
    [Fact]
    public async Task OpenAI_BothChanged_Triggers_AndNamesTheDefaults()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Fares
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { Temperature = 0.7f, {|#0:TopP = 0.8f|} };
            }
            """,
            Verify.Diagnostic("SAMP004").WithLocation(0).WithMessage(
                "Both temperature (0.7) and top-p (0.8) differ from openai's defaults (temperature 1, top-p 1); change one of them, not both"));
    }

    [Fact]
    public async Task EveryProviderSurface_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Collections.Generic;
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;
            using Azure.AI.Inference;
            using Microsoft.Extensions.AI;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using OllamaSharp.Models;

            class Fares
            {
                ChatOptions Mea() => new ChatOptions { Temperature = 0.5f, {|SAMP004:TopP = 0.9f|} };
                OpenAIPromptExecutionSettings Sk() => new OpenAIPromptExecutionSettings { Temperature = 0.5, {|SAMP004:TopP = 0.9|} };
                ChatCompletionsOptions Azure() => new ChatCompletionsOptions { Temperature = 0.5f, {|SAMP004:NucleusSamplingFactor = 0.9f|} };
                RequestOptions Ollama() => new RequestOptions { Temperature = 0.5f, {|SAMP004:TopP = 0.5f|} };
                Task<HttpResponseMessage> Raw(HttpClient http) => http.PostAsJsonAsync("v1/chat/completions", new { model = "gpt-4o-mini", temperature = 0.5, {|SAMP004:top_p = 0.9|} });
            }
            """);
    }

    [Fact]
    public async Task ExplicitDefaults_AndTemperatureExactlyOne_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using OllamaSharp.Models;
            using OpenAI.Chat;

            class Fares
            {
                ChatCompletionOptions DefaultTopP() => new ChatCompletionOptions { Temperature = 0.4f, TopP = 1f };
                ChatCompletionOptions DefaultTemperature() => new ChatCompletionOptions { Temperature = 1f, TopP = 0.5f };
                RequestOptions OllamaDefaults() => new RequestOptions { Temperature = 0.8f, TopP = 0.5f };
                ChatCompletionOptions Unknown(float t) => new ChatCompletionOptions { Temperature = t, TopP = 0.5f };
                ChatCompletionOptions Greedy() => new ChatCompletionOptions { Temperature = 0f, TopP = 0.5f }; // SAMP006's case, Info
            }
            """,
            Verify.Diagnostic("SAMP006").WithSpan(10, 85, 10, 96));
    }

    [Fact]
    public async Task FirstFix_RemovesTopP()
    {
        var test = new TemperanceTest("""
            using OpenAI.Chat;

            class Fares
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { Temperature = 0.7f, {|SAMP004:TopP = 0.8f|} };
            }
            """, fixedSource: """
            using OpenAI.Chat;

            class Fares
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { Temperature = 0.7f };
            }
            """);
        test.CodeActionEquivalenceKey = PrimaryKey;
        await test.RunAsync();
    }

    [Fact]
    public async Task SecondFix_RemovesTemperature_FromAMutation()
    {
        var test = new TemperanceTest("""
            using OpenAI.Chat;

            class Fares
            {
                ChatCompletionOptions A()
                {
                    var options = new ChatCompletionOptions { TopP = 0.8f };
                    options.Temperature = 0.7f;
                    return options;
                }
            }
            """.Replace("TopP = 0.8f", "{|SAMP004:TopP = 0.8f|}", StringComparison.Ordinal), fixedSource: """
            using OpenAI.Chat;

            class Fares
            {
                ChatCompletionOptions A()
                {
                    var options = new ChatCompletionOptions { TopP = 0.8f };
                    return options;
                }
            }
            """);
        test.CodeActionEquivalenceKey = Key("SAMP004", RemoveMember, 1);
        test.CodeActionIndex = 1;
        await test.RunAsync();
    }
}
