using Temperance.Tests.Infrastructure;
using static Temperance.Rules.FixProperties;

namespace Temperance.Tests.Rules;

/// <summary>SAMP002: random sampling where a test compares the model's exact output, across frameworks and assertion libraries.</summary>
public class SAMP002Tests
{
    // ---- every framework and assertion family ----------------------------------------------------------------------

    [Fact]
    public async Task XunitAssertEqual_OnOpenAIText_Triggers_WithMessage()
    {
        await Verify.AnalyzerAsync("""
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            public class GreetingTests
            {
                private readonly ChatClient chat = new ChatClient("gpt-4o-mini", "key");

                [Fact]
                public async Task Greeting_IsStable()
                {
                    var options = new ChatCompletionOptions { Temperature = 0.7f };
                    ChatCompletion completion = await {|#0:chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Greet a passenger.") }, options)|};
                    Assert.Equal("Welcome aboard!", completion.Content[0].Text);
                }
            }
            """,
            Verify.Diagnostic("SAMP002").WithLocation(0).WithMessage(
                "The test compares this model output exactly (Assert.Equal in 'Greeting_IsStable') but sampling is random (temperature 0.7); the test passes or fails by chance"));
    }

    [Fact]
    public async Task NUnitIsEqualToAndClassicAreEqual_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using NUnit.Framework;
            using NUnit.Framework.Legacy;

            public class RouteTests
            {
                private IChatClient client = null!;

                [Test]
                public async Task Route_IsStable()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Which pier for the 9:40?", new ChatOptions { MaxOutputTokens = 20 })|};
                    Assert.That(response.Text, Is.EqualTo("Pier 4"));
                }

                [TestCase("Pier 4")]
                public async Task Route_Classic(string expected)
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Which pier?", new ChatOptions { Temperature = 0.4f })|};
                    ClassicAssert.AreEqual(expected, response.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task MSTestAreEqual_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Microsoft.VisualStudio.TestTools.UnitTesting;

            [TestClass]
            public class FareTests
            {
                private IChatClient client = null!;

                [TestMethod]
                public async Task Fare_IsStable()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Fare class for seat 12A?", new ChatOptions { Temperature = 1f })|};
                    var answer = response.Text.Trim();
                    Assert.AreEqual("economy", answer);
                }
            }
            """);
    }

    [Fact]
    public async Task AwesomeAndFluentAssertionsAndShouldly_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using System.Text.Json;
            using System.Threading.Tasks;
            using AwesomeAssertions;
            using Microsoft.Extensions.AI;
            using Shouldly;
            using Xunit;

            public record Cabin(string Deck, int Number);

            public class CabinTests
            {
                private IChatClient client = null!;

                [Fact]
                public async Task Awesome()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Cabin for Ms. Ortega?", new ChatOptions { Temperature = 0.5f })|};
                    response.Text.Should().Be("B-12");
                }

                [Fact]
                public async Task Deserialised()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Cabin as JSON", new ChatOptions { Temperature = 0.5f })|};
                    var cabin = JsonSerializer.Deserialize<Cabin>(response.Text);
                    cabin.Should().BeEquivalentTo(new Cabin("B", 12));
                }

                [Fact]
                public async Task Shouldly()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Deck?", new ChatOptions { Temperature = 0.5f })|};
                    response.Text.ShouldBe("B");
                }
            }
            """);
    }

    [Fact]
    public async Task FluentAssertionsAndSnapshot_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using FluentAssertions;
            using Microsoft.Extensions.AI;
            using Snapshooter.Xunit;
            using Xunit;

            public class NoticeTests
            {
                private IChatClient client = null!;

                [Theory]
                [InlineData("fog")]
                public async Task Fluent(string weather)
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Notice for " + weather, new ChatOptions { Temperature = 0.3f })|};
                    response.Text.Should().Be("Sailings delayed.");
                }

                [Fact]
                public async Task Snapshot_Of_Notice()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Notice", new ChatOptions { Temperature = 0.3f })|};
                    Snapshot.Match(response.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task HelperCalledFromATest_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class HelperTests
            {
                private IChatClient client = null!;

                [Fact]
                public Task Answer_IsStable() => AskAndCompare("Departure time?", "09:40");

                private async Task AskAndCompare(string question, string expected)
                {
                    var response = await {|SAMP002:client.GetResponseAsync(question, new ChatOptions { Temperature = 0.9f })|};
                    Assert.Equal(expected, response.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task TeamTestAttribute_FromEditorConfig_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public sealed class IntegrationFactAttribute : Attribute { }

            public class Integration
            {
                private IChatClient client = null!;

                [IntegrationFact]
                public async Task Answer()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Gate?", new ChatOptions { Temperature = 0.9f })|};
                    Assert.Equal("B", response.Text);
                }
            }
            """, "temperance.test_attributes = IntegrationFact\n");
    }

    [Fact]
    public async Task Anthropic_MessageSaysNoSeedIsAvailable()
    {
        await Verify.AnalyzerAsync("""
            using System;
            using System.Linq;
            using System.Threading.Tasks;
            using Anthropic;
            using Anthropic.Models.Messages;
            using Xunit;

            public class ClaimTests
            {
                private AnthropicClient client = null!;

                [Fact]
                public async Task Claim_IsStable()
                {
                    var parameters = new MessageCreateParams { Model = "claude-haiku-4-5", MaxTokens = 64, Messages = Array.Empty<MessageParam>() };
                    Message message = await {|#0:client.Messages.Create(parameters)|};
                    Assert.Equal("approved", message.Content.First().ToString());
                }
            }
            """,
            Verify.Diagnostic("SAMP002").WithLocation(0).WithMessage(
                "The test compares this model output exactly (Assert.Equal in 'Claim_IsStable') but sampling is random (temperature unset, so anthropic's default 1 applies; MessageCreateParams has no seed, so even temperature 0 is only best effort); the test passes or fails by chance"));
    }

    // ---- silence --------------------------------------------------------------------------------------------------

    [Fact]
    public async Task TolerantAssertions_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class TolerantTests
            {
                private IChatClient client = null!;

                [Fact]
                public async Task Tolerant()
                {
                    var response = await client.GetResponseAsync("Departure?", new ChatOptions { Temperature = 0.9f });
                    Assert.Contains("09:40", response.Text);
                    Assert.StartsWith("The", response.Text);
                    Assert.Matches("[0-9]{2}:[0-9]{2}", response.Text);
                    Assert.NotEqual("", response.Text);
                    Assert.True(response.Text.Length < 200);
                }
            }
            """);
    }

    [Fact]
    public async Task FakeClientDeclaredInTheTests_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public sealed class CannedChatClient : IChatClient
            {
                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, "Pier 4")));
                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();
                public object? GetService(Type serviceType, object? serviceKey = null) => null;
                public void Dispose() { }
            }

            public class RoutingTests
            {
                [Fact]
                public async Task Router_UsesTheAnswer()
                {
                    IChatClient client = new CannedChatClient();
                    var response = await client.GetResponseAsync("Which pier?", new ChatOptions { Temperature = 0.9f });
                    Assert.Equal("Pier 4", response.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task TwoOutputsComparedByACacheTest_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class CacheTests
            {
                private IChatClient cached = null!;

                [Fact]
                public async Task SecondCall_IsServedFromCache()
                {
                    var first = await cached.GetResponseAsync("Timetable?", new ChatOptions { Temperature = 0.9f });
                    var second = await cached.GetResponseAsync("Timetable?", new ChatOptions { Temperature = 0.9f });
                    Assert.Equal(first.Text, second.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task OutputsAssertedToDiffer_AndGreedyOrUnknownTemperature_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class VarietyTests
            {
                private IChatClient client = null!;

                [Fact]
                public async Task Taglines_Differ()
                {
                    var a = await client.GetResponseAsync("Tagline", new ChatOptions { Temperature = 1.2f });
                    Assert.NotEqual("Sail with us", a.Text);
                }

                [Fact]
                public async Task Greedy_IsSAMP003sCase()
                {
                    var r = await client.GetResponseAsync("Deck?", {|SAMP003:new ChatOptions { Temperature = 0f }|});
                    Assert.Equal("B", r.Text);
                }

                [Theory]
                [InlineData(0.5f)]
                public async Task Unknown(float t)
                {
                    var r = await client.GetResponseAsync("Deck?", new ChatOptions { Temperature = t });
                    Assert.Equal("B", r.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task ExactComparisonOutsideATest_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class Router
            {
                public async Task<bool> IsPierFour(IChatClient client)
                {
                    var response = await client.GetResponseAsync("Which pier?", new ChatOptions { Temperature = 0.9f });
                    Assert.Equal("Pier 4", response.Text);
                    return true;
                }
            }
            """);
    }

    // ---- fixes -----------------------------------------------------------------------------------------------------

    [Fact]
    public async Task Fix_SetsTemperatureAndSeed_OnChatOptions()
    {
        await Verify.FixAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class DeckTests
            {
                private IChatClient client = null!;

                [Fact]
                public async Task Deck()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Deck?", new ChatOptions { Temperature = 0.8f })|};
                    Assert.Equal("B", response.Text);
                }
            }
            """, """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class DeckTests
            {
                private IChatClient client = null!;

                [Fact]
                public async Task Deck()
                {
                    var response = await client.GetResponseAsync("Deck?", new ChatOptions { Temperature = 0.0f, Seed = 42L });
                    Assert.Equal("B", response.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task Fix_OpenAISeedIsExperimental_TheFixedCodeStillCompiles()
    {
        // OPENAI001 is an error by default and not suppressed here: the pragma the fix adds is what makes this compile.
        var test = new TemperanceTest("""
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            public class GreetingTests
            {
                private readonly ChatClient chat = new ChatClient("gpt-4o-mini", "key");

                [Fact]
                public async Task Greeting_IsStable()
                {
                    var options = new ChatCompletionOptions { Temperature = 0.7f };
                    ChatCompletion completion = await {|SAMP002:chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Greet a passenger.") }, options)|};
                    Assert.Equal("Welcome aboard!", completion.Content[0].Text);
                }
            }
            """, fixedSource: """
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            public class GreetingTests
            {
                private readonly ChatClient chat = new ChatClient("gpt-4o-mini", "key");

                [Fact]
                public async Task Greeting_IsStable()
                {
                    #pragma warning disable OPENAI001 // OPENAI001: the SDK marks this member experimental; set for reproducible runs
                    var options = new ChatCompletionOptions { Temperature = 0.0f, Seed = 42L };
                    #pragma warning restore OPENAI001
                    ChatCompletion completion = await chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Greet a passenger.") }, options);
                    Assert.Equal("Welcome aboard!", completion.Content[0].Text);
                }
            }
            """, suppressSdkExperimental: false);
        await test.RunAsync();
    }

    [Fact]
    public async Task Fix_NoOptionsPassed_PassesTemperatureAndSeed()
    {
        await Verify.FixAsync("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class DeckTests
            {
                private IChatClient client = null!;

                [Fact]
                public async Task Deck()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Deck?")|};
                    Assert.Equal("B", response.Text);
                }
            }
            """, """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class DeckTests
            {
                private IChatClient client = null!;

                [Fact]
                public async Task Deck()
                {
                    var response = await client.GetResponseAsync("Deck?", options: new ChatOptions { Temperature = 0.0f, Seed = 42L });
                    Assert.Equal("B", response.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task Fix_OllamaSeedIsAnInt()
    {
        await Verify.FixAsync("""
            using System.Threading.Tasks;
            using OllamaSharp;
            using OllamaSharp.Models;
            using OllamaSharp.Models.Chat;
            using Xunit;

            public class LocalTests
            {
                private IOllamaApiClient ollama = null!;

                [Fact]
                public async Task Answer()
                {
                    var request = new ChatRequest { Model = "llama3.2", Options = new RequestOptions { Temperature = 0.8f } };
                    var text = "";
                    await foreach (var chunk in {|SAMP002:ollama.ChatAsync(request)|}) { text += chunk?.Message.Content; }
                    Assert.Equal("Pier 4", text);
                }
            }
            """, """
            using System.Threading.Tasks;
            using OllamaSharp;
            using OllamaSharp.Models;
            using OllamaSharp.Models.Chat;
            using Xunit;

            public class LocalTests
            {
                private IOllamaApiClient ollama = null!;

                [Fact]
                public async Task Answer()
                {
                    var request = new ChatRequest { Model = "llama3.2", Options = new RequestOptions { Temperature = 0.0f, Seed = 42 } };
                    var text = "";
                    await foreach (var chunk in ollama.ChatAsync(request)) { text += chunk?.Message.Content; }
                    Assert.Equal("Pier 4", text);
                }
            }
            """);
    }

    [Fact]
    public async Task FixAll_FixesEveryTestInTheFile()
    {
        var test = new TemperanceTest("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class DeckTests
            {
                private IChatClient client = null!;

                [Fact]
                public async Task A() => Assert.Equal("B", (await {|SAMP002:client.GetResponseAsync("Deck?", new ChatOptions { Temperature = 0.8f })|}).Text);

                [Fact]
                public async Task B() => Assert.Equal("C", (await {|SAMP002:client.GetResponseAsync("Deck?", new ChatOptions())|}).Text);
            }
            """, fixedSource: """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            public class DeckTests
            {
                private IChatClient client = null!;

                [Fact]
                public async Task A() => Assert.Equal("B", (await client.GetResponseAsync("Deck?", new ChatOptions { Temperature = 0.0f, Seed = 42L })).Text);

                [Fact]
                public async Task B() => Assert.Equal("C", (await client.GetResponseAsync("Deck?", new ChatOptions { Temperature = 0.0f, Seed = 42L })).Text);
            }
            """);
        test.CodeActionEquivalenceKey = PrimaryKey;
        test.NumberOfFixAllIterations = 1;
        await test.RunAsync();
    }
}
