using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Reachability;

/// <summary>
/// What counts as comparing model output (content, a model-produced boolean, tool-call arguments; not metadata or the
/// options), what counts as evidence of a task, and the smaller misreadings found on real code.
/// </summary>
public class OutputAndTaskTests
{
    private const string LiveClient = """
        private static readonly IChatClient Client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("key")).AsIChatClient();
        """;

    [Fact]
    public async Task AssertionsOnResponseMetadata_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            public class ReplyShapeTests
            {
            """ + LiveClient + """

                [Fact]
                public async Task Reply_ComesFromTheAssistant()
                {
                    var options = new ChatOptions { Temperature = 0.8f, ModelId = "gpt-4o-mini" };
                    var response = await Client.GetResponseAsync("Hello", options);
                    Assert.Equal(ChatRole.Assistant, response.Messages[0].Role);
                    Assert.Equal(Microsoft.Extensions.AI.ChatFinishReason.Stop, response.FinishReason);
                    Assert.Equal("gpt-4o-mini", response.ModelId);
                    Assert.Equal(12, response.Usage!.OutputTokenCount);
                    Assert.Equal(0.8f, options.Temperature);
                }
            }
            """);
    }

    [Fact]
    public async Task AssertTrueOnAModelProducedBoolean_Triggers_ButAContainsCheckDoesNot()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            public record Verdict(bool IsUrgent);

            public class NoticeTests
            {
            """ + LiveClient + """

                [Fact]
                public async Task StormWarning_IsUrgent()
                {
                    var response = await {|SAMP002:Client.GetResponseAsync<Verdict>("Is 'storm warning, all sailings cancelled' urgent?")|};
                    Assert.True(response.Result.IsUrgent);
                }

                [Fact]
                public async Task Greeting_MentionsTheHarbour()
                {
                    var response = await Client.GetResponseAsync("Greet a passenger.");
                    Assert.True(response.Text.Contains("harbour"));
                }
            }
            """);
    }

    [Fact]
    public async Task ToolCallArgumentsCapturedFromTheModel_AreModelOutput()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            public class BookingToolTests
            {
                private static readonly IChatClient Client =
                    new ChatClientBuilder(new ChatClient("gpt-4o-mini", new ApiKeyCredential("key")).AsIChatClient()).UseFunctionInvocation().Build();

                [Fact]
                public async Task Booking_PicksTheIsland()
                {
                    string? island = null;
                    var tool = AIFunctionFactory.Create((string destination) => { island = destination; return "booked"; }, "book_crossing");
                    await {|SAMP002:Client.GetResponseAsync("Book me a crossing to Farrow Island.", new ChatOptions { Tools = new[] { tool } })|};
                    Assert.Equal("Farrow Island", island);
                }
            }
            """);
    }

    [Fact]
    public async Task JsonFormatAlone_IsNotExtraction()
    {
        // A menu generator asks for JSON too; without a name or prompt that says extraction, no task and no SAMP001.
        await Verify.AnalyzerAsync("""
            using System;
            using OpenAI.Chat;

            class GalleyMenus
            {
                ChatCompletionOptions SuggestDinnerMenu() => new ChatCompletionOptions
                {
                    Temperature = 0.9f,
                    ResponseFormat = ChatResponseFormat.CreateJsonSchemaFormat("menu", BinaryData.FromString("{}")),
                };
            }
            """);
    }

    [Fact]
    public async Task TestClassName_DoesNotGiveItsTaskToTheCallUnderTest()
    {
        // "GradeEssay…" names the test, not the generation it runs; the live call has no task of its own.
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            public class GradeEssayTests
            {
                private static readonly ChatClient Client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("key"));

                [Fact]
                public async Task GradeEssay_ProducesAnAnswerToGrade()
                {
                    var options = new ChatCompletionOptions { Temperature = 0.9f };
                    var answer = await Client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage("Write two lines about the tide.") }, options);
                    Assert.NotNull(answer);
                }
            }
            """);
    }

    [Fact]
    public async Task NounsInNames_AreNotATask()
    {
        // Printing an ingredients line on a box label is not classification.
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            class LabelWriter
            {
                private readonly ChatClient client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("key"));

                async Task<string> MakeBoxLabelAsync(string ingredients)
                {
                    var completion = await client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage("Write a friendly line for a box: " + ingredients) });
                    return completion.Value.Content[0].Text;
                }
            }
            """);
    }

    [Fact]
    public async Task ClientCreatedInTheConstructor_KeepsItsModel()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            class RouteReasoner
            {
                private readonly ChatClient reasoner;

                public RouteReasoner(string key)
                {
                    reasoner = new ChatClient("o3-mini", new ApiKeyCredential(key));
                }

                Task<System.ClientModel.ClientResult<ChatCompletion>> Plan(string question) =>
                    reasoner.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(question) }, new ChatCompletionOptions { {|SAMP007:Temperature = 0.4f|} });
            }
            """);
    }

    [Fact]
    public async Task TopPZeroWithTemperature_IsInertNotFighting()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            class Lighthouse
            {
                ChatCompletionOptions Options() => new ChatCompletionOptions { {|SAMP006:Temperature = 0.7f|}, TopP = 0f };
            }
            """);
    }

    [Fact]
    public async Task UndeclaredSettingsTypeDerivedFromADeclaredOne_IsUnknownNotUnset()
    {
        // A connector's settings class the analyzer does not declare carries its own Temperature: written 0 here, so the
        // test is not "temperature unset".
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Xunit;

            public sealed class DockPromptSettings : PromptExecutionSettings
            {
                public double? Temperature { get; set; }
                public double? TopP { get; set; }
            }

            public class DockTests
            {
                private readonly IChatCompletionService service = Kernel.CreateBuilder().AddOpenAIChatCompletion("gpt-4o-mini", "key").Build()
                    .GetRequiredService<IChatCompletionService>();

                [Fact]
                public async Task Dock_IsNamed()
                {
                    var settings = new DockPromptSettings { Temperature = 0 };
                    var reply = await service.GetChatMessageContentAsync("Which dock?", settings);
                    Assert.Equal("Dock 3", reply.Content);
                }
            }
            """);
    }

    [Fact]
    public async Task OptionsFromAHelper_GetTheTaskOfTheCallSiteThatSendsThem()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            class CrewDesk
            {
                private readonly ChatClient client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("key"));

                private static ChatCompletionOptions Sampling() => new ChatCompletionOptions { Temperature = 0.9f };

                Task<ClientResult<ChatCompletion>> CrewList(string manifest) =>
                    client.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Extract the crew names as JSON: " + manifest) }, {|SAMP001:Sampling()|});

                Task<ClientResult<ChatCompletion>> Welcome(string name) =>
                    client.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Welcome " + name + " aboard.") }, Sampling());
            }
            """);
    }

    [Fact]
    public async Task OptionsFromAHelper_InATestThatComparesExactly_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            public class BerthTests
            {
            """ + LiveClient + """

                private static ChatOptions Warm() => new ChatOptions { Temperature = 0.6f };

                [Fact]
                public async Task Berth_IsNamed()
                {
                    var response = await {|SAMP002:Client.GetResponseAsync("Which berth? Reply with the number only.", Warm())|};
                    Assert.Equal("7", response.Text);
                }
            }
            """);
    }
}
