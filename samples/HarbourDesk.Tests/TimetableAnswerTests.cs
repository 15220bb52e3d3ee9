using System.ClientModel;
using Microsoft.Extensions.AI;
using OpenAI.Chat;
using Xunit;

namespace HarbourDesk.Tests;

/// <summary>Tests a team wrote against the live model; two of them pass or fail by chance.</summary>
public class TimetableAnswerTests
{
    private static readonly IChatClient Client =
        new ChatClient("gpt-4o-mini", new ApiKeyCredential(Environment.GetEnvironmentVariable("HARBOUR_KEY") ?? "unset")).AsIChatClient();

    // SAMP002: temperature unset, exact comparison.
    [Fact]
    public async Task NextSailing_IsQuotedExactly()
    {
        var response = await Client.GetResponseAsync("When is the next sailing to Farrow Island? Reply with the time only.");
        Assert.Equal("09:40", response.Text);
    }

    // SAMP003: greedy, but no seed.
    [Fact]
    public async Task PierNumber_IsStable()
    {
        var options = new ChatOptions { Temperature = 0f };
        var response = await Client.GetResponseAsync("Which pier does the 09:40 leave from? Reply with the number only.", options);
        Assert.Equal("4", response.Text);
    }

    // Silent: a tolerant assertion.
    [Fact]
    public async Task Greeting_MentionsTheHarbour()
    {
        var response = await Client.GetResponseAsync("Greet a passenger arriving at Farrow harbour.", new ChatOptions { Temperature = 0.8f });
        Assert.Contains("harbour", response.Text, StringComparison.OrdinalIgnoreCase);
    }
}
