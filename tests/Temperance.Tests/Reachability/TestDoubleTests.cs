using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Reachability;

/// <summary>
/// A request sent only to a test double is silent for every rule: mocking libraries' proxies, clients declared in the
/// project (in another file, held in a field set in the constructor, in a fixture, behind a builder), SDK clients over a
/// canned transport. The twin sent to a real client still triggers.
/// </summary>
public class TestDoubleTests
{
    private const string FakeClient = """
        using System;
        using System.Collections.Generic;
        using System.Runtime.CompilerServices;
        using System.Threading;
        using System.Threading.Tasks;
        using Microsoft.Extensions.AI;

        namespace Ferry.Tests.Doubles;

        public sealed class RecordingChatClient : IChatClient
        {
            public List<ChatOptions?> Seen { get; } = new();

            public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
            {
                Seen.Add(options);
                return Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, "09:40")));
            }

            public async IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null,
                [EnumeratorCancellation] CancellationToken cancellationToken = default)
            {
                await Task.Yield();
                yield return new ChatResponseUpdate(ChatRole.Assistant, "09:40");
            }

            public object? GetService(Type serviceType, object? serviceKey = null) => null;

            public void Dispose() { }
        }
        """;

    private const string CannedHandler = """
        using System.Net;
        using System.Net.Http;
        using System.Threading;
        using System.Threading.Tasks;

        namespace Ferry.Tests.Doubles;

        public sealed class CannedReplyHandler : HttpMessageHandler
        {
            private readonly string json;

            public CannedReplyHandler(string json) => this.json = json;

            protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken) =>
                Task.FromResult(new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(json) });
        }
        """;

    [Fact]
    public async Task MoqProxy_TelemetryMarkerValues_AreSilent()
    {
        await Verify.AnalyzerAsync("""
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Moq;
            using Xunit;

            public class SamplingTagTests
            {
                [Fact]
                public async Task TopP_IsRecordedAsATag()
                {
                    var mock = new Mock<IChatClient>();
                    mock.Setup(c => c.GetResponseAsync(It.IsAny<IEnumerable<ChatMessage>>(), It.IsAny<ChatOptions>(), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(new ChatResponse(new ChatMessage(ChatRole.Assistant, "ok")));
                    var options = new ChatOptions { Temperature = 42f, TopP = 100f };
                    var response = await mock.Object.GetResponseAsync("ping", options);
                    Assert.Equal("ok", response.Text);
                    mock.Verify(c => c.GetResponseAsync(It.IsAny<IEnumerable<ChatMessage>>(), options, It.IsAny<CancellationToken>()), Times.Once());
                }
            }
            """);
    }

    [Fact]
    public async Task NSubstituteAndFakeItEasyDoubles_AreSilent()
    {
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using FakeItEasy;
            using Microsoft.Extensions.AI;
            using NSubstitute;
            using Xunit;

            public class QuayTests
            {
                [Fact]
                public async Task Substitute_Answers()
                {
                    var client = Substitute.For<IChatClient>();
                    var response = await client.GetResponseAsync("Which quay?", new ChatOptions { Temperature = 2.6f });
                    Assert.Equal("", response?.Text ?? "");
                }

                [Fact]
                public async Task Fake_Answers()
                {
                    var client = A.Fake<IChatClient>();
                    var options = new ChatOptions { Temperature = 0.9f, TopP = 0.4f };
                    var response = await client.GetResponseAsync("Which quay?", options);
                    Assert.Equal("", response?.Text ?? "");
                }
            }
            """);
    }

    [Fact]
    public async Task FakeClientInAnotherFile_HeldInAFieldSetInTheConstructor_IsSilent()
    {
        await Verify.ProjectAsync(new[]
        {
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Ferry.Tests.Doubles;
            using Xunit;

            namespace Ferry.Tests;

            public class DepartureBoardTests
            {
                private readonly IChatClient client;

                public DepartureBoardTests()
                {
                    client = new RecordingChatClient();
                }

                [Fact]
                public async Task Board_ShowsTheFirstSailing()
                {
                    var response = await client.GetResponseAsync("First sailing?", new ChatOptions { Temperature = 1.9f, TopP = 0.3f });
                    Assert.Equal("09:40", response.Text);
                }
            }
            """,
            FakeClient,
        }, null);
    }

    [Fact]
    public async Task FakeClientBehindABuilderAndAFixture_IsSilent()
    {
        await Verify.ProjectAsync(new[]
        {
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Ferry.Tests.Doubles;
            using Xunit;

            namespace Ferry.Tests;

            public sealed class ChatFixture
            {
                public IChatClient Client { get; } = new ChatClientBuilder(new RecordingChatClient()).UseFunctionInvocation().Build();
            }

            public class TideTableTests : IClassFixture<ChatFixture>
            {
                private readonly IChatClient client;

                public TideTableTests(ChatFixture fixture) => client = fixture.Client;

                [Fact]
                public async Task HighTide_IsQuoted()
                {
                    var response = await client.GetResponseAsync("High tide?");
                    Assert.Equal("09:40", response.Text);
                }

                [Fact]
                public async Task Builder_InTheTest()
                {
                    var built = new ChatClientBuilder(new RecordingChatClient()).Build();
                    var response = await built.GetResponseAsync("Low tide?", new ChatOptions { Temperature = 0.7f });
                    Assert.Equal("09:40", response.Text);
                }
            }
            """,
            FakeClient,
        }, null);
    }

    [Fact]
    public async Task SdkClientOverACannedHandlerInAnotherFile_IsSilent()
    {
        await Verify.ProjectAsync(new[]
        {
            """
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Net.Http;
            using OpenAI;
            using OpenAI.Chat;
            using Ferry.Tests.Doubles;
            using Xunit;

            namespace Ferry.Tests;

            public class FareQuoteTests
            {
                private static ChatClient CreateClient(string json) =>
                    new ChatClient("gpt-4o-mini", new ApiKeyCredential("test"),
                        new OpenAIClientOptions { Transport = new HttpClientPipelineTransport(new HttpClient(new CannedReplyHandler(json))) });

                [Fact]
                public void Fare_IsParsed()
                {
                    var client = CreateClient("{\"choices\":[]}");
                    var options = new ChatCompletionOptions { Temperature = 2.5f };
                    ChatCompletion completion = client.CompleteChat(new ChatMessage[] { new UserChatMessage("Fare to Farrow?") }, options);
                    Assert.Equal("12.50", completion.Content[0].Text);
                }
            }
            """,
            CannedHandler,
        }, null);
    }

    [Fact]
    public async Task RealClientInATest_StillTriggers()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            public class LiveFareTests
            {
                private readonly IChatClient client;

                public LiveFareTests()
                {
                    client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("key")).AsIChatClient();
                }

                [Fact]
                public async Task Fare_IsQuoted()
                {
                    var response = await {|SAMP002:client.GetResponseAsync("Fare to Farrow? Reply with the amount only.")|};
                    Assert.Equal("12.50", response.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task ProductClientOverANonGenerativeService_IsSilent_ButADecoratorOfARealClientTriggers()
    {
        // A chat interface the team put over its tide tables samples nothing; a logging decorator over OpenAI does.
        await Verify.ProjectAsync(new[]
        {
            """
            using System;
            using System.Collections.Generic;
            using System.Runtime.CompilerServices;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Ferry.Desk;

            public sealed class TideTable
            {
                public string HighWater(string port) => port + ": 09:40";
            }

            public sealed class TideTableChatClient : IChatClient
            {
                private readonly TideTable table;

                public TideTableChatClient(TideTable table) => this.table = table;

                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, table.HighWater("Farrow"))));

                public async IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null,
                    [EnumeratorCancellation] CancellationToken cancellationToken = default)
                {
                    await Task.Yield();
                    yield return new ChatResponseUpdate(ChatRole.Assistant, table.HighWater("Farrow"));
                }

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose() { }
            }

            public sealed class LoggingChatClient : DelegatingChatClient
            {
                public LoggingChatClient(IChatClient inner) : base(inner) { }
            }
            """,
            """
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;

            namespace Ferry.Desk;

            public class Desk
            {
                private readonly IChatClient tides = new TideTableChatClient(new TideTable());
                private readonly IChatClient live = new LoggingChatClient(new ChatClient("gpt-4o-mini", new ApiKeyCredential("key")).AsIChatClient());

                public Task<ChatResponse> HighWater(string question) => tides.GetResponseAsync(question, new ChatOptions { Temperature = 1.9f });

                public Task<ChatResponse> Chat(string question) => live.GetResponseAsync(question, new ChatOptions { {|SAMP009:Temperature = 1.9f|} });
            }
            """,
        }, null);
    }
}
