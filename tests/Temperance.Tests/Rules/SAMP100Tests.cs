using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Rules;

/// <summary>SAMP100: bad configuration names the key and the value; the rule that needs it stays silent.</summary>
public class SAMP100Tests
{
    private const string Source = """
        using OpenAI.Chat;

        class Settings
        {
            ChatCompletionOptions A() => {|#0:new ChatCompletionOptions { Temperature = 1.7f }|};
        }
        """;

    [Fact]
    public async Task NonNumericThreshold_Triggers_AndSAMP009IsSkipped()
    {
        await Verify.AnalyzerAsync(Source, "temperance.extreme_temperature = hot\n",
            Verify.Diagnostic("SAMP100").WithLocation(0).WithMessage(
                "Temperance configuration 'temperance.extreme_temperature' has the value 'hot'; expected a number such as 1.5 (invariant culture, '.' as decimal separator). The rule that needs it is skipped until this is fixed."));
    }

    [Fact]
    public async Task UnknownTaskKind_Triggers()
    {
        await Verify.AnalyzerAsync(Source, "temperance.task = poetry\n",
            Verify.Diagnostic("SAMP100").WithLocation(0).WithMessage(
                "Temperance configuration 'temperance.task' has the value 'poetry'; expected one of extraction, classification, code, evaluation, tool_use, summarization, translation, conversation, creative, brainstorming. The rule that needs it is skipped until this is fixed."),
            Verify.Diagnostic("SAMP009").WithSpan(5, 62, 5, 80));
    }

    [Fact]
    public async Task InvertedRange_Triggers_AndTheRangeIsNotUsed()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Settings
            {
                ChatCompletionOptions A() => {|#0:new ChatCompletionOptions { TopP = 1.4f }|};
            }
            """, "temperance.provider.openai.top_p.min = 1.5\n",
            Verify.Diagnostic("SAMP100").WithLocation(0).WithMessage(
                "Temperance configuration 'temperance.provider.openai.top_p.min' has the value '1.5'; expected a value no greater than 'temperance.provider.openai.top_p.max' (1). The rule that needs it is skipped until this is fixed."));
    }

    [Fact]
    public async Task ValidConfiguration_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Settings
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { Temperature = 0.2f };
            }
            """, "temperance.task = extraction\ntemperance.extreme_temperature = 1.4\n");
    }
}
