using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>Anthropic 13.x <c>MessageCreateParams</c>: recognised as a request, with no sampling members to judge.</summary>
public class AnthropicSurfaceTests
{
    private const string Source = """
        using Anthropic.Models.Messages;

        class Claims
        {
            MessageCreateParams Params() => new MessageCreateParams
            {
                Model = "claude-sonnet-4-5",
                MaxTokens = 1024,
                Messages = System.Array.Empty<MessageParam>(),
            };
        }
        """;

    [Fact]
    public void Request_IsRecognisedWithModel()
    {
        var request = Extract.Single(Source);
        Assert.Equal("anthropic", request.Provider);
        Assert.Equal("claude-sonnet-4-5", request.ModelId);
        Assert.Equal(ValueKind.Unset, request.Setting(Setting.Temperature).Kind);
    }

    [Fact]
    public async Task NoSamplingMembers_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync(Source);
    }
}
