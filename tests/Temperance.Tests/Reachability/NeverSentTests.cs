using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Reachability;

/// <summary>
/// Options that never reach a model are not judged: mapping, serialisation and clone tests, options that are only
/// logged, a factory called with an omitted options argument. Their live twins (the same options sent) still are.
/// </summary>
public class NeverSentTests
{
    private const string Mapper = """
        using Microsoft.Extensions.AI;

        namespace Ferry.Booking;

        public sealed record WireRequest(float? Heat, float? Nucleus);

        public static class WireMapper
        {
            public static WireRequest ToWire(ChatOptions options) => new(options.Temperature, options.TopP);
        }
        """;

    [Fact]
    public async Task MappingTest_OptionsConvertedByTheProjectsMapper_IsSilent()
    {
        // Marker values a test writes to find them again in the mapped request: out of range, extreme, both moved.
        await Verify.ProjectAsync(new[]
        {
            """
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Ferry.Booking.Tests;

            public class WireMapperTests
            {
                [Fact]
                public void Temperature_And_TopP_AreCopied()
                {
                    var options = new ChatOptions { Temperature = 1.9f, TopP = 0.5f };
                    var wire = WireMapper.ToWire(options);
                    Assert.Equal(1.9f, wire.Heat);
                    Assert.Equal(0.5f, wire.Nucleus);
                }
            }
            """,
            Mapper,
        }, null);
    }

    [Fact]
    public async Task SerialisationTest_ModelReaderWriterWrite_IsSilent()
    {
        // Was read as a typed structured-output call (Write<ChatCompletionOptions>) and judged as extraction.
        await Verify.AnalyzerAsync("""
            using System.ClientModel.Primitives;
            using OpenAI.Chat;
            using Xunit;

            public class OptionsJsonTests
            {
                [Fact]
                public void Writes_Temperature()
                {
                    var options = new ChatCompletionOptions { Temperature = 2.5f, TopP = 0.3f };
                    var json = ModelReaderWriter.Write<ChatCompletionOptions>(options).ToString();
                    Assert.Contains("\"temperature\":2.5", json);
                }
            }
            """);
    }

    [Fact]
    public async Task CloneTest_IsSilent()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;
            using Xunit;

            public class ChatOptionsCloneTests
            {
                [Fact]
                public void Clone_KeepsSampling()
                {
                    var original = new ChatOptions { Temperature = 1.7f, TopP = 0.2f, TopK = 1 };
                    var copy = original.Clone();
                    Assert.Equal(original.Temperature, copy.Temperature);
                }
            }
            """);
    }

    [Fact]
    public async Task ProductCode_OptionsOnlyLogged_IsSilent()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;
            using Microsoft.Extensions.Logging;

            class SettingsBanner
            {
                void Print(ILogger logger)
                {
                    var options = new ChatOptions { Temperature = 1.8f };
                    logger.LogInformation("Sampling: {Temperature}", options.Temperature);
                }
            }
            """);
    }

    [Fact]
    public async Task FactoryCalledWithOmittedOptions_IsNotARequest()
    {
        // A project method with an optional options parameter is not a send; calling it without options asks no model.
        await Verify.AnalyzerAsync("""
            using OpenAI.Chat;

            static class OptionsFactory
            {
                public static ChatCompletionOptions For(string purpose, ChatCompletionOptions? template = null) => template ?? new ChatCompletionOptions();
            }

            class Manifests
            {
                ChatCompletionOptions ExtractManifest() => OptionsFactory.For("manifest");
            }
            """);
    }

    [Fact]
    public async Task ProductCode_LocalNeverSent_IsSilent_ButTheSentTwinTriggers()
    {
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using OpenAI.Chat;

            class Timetable
            {
                void Draft()
                {
                    var unused = new ChatCompletionOptions { Temperature = 2.5f };
                }

                void Send(ChatClient client)
                {
                    var options = new ChatCompletionOptions { {|SAMP005:Temperature = 2.5f|} };
                    client.CompleteChat(new ChatMessage[] { new UserChatMessage("Next sailing?") }, options);
                }
            }
            """);
    }

    [Fact]
    public async Task TestHelperThatSendsTheOptions_CountsAsTheSend()
    {
        // The helper in the same class passes its options on to a real client: the test's exact assertion is judged.
        await Verify.AnalyzerAsync("""
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            public class HarbourAnswerTests
            {
                private static readonly IChatClient Live = new ChatClient("gpt-4o-mini", new ApiKeyCredential("key")).AsIChatClient();

                private static Task<ChatResponse> Ask(string question, ChatOptions options) => Live.GetResponseAsync(question, options);

                [Fact]
                public async Task Pier_IsQuoted()
                {
                    var options = new ChatOptions { Temperature = 0.8f };
                    var reply = await {|SAMP002:Ask("Which pier?", options)|};
                    Assert.Equal("4", reply.Text);
                }
            }
            """);
    }

    [Fact]
    public async Task TestHelperInAnotherFileThatOnlyMaps_IsNotASend()
    {
        await Verify.ProjectAsync(new[]
        {
            """
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Ferry.Booking.Tests;

            public class WireShapeTests
            {
                [Fact]
                public void Heat_IsCopied()
                {
                    var wire = Shapes.Map(new ChatOptions { Temperature = 2.4f, TopP = 0.1f });
                    Assert.Equal(2.4f, wire.Heat);
                }
            }
            """,
            """
            using Microsoft.Extensions.AI;

            namespace Ferry.Booking.Tests;

            public static class Shapes
            {
                public static Ferry.Booking.WireRequest Map(ChatOptions options) => Ferry.Booking.WireMapper.ToWire(options);
            }
            """,
            Mapper,
        }, null);
    }

    [Fact]
    public async Task KernelArgumentsCarryTheSettingsToTheKernel_Triggers()
    {
        // The settings ride in KernelArguments (a carrier) into InvokePromptAsync: sent, so judged.
        await Verify.AnalyzerAsync("""
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            class Lockkeeper
            {
                async Task<string> Answer(Kernel kernel)
                {
                    var settings = new OpenAIPromptExecutionSettings { {|SAMP005:Temperature = 2.4|} };
                    var arguments = new KernelArguments(settings);
                    var result = await kernel.InvokePromptAsync("When does the lock open?", arguments);
                    return result.ToString();
                }
            }
            """);
    }

    [Fact]
    public async Task TestProject_OptionsKeptInAFixtureField_AreSilent_ProductTwinTriggers()
    {
        // In a test project options stored in a field are judged only where they are sent; in product code a stored
        // options object is shared and sent elsewhere, so it is judged.
        const string Holder = """
            using Microsoft.Extensions.AI;

            public class SamplingFixture
            {
                public ChatOptions Options { get; } = new ChatOptions { Temperature = 1.8f };
            }
            """;
        await Verify.ProjectAsync(new[] { Holder }, "build_property.IsTestProject = true\n");
        await Verify.ProjectAsync(new[] { Holder.Replace("Temperature = 1.8f", "{|SAMP009:Temperature = 1.8f|}") }, null);
    }
}
