using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>
/// Model Context Protocol sampling (ModelContextProtocol.Core 2.4.0): an MCP server asks the client's model to sample.
/// The whole SDK is one declaration in Surfaces/McpSurfaces.cs plus rows in the rules table.
/// </summary>
public class McpSurfaceTests
{
    private const string Usings = """
        #pragma warning disable MCP9005 // sampling is obsolete in 2.4.0 (deprecated by the 2026-07-28 specification)
        using System.Threading;
        using System.Threading.Tasks;
        using Microsoft.Extensions.AI;
        using ModelContextProtocol.Protocol;
        using ModelContextProtocol.Server;

        """;

    [Fact]
    public void SampleAsync_WithRequestParams_IsAProviderAgnosticRequest()
    {
        var request = Extract.Single(Usings + """
            class TideNoticeTools
            {
                async Task<CreateMessageResult> Summarise(McpServer server, string notice, CancellationToken ct) =>
                    await server.SampleAsync(new CreateMessageRequestParams
                    {
                        MaxTokens = 200,
                        Temperature = 0.3f,
                        SystemPrompt = "Summarise the harbour notice in two sentences.",
                    }, ct);
            }
            """);

        Assert.Equal("generic", request.Provider); // the client picks the model; the specification publishes no range
        Assert.Equal((ValueKind.Known, 0.3), request.Setting(Setting.Temperature));
        Assert.Equal(Reach.Sent, request.Reach);
        Assert.Equal("SampleAsync", request.SendingCall?.Name);
    }

    [Fact]
    public async Task TemperatureFarAboveOne_IsExtreme_AndBelowZero_IsOutOfRange()
    {
        await Verify.AnalyzerAsync(Usings + """
            class TideNoticeTools
            {
                Task Loud(McpServer server) =>
                    server.SampleAsync(new CreateMessageRequestParams { MaxTokens = 50, {|SAMP009:Temperature = 2.5f|} }).AsTask();

                Task Negative(McpServer server) =>
                    server.SampleAsync(new CreateMessageRequestParams { MaxTokens = 50, {|SAMP005:Temperature = -0.2f|} }).AsTask();

                // The specification publishes no maximum: 1.2 is neither rejected nor extreme.
                Task Warm(McpServer server) =>
                    server.SampleAsync(new CreateMessageRequestParams { MaxTokens = 50, Temperature = 1.2f }).AsTask();
            }
            """);
    }

    [Fact]
    public async Task ChatOptionsOverload_DropsEverySettingButTemperature()
    {
        // SampleAsync(messages, ChatOptions) copies Temperature and drops top-p and the seed; a dropped top-p is not in force,
        // so it does not fight the temperature (no SAMP004).
        await Verify.AnalyzerAsync(Usings + """
            class TideNoticeTools
            {
                Task<ChatResponse> Ask(McpServer server, string question) =>
                    server.SampleAsync(
                        new[] { new ChatMessage(ChatRole.User, question) },
                        new ChatOptions { Temperature = 0.4f, {|SAMP007:TopP = 0.8f|}, {|SAMP007:Seed = 7|} });
            }
            """);
    }

    [Fact]
    public async Task SamplingChatClient_DropsTopK()
    {
        await Verify.AnalyzerAsync(Usings + """
            class TideNoticeTools
            {
                async Task<string> Ask(McpServer server, string question)
                {
                    IChatClient chat = server.AsSamplingChatClient();
                    var response = await chat.GetResponseAsync(question, new ChatOptions { Temperature = 0.4f, {|SAMP007:TopK = 20|} });
                    return response.Text;
                }
            }
            """);
    }

    [Fact]
    public async Task RequestParamsSerialisedInATest_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync(Usings + """
            using System.Text.Json;
            using Xunit;

            public class SamplingWireFormatTests
            {
                [Fact]
                public void Temperature_IsWrittenAsANumber()
                {
                    var request = new CreateMessageRequestParams { MaxTokens = 10, Temperature = 9f };
                    var json = JsonSerializer.Serialize(request);
                    Assert.Contains("\"temperature\":9", json);
                }
            }
            """);
    }

    [Fact]
    public async Task SampleAsyncOnASubstitutedServer_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync(Usings + """
            using NSubstitute;
            using Xunit;

            public class TideNoticeToolTests
            {
                [Fact]
                public async Task Summary_IsRequestedFromTheClient()
                {
                    var server = Substitute.For<McpServer>();
                    await server.SampleAsync(new CreateMessageRequestParams { MaxTokens = 10, Temperature = 2.5f });
                }
            }
            """);
    }
}
