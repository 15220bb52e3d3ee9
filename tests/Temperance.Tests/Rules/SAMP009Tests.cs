using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Rules;

/// <summary>SAMP009: temperature above <c>temperance.extreme_temperature</c> (1.5 by default).</summary>
public class SAMP009Tests
{
    [Fact]
    public async Task Message_NamesThresholdAndKey()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Slogans
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { {|#0:Temperature = 1.7f|} };
            }
            """,
            Verify.Diagnostic("SAMP009").WithLocation(0).WithMessage(
                "Temperature 1.7 is above 1.5 (temperance.extreme_temperature): sampling this flat drifts toward random tokens"));
    }

    [Fact]
    public async Task AtTheThreshold_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Slogans
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { Temperature = 1.5f };
                ChatCompletionOptions B() => new ChatCompletionOptions { Temperature = 1.2f };
            }
            """);
    }

    [Fact]
    public async Task OutOfRangeValue_IsSAMP005Only()
    {
        // Precedence: one mistake, one warning.
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Slogans
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { {|SAMP005:Temperature = 2.4f|} };
            }
            """);
    }

    [Fact]
    public async Task ThresholdFromEditorConfig_IsHonoured()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Slogans
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { {|SAMP009:Temperature = 1.3f|} };
                ChatCompletionOptions B() => new ChatCompletionOptions { Temperature = 1.2f };
            }
            """, "temperance.extreme_temperature = 1.25\n");
    }

    [Fact]
    public async Task Fix_SetsNeutralTemperature_WhenNoTaskIsKnown()
    {
        await Verify.FixAsync("""
            using Microsoft.Extensions.AI;

            class Slogans
            {
                ChatOptions A() => new ChatOptions { {|SAMP009:Temperature = 1.9f|} };
            }
            """, """
            using Microsoft.Extensions.AI;

            class Slogans
            {
                ChatOptions A() => new ChatOptions { Temperature = 1.0f };
            }
            """);
    }

    [Fact]
    public async Task Fix_SetsTheTasksTableValue_WhenTheFileHasATask()
    {
        await Verify.FixAsync("""
            using Microsoft.Extensions.AI;

            class Slogans
            {
                ChatOptions A() => new ChatOptions { {|SAMP009:Temperature = 1.9f|} };
            }
            """, """
            using Microsoft.Extensions.AI;

            class Slogans
            {
                ChatOptions A() => new ChatOptions { Temperature = 0.9f };
            }
            """, "temperance.task = creative\ntemperance.task.creative.temperature = 0.9\n");
    }

    [Fact]
    public async Task Fix_OnABagKey_WritesADouble()
    {
        await Verify.FixAsync("""
            using System.Collections.Generic;
            using Microsoft.SemanticKernel;

            class Slogans
            {
                PromptExecutionSettings A() => new PromptExecutionSettings { ExtensionData = new Dictionary<string, object> { {|SAMP009:["temperature"] = 2|} } };
            }
            """, """
            using System.Collections.Generic;
            using Microsoft.SemanticKernel;

            class Slogans
            {
                PromptExecutionSettings A() => new PromptExecutionSettings { ExtensionData = new Dictionary<string, object> { ["temperature"] = 1.0 } };
            }
            """);
    }

    [Fact]
    public async Task Fix_OnSearchOption_Compiles()
    {
        await Verify.FixAsync("""
            using Microsoft.ML.OnnxRuntimeGenAI;

            class Slogans
            {
                void A(GeneratorParams p) => {|SAMP009:p.SetSearchOption("temperature", 1.8)|};
            }
            """, """
            using Microsoft.ML.OnnxRuntimeGenAI;

            class Slogans
            {
                void A(GeneratorParams p) => p.SetSearchOption("temperature", 1.0);
            }
            """);
    }
}
