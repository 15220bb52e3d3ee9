using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>OpenAI 2.15 <c>ChatCompletionOptions</c> (Chat Completions).</summary>
public class OpenAIChatSurfaceTests
{
    [Fact]
    public async Task TemperatureAboveTwo_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Support
            {
                ChatCompletionOptions Options() => new ChatCompletionOptions { {|SAMP005:Temperature = 2.5f|} };
            }
            """);
    }

    [Fact]
    public async Task TemperatureWithinRange_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Support
            {
                ChatCompletionOptions Options() => new ChatCompletionOptions { Temperature = 0.3f, TopP = 1f, FrequencyPenalty = 0.5f };
            }
            """);
    }

    [Fact]
    public async Task PenaltyAndTopPOutOfRange_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Support
            {
                ChatCompletionOptions Options() => new ChatCompletionOptions
                {
                    {|SAMP005:TopP = 1.2f|},
                    {|SAMP005:PresencePenalty = -2.5f|},
                };
            }
            """);
    }

    [Fact]
    public void Request_CapturesProviderShapeAndSeed()
    {
        var request = Extract.Single("""
            using System;
            using OpenAI.Chat;

            class Invoices
            {
                ChatCompletionOptions Options() => new ChatCompletionOptions
                {
                    Temperature = 0f,
                    Seed = 7,
                    ResponseFormat = ChatResponseFormat.CreateJsonSchemaFormat("invoice", BinaryData.FromString("{}")),
                };
            }
            """);
        Assert.Equal("openai", request.Provider);
        Assert.Equal(ResponseShape.JsonSchema, request.ResponseShape);
        Assert.Equal((ValueKind.Known, 0d), request.Setting(Setting.Temperature));
        Assert.Equal((ValueKind.Known, 7d), request.Setting(Setting.Seed));
        Assert.Equal(ValueKind.Unset, request.Setting(Setting.TopP).Kind);
    }

    [Fact]
    public void Request_RecordsTheSendingCall()
    {
        var request = Extract.Single("""
            using System.Threading.Tasks;
            using OpenAI.Chat;

            class Tickets
            {
                async Task<string> Reply(ChatClient client, string text)
                {
                    var options = new ChatCompletionOptions { Temperature = 0.2f };
                    ChatCompletion completion = await client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(text) }, options);
                    return completion.Content[0].Text;
                }
            }
            """);
        Assert.Equal("CompleteChatAsync", request.SendingCall?.Name);
    }
}
