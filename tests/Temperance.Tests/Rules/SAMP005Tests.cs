using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Rules;

/// <summary>SAMP005: a value outside the provider's accepted range; the fix clamps into the range.</summary>
public class SAMP005Tests
{
    [Fact]
    public async Task Message_NamesValueRangeProviderAndKey()
    {
        await Verify.AnalyzerAsync("""
            using Azure.AI.Inference;

            class Quotes
            {
                ChatCompletionsOptions A() => new ChatCompletionsOptions { {|#0:Temperature = 1.3f|} };
            }
            """,
            Verify.Diagnostic("SAMP005").WithLocation(0).WithMessage(
                "Temperature = 1.3 is outside the range [0, 1] that azure_inference accepts for temperature (rules table: temperance.provider.azure_inference.temperature.max)"));
    }

    [Fact]
    public async Task ValuesAtTheBounds_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { Temperature = 0f, TopP = 1f, FrequencyPenalty = -2f, PresencePenalty = 2f };
            }
            """);
    }

    [Fact]
    public async Task Fix_ClampsTopPAndKeepsComments()
    {
        await Verify.FixAsync("""
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A() => new ChatCompletionOptions
                {
                    // keep this comment
                    {|SAMP005:TopP = /* tuned */ 1.4f|}, // trailing
                };
            }
            """, """
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A() => new ChatCompletionOptions
                {
                    // keep this comment
                    TopP = /* tuned */ 1.0f, // trailing
                };
            }
            """);
    }

    [Fact]
    public async Task Fix_ClampsNegativeTemperatureToZero_WithTheMembersType()
    {
        await Verify.FixAsync("""
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            class Quotes
            {
                OpenAIPromptExecutionSettings A() => new OpenAIPromptExecutionSettings { {|SAMP005:Temperature = -0.4|} };
            }
            """, """
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            class Quotes
            {
                OpenAIPromptExecutionSettings A() => new OpenAIPromptExecutionSettings { Temperature = 0.0 };
            }
            """);
    }

    [Fact]
    public async Task Fix_TemperatureAboveAHighMaximum_WritesTheNeutralValueNotAnExtremeOne()
    {
        // Clamping 2.6 to OpenAI's 2.0 would land on SAMP009; the fix writes 1.0 (no task known) instead.
        await Verify.FixAsync("""
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { {|SAMP005:Temperature = 2.6f|} };
            }
            """, """
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { Temperature = 1.0f };
            }
            """);
    }

    [Fact]
    public async Task Fix_IntegerMember_WritesAnInteger()
    {
        await Verify.FixAsync("""
            using OllamaSharp.Models;

            class Quotes
            {
                RequestOptions A() => new RequestOptions { {|SAMP005:TopK = -5|} };
            }
            """, """
            using OllamaSharp.Models;

            class Quotes
            {
                RequestOptions A() => new RequestOptions { TopK = 0 };
            }
            """);
    }

    [Fact]
    public async Task Fix_ReplacesOnlyTheOffendingBranch()
    {
        await Verify.FixAsync("""
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A(bool strict) => new ChatCompletionOptions { {|SAMP005:TopP = strict ? 0.5f : 1.5f|} };
            }
            """, """
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A(bool strict) => new ChatCompletionOptions { TopP = strict ? 0.5f : 1.0f };
            }
            """);
    }

    [Fact]
    public async Task FixAll_FixesEveryOccurrenceInTheDocument()
    {
        var test = new TemperanceTest("""
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { {|SAMP005:TopP = 1.4f|} };
                ChatCompletionOptions B() => new ChatCompletionOptions { {|SAMP005:TopP = 3f|} };
                ChatCompletionOptions C() => new ChatCompletionOptions { {|SAMP005:FrequencyPenalty = 4f|} };
            }
            """, fixedSource: """
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { TopP = 1.0f };
                ChatCompletionOptions B() => new ChatCompletionOptions { TopP = 1.0f };
                ChatCompletionOptions C() => new ChatCompletionOptions { FrequencyPenalty = 2.0f };
            }
            """);
        test.CodeActionEquivalenceKey = Temperance.Rules.FixProperties.PrimaryKey;
        test.NumberOfFixAllIterations = 1;
        await test.RunAsync();
    }

    [Fact]
    public async Task TeamEditorConfig_OverridesTheTable()
    {
        // A team on a gateway that caps temperature at 1.2 for OpenAI models.
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Quotes
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { {|SAMP005:Temperature = 1.4f|} };
            }
            """, "temperance.provider.openai.temperature.max = 1.2\n");
    }

    // Severity from .editorconfig (dotnet_diagnostic.SAMP005.severity = error) is checked with the real compiler in
    // EndToEnd/PackageEndToEndTests, where it must break the build.
}
