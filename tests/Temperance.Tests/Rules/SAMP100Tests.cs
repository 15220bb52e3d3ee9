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

    [Fact]
    public async Task MisspeltTaskKind_SuggestsTheNearestKind_AndNoOtherSignalDecidesTheTask()
    {
        // The method name says extraction, but the team wrote a task Temperance cannot read: SAMP001 waits for the fix.
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Settings
            {
                ChatCompletionOptions ExtractCrew() => {|#0:new ChatCompletionOptions { Temperature = 0.9f }|};
            }
            """, "temperance.task = extraktion\n",
            Verify.Diagnostic("SAMP100").WithLocation(0).WithMessage(
                "Temperance configuration 'temperance.task' has the value 'extraktion'; expected one of extraction, classification, code, evaluation, tool_use, summarization, translation, conversation, creative, brainstorming (did you mean 'extraction'?). The rule that needs it is skipped until this is fixed."));
    }

    [Fact]
    public async Task NonNumericTestSeed_TheFixSetsTemperatureOnly_AndWritesNoStandInSeed()
    {
        const string Test = """
            using System.ClientModel;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            public class PierTests
            {
                private static readonly ChatClient Client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("key"));

                [Fact]
                public async Task Pier_IsStable()
                {
                    var options = {|#1:new ChatCompletionOptions { Temperature = 0.7f }|};
                    var completion = await {|#0:Client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage("Pier?") }, options)|};
                    Assert.Equal("4", completion.Value.Content[0].Text);
                }
            }
            """;
        const string Fixed = """
            using System.ClientModel;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            public class PierTests
            {
                private static readonly ChatClient Client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("key"));

                [Fact]
                public async Task Pier_IsStable()
                {
                    var options = {|#1:new ChatCompletionOptions { Temperature = 0.0f }|};
                    var completion = await Client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage("Pier?") }, options);
                    Assert.Equal("4", completion.Value.Content[0].Text);
                }
            }
            """;
        var test = new TemperanceTest(Test, "temperance.test_seed = forty-two\n", Fixed);
        test.ExpectedDiagnostics.Add(Verify.Diagnostic("SAMP002").WithLocation(0));
        test.ExpectedDiagnostics.Add(Verify.Diagnostic("SAMP100").WithLocation(1).WithMessage(
            "Temperance configuration 'temperance.test_seed' has the value 'forty-two'; expected a number such as 1.5 (invariant culture, '.' as decimal separator). The rule that needs it is skipped until this is fixed."));
        // After the fix: temperature 0 and still no seed, so SAMP003 asks for one, with no fix to offer.
        test.FixedState.ExpectedDiagnostics.Add(Verify.Diagnostic("SAMP003").WithLocation(1));
        test.FixedState.ExpectedDiagnostics.Add(Verify.Diagnostic("SAMP100").WithLocation(1));
        await test.RunAsync();
    }

    [Fact]
    public async Task MisspeltKey_IsReportedAtItsLineInTheConfigFile_WithASuggestion()
    {
        const string EditorConfig = "root = true\n\n[*.cs]\ntemperance.extreme_temprature = 1.3\n";
        var test = new TemperanceTest("""
            using OpenAI.Chat;

            class Settings
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { Temperature = 0.2f };
            }
            """);
        test.TestState.AnalyzerConfigFiles.Add(("/.editorconfig", EditorConfig));
        test.TestState.AdditionalFiles.Add(("/.editorconfig", EditorConfig));
        test.ExpectedDiagnostics.Add(Verify.Diagnostic("SAMP100").WithSpan("/.editorconfig", 4, 1, 4, 36).WithMessage(
            "Temperance configuration 'temperance.extreme_temprature' has the value '1.3'; expected a key Temperance knows (did you mean 'temperance.extreme_temperature'?) (a misspelt key is ignored until fixed; see the README's Configuration section). The rule that needs it is skipped until this is fixed."));
        await test.RunAsync();
    }
}
