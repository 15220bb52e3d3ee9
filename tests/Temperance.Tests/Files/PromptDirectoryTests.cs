using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Files;

/// <summary>Semantic Kernel prompt directories: config.json (execution_settings per service) beside skprompt.txt.</summary>
public class PromptDirectoryTests
{
    private const string PoemPrompt = "Write a four-line poem about the lighthouse keeper's cat {{$name}}.";

    [Fact]
    public async Task TemperatureAndTopPBothMoved_InConfigJson_TriggersAtTheKey()
    {
        const string config = """
            {
              "schema": 1,
              "description": "Writes a short poem about a lighthouse cat",
              "execution_settings": {
                "default": {
                  "max_tokens": 120,
                  "temperature": 0.9,
                  {|SAMP004:"top_p": 0.5|}
                }
              }
            }
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
    }

    [Fact]
    public async Task OutOfRangeTopP_ForAnOpenAIModel_Triggers()
    {
        const string config = """
            {
              "execution_settings": {
                "gpt": { "model_id": "gpt-4o-mini", {|SAMP005:"top_p": 1.7|} }
              }
            }
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
    }

    [Fact]
    public async Task ServiceIdNamingAProvider_GivesItsRanges()
    {
        // No model_id: the service id "openai" says where the request goes, so OpenAI's range for frequency_penalty
        // applies; the "local" service says nothing, and the generic table has no bound for it.
        const string config = """
            { "execution_settings": { "openai": { {|SAMP005:"frequency_penalty": 2.5|} }, "local": { "frequency_penalty": 2.5 } } }
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
    }

    [Fact]
    public async Task ExtractionPromptAtHighTemperature_TaskFromSkprompt_Triggers()
    {
        const string config = """
            {
              // comments and trailing commas, as hand-edited files have them
              "execution_settings": {
                "default": { {|SAMP001:"temperature": 1.1|}, },
              },
            }
            """;
        await Verify.FilesAsync(new[]
        {
            ("/Plugins/Harbour/ReadManifest/config.json", config),
            ("/Plugins/Harbour/ReadManifest/skprompt.txt", "Extract the vessel name, berth and arrival time from {{$manifest}}. Return only JSON."),
        }, null);
    }

    [Fact]
    public async Task SensibleSettings_AreSilent()
    {
        const string config = """
            {
              "execution_settings": { "default": { "temperature": 0.7, "max_tokens": 200 } }
            }
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
    }

    [Fact]
    public async Task ComputedValues_AreUnknown_AndSilent()
    {
        const string config = """
            {
              "execution_settings": { "default": { "temperature": "{{$heat}}", "top_p": "=Env.TOP_P" } }
            }
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null);
    }

    [Fact]
    public async Task MalformedConfig_WithSamplingKeys_GivesOneSamp100NamingTheFile()
    {
        const string config = "{\n  \"execution_settings\": {\n    \"default\": { \"temperature\": 0.9 \"top_p\": 0.5 }\n  }\n}\n";
        await Verify.FilesAsync(new[] { ("/Prompts/Poem/config.json", config), ("/Prompts/Poem/skprompt.txt", PoemPrompt) }, null,
            Verify.Diagnostic("SAMP100").WithSpan("/Prompts/Poem/config.json", 3, 36, 3, 36)
                .WithMessage("Temperance configuration 'Poem/config.json' has the value 'After parsing a value an unexpected character was encountered: \".'; expected JSON that parses (the parser stopped at line 3, column 36); its sampling settings are not checked. The rule that needs it is skipped until this is fixed."));
    }

    [Fact]
    public async Task SettingsFileInATestProject_IsTestData_AndSilent()
    {
        const string config = """
            { "execution_settings": { "default": { "temperature": 0.9, "top_p": 0.5 } } }
            """;
        var test = new TemperanceTest("class Placeholder { }");
        test.TestState.AdditionalFiles.Add(("/Fixtures/Poem/config.json", config));
        test.TestState.AnalyzerConfigFiles.Add(("/.project.globalconfig", "is_global = true\nbuild_property.IsTestProject = true\n"));
        await test.RunAsync();
    }

    [Fact]
    public async Task EditorConfigSectionByPath_SetsTheTaskOfPromptFiles()
    {
        const string config = """
            { "execution_settings": { "default": { "temperature": 0.9 } } }
            """;
        // temperance.* keys follow the file's path, as for C# files: only the files under Prompts/ are extractions.
        const string configWithModel = """
            { "execution_settings": { "default": { {|SAMP001:"temperature": 0.9|} } } }
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/Manifest/config.json", configWithModel), ("/Other/Poem/config.json", config) },
            "root = true\n\n[/Prompts/**.json]\ntemperance.task = extraction\n");
    }
}
