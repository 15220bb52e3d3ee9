using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.ValueFlow;

/// <summary>Every value flow the extraction pass follows, and the ones it deliberately does not judge.</summary>
public class ValueFlowTests
{
    [Fact]
    public async Task ObjectInitializer_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Flows
            {
                ChatOptions Build() => new ChatOptions { {|SAMP009:Temperature = 1.8f|} };
            }
            """);
    }

    [Fact]
    public async Task LocalCreatedThenMutated_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Flows
            {
                ChatCompletionOptions Build()
                {
                    var options = new ChatCompletionOptions();
                    {|SAMP005:options.Temperature = 2.5f|};
                    options.TopP = 0.9f;
                    return options;
                }
            }
            """);
    }

    [Fact]
    public void LocalCreatedThenMutated_JoinsTheCreation()
    {
        var request = Extract.Single("""
            using OpenAI.Chat;

            class Flows
            {
                ChatCompletionOptions Build()
                {
                    var options = new ChatCompletionOptions { TopP = 0.5f };
                    options.Temperature = 0.3f;
                    return options;
                }
            }
            """);
        Assert.True(request.OriginVisible);
        Assert.Equal((ValueKind.Known, 0.3), request.Setting(Setting.Temperature));
        Assert.Equal((ValueKind.Known, 0.5), request.Setting(Setting.TopP));
    }

    [Fact]
    public async Task StaticAndInstanceFieldInitializers_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Flows
            {
                private static readonly ChatOptions Shared = new ChatOptions { {|SAMP009:Temperature = 1.6f|} };
                private readonly ChatOptions perInstance = new ChatOptions { {|SAMP005:TopP = 1.5f|} };
                public ChatOptions Property { get; } = new ChatOptions { {|SAMP005:TopK = -3|} };
            }
            """);
    }

    [Fact]
    public async Task FieldMutatedInAMethod_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Flows
            {
                private readonly ChatOptions options = new ChatOptions();

                void Tune() => {|SAMP009:options.Temperature = 1.7f|};
            }
            """);
    }

    [Fact]
    public async Task HelperMethodReturningOptions_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            class Flows
            {
                private static ChatOptions Creative() => new ChatOptions { {|SAMP009:Temperature = 1.9f|} };

                Task<ChatResponse> Ask(IChatClient client, string prompt) => client.GetResponseAsync(prompt, Creative());
            }
            """);
    }

    [Fact]
    public async Task ConstAndStaticReadonlyConstants_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Flows
            {
                private const float Wild = 1.9f;
                private static readonly float Wilder = 2.2f;
                private static readonly float Negative = -0.5f;

                ChatOptions A() => new ChatOptions { {|SAMP009:Temperature = Wild|} };
                ChatOptions B() => new ChatOptions { {|SAMP009:Temperature = Wilder|} };
                ChatOptions C() => new ChatOptions { {|SAMP005:Temperature = Negative|} };
            }
            """);
    }

    [Fact]
    public async Task Message_NamesTheConstant()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Flows
            {
                private const float Wild = 2.5f;

                ChatCompletionOptions A() => new ChatCompletionOptions { {|#0:Temperature = Wild|} };
            }
            """,
            Verify.Diagnostic("SAMP005").WithLocation(0).WithMessage(
                "Temperature = 2.5 (from constant 'Wild') is outside the range [0, 2] that openai accepts for temperature (rules table: temperance.provider.openai.temperature.max)"));
    }

    [Fact]
    public async Task ConditionalExpression_JudgesTheWorstBranch()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Flows
            {
                ChatCompletionOptions A(bool playful) => new ChatCompletionOptions { {|#0:Temperature = playful ? 2.5f : 0.2f|} };
            }
            """,
            Verify.Diagnostic("SAMP005").WithLocation(0).WithMessage(
                "Temperature = 2.5 is outside the range [0, 2] that openai accepts for temperature (rules table: temperance.provider.openai.temperature.max) (one branch of a conditional; the worst branch is judged)"));
    }

    [Fact]
    public async Task CoalesceFallback_IsJudged()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Flows
            {
                ChatOptions A(float? configured) => new ChatOptions { {|SAMP009:Temperature = configured ?? 1.8f|} };
            }
            """);
    }

    [Fact]
    public async Task CloneThenMutate_Triggers_AndInheritedValuesAreReportedOnce()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Flows
            {
                ChatOptions A()
                {
                    var baseline = new ChatOptions { {|SAMP009:Temperature = 1.6f|} };
                    var copy = baseline.Clone();
                    {|SAMP005:copy.TopP = 1.2f|};
                    return copy;
                }
            }
            """);
    }

    [Fact]
    public void Clone_InheritsTheOriginalsSettings()
    {
        var requests = Extract.Requests("""
            using Microsoft.Extensions.AI;

            class Flows
            {
                ChatOptions A()
                {
                    var baseline = new ChatOptions { Temperature = 0.2f };
                    var copy = baseline.Clone();
                    copy.TopP = 0.9f;
                    return copy;
                }
            }
            """);
        var copy = requests.Single(r => r.Setting(Setting.TopP).Kind == ValueKind.Known);
        Assert.Equal((ValueKind.Known, 0.2), copy.Setting(Setting.Temperature));
        Assert.True(copy.OriginVisible);
    }

    [Fact]
    public async Task RecordWith_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using LLama.Common;

            class Flows
            {
                InferenceParams A(InferenceParams start) => start with { SamplingPipeline = new LLama.Sampling.DefaultSamplingPipeline { {|SAMP009:Temperature = 1.7f|} } };
            }
            """);
    }

    [Fact]
    public void RecordWith_InheritsFromAVisibleOriginal()
    {
        var requests = Extract.Requests("""
            using Anthropic.Models.Messages;

            class Flows
            {
                MessageCreateParams A()
                {
                    var first = new MessageCreateParams { Model = "claude-haiku-4-5", MaxTokens = 256, Messages = System.Array.Empty<MessageParam>() };
                    var second = first with { MaxTokens = 512 };
                    return second;
                }
            }
            """);
        Assert.Equal(2, requests.Count);
        Assert.All(requests, r => Assert.Equal("claude-haiku-4-5", r.ModelId));
        Assert.All(requests, r => Assert.True(r.OriginVisible));
    }

    [Fact]
    public async Task ParameterAndConfigurationValues_AreUnknown_AndNeverJudged()
    {
        await Verify.AnalyzerAsync("""
            using System;
            using Microsoft.Extensions.AI;

            class Flows
            {
                ChatOptions FromParameter(float temperature) => new ChatOptions { Temperature = temperature };
                ChatOptions FromEnvironment() => new ChatOptions { Temperature = float.Parse(Environment.GetEnvironmentVariable("CHAT_TEMPERATURE") ?? "0") };
                ChatOptions FromLocal(float scale) { var t = scale * 3; return new ChatOptions { Temperature = t }; }
            }
            """);
    }

    [Fact]
    public void ParameterOptionsMutated_HaveUnknownUnwrittenSettings()
    {
        var request = Extract.Single("""
            using Microsoft.Extensions.AI;

            class Flows
            {
                void Tune(ChatOptions options) => options.TopP = 0.8f;
            }
            """);
        Assert.False(request.OriginVisible);
        Assert.Equal(ValueKind.Unknown, request.Setting(Setting.Temperature).Kind);
        Assert.Equal((ValueKind.Known, 0.8), request.Setting(Setting.TopP));
    }

    [Fact]
    public void UnwrittenSettingOfAVisibleCreation_IsUnset()
    {
        var request = Extract.Single("""
            using OpenAI.Chat;

            class Flows
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { TopP = 0.8f };
            }
            """);
        Assert.Equal(ValueKind.Unset, request.Setting(Setting.Temperature).Kind);
    }
}
