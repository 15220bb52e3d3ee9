using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Files;

/// <summary>
/// appsettings.json → an options class bound to a section → a sampling member written from it in C#. The value is judged at
/// the C# write, once per environment that changes it, and the message names the file that decided it.
/// </summary>
public class AppSettingsBindingTests
{
    private const string Options = """
        public sealed class FerryDeskOptions
        {
            public float Temperature { get; set; }
            public string Model { get; set; } = "gpt-4o-mini";
            public string ApiKey { get; set; } = "";
        }
        """;

    /// <summary>The ferry help desk: bound in the host builder, read through IOptions, copied into the request.</summary>
    private const string Desk = """
        using System.ClientModel;
        using System.Threading.Tasks;
        using Microsoft.Extensions.DependencyInjection;
        using Microsoft.Extensions.Hosting;
        using Microsoft.Extensions.Options;
        using OpenAI.Chat;

        public static class Startup
        {
            public static void Register(HostApplicationBuilder builder) =>
                builder.Services.Configure<FerryDeskOptions>(builder.Configuration.GetSection("FerryDesk"));
        }

        public sealed class CrossingAnswers(IOptions<FerryDeskOptions> options, ChatClient client)
        {
            private readonly FerryDeskOptions _options = options.Value;

            public Task<ClientResult<ChatCompletion>> AnswerAsync(string question) =>
                client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(question) }, new ChatCompletionOptions { {|#0:Temperature = _options.Temperature|} });
        }
        """;

    private static (string, string) Base(string json) => ("/FerryDesk/appsettings.json", json);

    private static (string, string) Production(string json) => ("/FerryDesk/appsettings.Production.json", json);

    private static string Extreme(string value, string origin) =>
        $"Temperature {value} (from {origin}) is above 1.5 (temperance.extreme_temperature): sampling this flat drifts toward random tokens";

    [Fact]
    public async Task ValueFromAppSettingsJson_IsJudgedAtTheCSharpWrite()
    {
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Temperature": 1.8 } }""") }, new[] { Desk, Options }, null,
            Verify.Diagnostic("SAMP009").WithLocation(0).WithMessage(Extreme("1.8", "configuration 'FerryDesk:Temperature' in appsettings.json")));
    }

    [Fact]
    public async Task ProductionOverride_IsFlaggedNamingItsFile_WhileTheBaseIsFine()
    {
        await Verify.FilesAsync(
            new[] { Base("""{ "FerryDesk": { "Temperature": 0.4, "Model": "gpt-4o" } }"""), Production("""{ "FerryDesk": { "Temperature": 1.9 } }""") },
            new[] { Desk, Options }, null,
            Verify.Diagnostic("SAMP009").WithLocation(0).WithMessage(Extreme("1.9", "configuration 'FerryDesk:Temperature' in appsettings.Production.json")));
    }

    [Fact]
    public async Task BaseValue_IsFlagged_WhileTheProductionOverrideIsFine()
    {
        await Verify.FilesAsync(
            new[] { Base("""{ "FerryDesk": { "Temperature": 1.9 } }"""), Production("""{ "FerryDesk": { "Temperature": 0.3 } }""") },
            new[] { Desk, Options }, null,
            Verify.Diagnostic("SAMP009").WithLocation(0).WithMessage(Extreme("1.9", "configuration 'FerryDesk:Temperature' in appsettings.json")));
    }

    [Fact]
    public async Task BothEnvironmentsTooHot_AreReportedSeparately_AtTheSameWrite()
    {
        // Keys are matched ignoring case, as the binder does: "ferrydesk:TEMPERATURE" sets FerryDeskOptions.Temperature.
        var desk = Desk.Replace("{|#0:", string.Empty).Replace("_options.Temperature|}", "_options.Temperature");
        await Verify.FilesAsync(
            new[]
            {
                Base("""{ "FerryDesk": { "Temperature": 1.7 } }"""),
                ("/FerryDesk/appsettings.Development.json", """{ "FerryDesk": { "Model": "gpt-4o" } }"""),
                Production("""{ "ferrydesk": { "TEMPERATURE": 1.9 } }"""),
            },
            new[] { desk, Options }, null,
            Verify.Diagnostic("SAMP009").WithSpan(19, 115, 19, 149).WithMessage(Extreme("1.7", "configuration 'FerryDesk:Temperature' in appsettings.json")),
            Verify.Diagnostic("SAMP009").WithSpan(19, 115, 19, 149).WithMessage(Extreme("1.9", "configuration 'FerryDesk:Temperature' in appsettings.Production.json")));
    }

    [Fact]
    public async Task InitializerDefault_IsJudged_WhenNoFileSetsTheKey()
    {
        var options = Options.Replace("public float Temperature { get; set; }", "public float Temperature { get; set; } = 1.9f;");
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Model": "gpt-4o" } }""") }, new[] { Desk, options }, null,
            Verify.Diagnostic("SAMP009").WithLocation(0).WithMessage(Extreme("1.9",
                "the initializer of FerryDeskOptions.Temperature ('FerryDesk:Temperature' is set in no configuration file)")));
    }

    [Fact]
    public async Task FileValue_WinsOverTheInitializer_AndSensibleValuesAreSilent()
    {
        var options = Options.Replace("public float Temperature { get; set; }", "public float Temperature { get; set; } = 1.9f;");
        await Verify.FilesAsync(
            new[]
            {
                Base("""{ "FerryDesk": { "Temperature": 0.4 } }"""),
                ("/FerryDesk/appsettings.Development.json", """{ "FerryDesk": { "Temperature": 0.9 } }"""),
            },
            new[] { Desk, options }, null);
    }

    [Fact]
    public async Task ClassNotBoundToASection_StaysUnknown_AndSilent()
    {
        var unbound = Desk.Replace("builder.Services.Configure<FerryDeskOptions>(builder.Configuration.GetSection(\"FerryDesk\"));", "builder.Services.AddSingleton<FerryDeskOptions>();");
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Temperature": 1.9 } }""") }, new[] { unbound, Options }, null);
    }

    [Fact]
    public async Task KeyAbsent_WithoutInitializer_StaysUnknown_AndSilent()
    {
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Model": "gpt-4o" }, "Temperature": 1.9 }""") }, new[] { Desk, Options }, null);
    }

    [Fact]
    public async Task MalformedAppSettings_DoesNotCrash_AndTheValueStaysUnknown()
    {
        // The initializer is not used either: the unreadable file may well set the key.
        var options = Options.Replace("public float Temperature { get; set; }", "public float Temperature { get; set; } = 1.9f;");
        const string broken = "{\n  \"FerryDesk\": { \"Temperature\": 1.8 \"Model\": \"gpt-4o\" }\n}\n";
        await Verify.FilesAsync(new[] { Base(broken) }, new[] { Desk, options }, null,
            Verify.Diagnostic("SAMP100").WithSpan("/FerryDesk/appsettings.json", 2, 36, 2, 36)
                .WithMessage("Temperance configuration 'FerryDesk/appsettings.json' has the value 'After parsing a value an unexpected character was encountered: \".'; expected JSON that parses (the parser stopped at line 2, column 36); its sampling settings are not checked. The rule that needs it is skipped until this is fixed."));
    }

    [Fact]
    public async Task ReasoningModelFromConfiguration_OnTheClientBuiltInTheConstructor_RejectsTemperature()
    {
        const string planner = """
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.Configuration;
            using Microsoft.Extensions.DependencyInjection;
            using Microsoft.Extensions.Options;
            using OpenAI.Chat;

            public static class Registration
            {
                public static IServiceCollection AddFerryDesk(this IServiceCollection services, IConfiguration configuration) =>
                    services.Configure<FerryDeskOptions>(configuration.GetSection("FerryDesk"));
            }

            public sealed class TimetablePlanner
            {
                private readonly ChatClient _client;

                public TimetablePlanner(IOptions<FerryDeskOptions> options)
                {
                    _client = new ChatClient(options.Value.Model, new ApiKeyCredential(options.Value.ApiKey));
                }

                public Task<ClientResult<ChatCompletion>> PlanAsync(string route) =>
                    _client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(route) }, new ChatCompletionOptions { {|#0:Temperature = 0.2f|} });
            }
            """;
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Model": "o3-mini" } }""") }, new[] { planner, Options }, null,
            Verify.Diagnostic("SAMP007").WithLocation(0).WithMessage(
                "Temperature is rejected by model 'o3-mini' (from configuration 'FerryDesk:Model' in appsettings.json) (family 'openai_reasoning', temperance.model.openai_reasoning.match)"));
    }

    [Fact]
    public async Task ReasoningModelFromConfiguration_OnTheOptionsModelId_RejectsTopP_OnlyInProduction()
    {
        const string concierge = """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Microsoft.Extensions.Configuration;
            using Microsoft.Extensions.DependencyInjection;
            using Microsoft.Extensions.Options;

            public static class Registration
            {
                public static void AddFerryDesk(IServiceCollection services) =>
                    services.AddOptions<FerryDeskOptions>().BindConfiguration("FerryDesk");
            }

            public sealed class BerthConcierge(IChatClient chat, IOptionsMonitor<FerryDeskOptions> settings)
            {
                public Task<ChatResponse> AskAsync(string question) =>
                    chat.GetResponseAsync(question, new ChatOptions { ModelId = settings.CurrentValue.Model, {|#0:TopP = 0.5f|} });
            }
            """;
        await Verify.FilesAsync(
            new[] { Base("""{ "FerryDesk": { "Model": "gpt-4o" } }"""), Production("""{ "FerryDesk": { "Model": "o4-mini" } }""") },
            new[] { concierge, Options }, null,
            Verify.Diagnostic("SAMP007").WithLocation(0).WithMessage(
                "TopP is rejected by model 'o4-mini' (from configuration 'FerryDesk:Model' in appsettings.Production.json) (family 'openai_reasoning', temperance.model.openai_reasoning.match)"));
    }

    /// <summary>Every binding form the options pattern offers, nested sections and renamed keys; each judged from the file.</summary>
    [Theory]
    [InlineData("services.AddOptions<FerryDeskOptions>().Bind(configuration.GetSection(\"FerryDesk\"));", "FerryDesk")]
    [InlineData("services.AddOptions<FerryDeskOptions>().ValidateOnStart().BindConfiguration(\"FerryDesk\");", "FerryDesk")]
    [InlineData("services.AddSingleton(configuration.GetSection(\"FerryDesk\").Get<FerryDeskOptions>()!);", "FerryDesk")]
    [InlineData("var desk = new FerryDeskOptions(); configuration.GetSection(\"FerryDesk\").Bind(desk); services.AddSingleton(desk);", "FerryDesk")]
    [InlineData("services.Configure<FerryDeskOptions>(o => configuration.GetSection(\"FerryDesk\").Bind(o));", "FerryDesk")]
    [InlineData("configuration.Bind(\"FerryDesk\", new FerryDeskOptions());", "FerryDesk")]
    [InlineData("services.Configure<FerryDeskOptions>(configuration.GetSection(\"Harbour\").GetSection(\"FerryDesk\"));", "Harbour:FerryDesk")]
    [InlineData("var section = configuration.GetSection(\"Harbour:FerryDesk\"); services.Configure<FerryDeskOptions>(section);", "Harbour:FerryDesk")]
    [InlineData("services.Configure<FerryDeskOptions>(configuration.GetSection(FerryDeskOptions.Section));", "Harbour:FerryDesk")]
    public async Task EveryBindingForm_BindsTheClassToItsSection(string binding, string section)
    {
        var source = """
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.Configuration;
            using Microsoft.Extensions.DependencyInjection;
            using Microsoft.Extensions.Options;
            using OpenAI.Chat;

            public static class Registration
            {
                public static void AddFerryDesk(IServiceCollection services, IConfiguration configuration)
                {
                    BINDING
                }
            }

            public sealed class FerryDeskOptions
            {
                public const string Section = "Harbour:FerryDesk";

                [ConfigurationKeyName("heat")]
                public float Temperature { get; set; }
            }

            public sealed class CrossingAnswers(IOptionsSnapshot<FerryDeskOptions> options, ChatClient client)
            {
                public Task<ClientResult<ChatCompletion>> AnswerAsync(string question) =>
                    client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(question) }, new ChatCompletionOptions { {|#0:Temperature = options.Value.Temperature|} });
            }
            """.Replace("BINDING", binding);
        var json = section == "FerryDesk"
            ? """{ "FerryDesk": { "Heat": 1.8 } }"""
            : """{ "Harbour": { "FerryDesk": { "heat": 1.8 } } }""";
        await Verify.FilesAsync(new[] { Base(json) }, new[] { source }, null,
            Verify.Diagnostic("SAMP009").WithLocation(0).WithMessage(Extreme("1.8", $"configuration '{section}:heat' in appsettings.json")));
    }

    [Fact]
    public async Task TopLevelProgram_BindsALocal_AndSendsWithItsValue()
    {
        const string program = """
            using System.ClientModel;
            using Microsoft.Extensions.Configuration;
            using Microsoft.Extensions.Hosting;
            using OpenAI.Chat;

            var builder = Host.CreateApplicationBuilder(args);
            var bakery = new BakeryOptions();
            builder.Configuration.GetSection("Bakery").Bind(bakery);
            var client = new ChatClient("gpt-4o-mini", new ApiKeyCredential(bakery.ApiKey));
            await client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage("Name three rye loaves.") }, new ChatCompletionOptions { {|#0:Temperature = bakery.Temperature|} });

            public sealed class BakeryOptions
            {
                public float Temperature { get; set; } = 0.7f;
                public string ApiKey { get; set; } = "";
            }
            """;
        var test = new TemperanceTest(program);
        test.TestState.OutputKind = Microsoft.CodeAnalysis.OutputKind.ConsoleApplication;
        test.TestState.AdditionalFiles.Add(("/Bakery/appsettings.json", """{ "Bakery": { "Temperature": 0.8 } }"""));
        test.TestState.AdditionalFiles.Add(("/Bakery/appsettings.Staging.json", """{ "Bakery": { "Temperature": 1.6 } }"""));
        test.ExpectedDiagnostics.Add(Verify.Diagnostic("SAMP009").WithLocation(0).WithMessage(Extreme("1.6", "configuration 'Bakery:Temperature' in appsettings.Staging.json")));
        await test.RunAsync();
    }

    [Fact]
    public async Task NestedOptionsObject_IsReadThroughItsPath()
    {
        const string source = """
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.Configuration;
            using Microsoft.Extensions.DependencyInjection;
            using Microsoft.Extensions.Options;
            using OpenAI.Chat;

            public sealed class LighthouseOptions
            {
                public SamplingOptions Sampling { get; set; } = new();
            }

            public sealed class SamplingOptions
            {
                public double TopP { get; set; } = 1;
                public float Temperature { get; set; }
            }

            public sealed class BeaconLog(IOptions<LighthouseOptions> options, ChatClient client)
            {
                public static void Add(IServiceCollection services, IConfiguration configuration) =>
                    services.Configure<LighthouseOptions>(configuration.GetSection("Lighthouse"));

                public Task<ClientResult<ChatCompletion>> NoteAsync(string entry) =>
                    client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(entry) },
                        new ChatCompletionOptions { {|#0:Temperature = options.Value.Sampling.Temperature|}, TopP = (float)options.Value.Sampling.TopP });
            }
            """;
        await Verify.FilesAsync(new[] { ("/Lighthouse/appsettings.json", """{ "Lighthouse": { "Sampling": { "Temperature": 2.6 } } }""") }, new[] { source }, null,
            Verify.Diagnostic("SAMP005").WithLocation(0).WithMessage(
                "Temperature = 2.6 (from configuration 'Lighthouse:Sampling:Temperature' in appsettings.json) is outside the range [0, 2] that openai accepts for temperature (rules table: temperance.provider.openai.temperature.max)"));
    }

    /// <summary>Precision: a unit test copies the configured value into options it only asserts on; only the live twin is judged.</summary>
    [Fact]
    public async Task SameOptionsClassInAUnitTestThatNeverSends_IsSilent_WhileTheProductTwinIsFlagged()
    {
        const string test = """
            using Microsoft.Extensions.Options;
            using OpenAI.Chat;
            using Xunit;

            public class CrossingAnswersTests
            {
                [Fact]
                public void CopiesTheConfiguredTemperature()
                {
                    var configured = Microsoft.Extensions.Options.Options.Create(new FerryDeskOptions());
                    var request = new ChatCompletionOptions { Temperature = configured.Value.Temperature };
                    Assert.Equal(configured.Value.Temperature, request.Temperature);
                }
            }
            """;
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Temperature": 1.8 } }""") }, new[] { Desk, Options, test }, null,
            Verify.Diagnostic("SAMP009").WithLocation(0).WithMessage(Extreme("1.8", "configuration 'FerryDesk:Temperature' in appsettings.json")));
    }

    /// <summary>Precision twin: the bound value sent to a Moq double in a test reaches no model; the product's send still fires.</summary>
    [Fact]
    public async Task ConfiguredValueSentToAMoqDouble_IsSilent_WhileTheProductTwinIsFlagged()
    {
        const string test = """
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Microsoft.Extensions.Options;
            using Moq;
            using Xunit;

            public class CrossingChatTests
            {
                [Fact]
                public async Task PassesTheConfiguredTemperature()
                {
                    var configured = Microsoft.Extensions.Options.Options.Create(new FerryDeskOptions());
                    var chat = new Mock<IChatClient>();
                    chat.Setup(c => c.GetResponseAsync(It.IsAny<IEnumerable<ChatMessage>>(), It.IsAny<ChatOptions?>(), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(new ChatResponse(new ChatMessage(ChatRole.Assistant, "The 09:40 crossing runs.")));
                    await chat.Object.GetResponseAsync("Does the 09:40 run?", new ChatOptions { Temperature = configured.Value.Temperature });
                }
            }
            """;
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Temperature": 1.8 } }""") }, new[] { Desk, Options, test }, null,
            Verify.Diagnostic("SAMP009").WithLocation(0).WithMessage(Extreme("1.8", "configuration 'FerryDesk:Temperature' in appsettings.json")));
    }

    /// <summary>Regression: options the code builds and fills itself hold what it wrote, not what the file says.</summary>
    [Fact]
    public async Task OptionsBuiltAndFilledInCode_AreNotConfiguration()
    {
        const string desk = """
            using System.ClientModel;
            using System.Threading.Tasks;
            using Microsoft.Extensions.Configuration;
            using Microsoft.Extensions.DependencyInjection;
            using OpenAI.Chat;

            public sealed class CrossingAnswers(ChatClient client)
            {
                public static void Add(IServiceCollection services, IConfiguration configuration) =>
                    services.Configure<FerryDeskOptions>(configuration.GetSection("FerryDesk"));

                public Task<ClientResult<ChatCompletion>> AnswerAsync(string question)
                {
                    var calm = new FerryDeskOptions { Temperature = 0.2f };
                    return client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(question) }, new ChatCompletionOptions { Temperature = calm.Temperature });
                }
            }
            """;
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Temperature": 1.9 } }""") }, new[] { desk, Options }, null);
    }

    /// <summary>Regression: named options bind one class to several sections; which one a call reads is not known.</summary>
    [Fact]
    public async Task ClassBoundToTwoSections_StaysUnknown()
    {
        var desk = Desk.Replace(
            "builder.Services.Configure<FerryDeskOptions>(builder.Configuration.GetSection(\"FerryDesk\"));",
            "builder.Services.Configure<FerryDeskOptions>(\"night\", builder.Configuration.GetSection(\"NightDesk\")).Configure<FerryDeskOptions>(builder.Configuration.GetSection(\"FerryDesk\"));");
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Temperature": 1.9 }, "NightDesk": { "Temperature": 1.7 } }""") }, new[] { desk, Options }, null);
    }

    /// <summary>Regression: code that rewrites the bound value after binding (a clamp in PostConfigure) sends its own value, not the file's.</summary>
    [Fact]
    public async Task ValueRewrittenAfterBinding_StaysUnknown()
    {
        var desk = Desk.Replace(
            "builder.Services.Configure<FerryDeskOptions>(builder.Configuration.GetSection(\"FerryDesk\"));",
            "builder.Services.Configure<FerryDeskOptions>(builder.Configuration.GetSection(\"FerryDesk\")).PostConfigure<FerryDeskOptions>(o => o.Temperature = System.Math.Min(o.Temperature, 1f));");
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Temperature": 1.9 } }""") }, new[] { desk, Options }, null);
    }

    /// <summary>Regression: a property whose setter clamps what the binder gives it holds the clamped value, which the file does not say.</summary>
    [Fact]
    public async Task PropertyWithAClampingSetter_StaysUnknown()
    {
        var options = Options.Replace(
            "public float Temperature { get; set; }",
            "private float _temperature; public float Temperature { get => _temperature; set => _temperature = System.Math.Min(value, 1f); }");
        await Verify.FilesAsync(new[] { Base("""{ "FerryDesk": { "Temperature": 1.9 } }""") }, new[] { Desk, options }, null);
    }

    /// <summary>Regression: an appsettings.json under a test-data folder is not the application's (the host reads its content root).</summary>
    [Fact]
    public async Task AppSettingsOutsideTheContentRoot_AreNotThisApplicationsConfiguration()
    {
        await Verify.FilesAsync(
            new[] { Base("""{ "FerryDesk": { "Temperature": 0.4 } }"""), ("/FerryDesk/TestData/appsettings.Production.json", """{ "FerryDesk": { "Temperature": 1.9 } }""") },
            new[] { Desk, Options }, null);
    }
}
