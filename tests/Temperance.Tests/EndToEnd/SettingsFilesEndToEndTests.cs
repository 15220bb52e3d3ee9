using System.Text.RegularExpressions;

namespace Temperance.Tests.EndToEnd;

/// <summary>
/// Settings files in a real consumer built by the real CLI: the package adds them as additional files by itself, the
/// warnings name the file and line in the build output and in the SARIF log, and one property turns it off.
/// </summary>
[Trait("Category", "EndToEnd")]
public class SettingsFilesEndToEndTests : IClassFixture<PackageFixture>
{
    private const string PoemConfig = """
        {
          "schema": 1,
          "description": "Writes a short poem about a lighthouse cat",
          "execution_settings": {
            "default": {
              "model_id": "gpt-4o-mini",
              "top_p": 1.7
            }
          }
        }
        """;

    private const string PlannerAgent = """
        type: chat_completion_agent
        name: CargoPlanner
        instructions: Plan the loading order of the vehicles on the car deck.
        model:
          id: o4-mini
          options:
            temperature: 0.2
        """;

    // Not a prompt: a workflow file with no sampling key is never parsed, even though it is not valid YAML.
    private const string Workflow = "on: [push\njobs: {\n";

    private readonly PackageFixture package;

    public SettingsFilesEndToEndTests(PackageFixture package)
    {
        this.package = package;
    }

    private Consumer CreateConsumerWithFiles(string name, string extraProperties = "")
    {
        var consumer = package.CreateConsumer(name, extraProperties: extraProperties);
        consumer.Write("Program.cs", "namespace Lighthouse; public static class Entry { }");
        Directory.CreateDirectory(Path.Combine(consumer.Directory, "Prompts", "Poem"));
        Directory.CreateDirectory(Path.Combine(consumer.Directory, "Agents"));
        Directory.CreateDirectory(Path.Combine(consumer.Directory, "ci"));
        consumer.Write("Prompts/Poem/config.json", PoemConfig);
        consumer.Write("Prompts/Poem/skprompt.txt", "Write a four-line poem about the lighthouse keeper's cat {{$name}}.");
        consumer.Write("Agents/planner.yaml", PlannerAgent);
        consumer.Write("ci/build.yml", Workflow);
        consumer.Write("appsettings.json", "{ \"Harbour\": { \"Temperature\": 0.4 \"TopP\": 0.9 } }");
        return consumer;
    }

    [Fact]
    public void Build_ShowsWarningsAtTheFilesLines_AndTheSarifLogHasThem()
    {
        var consumer = CreateConsumerWithFiles("settings-files");
        var log = Path.Combine(consumer.Directory, "build.sarif");
        var build = consumer.Run($"build --no-incremental -nodeReuse:false -p:UseSharedCompilation=false \"-p:ErrorLog={log}%2Cversion%3D2.1\"");
        Assert.True(build.ExitCode == 0, build.ToString());

        Assert.Matches(@"Prompts[/\\]Poem[/\\]config\.json\(7,7(,7,19)?\): warning SAMP005: ", build.Output);
        Assert.Matches(@"Agents[/\\]planner\.yaml\(7,5(,7,21)?\): warning SAMP007: ", build.Output);
        Assert.Matches(@"appsettings\.json\(1,\d+(,\d+,\d+)?\): warning SAMP100: Temperance configuration 'settings-files/appsettings\.json'", build.Output);
        Assert.DoesNotMatch(@"build\.yml|AD0001|CS8032", build.Output);

        using var sarif = System.Text.Json.JsonDocument.Parse(File.ReadAllText(log));
        var results = sarif.RootElement.GetProperty("runs")[0].GetProperty("results").EnumerateArray()
            .Select(r => (Id: r.GetProperty("ruleId").GetString(), Location: r.GetProperty("locations")[0].GetProperty("physicalLocation")))
            .ToList();
        var inPoem = Assert.Single(results, r => r.Id == "SAMP005");
        Assert.EndsWith("Prompts/Poem/config.json", inPoem.Location.GetProperty("artifactLocation").GetProperty("uri").GetString());
        Assert.Equal(7, inPoem.Location.GetProperty("region").GetProperty("startLine").GetInt32());
        Assert.Equal(7, inPoem.Location.GetProperty("region").GetProperty("startColumn").GetInt32());
        var inAgent = Assert.Single(results, r => r.Id == "SAMP007");
        Assert.EndsWith("Agents/planner.yaml", inAgent.Location.GetProperty("artifactLocation").GetProperty("uri").GetString());
        Assert.Equal(7, inAgent.Location.GetProperty("region").GetProperty("startLine").GetInt32());
    }

    [Fact]
    public void OneProperty_TurnsSettingsFilesOff()
    {
        var consumer = CreateConsumerWithFiles("settings-files-off", "<TemperanceSettingsFiles>false</TemperanceSettingsFiles>");
        var build = consumer.Build();
        Assert.True(build.ExitCode == 0, build.ToString());
        Assert.DoesNotMatch("SAMP", build.Output);
    }

    [Fact]
    public void TeamGlobalSeverity_BreaksTheBuildOnAPromptFile()
    {
        var consumer = CreateConsumerWithFiles("settings-files-error");
        consumer.Write("team.globalconfig", "is_global = true\ndotnet_diagnostic.SAMP005.severity = error\n");
        consumer.Write("Directory.Build.props", "<Project><ItemGroup><GlobalAnalyzerConfigFiles Include=\"team.globalconfig\" /></ItemGroup></Project>");
        var build = consumer.Build();
        Assert.NotEqual(0, build.ExitCode);
        Assert.Matches(@"config\.json\(7,7(,7,19)?\): error SAMP005", build.Output);
    }
}
