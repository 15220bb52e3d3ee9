using static Temperance.Tests.Precision.ExpectedFinding;
using static Temperance.Tests.Precision.PrecisionCase;
using Temperance.Tests.Precision;

namespace Temperance.Tests.HeldOut;

/// <summary>
/// A held-out precision corpus, written without reading the analyzer or the other corpora, that imitates the shapes
/// of real public .NET LLM code bases in scenarios of its own (a tram operator, a seed library, a climbing gym, a kite
/// festival). Expected findings were decided by hand from the principle "judge only what reaches a model":
/// requests sent to stubs, mocks, fakes and canned transports, or settings only serialised, mapped or traced, are
/// silent; samples, integration tests and product code that really call a model keep their findings.
/// Shapes modelled on (read from the repositories' own files):
/// - microsoft/semantic-kernel: dotnet/src/Connectors/Connectors.OpenAI.UnitTests/Services/OpenAIChatCompletionServiceTests.cs,
///   Connectors.AzureOpenAI.UnitTests/Services/AzureOpenAIChatCompletionServiceTests.cs, InternalUtilities/test/HttpMessageHandlerStub.cs,
///   MultipleHttpMessageHandlerStub.cs, Settings/OpenAIPromptExecutionSettingsTests.cs,
///   IntegrationTests/Connectors/OpenAI/OpenAIChatCompletion_NonStreamingTests.cs and OpenAIChatCompletionTests.cs,
///   samples/Concepts/ChatCompletion/ChatHistoryAuthorName.cs, TextGeneration/OpenAI_TextGenerationStreaming.cs;
/// - dotnet/extensions: test/Libraries/Microsoft.Extensions.AI.Abstractions.Tests/TestChatClient.cs,
///   Microsoft.Extensions.AI.Integration.Tests/VerbatimHttpHandler.cs and ChatClientIntegrationTests.cs,
///   Microsoft.Extensions.AI.OpenAI.Tests/OpenAIChatClientTests.cs (RawRepresentationFactory), OpenAIChatClientIntegrationTests.cs,
///   Microsoft.Extensions.AI.Tests/ChatCompletion/OpenTelemetryChatClientTests.cs;
/// - openai/openai-dotnet: tests/Chat/ChatMockTests.cs (GetClientOptionsWithMockResponse), tests/Chat/ChatTests.cs,
///   examples/Chat/Example06_StructuredOutputs.cs;
/// - awaescher/OllamaSharp: test/OllamaApiClientTests.cs (Moq.Protected handler, nested test classes),
///   test/TestOllamaApiClient.cs, test/FunctionalTests/ChatTests.cs;
/// - anthropics/anthropic-sdk-csharp: examples/ChatClientExample/Program.cs.
/// </summary>
public static class HeldOutCorpus
{
    public static IReadOnlyList<PrecisionCase> Cases { get; } = Build();

    public static PrecisionCase Find(string name) => Cases.Single(c => c.Name == name);

    private static IReadOnlyList<PrecisionCase> Build()
    {
        var cases = new List<PrecisionCase>();
        cases.AddRange(SemanticKernelConnectorUnitTests());
        cases.AddRange(ExtensionsAiUnitTests());
        cases.AddRange(SdkClientsOverCannedTransports());
        cases.AddRange(OllamaSharpTests());
        cases.AddRange(LiveTestsThatStaySilent());
        cases.AddRange(ProductCodeThatStaysSilent());
        cases.AddRange(LiveTestsWithTrueFindings());
        cases.AddRange(SamplesAndProductCodeWithTrueFindings());
        return cases;
    }

    // ==== silent: Semantic Kernel connector unit tests (stub handlers, mocked services, settings conversion) ===========

    private static IEnumerable<PrecisionCase> SemanticKernelConnectorUnitTests()
    {
        yield return Silent("SkStyle_ConnectorUnitTest_StubHandlerChecksRequestBody_IsSilent", "Tramline.Connectors.UnitTests",
            """"
            using System;
            using System.Net.Http;
            using System.Net.Http.Headers;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Tramline.Connectors.UnitTests;

            internal sealed class HttpMessageHandlerStub : HttpMessageHandler
            {
                public HttpRequestHeaders? RequestHeaders { get; private set; }

                public byte[]? RequestContent { get; private set; }

                public Uri? RequestUri { get; private set; }

                public HttpResponseMessage ResponseToReturn { get; set; } = new(System.Net.HttpStatusCode.OK)
                {
                    Content = new StringContent("{}", Encoding.UTF8, "application/json"),
                };

                protected override async Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    this.RequestUri = request.RequestUri;
                    this.RequestHeaders = request.Headers;
                    this.RequestContent = request.Content is null ? null : await request.Content.ReadAsByteArrayAsync(cancellationToken);
                    return this.ResponseToReturn;
                }
            }
            """",
            """"
            using System;
            using System.Net.Http;
            using System.Text;
            using System.Text.Json;
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Tramline.Connectors.UnitTests;

            public sealed class TimetableChatCompletionTests : IDisposable
            {
                private const string ChatCompletionResponse = """
                    {"id":"chatcmpl-1","object":"chat.completion","created":1711377846,"model":"gpt-4o","choices":[{"index":0,"message":{"role":"assistant","content":"07:12, 07:24, 07:36"},"finish_reason":"stop"}],"usage":{"prompt_tokens":20,"completion_tokens":9,"total_tokens":29}}
                    """;

                private readonly HttpMessageHandlerStub _messageHandlerStub = new();
                private readonly HttpClient _httpClient;

                public TimetableChatCompletionTests()
                {
                    this._httpClient = new HttpClient(this._messageHandlerStub, false);
                }

                [Fact]
                public async Task ItSendsSamplingSettingsInTheRequestBodyAsync()
                {
                    // Arrange
                    var service = new OpenAIChatCompletionService("gpt-4o", "NOKEY", httpClient: this._httpClient);
                    this._messageHandlerStub.ResponseToReturn = new HttpResponseMessage(System.Net.HttpStatusCode.OK)
                    {
                        Content = new StringContent(ChatCompletionResponse, Encoding.UTF8, "application/json"),
                    };
                    var settings = new OpenAIPromptExecutionSettings
                    {
                        Temperature = 1.7,
                        TopP = 0.4,
                        Seed = 99,
                        MaxTokens = 64,
                    };
                    var history = new ChatHistory();
                    history.AddUserMessage("Extract the departure times from this timetable row: Line 4, Depot 07:12 07:24 07:36");

                    // Act
                    var result = await service.GetChatMessageContentsAsync(history, settings);

                    // Assert
                    var body = JsonDocument.Parse(Encoding.UTF8.GetString(this._messageHandlerStub.RequestContent!)).RootElement;
                    Assert.Equal(1.7, body.GetProperty("temperature").GetDouble(), 3);
                    Assert.Equal(0.4, body.GetProperty("top_p").GetDouble(), 3);
                    Assert.Equal(99, body.GetProperty("seed").GetInt64());
                    Assert.Equal("07:12, 07:24, 07:36", result[0].Content);
                }

                public void Dispose() => this._httpClient.Dispose();
            }
            """");

        yield return Silent("SkStyle_AzureConnectorUnitTest_QueuedStubResponses_AssertsReplyText_IsSilent", "SeedVault.AzureConnector.UnitTests",
            """"
            using System.Collections.Generic;
            using System.Net.Http;
            using System.Threading;
            using System.Threading.Tasks;

            namespace SeedVault.AzureConnector.UnitTests;

            internal sealed class MultipleHttpMessageHandlerStub : HttpMessageHandler
            {
                private int _callIteration;

                public List<HttpResponseMessage> ResponsesToReturn { get; } = [];

                public List<byte[]?> RequestContents { get; } = [];

                protected override async Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    this.RequestContents.Add(request.Content is null ? null : await request.Content.ReadAsByteArrayAsync(cancellationToken));
                    return this.ResponsesToReturn[this._callIteration++];
                }
            }
            """",
            """"
            using System;
            using System.Net;
            using System.Net.Http;
            using System.Text.Json;
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.AzureOpenAI;
            using Xunit;

            namespace SeedVault.AzureConnector.UnitTests;

            public sealed class SowingAdviceChatCompletionServiceTests : IDisposable
            {
                private const string Reply = """
                    {"id":"chatcmpl-2","object":"chat.completion","created":1711377846,"model":"gpt-4o","choices":[{"index":0,"message":{"role":"assistant","content":"Sow after the last frost."},"finish_reason":"stop"}],"usage":{"prompt_tokens":55,"completion_tokens":6,"total_tokens":61}}
                    """;

                private readonly MultipleHttpMessageHandlerStub _messageHandlerStub = new();
                private readonly HttpClient _httpClient;

                public SowingAdviceChatCompletionServiceTests()
                {
                    this._httpClient = new HttpClient(this._messageHandlerStub, disposeHandler: false);
                }

                [Fact]
                public async Task GetChatMessageContentsHandlesSettingsCorrectlyAsync()
                {
                    // Arrange
                    var service = new AzureOpenAIChatCompletionService("seed-advice", "https://seedvault.openai.azure.com", "api-key", "gpt-4o", this._httpClient);
                    var settings = new AzureOpenAIPromptExecutionSettings
                    {
                        MaxTokens = 123,
                        Temperature = 0.9,
                        TopP = 0.5,
                        FrequencyPenalty = 2.5,
                        PresencePenalty = 1.2,
                        StopSequences = ["###"],
                    };
                    using var responseMessage = new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(Reply) };
                    this._messageHandlerStub.ResponsesToReturn.Add(responseMessage);

                    var chatHistory = new ChatHistory("You answer questions from seed library members.");
                    chatHistory.AddUserMessage("When should I sow runner beans?");

                    // Act
                    var result = await service.GetChatMessageContentsAsync(chatHistory, settings);

                    // Assert
                    Assert.Equal("Sow after the last frost.", result[0].Content);
                    var content = JsonDocument.Parse(this._messageHandlerStub.RequestContents[0]!).RootElement;
                    Assert.Equal(2.5, content.GetProperty("frequency_penalty").GetDouble(), 3);
                    Assert.Equal("user", content.GetProperty("messages")[1].GetProperty("role").GetString());
                }

                public void Dispose() => this._httpClient.Dispose();
            }
            """");

        yield return Silent("SkStyle_ExecutionSettingsTests_ExtensionDataJsonAndFreeze_IsSilent", "Cragboard.Ai.UnitTests",
            """"
            using System;
            using System.Collections.Generic;
            using System.Text.Json;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Cragboard.Ai.UnitTests.Settings;

            public class BetaAdvisorExecutionSettingsTests
            {
                [Fact]
                public void ItCreatesOpenAIExecutionSettingsFromExtensionData()
                {
                    // Arrange
                    var generic = new PromptExecutionSettings
                    {
                        ExtensionData = new Dictionary<string, object>
                        {
                            ["temperature"] = 3.2,
                            ["top_p"] = 1.4,
                            ["seed"] = 123,
                            ["max_tokens"] = 256,
                        },
                    };

                    // Act
                    var settings = OpenAIPromptExecutionSettings.FromExecutionSettings(generic);

                    // Assert
                    Assert.Equal(3.2, settings.Temperature);
                    Assert.Equal(1.4, settings.TopP);
                    Assert.Equal(123L, settings.Seed);
                }

                [Fact]
                public void ItDeserialisesSnakeCaseJson()
                {
                    var json = """{ "temperature": 1.9, "top_p": 0.2, "max_tokens": 60 }""";

                    var settings = JsonSerializer.Deserialize<OpenAIPromptExecutionSettings>(json)!;

                    Assert.Equal(1.9, settings.Temperature);
                    Assert.Equal(0.2, settings.TopP);
                    Assert.Equal(60, settings.MaxTokens);
                }

                [Fact]
                public void FrozenSettingsCannotBeModified()
                {
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 0.7, TopP = 0.7 };

                    settings.Freeze();

                    Assert.Throws<InvalidOperationException>(() => settings.Temperature = 2.9);
                }
            }
            """");

        yield return Silent("SkStyle_KernelWithMoqChatCompletionService_LabelPromptExactEqual_IsSilent", "Cragboard.Routes.UnitTests",
            """"
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.DependencyInjection;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Moq;
            using Xunit;

            namespace Cragboard.Routes.UnitTests;

            public class RouteStyleLabellerTests
            {
                [Fact]
                public async Task InvokePromptReturnsTheLabelFromTheService()
                {
                    // Arrange
                    var service = new Mock<IChatCompletionService>();
                    service
                        .Setup(s => s.GetChatMessageContentsAsync(It.IsAny<ChatHistory>(), It.IsAny<PromptExecutionSettings>(), It.IsAny<Kernel>(), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(new List<ChatMessageContent> { new(AuthorRole.Assistant, "overhang") });

                    var builder = Kernel.CreateBuilder();
                    builder.Services.AddSingleton(service.Object);
                    var kernel = builder.Build();

                    // Act
                    var result = await kernel.InvokePromptAsync(
                        "Label the climbing route as one of: slab, vertical, overhang. Route: {{$route}}",
                        new KernelArguments(new OpenAIPromptExecutionSettings { Temperature = 0.9 }) { ["route"] = "45 degree roof with big jugs" });

                    // Assert
                    Assert.Equal("overhang", result.ToString());
                    service.Verify(
                        s => s.GetChatMessageContentsAsync(It.IsAny<ChatHistory>(), It.IsAny<PromptExecutionSettings>(), It.IsAny<Kernel>(), It.IsAny<CancellationToken>()),
                        Times.Once);
                }
            }
            """");

        yield return Silent("SkStyle_PromptTemplateConfigFromJson_ExecutionSettings_IsSilent", "Cragboard.Prompts.UnitTests",
            """"
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Cragboard.Prompts.UnitTests;

            public class WallNewsPromptConfigTests
            {
                [Fact]
                public void ItReadsExecutionSettingsFromJson()
                {
                    // Arrange
                    var json = """
                        {
                          "name": "wall_news",
                          "template": "Write a short note about {{$wall}} reopening.",
                          "execution_settings": {
                            "default": { "temperature": 2.7, "top_p": 0.3, "max_tokens": 120 }
                          }
                        }
                        """;

                    // Act
                    var config = PromptTemplateConfig.FromJson(json);
                    var settings = OpenAIPromptExecutionSettings.FromExecutionSettings(config.ExecutionSettings["default"]);

                    // Assert
                    Assert.Equal("wall_news", config.Name);
                    Assert.Equal(2.7, settings.Temperature);
                    Assert.Equal(0.3, settings.TopP);
                }

                [Fact]
                public void ItKeepsNamedExecutionSettingsOnTheFunction()
                {
                    var config = new PromptTemplateConfig("Write a short note about {{$wall}} reopening.");
                    config.AddExecutionSettings(new OpenAIPromptExecutionSettings { Temperature = 1.9, TopP = 0.3 }, "lively");

                    var function = KernelFunctionFactory.CreateFromPrompt(config);

                    Assert.NotNull(function.ExecutionSettings);
                    Assert.True(function.ExecutionSettings!.ContainsKey("lively"));
                }
            }
            """");

        yield return Silent("SkStyle_KernelBuilderOverStubHttpClient_TranslatePrompt_IsSilent", "Tramline.Prompting.UnitTests",
            """"
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Tramline.Prompting.UnitTests;

            internal sealed class RequestCapturingHandler : HttpMessageHandler
            {
                public string? LastBody { get; private set; }

                public string ResponseJson { get; set; } = """
                    {"id":"chatcmpl-3","object":"chat.completion","created":1711377846,"model":"gpt-4o","choices":[{"index":0,"message":{"role":"assistant","content":"Volgende halte: Depot"},"finish_reason":"stop"}]}
                    """;

                protected override async Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    this.LastBody = request.Content is null ? null : await request.Content.ReadAsStringAsync(cancellationToken);
                    return new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(this.ResponseJson, Encoding.UTF8, "application/json") };
                }
            }
            """",
            """"
            using System;
            using System.Net.Http;
            using System.Text.Json;
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Tramline.Prompting.UnitTests;

            public sealed class AnnouncementTranslationKernelTests : IDisposable
            {
                private readonly RequestCapturingHandler _handler = new();
                private readonly HttpClient _httpClient;

                public AnnouncementTranslationKernelTests()
                {
                    this._httpClient = new HttpClient(this._handler, disposeHandler: false);
                }

                [Fact]
                public async Task PromptExecutionSettingsReachTheRequestBodyAsync()
                {
                    // Arrange
                    var builder = Kernel.CreateBuilder();
                    builder.AddOpenAIChatCompletion("gpt-4o", "NOKEY", httpClient: this._httpClient);
                    Kernel kernel = builder.Build();

                    // Act
                    var result = await kernel.InvokePromptAsync(
                        "Translate 'Next stop: Depot' into Dutch.",
                        new(new OpenAIPromptExecutionSettings { Temperature = 1.9 }));

                    // Assert
                    Assert.Equal("Volgende halte: Depot", result.GetValue<string>());
                    using var body = JsonDocument.Parse(this._handler.LastBody!);
                    Assert.Equal(1.9, body.RootElement.GetProperty("temperature").GetDouble(), 3);
                }

                public void Dispose() => this._httpClient.Dispose();
            }
            """");
    }

    // ==== silent: Microsoft.Extensions.AI style unit tests (TestChatClient, verbatim handlers, middleware) =============

    private static IEnumerable<PrecisionCase> ExtensionsAiUnitTests()
    {
        const string TestChatClient = """"
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Microsoft.Extensions.AI;

            public sealed class TestChatClient : IChatClient
            {
                public TestChatClient()
                {
                    GetServiceCallback = DefaultGetServiceCallback;
                }

                public IServiceProvider? Services { get; set; }

                public Func<IEnumerable<ChatMessage>, ChatOptions?, CancellationToken, Task<ChatResponse>>? GetResponseAsyncCallback { get; set; }

                public Func<IEnumerable<ChatMessage>, ChatOptions?, CancellationToken, IAsyncEnumerable<ChatResponseUpdate>>? GetStreamingResponseAsyncCallback { get; set; }

                public Func<Type, object?, object?> GetServiceCallback { get; set; }

                private object? DefaultGetServiceCallback(Type serviceType, object? serviceKey) =>
                    serviceType is not null && serviceKey is null && serviceType.IsInstanceOfType(this) ? this : null;

                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
                    => GetResponseAsyncCallback!.Invoke(messages, options, cancellationToken);

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
                    => GetStreamingResponseAsyncCallback!.Invoke(messages, options, cancellationToken);

                public object? GetService(Type serviceType, object? serviceKey = null)
                    => GetServiceCallback(serviceType, serviceKey);

                void IDisposable.Dispose()
                {
                }
            }
            """";

        yield return Silent("MeaiStyle_TestChatClientCallback_ConfigureOptionsMiddleware_IsSilent", "Tramline.Assistant.Tests",
            TestChatClient,
            """"
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Tramline.Assistant.Tests;

            public class ServiceFrequencyAnswerTests
            {
                [Fact]
                public async Task CallerOptionsWinOverConfiguredDefaults()
                {
                    ChatOptions? seen = null;
                    using var innerClient = new TestChatClient
                    {
                        GetResponseAsyncCallback = (messages, options, cancellationToken) =>
                        {
                            seen = options;
                            return Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, "Line 4 runs every 8 minutes.")));
                        },
                    };

                    using IChatClient client = innerClient
                        .AsBuilder()
                        .ConfigureOptions(options =>
                        {
                            options.Temperature ??= 1.8f;
                            options.TopP ??= 0.3f;
                        })
                        .Build();

                    var response = await client.GetResponseAsync("How often does line 4 run on Sundays?", new ChatOptions { Temperature = 1.9f, TopP = 0.2f });

                    Assert.Equal("Line 4 runs every 8 minutes.", response.Text);
                    Assert.Equal(1.9f, seen!.Temperature);
                    Assert.Equal(0.2f, seen.TopP);
                }
            }
            """");

        yield return Silent("MeaiStyle_OpenAIAdapter_VerbatimHandlerComparesRequestJson_IsSilent", "SeedVault.Chat.Tests",
            """"
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Text.Json.Nodes;
            using System.Threading;
            using System.Threading.Tasks;
            using Xunit;

            namespace SeedVault.Chat.Tests;

            /// <summary>Checks the request body against an expected one and sends back an expected response.</summary>
            public sealed class VerbatimHttpHandler(string expectedInput, string expectedOutput) : HttpMessageHandler
            {
                protected override async Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    Assert.NotNull(request.Content);
                    string actualInput = await request.Content!.ReadAsStringAsync(cancellationToken);
                    Assert.Equal(Normalize(expectedInput), Normalize(actualInput));

                    return new HttpResponseMessage(HttpStatusCode.OK)
                    {
                        Content = new StringContent(expectedOutput, Encoding.UTF8, "application/json"),
                    };
                }

                private static string Normalize(string json) => JsonNode.Parse(json)!.ToJsonString();
            }
            """",
            """"
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Net.Http;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI;
            using Xunit;

            namespace SeedVault.Chat.Tests;

            public class SeedSwapChatClientTests
            {
                [Fact]
                public async Task BasicRequestResponse_NonStreaming()
                {
                    const string Input = """
                        {"messages":[{"role":"user","content":"hello"}],"model":"gpt-4o-mini","max_completion_tokens":10,"temperature":0.5,"top_p":0.5,"seed":42}
                        """;

                    const string Output = """
                        {"id":"chatcmpl-ADx3PvAnCw","object":"chat.completion","created":1727888631,"model":"gpt-4o-mini-2024-07-18","choices":[{"index":0,"message":{"role":"assistant","content":"Hello! Which seeds are you looking for?"},"finish_reason":"stop"}],"usage":{"prompt_tokens":8,"completion_tokens":9,"total_tokens":17}}
                        """;

                    using VerbatimHttpHandler handler = new(Input, Output);
                    using HttpClient httpClient = new(handler);
                    using IChatClient client = CreateChatClient(httpClient, "gpt-4o-mini");

                    var response = await client.GetResponseAsync("hello", new()
                    {
                        MaxOutputTokens = 10,
                        Temperature = 0.5f,
                        TopP = 0.5f,
                        Seed = 42,
                    });

                    Assert.NotNull(response);
                    Assert.Equal("Hello! Which seeds are you looking for?", response.Text);
                    Assert.Equal("gpt-4o-mini-2024-07-18", response.ModelId);
                }

                private static IChatClient CreateChatClient(HttpClient httpClient, string modelId) =>
                    new OpenAIClient(new ApiKeyCredential("apikey"), new OpenAIClientOptions { Transport = new HttpClientPipelineTransport(httpClient) })
                        .GetChatClient(modelId)
                        .AsIChatClient();
            }
            """");

        yield return Silent("MeaiStyle_RawRepresentationFactory_StreamingOverReplayHandler_IsSilent", "Cragboard.Chat.Tests",
            """"
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Cragboard.Chat.Tests;

            internal sealed class ReplayHandler(string body, string mediaType) : HttpMessageHandler
            {
                public string? LastRequestBody { get; private set; }

                protected override async Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    LastRequestBody = request.Content is null ? null : await request.Content.ReadAsStringAsync(cancellationToken);
                    return new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(body, Encoding.UTF8, mediaType) };
                }
            }
            """",
            """"
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Collections.Generic;
            using System.Linq;
            using System.Net.Http;
            using System.Text.Json;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI;
            using OpenAI.Chat;
            using Xunit;

            namespace Cragboard.Chat.Tests;

            public class OpeningHoursChatClientTests
            {
                [Fact]
                public async Task RawRepresentationWinsOverAbstractOptions_Streaming()
                {
                    const string Output = """
                        data: {"id":"c1","object":"chat.completion.chunk","created":1,"model":"gpt-4o-mini","choices":[{"index":0,"delta":{"role":"assistant","content":"The north wall opens at nine."},"finish_reason":null}]}

                        data: {"id":"c1","object":"chat.completion.chunk","created":1,"model":"gpt-4o-mini","choices":[{"index":0,"delta":{},"finish_reason":"stop"}]}

                        data: [DONE]

                        """;

                    var handler = new ReplayHandler(Output, "text/event-stream");
                    using HttpClient httpClient = new(handler);
                    IChatClient client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("apikey"), new OpenAIClientOptions { Transport = new HttpClientPipelineTransport(httpClient) })
                        .AsIChatClient();

                    ChatOptions options = new()
                    {
                        RawRepresentationFactory = _ => new ChatCompletionOptions
                        {
                            Temperature = 2.4f,
                            TopP = 0.5f,
                            FrequencyPenalty = 0.75f,
                        },
                        Temperature = 0.125f,
                        TopP = 0.125f,
                    };

                    List<ChatResponseUpdate> updates = [];
                    await foreach (var update in client.GetStreamingResponseAsync("Which wall opens first?", options))
                    {
                        updates.Add(update);
                    }

                    Assert.Equal("The north wall opens at nine.", string.Concat(updates.Select(u => u.Text)));
                    using var sent = JsonDocument.Parse(handler.LastRequestBody!);
                    Assert.Equal(2.4, sent.RootElement.GetProperty("temperature").GetDouble(), 3);
                }
            }
            """");

        yield return Silent("MeaiStyle_FunctionInvokingClientOverScriptedClient_AssertsToolArguments_IsSilent", "Tramline.Tools.Tests",
            """"
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Tramline.Tools.Tests;

            /// <summary>Plays back a fixed script of responses, one per call.</summary>
            public sealed class ScriptedChatClient(params ChatResponse[] script) : IChatClient
            {
                private readonly Queue<ChatResponse> _script = new(script);

                public List<ChatOptions?> ReceivedOptions { get; } = [];

                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
                {
                    ReceivedOptions.Add(options);
                    return Task.FromResult(_script.Dequeue());
                }

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """",
            """"
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Tramline.Tools.Tests;

            public class NextTramToolTests
            {
                [Fact]
                public async Task InvokesTheStopLookupWithTheModelsArguments()
                {
                    var inner = new ScriptedChatClient(
                        new ChatResponse(new ChatMessage(ChatRole.Assistant, [new FunctionCallContent("call_1", "GetNextTram", new Dictionary<string, object?> { ["stop"] = "Market Square" })])),
                        new ChatResponse(new ChatMessage(ChatRole.Assistant, "The next tram leaves in 3 minutes.")));
                    using var client = new FunctionInvokingChatClient(inner);

                    string? stopName = null;
                    AIFunction nextTram = AIFunctionFactory.Create((string stop) => { stopName = stop; return "3 min"; }, "GetNextTram");

                    var response = await client.GetResponseAsync("When is the next tram at Market Square?", new ChatOptions { Tools = [nextTram], Temperature = 0.9f });

                    Assert.Equal("Market Square", stopName);
                    Assert.Equal("The next tram leaves in 3 minutes.", response.Text);
                    Assert.Equal(2, inner.ReceivedOptions.Count);
                }
            }
            """");

        yield return Silent("MeaiStyle_OpenTelemetryChatClient_MarkerSamplingValuesInTags_IsSilent", "Tramline.Observability.Tests",
            """"
            using System;
            using System.Collections.Generic;
            using System.Runtime.CompilerServices;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Tramline.Observability.Tests;

            internal sealed class CannedChatClient(string reply) : IChatClient
            {
                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, reply))
                    {
                        FinishReason = ChatFinishReason.Stop,
                        Usage = new UsageDetails { InputTokenCount = 10, OutputTokenCount = 6, TotalTokenCount = 16 },
                    });

                public async IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, [EnumeratorCancellation] CancellationToken cancellationToken = default)
                {
                    await Task.Yield();
                    yield return new ChatResponseUpdate(ChatRole.Assistant, reply);
                }

                public object? GetService(Type serviceType, object? serviceKey = null) =>
                    serviceType == typeof(ChatClientMetadata) ? new ChatClientMetadata("testservice", new Uri("http://localhost:12345/"), "amazingmodel") : null;

                public void Dispose()
                {
                }
            }
            """",
            """"
            using System;
            using System.Collections.Generic;
            using System.Diagnostics;
            using System.Globalization;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Tramline.Observability.Tests;

            public sealed class ChatTracingTests : IDisposable
            {
                private readonly string _sourceName = Guid.NewGuid().ToString();
                private readonly List<Activity> _activities = [];
                private readonly ActivityListener _listener;

                public ChatTracingTests()
                {
                    _listener = new ActivityListener
                    {
                        ShouldListenTo = source => source.Name == _sourceName,
                        Sample = (ref ActivityCreationOptions<ActivityContext> _) => ActivitySamplingResult.AllDataAndRecorded,
                        ActivityStopped = activity => _activities.Add(activity),
                    };
                    ActivitySource.AddActivityListener(_listener);
                }

                [Fact]
                public async Task RequestTagsCarryTheSamplingSettings()
                {
                    using var innerClient = new CannedChatClient("Next tram in 4 minutes.");
                    using var chatClient = innerClient
                        .AsBuilder()
                        .UseOpenTelemetry(sourceName: _sourceName)
                        .Build();

                    var options = new ChatOptions
                    {
                        ModelId = "replacementmodel",
                        FrequencyPenalty = 3.0f,
                        TopP = 4.0f,
                        TopK = 7,
                        Temperature = 6.0f,
                        Seed = 42,
                    };

                    var response = await chatClient.GetResponseAsync("When is the next tram?", options);

                    Assert.Equal("Next tram in 4 minutes.", response.Text);
                    var activity = Assert.Single(_activities);
                    Assert.Equal(6.0, Convert.ToDouble(activity.GetTagItem("gen_ai.request.temperature"), CultureInfo.InvariantCulture));
                    Assert.Equal(4.0, Convert.ToDouble(activity.GetTagItem("gen_ai.request.top_p"), CultureInfo.InvariantCulture));
                    Assert.Equal(7, Convert.ToInt32(activity.GetTagItem("gen_ai.request.top_k"), CultureInfo.InvariantCulture));
                }

                public void Dispose() => _listener.Dispose();
            }
            """");

        yield return Silent("MeaiStyle_ChatOptionsJsonRoundTripAndClone_IsSilent", "SeedVault.Contracts.Tests",
            """"
            using System.Text.Json;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace SeedVault.Contracts.Tests;

            public class ChatOptionsContractTests
            {
                [Fact]
                public void RoundTripsThroughJson()
                {
                    ChatOptions original = new()
                    {
                        ModelId = "gpt-4o-mini",
                        Temperature = 0.1f,
                        TopP = 0.2f,
                        TopK = 3,
                        Seed = 5,
                        FrequencyPenalty = 0.4f,
                        PresencePenalty = 0.5f,
                    };

                    string json = JsonSerializer.Serialize(original, AIJsonUtilities.DefaultOptions);
                    ChatOptions? result = JsonSerializer.Deserialize<ChatOptions>(json, AIJsonUtilities.DefaultOptions);

                    Assert.NotNull(result);
                    Assert.Equal(0.1f, result!.Temperature);
                    Assert.Equal(0.2f, result.TopP);
                    Assert.Equal(3, result.TopK);
                    Assert.Equal(5L, result.Seed);
                }

                [Fact]
                public void CloneCopiesSamplingSettings()
                {
                    var options = new ChatOptions { Temperature = 2.2f, TopP = 0.05f, TopK = 1 };

                    var clone = options.Clone();

                    Assert.NotSame(options, clone);
                    Assert.Equal(2.2f, clone.Temperature);
                    Assert.Equal(0.05f, clone.TopP);
                    Assert.Equal(1, clone.TopK);
                }
            }
            """");

        yield return Silent("MsTestStyle_MoqChatClientBehindFunctionInvocationPipeline_IsSilent", "Kites.Festival.Tests",
            """"
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Microsoft.VisualStudio.TestTools.UnitTesting;
            using Moq;

            namespace Kites.Festival.Tests;

            [TestClass]
            public class LaunchWindowAdvisorTests
            {
                [TestMethod]
                public async Task ReturnsTheAdvisorsAnswer()
                {
                    var inner = new Mock<IChatClient>();
                    inner
                        .Setup(c => c.GetResponseAsync(It.IsAny<IEnumerable<ChatMessage>>(), It.IsAny<ChatOptions?>(), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(new ChatResponse(new ChatMessage(ChatRole.Assistant, "Launch between 14:00 and 16:00.")));

                    using IChatClient client = new ChatClientBuilder(inner.Object)
                        .UseFunctionInvocation()
                        .Build();

                    var response = await client.GetResponseAsync(
                        "When is the best launch window for the stunt kites on Saturday?",
                        new ChatOptions { Temperature = 1.6f, TopP = 0.3f });

                    Assert.AreEqual("Launch between 14:00 and 16:00.", response.Text);
                    inner.Verify(c => c.GetResponseAsync(It.IsAny<IEnumerable<ChatMessage>>(), It.Is<ChatOptions?>(o => o!.Temperature == 1.6f), It.IsAny<CancellationToken>()), Times.Once());
                }
            }
            """");

        yield return Silent("FakeItEasyStyle_FakeChatClientForTriagePipeline_FluentExactLabel_IsSilent", "Cragboard.Support.Tests",
            """"
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using FakeItEasy;
            using FluentAssertions;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Cragboard.Support.Tests;

            public class IncidentTriagePipelineTests
            {
                [Fact]
                public async Task FakeModelLabelIsPassedThrough()
                {
                    var chatClient = A.Fake<IChatClient>();
                    A.CallTo(() => chatClient.GetResponseAsync(A<IEnumerable<ChatMessage>>._, A<ChatOptions?>._, A<CancellationToken>._))
                        .Returns(new ChatResponse(new ChatMessage(ChatRole.Assistant, "equipment")));

                    using IChatClient pipeline = chatClient.AsBuilder().UseFunctionInvocation().Build();

                    var response = await pipeline.GetResponseAsync(
                        [
                            new ChatMessage(ChatRole.System, "Classify the incident report as one of: equipment, injury, behaviour, facility. Reply with the label only."),
                            new ChatMessage(ChatRole.User, "Auto-belay 3 has a frayed webbing strap."),
                        ],
                        new ChatOptions { Temperature = 0.8f });

                    response.Text.Should().Be("equipment");
                    A.CallTo(() => chatClient.GetResponseAsync(A<IEnumerable<ChatMessage>>._, A<ChatOptions?>._, A<CancellationToken>._))
                        .MustHaveHappenedOnceExactly();
                }
            }
            """");
    }

    // ==== silent: SDK clients built over handlers and transports declared in the test project ========================

    private static IEnumerable<PrecisionCase> SdkClientsOverCannedTransports()
    {
        yield return Silent("OpenAiDotnetStyle_MockResponseTransport_DeserializesContent_IsSilent", "Cragboard.OpenAI.Tests",
            """"
            using System.ClientModel.Primitives;
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Cragboard.OpenAI.Tests;

            /// <summary>A pipeline transport that answers every request with one canned response.</summary>
            internal sealed class CannedResponseTransport : HttpClientPipelineTransport
            {
                public CannedResponseTransport(int status, string json)
                    : base(new HttpClient(new CannedHandler(status, json)))
                {
                }

                private sealed class CannedHandler(int status, string json) : HttpMessageHandler
                {
                    protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken) =>
                        Task.FromResult(new HttpResponseMessage((HttpStatusCode)status) { Content = new StringContent(json, Encoding.UTF8, "application/json") });
                }
            }
            """",
            """"
            using System.ClientModel;
            using System.Threading.Tasks;
            using NUnit.Framework;
            using OpenAI;
            using OpenAI.Chat;

            namespace Cragboard.OpenAI.Tests;

            [TestFixture]
            [Category("Smoke")]
            public class BoulderGradeChatMockTests
            {
                private static readonly ApiKeyCredential s_fakeCredential = new("key");

                private static OpenAIClientOptions GetClientOptionsWithMockResponse(int status, string json) =>
                    new() { Transport = new CannedResponseTransport(status, json) };

                [Test]
                public async Task CompleteChatDeserializesContent()
                {
                    OpenAIClientOptions clientOptions = GetClientOptionsWithMockResponse(200, """
                        { "id": "chat_id", "choices": [ { "index": 0, "finish_reason": "stop", "message": { "role": "assistant", "content": "6b+" } } ] }
                        """);
                    ChatClient client = new("gpt-4o", s_fakeCredential, clientOptions);

                    ChatCompletion completion = await client.CompleteChatAsync(
                        [new SystemChatMessage("Grade the boulder problem on the Fontainebleau scale."), new UserChatMessage("Crimpy traverse, 12 moves, no feet for the last three.")],
                        new ChatCompletionOptions { Temperature = 1.2f });

                    Assert.That(completion.Content[0].Text, Is.EqualTo("6b+"));
                    Assert.That(completion.Id, Is.EqualTo("chat_id"));
                }
            }
            """");

        yield return Silent("AzureInferenceStyle_ClientOverHttpClientTransportWithCannedHandler_IsSilent", "SeedVault.Inference.Tests",
            """"
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace SeedVault.Inference.Tests;

            internal sealed class CannedInferenceHandler(string json) : HttpMessageHandler
            {
                public int Calls { get; private set; }

                protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    Calls++;
                    return Task.FromResult(new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(json, Encoding.UTF8, "application/json") });
                }
            }
            """",
            """"
            using System;
            using System.Net.Http;
            using System.Threading.Tasks;
            using Azure;
            using Azure.AI.Inference;
            using Azure.Core.Pipeline;
            using Xunit;

            namespace SeedVault.Inference.Tests;

            public class StorageAdviceInferenceTests
            {
                private const string Canned = """
                    {"id":"1","created":1711377846,"model":"phi-4","choices":[{"index":0,"finish_reason":"stop","message":{"role":"assistant","content":"Keep bean seeds cool and dry."}}],"usage":{"completion_tokens":7,"prompt_tokens":9,"total_tokens":16}}
                    """;

                [Fact]
                public async Task CompleteAsyncReturnsTheCannedAnswer()
                {
                    var handler = new CannedInferenceHandler(Canned);
                    var clientOptions = new AzureAIInferenceClientOptions { Transport = new HttpClientTransport(new HttpClient(handler)) };
                    var client = new ChatCompletionsClient(new Uri("https://seedvault.services.ai.azure.com/models"), new AzureKeyCredential("key"), clientOptions);

                    var requestOptions = new ChatCompletionsOptions
                    {
                        Messages =
                        {
                            new ChatRequestSystemMessage("You answer seed storage questions."),
                            new ChatRequestUserMessage("How do I store bean seeds over winter?"),
                        },
                        Model = "phi-4",
                        Temperature = 1.5f,
                        NucleusSamplingFactor = 0.5f,
                    };

                    Response<ChatCompletions> response = await client.CompleteAsync(requestOptions);

                    Assert.Equal("Keep bean seeds cool and dry.", response.Value.Content);
                    Assert.Equal(1, handler.Calls);
                }
            }
            """");

        yield return Silent("AzureOpenAIStyle_ClientOverRecordedReplyHandler_ExactEqual_IsSilent", "Cragboard.Azure.Tests",
            """"
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Cragboard.Azure.Tests.Infrastructure;

            public sealed class RecordedReplyHandler : HttpMessageHandler
            {
                private const string Recorded = """
                    {"id":"chatcmpl-9","object":"chat.completion","created":1711377846,"model":"gpt-4o","choices":[{"index":0,"message":{"role":"assistant","content":"Start with ten minutes of easy traversing."},"finish_reason":"stop"}]}
                    """;

                protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken) =>
                    Task.FromResult(new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(Recorded, Encoding.UTF8, "application/json") });
            }
            """",
            """"
            using System;
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Net.Http;
            using System.Threading.Tasks;
            using Azure.AI.OpenAI;
            using Cragboard.Azure.Tests.Infrastructure;
            using OpenAI.Chat;
            using Xunit;

            namespace Cragboard.Azure.Tests;

            public class WarmUpSuggestionTests
            {
                private static AzureOpenAIClient CreateClient() =>
                    new(new Uri("https://cragboard.openai.azure.com"), new ApiKeyCredential("key"),
                        new AzureOpenAIClientOptions { Transport = new HttpClientPipelineTransport(new HttpClient(new RecordedReplyHandler())) });

                [Fact]
                public async Task SuggestionIsReadFromTheRecordedReply()
                {
                    ChatClient chat = CreateClient().GetChatClient("gpt-4o");

                    ChatCompletion completion = await chat.CompleteChatAsync(
                        [new UserChatMessage("Suggest a warm-up for a beginner's first session.")],
                        new ChatCompletionOptions { Temperature = 0.9f, TopP = 0.9f });

                    Assert.Equal("Start with ten minutes of easy traversing.", completion.Content[0].Text);
                }
            }
            """");
        yield return Silent("OpenAiReadmeStyle_MoqChatClientWithModelFactory_IsEqualTo_IsSilent", "Cragboard.Grades.Tests",
            """"
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Moq;
            using NUnit.Framework;
            using OpenAI.Chat;

            namespace Cragboard.Grades.Tests;

            public class HarderGradePickerTests
            {
                private static async Task<string> PickHarderGradeAsync(ChatClient client, string first, string second)
                {
                    ChatCompletion completion = await client.CompleteChatAsync(
                        [new UserChatMessage($"Which is harder on the French scale, {first} or {second}? Answer with the grade only.")],
                        new ChatCompletionOptions { Temperature = 1.3f });
                    return completion.Content[0].Text;
                }

                [Test]
                public async Task ReturnsTheGradeTheModelNames()
                {
                    // Instantiate mocks and the ChatCompletion object.
                    Mock<ChatClient> mockClient = new();
                    ChatCompletion completion = OpenAIChatModelFactory.ChatCompletion(content: new ChatMessageContent("7a"));

                    // Set up mocks' methods.
                    mockClient
                        .Setup(client => client.CompleteChatAsync(It.IsAny<IEnumerable<ChatMessage>>(), It.IsAny<ChatCompletionOptions>(), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(ClientResult.FromValue(completion, Mock.Of<PipelineResponse>()));

                    // Perform validation.
                    string harder = await PickHarderGradeAsync(mockClient.Object, "6a", "7a");

                    Assert.That(harder, Is.EqualTo("7a"));
                }
            }
            """");
    }

    // ==== silent: OllamaSharp style tests ==============================================================================

    private static IEnumerable<PrecisionCase> OllamaSharpTests()
    {
        yield return Silent("OllamaSharpStyle_MoqProtectedHttpHandler_NestedTestClass_TopP100_IsSilent", "SeedVault.Ollama.Tests",
            """"
            using System;
            using System.Net;
            using System.Net.Http;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Moq;
            using Moq.Protected;
            using NUnit.Framework;
            using OllamaSharp;
            using Shouldly;

            namespace SeedVault.Ollama.Tests;

            /// <summary>Contains tests for the <see cref="IOllamaApiClient"/> implementation.</summary>
            public class ExchangeDeskApiClientTests
            {
                private IOllamaApiClient _client = null!;
                private HttpResponseMessage? _response;
                private string? _requestContent;

                [OneTimeSetUp]
                public void OneTimeSetUp()
                {
                    var mockHandler = new Mock<HttpMessageHandler>(MockBehavior.Strict);
                    mockHandler
                        .Protected()
                        .Setup<Task<HttpResponseMessage>>("SendAsync", ItExpr.IsAny<HttpRequestMessage>(), ItExpr.IsAny<CancellationToken>())
                        .Returns<HttpRequestMessage, CancellationToken>(async (request, _) =>
                        {
                            _requestContent = request.Content is null ? null : await request.Content.ReadAsStringAsync();
                            return _response!;
                        });

                    var httpClient = new HttpClient(mockHandler.Object) { BaseAddress = new Uri("http://empty") };
                    _client = new OllamaApiClient(httpClient);
                }

                [OneTimeTearDown]
                public void OneTimeTearDown() => (_client as IDisposable)?.Dispose();

                public class ChatClientMethod : ExchangeDeskApiClientTests
                {
                    [Test, NonParallelizable]
                    public async Task Sends_Sampling_Options_In_Snake_Case()
                    {
                        _response = new HttpResponseMessage(HttpStatusCode.OK)
                        {
                            Content = new StringContent("""{"model":"llama3.2","created_at":"2024-07-12T12:34:39Z","message":{"role":"assistant","content":"We hold 14 bean varieties."},"done_reason":"stop","done":true}""" + "\n"),
                        };

                        var chatClient = (IChatClient)_client;
                        var options = new ChatOptions
                        {
                            ModelId = "llama3.2",
                            TopP = 100,
                            TopK = 50,
                            Temperature = 0.5f,
                            FrequencyPenalty = 0.1f,
                        };

                        var response = await chatClient.GetResponseAsync([new ChatMessage(ChatRole.User, "How many bean varieties do you hold?")], options, CancellationToken.None);

                        response.Text.ShouldBe("We hold 14 bean varieties.");
                        _requestContent.ShouldNotBeNull();
                        _requestContent.ShouldContain("\"top_p\":100");
                        _requestContent.ShouldContain("\"temperature\":0.5");
                    }
                }
            }
            """");

        yield return Silent("OllamaSharpStyle_NSubstituteApiClientBehindChat_ExactEqual_IsSilent", "Tramline.Ollama.Tests",
            """"
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using NSubstitute;
            using OllamaSharp;
            using OllamaSharp.Models;
            using OllamaSharp.Models.Chat;
            using Xunit;

            namespace Tramline.Ollama.Tests;

            public class DiversionBotTests
            {
                [Fact]
                public async Task AnswerIsTheConcatenatedStream()
                {
                    var ollama = Substitute.For<IOllamaApiClient>();
                    ollama.ChatAsync(Arg.Any<ChatRequest>(), Arg.Any<CancellationToken>())
                        .Returns(_ => Stream("Route 9 is diverted ", "via Mill Lane."));

                    var chat = new Chat(ollama)
                    {
                        Model = "llama3.2",
                        Options = new RequestOptions { Temperature = 1.6f, TopP = 0.4f },
                    };

                    var answer = await chat.SendAsync("Is route 9 running normally today?", CancellationToken.None).StreamToEndAsync();

                    Assert.Equal("Route 9 is diverted via Mill Lane.", answer);
                    _ = ollama.Received(1).ChatAsync(Arg.Any<ChatRequest>(), Arg.Any<CancellationToken>());
                }

                private static async IAsyncEnumerable<ChatResponseStream?> Stream(params string[] parts)
                {
                    foreach (var part in parts)
                    {
                        await Task.Yield();
                        yield return new ChatResponseStream { Message = new Message(ChatRole.Assistant, part) };
                    }
                }
            }
            """");
    }

    // ==== silent: live tests that reach a model but compare nothing the model sampled ==================================

    private static IEnumerable<PrecisionCase> LiveTestsThatStaySilent()
    {
        yield return Silent("IntegrationStyle_LiveOpenAI_AssertsFinishReasonRoleAndUsageOnly_IsSilent", "Tramline.IntegrationTests",
            """"
            using System;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            namespace Tramline.IntegrationTests;

            public sealed class NightServiceGreetingTests
            {
                private static ChatClient? CreateClient()
                {
                    var apiKey = Environment.GetEnvironmentVariable("TRAMLINE_OPENAI_API_KEY");
                    return string.IsNullOrEmpty(apiKey) ? null : new ChatClient("gpt-4o-mini", apiKey);
                }

                [Fact]
                public async Task GreetingCompletesWithStopAndUsage()
                {
                    var client = CreateClient();
                    if (client is null)
                    {
                        return;
                    }

                    ChatCompletionOptions options = new() { Temperature = 0.8f, MaxOutputTokenCount = 60 };

                    ChatCompletion completion = await client.CompleteChatAsync([new UserChatMessage("Greet a passenger boarding the last night tram of the evening.")], options);

                    Assert.Equal(ChatFinishReason.Stop, completion.FinishReason);
                    Assert.Equal(ChatMessageRole.Assistant, completion.Role);
                    Assert.True(completion.Usage.OutputTokenCount > 0);
                    Assert.False(string.IsNullOrWhiteSpace(completion.Content[0].Text));
                }
            }
            """");

        yield return Silent("IntegrationStyle_LiveChatClient_TolerantContainsAndRegex_IsSilent", "SeedVault.IntegrationTests",
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI;
            using Xunit;

            namespace SeedVault.IntegrationTests;

            public class SeedStorageAdviceIntegrationTests
            {
                private readonly IChatClient? _chatClient;

                public SeedStorageAdviceIntegrationTests()
                {
                    var key = Environment.GetEnvironmentVariable("OPENAI_API_KEY");
                    _chatClient = key is null ? null : new OpenAIClient(key).GetChatClient("gpt-4o-mini").AsIChatClient();
                }

                [Fact]
                public async Task AdviceMentionsKeepingSeedsDry()
                {
                    if (_chatClient is null)
                    {
                        return;
                    }

                    var response = await _chatClient.GetResponseAsync(
                        "How should I store tomato seeds after saving them? Two sentences.",
                        new ChatOptions { Temperature = 0.7f, MaxOutputTokens = 120 });

                    Assert.Contains("dry", response.Text, StringComparison.OrdinalIgnoreCase);
                    Assert.Matches("(?i)(jar|envelope|container|packet)", response.Text);
                }
            }
            """");

        yield return Silent("IntegrationStyle_LiveOpenAI_TemperatureZeroWithSeed_ExactEqual_IsSilent", "Cragboard.Scoring.IntegrationTests",
            """"
            using System;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            namespace Cragboard.Scoring.IntegrationTests;

            public class TopsCountIntegrationTests
            {
                [Fact]
                public async Task SumOfTopsIsStable()
                {
                    string? key = Environment.GetEnvironmentVariable("OPENAI_API_KEY");
                    Assert.NotNull(key);

                    ChatClient client = new("gpt-4o-mini", key);
                    ChatCompletionOptions options = new() { Temperature = 0f, Seed = 7, MaxOutputTokenCount = 5 };

                    ChatCompletion completion = await client.CompleteChatAsync(
                        [new UserChatMessage("A climber tops 5 problems on Monday and 7 on Tuesday. How many in total? Reply with the number only.")],
                        options);

                    Assert.Equal("12", completion.Content[0].Text.Trim());
                }
            }
            """");

        yield return Silent("MeaiIntegrationStyle_LiveCachingClient_ComparesTwoOutputs_IsSilent", "Tramline.Caching.IntegrationTests",
            """"
            using System;
            using System.Collections.Concurrent;
            using System.Collections.Generic;
            using System.Text.Json;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Tramline.Caching.IntegrationTests;

            /// <summary>A process-local cache for chat responses, keyed by the serialized request.</summary>
            public sealed class InMemoryCachingChatClient(IChatClient innerClient) : CachingChatClient(innerClient)
            {
                private readonly ConcurrentDictionary<string, ChatResponse> _responses = new();
                private readonly ConcurrentDictionary<string, IReadOnlyList<ChatResponseUpdate>> _streams = new();

                protected override string GetCacheKey(IEnumerable<ChatMessage> messages, ChatOptions? options, params ReadOnlySpan<object?> additionalValues) =>
                    JsonSerializer.Serialize(messages, AIJsonUtilities.DefaultOptions);

                protected override Task<ChatResponse?> ReadCacheAsync(string key, CancellationToken cancellationToken) =>
                    Task.FromResult(_responses.TryGetValue(key, out var value) ? value : null);

                protected override Task<IReadOnlyList<ChatResponseUpdate>?> ReadCacheStreamingAsync(string key, CancellationToken cancellationToken) =>
                    Task.FromResult(_streams.TryGetValue(key, out var value) ? value : null);

                protected override Task WriteCacheAsync(string key, ChatResponse value, CancellationToken cancellationToken)
                {
                    _responses[key] = value;
                    return Task.CompletedTask;
                }

                protected override Task WriteCacheStreamingAsync(string key, IReadOnlyList<ChatResponseUpdate> value, CancellationToken cancellationToken)
                {
                    _streams[key] = value;
                    return Task.CompletedTask;
                }
            }
            """",
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Tramline.Caching.IntegrationTests;

            public class ResponseCacheIntegrationTests
            {
                [Fact]
                public async Task SamePromptIsServedFromTheCache()
                {
                    var key = Environment.GetEnvironmentVariable("OPENAI_API_KEY");
                    if (string.IsNullOrEmpty(key))
                    {
                        return;
                    }

                    using var client = new InMemoryCachingChatClient(new OpenAI.Chat.ChatClient("gpt-4o-mini", key).AsIChatClient());
                    var message = new ChatMessage(ChatRole.User, "Pick a random tram fleet number between 1 and 1000.");

                    var first = await client.GetResponseAsync([message]);
                    var second = await client.GetResponseAsync([message]);

                    Assert.Equal(first.Text, second.Text);
                }
            }
            """");

        yield return Silent("MeaiIntegrationStyle_LiveRandomness_AssertNotEqual_IsSilent", "Kites.Festival.IntegrationTests",
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI;
            using Xunit;

            namespace Kites.Festival.IntegrationTests;

            public class RaffleNumberIntegrationTests
            {
                private static IChatClient? CreateChatClient()
                {
                    var key = Environment.GetEnvironmentVariable("OPENAI_API_KEY");
                    return key is null ? null : new OpenAIClient(key).GetChatClient("gpt-4o-mini").AsIChatClient();
                }

                [Fact]
                public async Task TwoDrawsDiffer()
                {
                    using var chatClient = CreateChatClient();
                    if (chatClient is null)
                    {
                        return;
                    }

                    var message = new ChatMessage(ChatRole.User, "Pick a random raffle number, uniformly distributed between 1 and 1000000.");
                    var firstResponse = await chatClient.GetResponseAsync([message]);
                    var secondResponse = await chatClient.GetResponseAsync([message]);

                    Assert.NotEqual(firstResponse.Text, secondResponse.Text);
                }
            }
            """");

        yield return Silent("MeaiIntegrationStyle_LiveUsageArithmeticAndModelId_IsSilent", "Tramline.Chat.Usage.IntegrationTests",
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI;
            using Xunit;

            namespace Tramline.Chat.Usage.IntegrationTests;

            public class UsageIntegrationTests
            {
                private readonly IChatClient? _chatClient =
                    Environment.GetEnvironmentVariable("OPENAI_API_KEY") is { } key
                        ? new OpenAIClient(key).GetChatClient("gpt-4o-mini").AsIChatClient()
                        : null;

                [Fact]
                public async Task GetResponseAsync_UsageDataAvailable()
                {
                    if (_chatClient is null)
                    {
                        return;
                    }

                    var response = await _chatClient.GetResponseAsync("Explain in 10 words how a tram's pantograph works.", new ChatOptions { Temperature = 1.1f });

                    Assert.True(response.Usage?.InputTokenCount > 1);
                    Assert.True(response.Usage?.OutputTokenCount > 1);
                    Assert.Equal(response.Usage?.InputTokenCount + response.Usage?.OutputTokenCount, response.Usage?.TotalTokenCount);
                    Assert.StartsWith("gpt-4o-mini", response.ModelId);
                    Assert.Equal(ChatFinishReason.Stop, response.FinishReason);
                }
            }
            """");
    }

    // ==== silent: product code and samples whose settings are fine or unknown ==========================================

    private static IEnumerable<PrecisionCase> ProductCodeThatStaysSilent()
    {
        yield return Silent("ProductStyle_SamplingFromInjectedSettings_ValuesUnknown_IsSilent", "Tramline.Assistant",
            """"
            namespace Tramline.Assistant;

            public sealed record AssistantSamplingSettings(float Temperature, float TopP);
            """",
            """"
            using System.Threading;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Tramline.Assistant;

            public sealed class StopNameExtractor(ChatClient chat, AssistantSamplingSettings sampling)
            {
                public async Task<string> ExtractStopNamesAsync(string announcement, CancellationToken cancellationToken = default)
                {
                    var options = new ChatCompletionOptions
                    {
                        Temperature = sampling.Temperature,
                        TopP = sampling.TopP,
                    };

                    ChatCompletion completion = await chat.CompleteChatAsync(
                        [new SystemChatMessage("Extract every tram stop name from the announcement. Return them comma-separated."), new UserChatMessage(announcement)],
                        options,
                        cancellationToken);

                    return completion.Content[0].Text;
                }
            }
            """");

        yield return Silent("ProductStyle_NewsletterSummaryAt0_9_WithinCeiling_IsSilent", "SeedVault.Newsletter",
            """"
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace SeedVault.Newsletter;

            public sealed class SwapNotesDigest(ChatClient chat)
            {
                public async Task<string> SummarizeSwapNotesAsync(string notes)
                {
                    ChatCompletion completion = await chat.CompleteChatAsync(
                        [new SystemChatMessage("Summarize this month's seed swap notes for the newsletter in three friendly sentences."), new UserChatMessage(notes)],
                        new ChatCompletionOptions { Temperature = 0.9f, MaxOutputTokenCount = 200 });

                    return completion.Content[0].Text;
                }
            }
            """");

        yield return Silent("ProductStyle_TranslationAt0_3_TopPAtDefault_IsSilent", "Cragboard.Localization",
            """"
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Cragboard.Localization;

            public sealed class RouteDescriptionTranslator(IChatClient chatClient)
            {
                private const string Instructions = "Translate the route description into German. Keep grades and hold names unchanged.";

                public async Task<string> TranslateAsync(string description, CancellationToken cancellationToken = default)
                {
                    var options = new ChatOptions
                    {
                        Temperature = 0.3f,
                        TopP = 1f,
                    };

                    var response = await chatClient.GetResponseAsync(
                        [new ChatMessage(ChatRole.System, Instructions), new ChatMessage(ChatRole.User, description)],
                        options,
                        cancellationToken);

                    return response.Text;
                }
            }
            """");

        yield return Silent("ProductStyle_O3MiniQueryWriterWithoutTemperature_IsSilent", "Tramline.Planning",
            """"
            using System.Threading.Tasks;
            using OpenAI;
            using OpenAI.Chat;

            namespace Tramline.Planning;

            public sealed class TripQueryWriter(OpenAIClient openAI)
            {
                public async Task<string> WriteSqlForQuestionAsync(string question)
                {
                    ChatClient chat = openAI.GetChatClient("o3-mini");
                    var options = new ChatCompletionOptions
                    {
                        ReasoningEffortLevel = ChatReasoningEffortLevel.Low,
                        MaxOutputTokenCount = 2000,
                    };

                    ChatCompletion completion = await chat.CompleteChatAsync(
                        [new DeveloperChatMessage("Write a SQL query against the tram_trips table that answers the question. Return only SQL."), new UserChatMessage(question)],
                        options);

                    return completion.Content[0].Text;
                }
            }
            """");

        yield return Silent("SkSampleStyle_TemperatureAtDefaultWithTopP_RhymingReply_IsSilent", "SeedVault.Samples",
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            namespace SeedVault.Samples;

            // Shows how a rhyming reply is produced from a chat history.
            public static class RhymingReplySample
            {
                private static readonly OpenAIPromptExecutionSettings s_executionSettings =
                    new()
                    {
                        FrequencyPenalty = 0,
                        PresencePenalty = 0,
                        Temperature = 1,
                        TopP = 0.5,
                    };

                public static async Task RunAsync()
                {
                    Console.WriteLine("======== Rhyming reply ========");

                    var apiKey = Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? throw new InvalidOperationException("Set OPENAI_API_KEY.");
                    IChatCompletionService chatService = new OpenAIChatCompletionService("gpt-4o-mini", apiKey);

                    var chatHistory = new ChatHistory("Write one paragraph in response to the user that rhymes.");
                    chatHistory.AddUserMessage("Why should I join the seed library?");

                    foreach (var reply in await chatService.GetChatMessageContentsAsync(chatHistory, s_executionSettings))
                    {
                        Console.WriteLine(reply.Content);
                    }
                }
            }
            """");
        yield return Silent("MeaiProductStyle_ClassificationWithUnsetChatOptionsTemperature_IsSilent", "SeedVault.Requests",
            """"
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace SeedVault.Requests;

            /// <summary>Sorts incoming member requests; the temperature comes from the client pipeline's defaults.</summary>
            public sealed class RequestSorter(IChatClient chatClient)
            {
                public async Task<string> SortAsync(string request, CancellationToken cancellationToken = default)
                {
                    var response = await chatClient.GetResponseAsync(
                        [
                            new ChatMessage(ChatRole.System, "Classify the member request as one of: donation, borrowing, volunteering, other. Reply with the label only."),
                            new ChatMessage(ChatRole.User, request),
                        ],
                        new ChatOptions { MaxOutputTokens = 5 },
                        cancellationToken);

                    return response.Text.Trim();
                }
            }
            """");
    }

    // ==== true findings: tests that really call a model and compare its exact output ====================================

    private static IEnumerable<PrecisionCase> LiveTestsWithTrueFindings()
    {
        yield return Fires("IntegrationStyle_LiveOpenAI_ExactNumberAtProviderDefault_SAMP002", "Tramline.IntegrationTests",
            new[] { At("SAMP002", "await client.CompleteChatAsync(") },
            """"
            using System;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            namespace Tramline.IntegrationTests;

            public sealed class JourneyArithmeticIntegrationTests
            {
                [Fact]
                public async Task MinutesInTwoAndAHalfHours()
                {
                    string? apiKey = Environment.GetEnvironmentVariable("OPENAI_API_KEY");
                    Assert.NotNull(apiKey);

                    ChatClient client = new("gpt-4o-mini", apiKey);

                    ChatCompletion completion = await client.CompleteChatAsync(new UserChatMessage("A tram shift lasts two and a half hours. How many minutes is that? Reply with the number only."));

                    Assert.Equal("150", completion.Content[0].Text);
                }
            }
            """");

        yield return Fires("MeaiIntegrationStyle_LiveTemperatureZeroWithoutSeed_ExactEqual_SAMP003", "SeedVault.Calendar.IntegrationTests",
            new[] { At("SAMP003", "new ChatOptions { Temperature = 0f }") },
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace SeedVault.Calendar.IntegrationTests;

            public class SowingMonthIntegrationTests
            {
                [Fact]
                public async Task ChilliSowingMonthIsNamed()
                {
                    var key = Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? throw new InvalidOperationException("OPENAI_API_KEY is not set.");
                    IChatClient client = new OpenAI.Chat.ChatClient("gpt-4o-mini", key).AsIChatClient();

                    var options = new ChatOptions { Temperature = 0f };
                    var response = await client.GetResponseAsync("In a temperate northern climate, in which month do most gardeners start sowing chillies indoors? Answer with the month name only.", options);

                    Assert.Equal("February", response.Text);
                }
            }
            """");

        yield return Fires("OllamaFunctionalStyle_LocalModelChatFromSetUp_ShouldBe_SAMP002", "Cragboard.Ollama.IntegrationTests",
            new[] { At("SAMP002", "_chat.SendAsync(") },
            """"
            using System;
            using System.Linq;
            using System.Threading;
            using System.Threading.Tasks;
            using NUnit.Framework;
            using OllamaSharp;
            using OllamaSharp.Models;
            using Shouldly;

            namespace Cragboard.Ollama.IntegrationTests;

            /// <summary>Functional tests against a local Ollama server.</summary>
            public class LocalModelChatTests
            {
                private readonly Uri _baseUri = new("http://localhost:11434");
                private readonly string _model = "llama3.2:1b";

                private OllamaApiClient _client = null!;
                private Chat _chat = null!;

                [SetUp]
                public async Task Setup()
                {
                    _client = new OllamaApiClient(_baseUri);
                    _chat = new Chat(_client) { Options = new RequestOptions { Temperature = 0.6f } };

                    var modelExists = (await _client.ListLocalModelsAsync()).Any(m => m.Name == _model);
                    if (!modelExists)
                    {
                        await foreach (var _ in _client.PullModelAsync(_model))
                        {
                        }
                    }
                }

                [TearDown]
                public void Teardown() => _client?.Dispose();

                [Test]
                public async Task SendAsync_ReturnsTheHoldCount()
                {
                    _client.SelectedModel = _model;

                    var response = await _chat.SendAsync("A route has 7 hand holds and 5 foot holds. How many holds in total? Provide only the number.", CancellationToken.None).StreamToEndAsync();

                    response.ShouldBe("12");
                }
            }
            """");

        yield return Fires("SkIntegrationStyle_KernelFromHelper_InvokePromptExactEqual_SAMP002", "Cragboard.IntegrationTests",
            new[] { At("SAMP002", "kernel.InvokePromptAsync(") },
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Cragboard.IntegrationTests.Connectors.OpenAI;

            public sealed class GradeComparisonIntegrationTests
            {
                [Fact]
                public async Task HarderGradeIsNamedAsync()
                {
                    // Arrange
                    Kernel kernel = this.CreateAndInitializeKernel();

                    // Act
                    FunctionResult result = await kernel.InvokePromptAsync(
                        "Which is harder on the French sport scale, 6a or 7a? Answer with the grade only.",
                        new(new OpenAIPromptExecutionSettings { Temperature = 0.7 }));

                    // Assert
                    Assert.Equal("7a", result.GetValue<string>());
                }

                private Kernel CreateAndInitializeKernel()
                {
                    string apiKey = Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? throw new InvalidOperationException("OPENAI_API_KEY is not set.");

                    IKernelBuilder kernelBuilder = Kernel.CreateBuilder();
                    kernelBuilder.AddOpenAIChatCompletion(modelId: "gpt-4o-mini", apiKey: apiKey);
                    return kernelBuilder.Build();
                }
            }
            """");

        yield return Fires("MeaiIntegrationStyle_LiveFunctionInvocation_ExactToolArgument_SAMP002", "SeedVault.Chat.IntegrationTests",
            new[] { At("SAMP002", "await chatClient.GetResponseAsync(") },
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI;
            using Xunit;

            namespace SeedVault.Chat.IntegrationTests;

            public class StockLookupIntegrationTests
            {
                [Fact]
                public async Task FunctionInvocation_VarietyIsPassedThrough()
                {
                    var key = Environment.GetEnvironmentVariable("OPENAI_API_KEY");
                    Assert.NotNull(key);

                    using IChatClient chatClient = new ChatClientBuilder(new OpenAIClient(key).GetChatClient("gpt-4o-mini").AsIChatClient())
                        .UseFunctionInvocation()
                        .Build();

                    string? variety = null;
                    AIFunction checkStock = AIFunctionFactory.Create((string name) => { variety = name; return "in stock"; }, "CheckSeedStock");

                    var response = await chatClient.GetResponseAsync("Do you have Cherokee Purple tomato seeds in stock?", new ChatOptions { Tools = [checkStock] });

                    Assert.Equal("Cherokee Purple", variety);
                    Assert.Contains("stock", response.Text, StringComparison.OrdinalIgnoreCase);
                }
            }
            """");

        yield return Fires("IntegrationStyle_LiveStreamingAccumulated_FluentShouldBe_SAMP002", "Tramline.Chat.IntegrationTests",
            new[] { At("SAMP002", "client.CompleteChatStreamingAsync(") },
            """"
            using System;
            using System.Text;
            using System.Threading.Tasks;
            using FluentAssertions;
            using OpenAI.Chat;
            using Xunit;

            namespace Tramline.Chat.IntegrationTests;

            public class DepotNameStreamingTests
            {
                [Fact]
                public async Task StreamedDepotNameIsExact()
                {
                    var key = Environment.GetEnvironmentVariable("OPENAI_API_KEY");
                    if (key is null)
                    {
                        return;
                    }

                    var client = new ChatClient("gpt-4o-mini", key);
                    var text = new StringBuilder();

                    await foreach (StreamingChatCompletionUpdate update in client.CompleteChatStreamingAsync([new UserChatMessage("Trams sleep overnight in a building at the end of the line. What is that building usually called? One word.")], new ChatCompletionOptions { Temperature = 0.4f }))
                    {
                        foreach (ChatMessageContentPart part in update.ContentUpdate)
                        {
                            text.Append(part.Text);
                        }
                    }

                    text.ToString().Should().Be("Depot");
                }
            }
            """");

        yield return Fires("IntegrationStyle_HelperOfLiveTestClassSendsAtTemperature0_5_SAMP002", "Tramline.Timetable.IntegrationTests",
            new[] { At("SAMP002", "await _chat.CompleteChatAsync(") },
            """"
            using System;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            namespace Tramline.Timetable.IntegrationTests;

            public sealed class TimetableQuestionIntegrationTests
            {
                private readonly ChatClient _chat = new("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing-key");

                [Fact]
                public async Task FirstSundayTramArrivalIsComputed()
                {
                    string answer = await AskAsync("The first Sunday tram leaves the depot at 06:40 and takes 12 minutes to reach Market Square. When does it reach Market Square? Reply in HH:mm only.");

                    Assert.Equal("06:52", answer);
                }

                private async Task<string> AskAsync(string question)
                {
                    ChatCompletionOptions options = new() { Temperature = 0.5f };
                    ChatCompletion completion = await _chat.CompleteChatAsync([new UserChatMessage(question)], options);
                    return completion.Content[0].Text.Trim();
                }
            }
            """");

        yield return Fires("MsTestIntegrationStyle_LocalOllamaChatClientFromClassInitialize_AreEqual_SAMP002", "Kites.Festival.Weather.IntegrationTests",
            new[] { At("SAMP002", "await s_client.GetResponseAsync(") },
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Microsoft.VisualStudio.TestTools.UnitTesting;
            using OllamaSharp;

            namespace Kites.Festival.Weather.IntegrationTests;

            [TestClass]
            public class WindScaleIntegrationTests
            {
                private static readonly IChatClient s_client = new OllamaApiClient(new Uri("http://localhost:11434"), "llama3.2");

                [TestMethod]
                public async Task BeaufortNumberForStrongBreeze()
                {
                    var response = await s_client.GetResponseAsync("What is the Beaufort number for a strong breeze? Reply with the number only.", new ChatOptions { Temperature = 0.3f });

                    Assert.AreEqual("6", response.Text.Trim());
                }
            }
            """");
        yield return Fires("SkIntegrationStyle_ServiceFromKernel_TemperatureZeroNoSeed_NUnitIsEqualTo_SAMP003", "Tramline.Fares.IntegrationTests",
            new[] { At("SAMP003", "new OpenAIPromptExecutionSettings { Temperature = 0 }") },
            """"
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.DependencyInjection;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using NUnit.Framework;

            namespace Tramline.Fares.IntegrationTests;

            [TestFixture]
            public class FareZoneIntegrationTests
            {
                private Kernel _kernel = null!;

                [OneTimeSetUp]
                public void CreateKernel()
                {
                    var apiKey = Environment.GetEnvironmentVariable("OPENAI_API_KEY");
                    Assume.That(apiKey, Is.Not.Null.And.Not.Empty);

                    var builder = Kernel.CreateBuilder();
                    builder.AddOpenAIChatCompletion("gpt-4o-mini", apiKey!);
                    _kernel = builder.Build();
                }

                [Test]
                public async Task ZoneCountForCrossTownTrip()
                {
                    var chatCompletion = _kernel.Services.GetRequiredService<IChatCompletionService>();
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 0 };

                    var result = await chatCompletion.GetChatMessageContentAsync(
                        "A trip from zone 1 to zone 4 crosses every zone in between. How many zones does it touch? Reply with the number only.",
                        settings,
                        _kernel);

                    Assert.That(result.Content, Is.EqualTo("4"));
                }
            }
            """");
    }

    // ==== true findings: samples and product code that really send bad settings =========================================

    private static IEnumerable<PrecisionCase> SamplesAndProductCodeWithTrueFindings()
    {
        yield return Fires("SampleStyle_ConsoleAppCallsGpt4oAtTemperature2_5_SAMP005", "Tramline.AnnouncementSample",
            new[] { At("SAMP005", "Temperature = 2.5f") },
            """"
            using System;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Tramline.AnnouncementSample;

            public static class Program
            {
                public static async Task Main()
                {
                    ChatClient client = new("gpt-4o", Environment.GetEnvironmentVariable("OPENAI_API_KEY"));

                    ChatCompletionOptions options = new()
                    {
                        Temperature = 2.5f,
                        MaxOutputTokenCount = 200,
                    };

                    ChatCompletion completion = await client.CompleteChatAsync(
                        [new UserChatMessage("Write a cheerful announcement for the 100th birthday of our city's tram network.")],
                        options);

                    Console.WriteLine($"[ASSISTANT]: {completion.Content[0].Text}");
                }
            }
            """");

        yield return Fires("ExampleStyle_JsonSchemaExtractionAtProviderDefault_SAMP001", "SeedVault.Cataloguing",
            new[] { At("SAMP001", "new ChatCompletionOptions") },
            """"
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace SeedVault.Cataloguing;

            public sealed class SeedPacketReader(ChatClient chat)
            {
                private static readonly BinaryData Schema = BinaryData.FromString("""
                    {
                      "type": "object",
                      "properties": {
                        "variety": { "type": "string" },
                        "sowing_months": { "type": "array", "items": { "type": "string" } },
                        "germination_days": { "type": "integer" }
                      },
                      "required": ["variety", "sowing_months", "germination_days"],
                      "additionalProperties": false
                    }
                    """);

                public async Task<string> ExtractPacketDetailsAsync(string packetText, CancellationToken cancellationToken = default)
                {
                    List<ChatMessage> messages =
                    [
                        new SystemChatMessage("Extract the variety, the sowing months and the days to germination from the seed packet text."),
                        new UserChatMessage(packetText),
                    ];

                    ChatCompletion completion = await chat.CompleteChatAsync(messages, new ChatCompletionOptions
                    {
                        ResponseFormat = ChatResponseFormat.CreateJsonSchemaFormat("seed_packet", Schema, jsonSchemaIsStrict: true),
                    }, cancellationToken);

                    return completion.Content[0].Text;
                }
            }
            """");

        yield return Fires("ProductStyle_IncidentClassifierAt0_9_SAMP001", "Cragboard.Support",
            new[] { At("SAMP001", "Temperature = 0.9f") },
            """"
            using System.Threading;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Cragboard.Support;

            public sealed class IncidentTriage(ChatClient chat)
            {
                public async Task<string> ClassifyIncidentAsync(string report, CancellationToken cancellationToken = default)
                {
                    var options = new ChatCompletionOptions
                    {
                        Temperature = 0.9f,
                        MaxOutputTokenCount = 5,
                    };

                    ChatCompletion completion = await chat.CompleteChatAsync(
                        [
                            new SystemChatMessage("Classify the incident report as one of: equipment, injury, behaviour, facility. Reply with the label only."),
                            new UserChatMessage(report),
                        ],
                        options,
                        cancellationToken);

                    return completion.Content[0].Text.Trim().ToLowerInvariant();
                }
            }
            """");

        yield return Fires("ProductStyle_O4MiniFromGetChatClientWithTemperature_SAMP007", "Tramline.Maintenance",
            new[] { At("SAMP007", "Temperature = 0.2f") },
            """"
            using System.Threading.Tasks;
            using OpenAI;
            using OpenAI.Chat;

            namespace Tramline.Maintenance;

            public sealed class TrackWorkPlanner(OpenAIClient openAI)
            {
                public async Task<string> PlanWeekendWorksAsync(string constraints)
                {
                    ChatClient chat = openAI.GetChatClient("o4-mini");
                    var options = new ChatCompletionOptions
                    {
                        Temperature = 0.2f,
                        MaxOutputTokenCount = 4000,
                    };

                    ChatCompletion completion = await chat.CompleteChatAsync(
                        [new UserChatMessage("Plan the weekend track maintenance so that no two adjacent sections close together. Constraints: " + constraints)],
                        options);

                    return completion.Content[0].Text;
                }
            }
            """");

        yield return Fires("AnthropicExampleStyle_ChatClientAdapterDropsTemperature_SAMP007", "SeedVault.Assistant",
            new[] { At("SAMP007", "Temperature = 0.2f") },
            """"
            using System;
            using System.Threading.Tasks;
            using Anthropic;
            using Microsoft.Extensions.AI;

            namespace SeedVault.Assistant;

            public static class Program
            {
                public static async Task Main()
                {
                    // Configured using the ANTHROPIC_API_KEY environment variable.
                    IChatClient chatClient = new AnthropicClient()
                        .AsIChatClient("claude-haiku-4-5")
                        .AsBuilder()
                        .UseFunctionInvocation()
                        .Build();

                    ChatOptions options = new()
                    {
                        Temperature = 0.2f,
                        MaxOutputTokens = 400,
                    };

                    await foreach (var update in chatClient.GetStreamingResponseAsync("Which vegetables can a beginner grow from saved seed?", options))
                    {
                        Console.Write(update);
                    }

                    Console.WriteLine();
                }
            }
            """");

        yield return Fires("SkProductStyle_InvokePromptWithTemperatureAndTopPBothMoved_SAMP004", "Cragboard.Newsletter",
            new[] { At("SAMP004", "TopP = 0.7") },
            """"
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            namespace Cragboard.Newsletter;

            public sealed class WeeklySetterNotes
            {
                private readonly Kernel _kernel;

                public WeeklySetterNotes(string apiKey)
                {
                    var builder = Kernel.CreateBuilder();
                    builder.AddOpenAIChatCompletion("gpt-4o", apiKey);
                    _kernel = builder.Build();
                }

                public async Task<string> WriteIntroAsync(string problems)
                {
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 0.8, TopP = 0.7, MaxTokens = 300 };

                    FunctionResult result = await _kernel.InvokePromptAsync(
                        "Write a short, upbeat intro for this week's new boulder problems: {{$problems}}",
                        new KernelArguments(settings) { ["problems"] = problems });

                    return result.GetValue<string>() ?? string.Empty;
                }
            }
            """");

        yield return Fires("OllamaProductStyle_ChatRequestTopPAboveOne_SAMP005", "Tramline.Edge",
            new[] { At("SAMP005", "TopP = 1.5f") },
            """"
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;
            using OllamaSharp;
            using OllamaSharp.Models;
            using OllamaSharp.Models.Chat;

            namespace Tramline.Edge;

            public sealed class DelayExplainer(IOllamaApiClient ollama)
            {
                public async Task<string> ExplainAsync(string incident, CancellationToken cancellationToken = default)
                {
                    var request = new ChatRequest
                    {
                        Model = "llama3.2",
                        Messages = [new Message(ChatRole.System, "You explain tram delays to waiting passengers in plain language."), new Message(ChatRole.User, incident)],
                        Options = new RequestOptions { TopP = 1.5f },
                        Stream = true,
                    };

                    var text = new StringBuilder();
                    await foreach (var chunk in ollama.ChatAsync(request, cancellationToken))
                    {
                        text.Append(chunk?.Message.Content);
                    }

                    return text.ToString();
                }
            }
            """");

        yield return Fires("AzureInferenceProductStyle_TemperatureAboveOne_SAMP005", "SeedVault.Inference",
            new[] { At("SAMP005", "Temperature = 1.2f") },
            """"
            using System;
            using System.Threading.Tasks;
            using Azure;
            using Azure.AI.Inference;

            namespace SeedVault.Inference;

            public sealed class GardeningTipWriter
            {
                private readonly ChatCompletionsClient _client;

                public GardeningTipWriter(Uri endpoint, string key)
                {
                    _client = new ChatCompletionsClient(endpoint, new AzureKeyCredential(key));
                }

                public async Task<string> WriteTipOfTheWeekAsync(string season)
                {
                    var requestOptions = new ChatCompletionsOptions
                    {
                        Messages =
                        {
                            new ChatRequestSystemMessage("You write a friendly gardening tip for seed library members."),
                            new ChatRequestUserMessage("Season: " + season),
                        },
                        Model = "Phi-4",
                        Temperature = 1.2f,
                    };

                    Response<ChatCompletions> response = await _client.CompleteAsync(requestOptions);
                    return response.Value.Content;
                }
            }
            """");

        yield return Fires("ProductStyle_ExtractionAtTemperatureZeroWithTopP_SAMP006", "Cragboard.RouteCards",
            new[] { At("SAMP006", "TopP = 0.1f") },
            """"
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Cragboard.RouteCards;

            public sealed class RouteCardReader(ChatClient chat)
            {
                public async Task<string> ReadCardAsync(string cardText)
                {
                    var options = new ChatCompletionOptions
                    {
                        Temperature = 0f,
                        TopP = 0.1f,
                        ResponseFormat = ChatResponseFormat.CreateJsonObjectFormat(),
                    };

                    ChatCompletion completion = await chat.CompleteChatAsync(
                        [new SystemChatMessage("Extract the grade, the setter and the wall name from the route card. Return JSON."), new UserChatMessage(cardText)],
                        options);

                    return completion.Content[0].Text;
                }
            }
            """");

        yield return Fires("RawHttpProductStyle_ThreeCandidatesAtTemperatureZero_SAMP008", "Tramline.Signage",
            new[] { At("SAMP008", "n = 3") },
            """"
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Tramline.Signage;

            /// <summary>Asks an OpenAI-compatible endpoint for alternative texts for the platform displays.</summary>
            public sealed class DisplayTextAlternatives(HttpClient http)
            {
                public async Task<string> SuggestAsync(string notice, CancellationToken cancellationToken = default)
                {
                    using var response = await http.PostAsJsonAsync("v1/chat/completions", new
                    {
                        model = "gpt-4o-mini",
                        temperature = 0, n = 3,
                        messages = new object[]
                        {
                            new { role = "system", content = "Rewrite the service notice for a 40-character platform display." },
                            new { role = "user", content = notice },
                        },
                    }, cancellationToken);

                    response.EnsureSuccessStatusCode();
                    return await response.Content.ReadAsStringAsync(cancellationToken);
                }
            }
            """");

        yield return Fires("MeaiProductStyle_InjectedChatClientSummaryAt1_4_SAMP001", "SeedVault.Volunteers",
            new[] { At("SAMP001", "Temperature = 1.4f") },
            """"
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace SeedVault.Volunteers;

            public sealed class MinutesDigest(IChatClient chatClient)
            {
                public async Task<string> SummarizeMinutesAsync(string minutes, CancellationToken cancellationToken = default)
                {
                    var options = new ChatOptions
                    {
                        Temperature = 1.4f,
                        MaxOutputTokens = 300,
                    };

                    ChatResponse response = await chatClient.GetResponseAsync(
                        [new ChatMessage(ChatRole.System, "Summarize the volunteer meeting minutes in five bullet points."), new ChatMessage(ChatRole.User, minutes)],
                        options,
                        cancellationToken);

                    return response.Text;
                }
            }
            """");

        yield return Fires("SkProductStyle_LlmTaskCodeAttributeOnInjectedService_SAMP001", "Cragboard.Reports",
            new[] { At("SAMP001", "Temperature = 0.9") },
            """"
            using System;

            namespace Cragboard.Reports;

            [AttributeUsage(AttributeTargets.Method | AttributeTargets.Class)]
            internal sealed class LlmTaskAttribute(string kind) : Attribute
            {
                public string Kind { get; } = kind;
            }
            """",
            """"
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            namespace Cragboard.Reports;

            public sealed class MembershipReportQueries(IChatCompletionService chat)
            {
                [LlmTask("code")]
                public async Task<string> DraftQueryAsync(string question, CancellationToken cancellationToken = default)
                {
                    var history = new ChatHistory("You help the front desk with reports over the memberships database.");
                    history.AddUserMessage(question);

                    var settings = new OpenAIPromptExecutionSettings { Temperature = 0.9, MaxTokens = 400 };
                    var reply = await chat.GetChatMessageContentAsync(history, settings, cancellationToken: cancellationToken);

                    return reply.Content ?? string.Empty;
                }
            }
            """");

        yield return Fires("MeaiProductStyle_TopKThroughOpenAIAdapter_SAMP007", "Tramline.RiderHelp",
            new[] { At("SAMP007", "TopK = 20") },
            """"
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI;

            namespace Tramline.RiderHelp;

            public sealed class RiderQuestions
            {
                private readonly OpenAIClient _openAI;

                public RiderQuestions(OpenAIClient openAI) => _openAI = openAI;

                public async Task<string> AnswerAsync(string question)
                {
                    IChatClient client = _openAI.GetChatClient("gpt-4o-mini").AsIChatClient();
                    var options = new ChatOptions
                    {
                        Temperature = 0.5f,
                        TopK = 20,
                    };

                    var response = await client.GetResponseAsync(question, options);
                    return response.Text;
                }
            }
            """");

        yield return Fires("MeaiProductStyle_BrainstormAt1_8_SAMP009", "Cragboard.Events",
            new[] { At("SAMP009", "Temperature = 1.8f") },
            """"
            using System;
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Cragboard.Events;

            public sealed class WallNamingIdeas(IChatClient chat)
            {
                public async Task<IReadOnlyList<string>> BrainstormNamesAsync(string wallDescription)
                {
                    var response = await chat.GetResponseAsync(
                        "Brainstorm ten playful names for our new climbing wall. Description: " + wallDescription,
                        new ChatOptions { Temperature = 1.8f });

                    return response.Text.Split('\n', StringSplitOptions.RemoveEmptyEntries);
                }
            }
            """");
        yield return Fires("ProductStyle_LabelPromptSentWithoutAnyOptions_SAMP001", "Kites.Festival.Stalls",
            new[] { At("SAMP001", "await chat.CompleteChatAsync(") },
            """"
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Kites.Festival.Stalls;

            public sealed class StallApplicationSorter(ChatClient chat)
            {
                public async Task<string> SortApplicationAsync(string application)
                {
                    ChatCompletion completion = await chat.CompleteChatAsync(
                        new SystemChatMessage("Label the stall application as one of: food, crafts, kites, charity. Reply with the label only."),
                        new UserChatMessage(application));

                    return completion.Content[0].Text.Trim();
                }
            }
            """");

        yield return Fires("ProductStyle_LlmJudgeGradesAnswersAt0_7_SAMP001", "Tramline.Quality",
            new[] { At("SAMP001", "Temperature = 0.7f") },
            """"
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Tramline.Quality;

            public sealed class AnswerJudge(ChatClient judge)
            {
                private const string Rubric = "Grade the assistant's answer to the passenger from 1 to 5 for accuracy against the timetable excerpt. Reply with the number only.";

                public async Task<int> GradeAnswerAsync(string timetableExcerpt, string answer)
                {
                    var options = new ChatCompletionOptions
                    {
                        Temperature = 0.7f,
                        Seed = 11,
                    };

                    ChatCompletion completion = await judge.CompleteChatAsync(
                        [new SystemChatMessage(Rubric), new UserChatMessage($"Timetable: {timetableExcerpt}\nAnswer: {answer}")],
                        options);

                    return int.Parse(completion.Content[0].Text.Trim());
                }
            }
            """");
    }
}
