using Temperance.Tests.Infrastructure;
using Microsoft.CodeAnalysis.Diagnostics;

namespace Temperance.Tests.Files;

/// <summary>
/// Regression tests from the review of the settings-file front end: each case once gave a crash, a false positive, a
/// wrong location or a fix that broke the file, and asserts what should happen instead.
/// </summary>
public class SettingsFileRegressionTests
{
    private const string PoemPrompt = "Write a four-line poem about the lighthouse keeper's cat {{$name}}.";

    // ---------- crashes ----------

    [Fact]
    public async Task Crash_JsonConstructorValue_InConfigJson()
    {
        // Json.NET accepts constructor syntax; the reader then casts the constructor's argument to a property name.
        const string config = """
            {
              "description": new Date(1700000000),
              "execution_settings": { "default": { "temperature": 0.7 } }
            }
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null,
            Verify.Diagnostic("SAMP100").WithSpan("/Prompts/Poem/config.json", 2, 26, 2, 26));
    }

    [Fact]
    public async Task Crash_YamlDuplicateKey_InTemplate()
    {
        const string template = """
            name: BakeryDailySpecial
            template: Describe today's special loaf for the chalkboard.
            execution_settings:
              default:
                temperature: 0.7
                temperature: 0.8
            """;
        // Either silent or one SAMP100; never an exception.
        try
        {
            await Verify.FilesAsync(new[] { ("/Prompts/special.yaml", template) }, null);
        }
        catch (Exception e) when (e.Message.Contains("SAMP100") && !e.Message.Contains("AD0001"))
        {
            // a SAMP100 is acceptable
        }
    }

    [Fact]
    public async Task Crash_YamlAliasToMissingAnchor()
    {
        const string template = "name: X\nexecution_settings:\n  default: *nowhere\n  fast:\n    temperature: 0.5\n";
        try
        {
            await Verify.FilesAsync(new[] { ("/Prompts/x.yaml", template) }, null);
        }
        catch (Exception e) when (e.Message.Contains("SAMP100") && !e.Message.Contains("AD0001"))
        {
        }
    }

    [Fact]
    public async Task Crash_OddRootsAndEmptyFiles()
    {
        await Verify.FilesAsync(new[]
        {
            ("/Prompts/A/config.json", "[ { \"temperature\": 0.2 } ]"),
            ("/Prompts/A/skprompt.txt", PoemPrompt),
            ("/Prompts/B/config.json", "\"temperature\""),
            ("/Prompts/B/skprompt.txt", PoemPrompt),
            ("/Prompts/scalar.yaml", "temperature"),
            ("/Prompts/seq.yaml", "- temperature: 0.3\n- seed: 4\n"),
            ("/Prompts/empty.prompty", "---\n---\ntemperature\n"),
            ("/Prompts/open.prompty", "---\nmodel:\n  parameters:\n    temperature: 3.0\nno closing line, temperature\n"),
            ("/Prompts/nullroot.yaml", "~\n# temperature\n"),
            ("/Prompts/multi.yaml", "---\n# temperature\n---\nexecution_settings:\n  default:\n    temperature: 0.5\n"),
        }, null);
    }

    [Fact]
    public async Task Crash_NaNAndInfinity_InJson()
    {
        const string config = """
            {
              "execution_settings": { "default": { "temperature": NaN, "top_p": Infinity, "seed": 1e400, "n": -Infinity } }
            }
            """;
        // Json.NET reads NaN/Infinity as numbers. Whatever the rules say, no exception.
        try
        {
            await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
        }
        catch (Exception e) when (!e.Message.Contains("AD0001") && !e.Message.Contains("Exception"))
        {
            throw new Exception("no crash, but findings: " + e.Message);
        }
    }

    [Fact]
    public async Task Crash_DeepYamlNesting()
    {
        var deep = "execution_settings:\n  default:\n    temperature: 0.5\n    extra: " + new string('[', 3000) + new string(']', 3000) + "\n";
        try
        {
            await Verify.FilesAsync(new[] { ("/Prompts/deep.yaml", deep) }, null);
        }
        catch (Exception e) when (e.Message.Contains("SAMP100") && !e.Message.Contains("AD0001"))
        {
        }
    }

    // ---------- false positives ----------

    [Fact]
    public async Task FalsePositive_OvenThermalModelYaml_IsNotAnAgent()
    {
        // A bakery's oven simulation: "model" is a thermal model, "temperature" is in degrees Celsius.
        const string oven = """
            name: SourdoughBake
            description: Baking profile for the stone-deck oven.
            model:
              id: deck-oven-thermal-v2
              options:
                temperature: 230
                seed: 7
            """;
        await Verify.FilesAsync(new[] { ("/Bakery/profiles/sourdough.yaml", oven) }, null);
    }

    [Fact]
    public async Task FalsePositive_MergeKey_HidesTheInheritedTemperature()
    {
        // The fast service inherits temperature 0 from the anchor; the reader does not see merge keys and judges it as unset.
        const string template = """
            name: ReadTideTable
            template: |
              Extract the date, time and height of every high tide from {{$table}}. Return only JSON.
            base: &base
              temperature: 0
              seed: 7
            execution_settings:
              openai:
                <<: *base
                max_tokens: 300
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/tide-table.yaml", template) }, null);
    }

    [Fact]
    // Low: the compiler and the IDE strip a BOM when they decode a file, so this only bites a text that still holds U+FEFF.
    public async Task FalsePositive_BomBeforeJson_IsNotUnreadable()
    {
        const string config = "\uFEFF{ \"execution_settings\": { \"default\": { \"temperature\": 0.7 } } }";
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
    }

    [Fact]
    public async Task FalsePositive_BomBeforeAppSettings_IsNotUnreadable()
    {
        await Verify.FilesAsync(new[] { ("/App/appsettings.json", "\uFEFF{ \"Lighthouse\": { \"Temperature\": 0.3 } }") }, null);
    }

    [Fact]
    public async Task FalsePositive_AppSettingsWhitespaceAfterAComment()
    {
        await Verify.FilesAsync(new[] { ("/App/appsettings.Staging.json", "{\n  // temperature from the vault\n}\n\n") }, null);
    }

    [Fact]
    public async Task FalsePositive_DeliberatelyBrokenFixtureInATestProject_NoSamp100()
    {
        // A loader's own tests keep a malformed prompt config on purpose; a test project's files are its test data.
        const string broken = "{ \"execution_settings\": { \"default\": { \"temperature\": 0.9 \"top_p\": 0.5 } } }";
        var test = new TemperanceTest("class Placeholder { }");
        test.TestState.AdditionalFiles.Add(("/Fixtures/Broken/config.json", broken));
        test.TestState.AdditionalFiles.Add(("/Fixtures/broken-template.yaml", "execution_settings:\n  default:\n    temperature: [0.9\n"));
        test.TestState.AnalyzerConfigFiles.Add(("/.project.globalconfig", "is_global = true\nbuild_property.IsTestProject = true\n"));
        await test.RunAsync();
    }

    // ---------- locations and fixes ----------

    [Fact]
    public async Task Location_Crlf_Json()
    {
        var config = "{\r\n  \"execution_settings\": {\r\n    \"gpt\": {\r\n      \"model_id\": \"gpt-4o-mini\",\r\n      {|SAMP005:\"top_p\": 1.7|}\r\n    }\r\n  }\r\n}\r\n";
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
        var plain = config.Replace("{|SAMP005:", "").Replace("|}", "");
        var fixedText = await FileFixRunner.ApplyAsync("/Prompts/Poem/config.json", plain, "SAMP005");
        Assert.Equal(plain.Replace("1.7", "1.0"), fixedText);
    }

    [Fact]
    public async Task Location_LineSeparatorInsideJsonString()
    {
        // U+2028 is a line break for Roslyn's SourceText but not for Json.NET: later positions shift.
        var config = "{\n  \"description\": \"Poem for the lighthouse\u2028keeper\",\n  \"execution_settings\": {\n    \"gpt\": { \"model_id\": \"gpt-4o-mini\", {|SAMP005:\"top_p\": 1.7|} }\n  }\n}\n";
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
    }

    [Fact]
    public void Location_LineSeparatorInsideJsonString_KeySpans()
    {
        var json = "{\n  \"description\": \"Poem for the lighthouse\u2028keeper\",\n  \"execution_settings\": {\n    \"gpt\": { \"model_id\": \"gpt-4o-mini\", \"top_p\": 1.7 }\n  }\n}\n";
        var text = Microsoft.CodeAnalysis.Text.SourceText.From(json);
        var root = Temperance.Files.JsonFileReader.Read(text, out _)!;
        Assert.Equal("\"execution_settings\"", text.ToString(root.Entry("execution_settings")!.KeySpan));
        var topP = root.At("execution_settings", "gpt")!.Entry("top_p")!;
        Assert.Equal("\"top_p\"", text.ToString(topP.KeySpan));
        Assert.Equal("1.7", text.ToString(topP.Value.Span));
    }

    [Fact]
    public async Task Location_LoneCarriageReturns_Json()
    {
        var config = "{\r  \"execution_settings\": {\r    \"gpt\": { \"model_id\": \"gpt-4o-mini\", {|SAMP005:\"top_p\": 1.7|} }\r  }\r}\r";
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
    }

    [Fact]
    public async Task Location_TabsAndSpaceBeforeColon_Json()
    {
        var config = "{\n\t\"execution_settings\": {\n\t\t\"gpt\": {\n\t\t\t\"model_id\":\t\"gpt-4o-mini\",\n\t\t\t{|SAMP005:\"top_p\"  :\t1.7|}\n\t\t}\n\t}\n}\n";
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
    }

    [Fact]
    public async Task Fix_Crlf_Yaml_RemovesTheWholeLine()
    {
        var agent = "name: CargoPlanner\r\ninstructions: Plan the car deck.\r\nmodel:\r\n  id: o4-mini\r\n  options:\r\n    temperature: 0.2\r\n    maxOutputTokens: 800\r\n";
        var fixedText = await FileFixRunner.ApplyAsync("/Agents/cargo.yaml", agent, "SAMP007");
        Assert.Equal("name: CargoPlanner\r\ninstructions: Plan the car deck.\r\nmodel:\r\n  id: o4-mini\r\n  options:\r\n    maxOutputTokens: 800\r\n", fixedText);
    }

    [Fact]
    public async Task Fix_Yaml_ValueWithTrailingComment()
    {
        var template = "name: Notice\nexecution_settings:\n  fast:\n    model_id: gpt-4o-mini\n    top_p: 1.7   # too wide\n";
        var fixedText = await FileFixRunner.ApplyAsync("/Prompts/notice.yaml", template, "SAMP005");
        Assert.Equal("name: Notice\nexecution_settings:\n  fast:\n    model_id: gpt-4o-mini\n    top_p: 1.0   # too wide\n", fixedText);
    }

    [Fact]
    public async Task Fix_FrontMatter_Crlf_SetsTheValue()
    {
        var prompty = "---\r\nname: Reply\r\nmodel:\r\n  configuration:\r\n    type: azure_openai\r\n    azure_deployment: gpt-4o\r\n  parameters:\r\n    frequency_penalty: 2.5\r\n---\r\nuser:\r\n{{question}}\r\n";
        var fixedText = await FileFixRunner.ApplyAsync("/Prompts/reply.prompty", prompty, "SAMP005");
        Assert.Equal(prompty.Replace("2.5", "2.0"), fixedText);
    }

    [Fact]
    public async Task Fix_Json_RemoveLastEntry_AfterACommentedComma()
    {
        const string config = "{\n  \"execution_settings\": {\n    \"default\": {\n      \"temperature\": 0.9, // warm\n      \"top_p\": 0.5\n    }\n  }\n}\n";
        var fixedText = await FileFixRunner.ApplyAsync("/Prompts/Poem/config.json", config, "SAMP004");
        // Strict JSON (System.Text.Json without trailing commas) must still read the file.
        System.Text.Json.JsonDocument.Parse(fixedText, new System.Text.Json.JsonDocumentOptions { CommentHandling = System.Text.Json.JsonCommentHandling.Skip });
    }

    [Fact]
    public async Task Fix_Yaml_QuotedValue_StaysAString()
    {
        var template = "name: Notice\nexecution_settings:\n  fast:\n    model_id: gpt-4o-mini\n    top_p: \"1.7\"\n";
        var fixedText = await FileFixRunner.ApplyAsync("/Prompts/notice.yaml", template, "SAMP005");
        Assert.Equal("name: Notice\nexecution_settings:\n  fast:\n    model_id: gpt-4o-mini\n    top_p: 1.0\n", fixedText);
    }

    [Fact]
    public async Task Location_AnchoredBlock_UsedTwice()
    {
        var template = "name: Notice\nexecution_settings:\n  fast: &shared\n    model_id: gpt-4o-mini\n    {|SAMP005:top_p: 1.7|}\n  careful: *shared\n";
        await Verify.FilesAsync(new[] { ("/Prompts/notice.yaml", template) }, null);
    }
}

/// <summary>Regression tests from the review of configuration binding (appsettings → options class → C# write).</summary>
public class ConfigurationRegressionTests
{
    private const string Usings = """
        using System.ClientModel;
        using System.Threading.Tasks;
        using Microsoft.Extensions.Configuration;
        using Microsoft.Extensions.DependencyInjection;
        using Microsoft.Extensions.Options;
        using OpenAI.Chat;
        """;

    [Fact]
    public async Task SameClassNameInAnotherNamespace_IsNotTheBoundClass()
    {
        // Ferry.DeskOptions is bound to "Desk"; Bakery.DeskOptions is a different class, registered as a plain singleton.
        const string source = Usings + """

            namespace Ferry
            {
                public sealed class DeskOptions { public float Temperature { get; set; } }
                public static class Registration
                {
                    public static void Add(IServiceCollection services, IConfiguration configuration) =>
                        services.Configure<DeskOptions>(configuration.GetSection("Desk"));
                }
            }

            namespace Bakery
            {
                public sealed class DeskOptions { public float Temperature { get; set; } = 0.3f; }

                public sealed class LoafNamer(DeskOptions options, ChatClient client)
                {
                    public Task<ClientResult<ChatCompletion>> NameAsync(string dough) =>
                        client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(dough) }, new ChatCompletionOptions { Temperature = options.Temperature });
                }
            }
            """;
        await Verify.FilesAsync(new[] { ("/Harbour/appsettings.json", """{ "Desk": { "Temperature": 1.9 } }""") }, new[] { source }, null);
    }

    [Fact]
    public async Task OnlyNamedOptionsBound_TheDefaultInstanceIsNotThatSection()
    {
        // Only the "night" named instance is bound; IOptions<T>.Value is the unnamed default, which no file sets.
        const string source = Usings + """

            public sealed class DeskOptions { public float Temperature { get; set; } = 0.4f; }

            public sealed class Answers(IOptions<DeskOptions> options, ChatClient client)
            {
                public static void Add(IServiceCollection services, IConfiguration configuration) =>
                    services.Configure<DeskOptions>("night", configuration.GetSection("NightDesk"));

                public Task<ClientResult<ChatCompletion>> AnswerAsync(string question) =>
                    client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(question) }, new ChatCompletionOptions { Temperature = options.Value.Temperature });
            }
            """;
        await Verify.FilesAsync(new[] { ("/Harbour/appsettings.json", """{ "NightDesk": { "Temperature": 1.9 } }""") }, new[] { source }, null);
    }

    [Fact]
    public async Task NoAppSettingsInTheProjectFolder_DocsExampleIsNotConfiguration()
    {
        // The project has no appsettings.json of its own; docs/examples holds one for readers.
        const string source = Usings + """

            public sealed class DeskOptions { public float Temperature { get; set; } }

            public sealed class Answers(IOptions<DeskOptions> options, ChatClient client)
            {
                public static void Add(IServiceCollection services, IConfiguration configuration) =>
                    services.Configure<DeskOptions>(configuration.GetSection("Desk"));

                public Task<ClientResult<ChatCompletion>> AnswerAsync(string question) =>
                    client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(question) }, new ChatCompletionOptions { Temperature = options.Value.Temperature });
            }
            """;
        // The package makes MSBuildProjectDirectory visible to the analyzer; the project is /Harbour.
        var test = new TemperanceTest(source);
        test.TestState.AdditionalFiles.Add(("/Harbour/docs/examples/appsettings.json", """{ "Desk": { "Temperature": 1.9 } }"""));
        test.TestState.AnalyzerConfigFiles.Add(("/.project.globalconfig", "is_global = true\nbuild_property.MSBuildProjectDirectory = /Harbour\n"));
        await test.RunAsync();
    }

    [Fact]
    public async Task FieldHoldingANewInstance_IsNotConfiguration()
    {
        // The class is bound elsewhere, but this field is a fresh instance with its initializer (0.3), not the bound one.
        const string source = Usings + """

            public sealed class DeskOptions { public float Temperature { get; set; } = 0.3f; }

            public sealed class Answers(ChatClient client)
            {
                private readonly DeskOptions _defaults = new DeskOptions();

                public static void Add(IServiceCollection services, IConfiguration configuration) =>
                    services.Configure<DeskOptions>(configuration.GetSection("Desk"));

                public Task<ClientResult<ChatCompletion>> AnswerAsync(string question) =>
                    client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(question) }, new ChatCompletionOptions { Temperature = _defaults.Temperature });
            }
            """;
        await Verify.FilesAsync(new[] { ("/Harbour/appsettings.json", """{ "Desk": { "Temperature": 1.9 } }""") }, new[] { source }, null);
    }

    [Fact]
    public async Task LocalOverwrittenAfterBind_IsNotTheFilesValue()
    {
        const string program = """
            using System.ClientModel;
            using Microsoft.Extensions.Configuration;
            using Microsoft.Extensions.Hosting;
            using OpenAI.Chat;

            var builder = Host.CreateApplicationBuilder(args);
            var bakery = new BakeryOptions();
            builder.Configuration.GetSection("Bakery").Bind(bakery);
            bakery.Temperature = 0.2f;
            var client = new ChatClient("gpt-4o-mini", new ApiKeyCredential(bakery.ApiKey));
            await client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage("Name three rye loaves.") }, new ChatCompletionOptions { Temperature = bakery.Temperature });

            public sealed class BakeryOptions
            {
                public float Temperature { get; set; } = 0.7f;
                public string ApiKey { get; set; } = "";
            }
            """;
        var test = new TemperanceTest(program);
        test.TestState.OutputKind = Microsoft.CodeAnalysis.OutputKind.ConsoleApplication;
        test.TestState.AdditionalFiles.Add(("/Bakery/appsettings.json", """{ "Bakery": { "Temperature": 1.9 } }"""));
        await test.RunAsync();
    }

    [Fact]
    public async Task FloatOverflowInConfiguration_DoesNotCrash()
    {
        const string source = Usings + """

            public sealed class DeskOptions { public float Temperature { get; set; } }

            public sealed class Answers(IOptions<DeskOptions> options, ChatClient client)
            {
                public static void Add(IServiceCollection services, IConfiguration configuration) =>
                    services.Configure<DeskOptions>(configuration.GetSection("Desk"));

                public Task<ClientResult<ChatCompletion>> AnswerAsync(string question) =>
                    client.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(question) }, new ChatCompletionOptions { {|SAMP005:Temperature = options.Value.Temperature|} });
            }
            """;
        await Verify.FilesAsync(new[] { ("/Harbour/appsettings.json", """{ "Desk": { "Temperature": 1e39 } }""") }, new[] { source }, null);
    }
}
