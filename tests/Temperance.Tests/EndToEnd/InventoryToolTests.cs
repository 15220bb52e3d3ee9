using System.Text.Json;
using Temperance.Tests.Infrastructure;
using Xunit.Abstractions;

namespace Temperance.Tests.EndToEnd;

/// <summary>Builds the inventory tool and the demo once, for the tests that run the tool as a user would.</summary>
public sealed class InventoryFixture
{
    public InventoryFixture()
    {
        var root = TestReferences.RepositoryRoot;
        Output = Path.Combine(Path.GetTempPath(), "temperance-inventory-" + Guid.NewGuid().ToString("N")[..8]);
        Directory.CreateDirectory(Output);
        var build = DotNet.Run(root, $"build src/Temperance.Inventory/Temperance.Inventory.csproj -c Release -o \"{Path.Combine(Output, "tool")}\" -nodeReuse:false");
        if (build.ExitCode != 0)
        {
            throw new InvalidOperationException("inventory tool build failed:\n" + build);
        }

        var restore = DotNet.Run(root, "restore samples/HarbourDesk/HarbourDesk.csproj");
        if (restore.ExitCode != 0)
        {
            throw new InvalidOperationException("demo restore failed:\n" + restore);
        }

        Demo = Path.Combine(root, "samples", "HarbourDesk", "HarbourDesk.csproj");
    }

    public string Output { get; }
    public string Demo { get; }
    public string Tool => Path.Combine(Output, "tool", "Temperance.Inventory.dll");

    public DotNet.Result Run(string arguments) =>
        DotNet.Run(TestReferences.RepositoryRoot, $"\"{Tool}\" {arguments}");

    /// <summary>Runs the tool in a folder of generated projects, with the packages that folder restored into.</summary>
    public DotNet.Result RunIn(string folder, string arguments) =>
        DotNet.Run(folder, $"\"{Tool}\" {arguments}", new Dictionary<string, string> { ["NUGET_PACKAGES"] = Path.Combine(folder, "packages") });

    /// <summary>
    /// A folder for generated projects whose only package source is the packages the test project restored (offline),
    /// restored into a packages folder of its own.
    /// </summary>
    public string NewFolder(string name)
    {
        var root = Path.Combine(Output, name);
        Directory.CreateDirectory(root);
        File.WriteAllText(Path.Combine(root, "nuget.config"), $"""
            <?xml version="1.0" encoding="utf-8"?>
            <configuration><packageSources><clear /><add key="restored" value="{PackageFixture.RestoredPackages}" /></packageSources></configuration>
            """);
        return root;
    }

    public static void WriteProject(string folder, string name, string packages, params (string File, string Text)[] sources)
    {
        var directory = Path.Combine(folder, name);
        Directory.CreateDirectory(directory);
        File.WriteAllText(Path.Combine(directory, name + ".csproj"), $"""
            <Project Sdk="Microsoft.NET.Sdk">
              <PropertyGroup><TargetFramework>net10.0</TargetFramework><Nullable>enable</Nullable><NoWarn>$(NoWarn);NU1603;NU1608;OPENAI001</NoWarn></PropertyGroup>
              <ItemGroup>{packages}</ItemGroup>
            </Project>
            """);
        foreach (var (file, text) in sources)
        {
            File.WriteAllText(Path.Combine(directory, file), text);
        }
    }

    public static DotNet.Result Restore(string folder, string target) =>
        DotNet.Run(folder, $"restore \"{target}\"", new Dictionary<string, string> { ["NUGET_PACKAGES"] = Path.Combine(folder, "packages") });
}

/// <summary>
/// The inventory tool run as a user runs it. The class is split over files by subject (InventoryHtmlTests.cs: the page in
/// Chromium; InventoryTableTests.cs: the terminal table as a pure function), sharing one build of the tool.
/// </summary>
[Trait("Category", "EndToEnd")]
public partial class InventoryToolTests : IClassFixture<InventoryFixture>
{
    private readonly InventoryFixture tool;
    private readonly ITestOutputHelper log;

    public InventoryToolTests(InventoryFixture tool, ITestOutputHelper log)
    {
        this.tool = tool;
        this.log = log;
    }

    [Fact]
    public void Json_ListsEveryDemoRequest_WithValuesSourcesTasksAndFindings()
    {
        var file = Path.Combine(tool.Output, "report.json");
        var run = tool.Run($"\"{tool.Demo}\" --format json --output \"{file}\"");
        Assert.True(run.ExitCode == 0, run.ToString());

        using var json = JsonDocument.Parse(File.ReadAllText(file));
        var requests = json.RootElement.GetProperty("requests").EnumerateArray().ToList();
        Assert.True(requests.Count >= 19, $"expected the demo's requests, found {requests.Count}");

        JsonElement At(string file, int line) => requests.Single(r => r.GetProperty("file").GetString()!.EndsWith(file, StringComparison.Ordinal) && r.GetProperty("line").GetInt32() == line);

        var newsletter = At("Program.cs", 40);
        Assert.Equal(1.8, newsletter.GetProperty("settings").GetProperty("temperature").GetProperty("value").GetDouble(), 3);
        Assert.Equal("constant 'NewsletterMood'", newsletter.GetProperty("settings").GetProperty("temperature").GetProperty("source").GetString());
        Assert.Contains(newsletter.GetProperty("findings").EnumerateArray(), f => f.GetProperty("id").GetString() == "SAMP009");

        var crew = At("CrewManifest.cs", 11);
        Assert.Equal("extraction", crew.GetProperty("task").GetProperty("kind").GetString());
        Assert.Contains(".editorconfig", crew.GetProperty("task").GetProperty("evidence").GetString(), StringComparison.Ordinal);
        Assert.Equal("default of the provider", crew.GetProperty("settings").GetProperty("temperature").GetProperty("source").GetString());
        Assert.Contains(crew.GetProperty("findings").EnumerateArray(), f => f.GetProperty("id").GetString() == "SAMP001");

        var ollama = At("Program.cs", 46);
        Assert.Equal("llama3.2", ollama.GetProperty("model").GetString());
        Assert.Equal("ollama", ollama.GetProperty("provider").GetString());

        // Agreement with the analyzer: ChatOptions (generic provider) with no temperature is left to the client, not a guessed 1.
        var cabin = At("Tuning.cs", 20);
        var temperature = cabin.GetProperty("settings").GetProperty("temperature");
        Assert.Equal(JsonValueKind.Null, temperature.GetProperty("value").ValueKind);
        Assert.Equal("unset (left to the client)", temperature.GetProperty("source").GetString());
        Assert.Equal("unset", temperature.GetProperty("state").GetString());
        Assert.DoesNotContain("usually", File.ReadAllText(file), StringComparison.Ordinal);
    }

    [Fact]
    public void Json_ListsTheDemosSettingsFileRequests_WithTheirFileLineAndFindings()
    {
        var file = Path.Combine(tool.Output, "files.json");
        var run = tool.Run($"\"{tool.Demo}\" --format json --output \"{file}\"");
        Assert.True(run.ExitCode == 0, run.ToString());

        using var json = JsonDocument.Parse(File.ReadAllText(file));
        var requests = json.RootElement.GetProperty("requests").EnumerateArray().ToList();
        var booking = requests.Single(r => r.GetProperty("file").GetString()!.Replace('\\', '/').EndsWith("Prompts/BookingLookup/config.json", StringComparison.Ordinal));
        Assert.Equal(5, booking.GetProperty("line").GetInt32());
        Assert.Equal("settings file", booking.GetProperty("library").GetString());
        Assert.Equal("extraction", booking.GetProperty("task").GetProperty("kind").GetString());
        Assert.Equal(0.9, booking.GetProperty("settings").GetProperty("temperature").GetProperty("value").GetDouble(), 3);
        Assert.Equal(new[] { "SAMP001", "SAMP004" }, booking.GetProperty("findings").EnumerateArray().Select(f => f.GetProperty("id").GetString()).OrderBy(i => i));
        Assert.Equal(new[] { "file" }, booking.GetProperty("layers").EnumerateArray().Select(l => l.GetString()));

        var planner = requests.Single(r => r.GetProperty("file").GetString()!.EndsWith("deck-planner.yaml", StringComparison.Ordinal));
        Assert.Equal(10, planner.GetProperty("line").GetInt32());
        Assert.Equal("o4-mini", planner.GetProperty("model").GetString());
        var rejected = Assert.Single(planner.GetProperty("findings").EnumerateArray());
        Assert.Equal("SAMP007", rejected.GetProperty("id").GetString());
        Assert.Equal(11, rejected.GetProperty("line").GetInt32());

        // A request built in code whose temperature comes from appsettings: one row per environment that changes it,
        // each marked as layered, the production one with its finding.
        var bulletins = requests.Where(r => r.GetProperty("file").GetString()!.EndsWith("WeatherBulletin.cs", StringComparison.Ordinal)).ToList();
        Assert.Equal(2, bulletins.Count);
        Assert.All(bulletins, b => Assert.Equal(new[] { "code", "configuration" }, b.GetProperty("layers").EnumerateArray().Select(l => l.GetString())));
        var production = Assert.Single(bulletins, b => b.GetProperty("settings").GetProperty("temperature").GetProperty("value").GetDouble() > 1.5);
        Assert.Contains("appsettings.Production.json", production.GetProperty("settings").GetProperty("temperature").GetProperty("source").GetString(), StringComparison.Ordinal);
        Assert.Equal("SAMP009", Assert.Single(production.GetProperty("findings").EnumerateArray()).GetProperty("id").GetString());
    }

    [Fact]
    public void Json_NamesTheModel_ItsFamily_AndWhereBothCameFrom()
    {
        var file = Path.Combine(tool.Output, "models.json");
        var run = tool.Run($"\"{tool.Demo}\" --format json --output \"{file}\"");
        Assert.True(run.ExitCode == 0, run.ToString());

        using var json = JsonDocument.Parse(File.ReadAllText(file));
        var requests = json.RootElement.GetProperty("requests").EnumerateArray().ToList();
        JsonElement At(string name, int line) => requests.Single(r => r.GetProperty("file").GetString()!.EndsWith(name, StringComparison.Ordinal) && r.GetProperty("line").GetInt32() == line);

        var planner = At("Tuning.cs", 24);
        Assert.Equal("o4-mini", planner.GetProperty("model").GetString());
        Assert.Equal("openai_reasoning", planner.GetProperty("model_family").GetString());
        Assert.Equal("from the options; family from temperance.model.openai_reasoning.match", planner.GetProperty("model_source").GetString());

        var lostLuggage = At("Program.cs", 37);
        Assert.Equal("gpt-4o-mini", lostLuggage.GetProperty("model").GetString());
        Assert.Equal("openai", lostLuggage.GetProperty("model_family").GetString());
    }

    [Fact]
    public void TableAndMarkdown_ShowTheSameRequests()
    {
        var table = tool.Run($"\"{tool.Demo}\"");
        Assert.True(table.ExitCode == 0, table.ToString());
        Assert.Contains("Extraction/CrewManifest.cs:11", table.Output, StringComparison.Ordinal);
        Assert.Matches(@"\d+ requests, \d+ findings", table.Output);

        Assert.Contains("unset (left to the client)", table.Output, StringComparison.Ordinal);

        var markdown = tool.Run($"\"{tool.Demo}\" --format markdown");
        Assert.True(markdown.ExitCode == 0, markdown.ToString());
        Assert.Contains("| where | SDK | model | task (evidence) |", markdown.Output, StringComparison.Ordinal);
        Assert.Contains("`Program.cs:40`", markdown.Output, StringComparison.Ordinal);

        // The summary and the findings grouped by rule come before the requests table.
        var text = markdown.Output;
        var summary = text.IndexOf("| **Requests** | 24", StringComparison.Ordinal);
        var byRule = text.IndexOf("## Findings by rule", StringComparison.Ordinal);
        var samp001 = text.IndexOf("### [SAMP001](", StringComparison.Ordinal);
        var requests = text.IndexOf("## Requests", StringComparison.Ordinal);
        Assert.True(summary >= 0 && byRule > summary && samp001 > byRule && requests > samp001, text);
        Assert.Matches(@"\| \*\*Findings\*\* \| \d+: \d+ warning", text);
        Assert.Contains("| **Project** | 1: HarbourDesk |", text, StringComparison.Ordinal);
        Assert.Contains("### [SAMP001](https://github.com/temperance-analyzers/temperance/blob/main/rules/SAMP001.md): Temperature above the ceiling", text, StringComparison.Ordinal);
        Assert.Contains("- `Intake.cs:21` Temperature 0.9 is above the ceiling 0.3", text, StringComparison.Ordinal);
    }

    [Fact]
    public void FailOn_SetsTheExitCode()
    {
        Assert.Equal(2, tool.Run($"\"{tool.Demo}\" --format json --fail-on warning").ExitCode);
        Assert.Equal(0, tool.Run($"\"{tool.Demo}\" --format json --fail-on error").ExitCode);
        Assert.Equal(1, tool.Run("no-such.sln").ExitCode);
        Assert.Contains("--fail-on", tool.Run("--help").Output, StringComparison.Ordinal);
    }

    [Fact]
    public void GeneratedSolution_ListsEveryRequestOfEveryProject()
    {
        var root = Path.Combine(tool.Output, "generated");
        Directory.CreateDirectory(root);
        File.WriteAllText(Path.Combine(root, "nuget.config"), $"""
            <?xml version="1.0" encoding="utf-8"?>
            <configuration><packageSources><clear /><add key="restored" value="{PackageFixture.RestoredPackages}" /></packageSources></configuration>
            """);
        var expected = new List<(string Project, string File, double Temperature)>();
        for (var p = 0; p < 2; p++)
        {
            var name = $"Berth{p}";
            var folder = Path.Combine(root, name);
            Directory.CreateDirectory(folder);
            File.WriteAllText(Path.Combine(folder, name + ".csproj"), """
                <Project Sdk="Microsoft.NET.Sdk">
                  <PropertyGroup><TargetFramework>net10.0</TargetFramework><Nullable>enable</Nullable></PropertyGroup>
                  <ItemGroup><PackageReference Include="OpenAI" Version="2.15.0" /></ItemGroup>
                </Project>
                """);
            for (var f = 0; f < 3; f++)
            {
                var temperature = 0.1 * (p * 3 + f + 1);
                var text = temperature.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture);
                File.WriteAllText(Path.Combine(folder, $"Options{f}.cs"), $$"""
                    namespace {{name}};
                    public static class Options{{f}}
                    {
                        public static OpenAI.Chat.ChatCompletionOptions Create() => new OpenAI.Chat.ChatCompletionOptions { Temperature = {{text}}f };
                    }
                    """);
                expected.Add((name, $"Options{f}.cs", Math.Round(temperature, 1)));
            }
        }

        Assert.Equal(0, DotNet.Run(root, "new sln -n Harbour --format sln").ExitCode);
        Assert.Equal(0, DotNet.Run(root, "sln Harbour.sln add Berth0/Berth0.csproj Berth1/Berth1.csproj").ExitCode);
        var restore = DotNet.Run(root, "restore Harbour.sln", new Dictionary<string, string> { ["NUGET_PACKAGES"] = Path.Combine(root, "packages") });
        Assert.True(restore.ExitCode == 0, restore.ToString());

        var file = Path.Combine(root, "inventory.json");
        var run = DotNet.Run(root, $"\"{Path.Combine(tool.Output, "tool", "Temperance.Inventory.dll")}\" Harbour.sln --format json --output \"{file}\"",
            new Dictionary<string, string> { ["NUGET_PACKAGES"] = Path.Combine(root, "packages") });
        Assert.True(run.ExitCode == 0, run.ToString());

        using var json = JsonDocument.Parse(File.ReadAllText(file));
        Assert.Equal(new[] { "Berth0", "Berth1" }, json.RootElement.GetProperty("summary").GetProperty("projects").EnumerateArray().Select(p => p.GetString()).ToArray());
        var listed = json.RootElement.GetProperty("requests").EnumerateArray()
            .Select(r => (Project: r.GetProperty("project").GetString()!, File: Path.GetFileName(r.GetProperty("file").GetString()!),
                Temperature: Math.Round(r.GetProperty("settings").GetProperty("temperature").GetProperty("value").GetDouble(), 1)))
            .OrderBy(r => r.Project).ThenBy(r => r.File)
            .ToList();
        Assert.Equal(expected.OrderBy(r => r.Project).ThenBy(r => r.File).ToList(), listed);
    }

    [Fact]
    public void Help_DocumentsEveryExitCode()
    {
        var help = tool.Run("--help");
        Assert.Equal(0, help.ExitCode);
        foreach (var line in new[] { "0  the report was made", "1  bad arguments", "2  a finding at or above the --fail-on severity", "3  a project could not be analysed" })
        {
            Assert.Contains(line, help.Output, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void BadArguments_ExitWithOne_AndNameTheArgumentAndItsAcceptedValues()
    {
        var folder = Path.Combine(tool.Output, "arguments");
        Directory.CreateDirectory(folder);
        var notes = Path.Combine(folder, "notes.txt");
        File.WriteAllText(notes, "not a project");
        var demoFolder = Path.GetDirectoryName(tool.Demo)!;
        var cases = new (string Arguments, string Message)[]
        {
            ("no-such.sln", "PATH 'no-such.sln' does not exist"),
            ($"\"{demoFolder}\"", $"PATH '{demoFolder}' is a folder; give a .sln, .slnx or .csproj file; it holds one: '{tool.Demo}'"),
            ($"\"{folder}\"", $"PATH '{folder}' is a folder; give a .sln, .slnx or .csproj file; it holds none"),
            ($"\"{notes}\"", $"PATH '{notes}' must be a .sln, .slnx or .csproj file; got a '.txt' file"),
            ($"\"{tool.Demo}\" --format pdf", "--format must be table, markdown, json or html; got 'pdf'"),
            ($"\"{tool.Demo}\" --fail-on fatal", "--fail-on must be info, warning or error; got 'fatal'"),
            ($"\"{tool.Demo}\" --format", "--format needs a value: table, markdown, json or html"),
            ($"\"{tool.Demo}\" --fail-on --format json", "--fail-on needs a value: info, warning or error"),
            ($"\"{tool.Demo}\" --output", "--output needs a value: a file to write the report to"),
            ($"\"{tool.Demo}\" --colour red", "unknown option '--colour'; the options are --format, --output, --fail-on and --help"),
            ($"\"{tool.Demo}\" --format json --format html", "--format is given twice ('json' and 'html')"),
            ($"\"{tool.Demo}\" other.sln", $"only one PATH is accepted; got '{tool.Demo}' and 'other.sln'"),
            ("--format json", "PATH is missing: give a .sln, .slnx or .csproj file"),
            ($"\"{tool.Demo}\" --output \"{Path.Combine(folder, "absent", "report.html")}\"", $"the folder '{Path.Combine(folder, "absent")}' does not exist"),
        };
        foreach (var (arguments, message) in cases)
        {
            var run = tool.Run(arguments);
            Assert.True(run.ExitCode == 1, $"{arguments}: {run}");
            Assert.True(run.Output.StartsWith("temperance-inventory: ", StringComparison.Ordinal) && run.Output.Contains(message, StringComparison.Ordinal),
                $"{arguments}: expected \"{message}\" in\n{run.Output}");
            Assert.Contains("temperance-inventory --help", run.Output, StringComparison.Ordinal);
            Assert.DoesNotContain("requests", run.Output, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void ProjectThatCannotBeAnalysed_ExitsWithThree_NamesTheProject_AndReportsNoRequests()
    {
        var root = tool.NewFolder("unanalysable");
        var options = ("Options.cs", """
            using OpenAI.Chat;
            namespace Drydock;
            public static class Options
            {
                public static ChatCompletionOptions Create() => new ChatCompletionOptions { Temperature = 0.9f };
            }
            """);

        // Not restored: a project referencing OpenAI 2.15.0 that nobody restored.
        InventoryFixture.WriteProject(root, "Drydock", "<PackageReference Include=\"OpenAI\" Version=\"2.15.0\" />", options);
        var project = Path.Combine(root, "Drydock", "Drydock.csproj");
        foreach (var format in new[] { "table", "json", "html" })
        {
            var run = tool.RunIn(root, $"\"{project}\" --format {format}");
            Assert.True(run.ExitCode == 3, run.ToString());
            Assert.Contains($"temperance-inventory: cannot analyse project 'Drydock' ({project}) is not restored", run.Output, StringComparison.Ordinal);
            Assert.Contains("dotnet restore", run.Output, StringComparison.Ordinal);
            Assert.DoesNotContain("0 requests", run.Output, StringComparison.Ordinal);
            Assert.DoesNotContain("\"requests\"", run.Output, StringComparison.Ordinal);
        }

        // Restored, but the SDK package is not referenced: the using does not resolve and hides every request.
        InventoryFixture.WriteProject(root, "Slipway", string.Empty, options);
        var slipway = Path.Combine(root, "Slipway", "Slipway.csproj");
        var restore = InventoryFixture.Restore(root, slipway);
        Assert.True(restore.ExitCode == 0, restore.ToString());
        var hidden = tool.RunIn(root, $"\"{slipway}\"");
        Assert.True(hidden.ExitCode == 3, hidden.ToString());
        Assert.Contains($"cannot analyse project 'Slipway' ({slipway}) has compile errors that hide its LLM SDK (Options.cs:1: error CS0246", hidden.Output, StringComparison.Ordinal);
        Assert.DoesNotContain("0 requests", hidden.Output, StringComparison.Ordinal);

        // Does not load: a project file that is not valid XML, reached through a solution.
        var broken = Path.Combine(root, "Capsized");
        Directory.CreateDirectory(broken);
        File.WriteAllText(Path.Combine(broken, "Capsized.csproj"), "<Project Sdk=\"Microsoft.NET.Sdk\">\n<PropertyGroup><TargetFramework>net10.0</TargetFramework>\n</Project>\n");
        Assert.Equal(0, DotNet.Run(root, "new sln -n Fleet --format sln").ExitCode);
        var solution = File.ReadAllText(Path.Combine(root, "Fleet.sln"));
        var entry = "Project(\"{FAE04EC0-301F-11D3-BF4B-00C04F79EFBC}\") = \"Capsized\", \"Capsized\\Capsized.csproj\", \"{5D3C6A52-1B1E-4C55-9C0B-0F3C2B7A9E11}\"\nEndProject\n";
        File.WriteAllText(Path.Combine(root, "Fleet.sln"), solution.Replace("Global\n", entry + "Global\n", StringComparison.Ordinal).Replace("Global\r\n", entry + "Global\r\n", StringComparison.Ordinal));
        var notLoaded = tool.RunIn(root, "Fleet.sln");
        Assert.True(notLoaded.ExitCode == 3, notLoaded.ToString());
        Assert.Contains($"cannot analyse project 'Capsized' ({Path.Combine(broken, "Capsized.csproj")}) does not load:", notLoaded.Output, StringComparison.Ordinal);
        Assert.DoesNotContain("0 requests", notLoaded.Output, StringComparison.Ordinal);
    }

    [Fact]
    public void Json_IsOneObject_WithToolDateCommitSummaryAndRequests()
    {
        var file = Path.Combine(tool.Output, "shape.json");
        var run = tool.Run($"\"{tool.Demo}\" --format json --output \"{file}\"");
        Assert.True(run.ExitCode == 0, run.ToString());
        using var json = JsonDocument.Parse(File.ReadAllText(file));
        var top = json.RootElement;
        Assert.Equal(JsonValueKind.Object, top.ValueKind);
        Assert.Equal(new[] { "tool", "generated", "commit", "path", "summary", "requests" }, top.EnumerateObject().Select(p => p.Name).ToArray());

        Assert.Equal("temperance-inventory", top.GetProperty("tool").GetProperty("name").GetString());
        Assert.Matches(@"^\d+\.\d+\.\d+", top.GetProperty("tool").GetProperty("version").GetString()!);
        var generated = DateTimeOffset.Parse(top.GetProperty("generated").GetString()!, System.Globalization.CultureInfo.InvariantCulture);
        Assert.True(Math.Abs((DateTimeOffset.UtcNow - generated).TotalHours) < 1, $"generated {generated}");
        Assert.Matches(@"^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}Z$", top.GetProperty("generated").GetString()!);

        // The commit is the short HEAD of the work tree holding the demo, or null outside git.
        var git = GitShortHead(Path.GetDirectoryName(tool.Demo)!);
        var commit = top.GetProperty("commit");
        if (git == null)
        {
            Assert.Equal(JsonValueKind.Null, commit.ValueKind);
        }
        else
        {
            Assert.Equal(git, commit.GetString());
        }

        var requests = top.GetProperty("requests").EnumerateArray().ToList();
        var summary = top.GetProperty("summary");
        Assert.Equal(requests.Count, summary.GetProperty("requests").GetInt32());
        Assert.Equal(requests.Count(r => r.GetProperty("not_judged").ValueKind != JsonValueKind.Null), summary.GetProperty("not_judged").GetInt32());
        Assert.Equal(new[] { "HarbourDesk" }, summary.GetProperty("projects").EnumerateArray().Select(p => p.GetString()).ToArray());
        var findings = summary.GetProperty("findings");
        var total = findings.GetProperty("total").GetInt32();
        var byRule = findings.GetProperty("by_rule").EnumerateObject().ToDictionary(p => p.Name, p => p.Value.GetInt32());
        var bySeverity = findings.GetProperty("by_severity").EnumerateObject().ToDictionary(p => p.Name, p => p.Value.GetInt32());
        Assert.Equal(total, byRule.Values.Sum());
        Assert.Equal(total, bySeverity.Values.Sum());
        Assert.All(byRule.Keys, id => Assert.Matches(@"^SAMP\d{3}$", id));
        Assert.All(bySeverity.Keys, s => Assert.Contains(s, new[] { "error", "warning", "info" }));
        Assert.Equal(6, byRule["SAMP001"]); // five in C#, one in the prompt directory
        var listed = requests.SelectMany(r => r.GetProperty("findings").EnumerateArray())
            .Select(f => (f.GetProperty("id").GetString(), f.GetProperty("file").GetString(), f.GetProperty("line").GetInt32(), f.GetProperty("message").GetString()))
            .Distinct().Count();
        Assert.Equal(total, listed);

        // Each request keeps today's fields, with the SDK it belongs to and each finding's rule page and line.
        var first = requests[0];
        foreach (var field in new[] { "file", "line", "project", "sdk", "library", "provider", "model", "task", "settings", "findings", "not_judged" })
        {
            Assert.True(first.TryGetProperty(field, out _), field);
        }

        var finding = requests.SelectMany(r => r.GetProperty("findings").EnumerateArray()).First();
        Assert.EndsWith($"/rules/{finding.GetProperty("id").GetString()}.md", finding.GetProperty("help").GetString(), StringComparison.Ordinal);
        Assert.True(finding.GetProperty("line").GetInt32() > 0);
    }

    [Fact]
    public void UnknownValues_NameWhereTheyComeFrom_AndUnsetIsLeftToTheClient()
    {
        var root = tool.NewFolder("unknowns");
        InventoryFixture.WriteProject(root, "Ballast", """
            <PackageReference Include="OpenAI" Version="2.15.0" />
            <PackageReference Include="Microsoft.Extensions.AI" Version="10.11.0" />
            <PackageReference Include="Microsoft.Extensions.Configuration.Abstractions" Version="10.0.10" />
            """, ("Requests.cs", """
            using Microsoft.Extensions.AI;
            using Microsoft.Extensions.Configuration;
            using OpenAI.Chat;

            namespace Ballast;

            public sealed class LlmOptions
            {
                public float Temperature { get; set; }
            }

            public sealed class Requests
            {
                private readonly IConfiguration config;
                private readonly LlmOptions _options;

                public Requests(IConfiguration config, LlmOptions options)
                {
                    this.config = config;
                    _options = options;
                }

                public ChatCompletionOptions FromParameter(float heat) => new ChatCompletionOptions { Temperature = heat };

                public ChatCompletionOptions FromConfiguration() => new ChatCompletionOptions { Temperature = float.Parse(config["Llm:Temperature"]!) };

                public ChatCompletionOptions FromOptions() => new ChatCompletionOptions { Temperature = _options.Temperature };

                public ChatOptions LeftToTheClient() => new ChatOptions { ModelId = "gpt-4o-mini" };
            }
            """));
        var project = Path.Combine(root, "Ballast", "Ballast.csproj");
        var restore = InventoryFixture.Restore(root, project);
        Assert.True(restore.ExitCode == 0, restore.ToString());

        var file = Path.Combine(root, "ballast.json");
        var run = tool.RunIn(root, $"\"{project}\" --format json --output \"{file}\"");
        Assert.True(run.ExitCode == 0, run.ToString());
        using var json = JsonDocument.Parse(File.ReadAllText(file));
        var temperatures = json.RootElement.GetProperty("requests").EnumerateArray()
            .Select(r => r.GetProperty("settings").GetProperty("temperature"))
            .ToList();
        Assert.All(temperatures, t => Assert.Equal(JsonValueKind.Null, t.GetProperty("value").ValueKind));
        var sources = temperatures.Select(t => t.GetProperty("source").GetString()).ToList();
        Assert.Equal(new[]
        {
            "unknown (from parameter 'heat')",
            "unknown (from configuration key 'Llm:Temperature')",
            "unknown (from '_options.Temperature')",
            "unset (left to the client)",
        }, sources);

        var table = tool.RunIn(root, $"\"{project}\"");
        Assert.True(table.ExitCode == 0, table.ToString());
        Assert.Contains("unknown (from parameter 'heat')", table.Output, StringComparison.Ordinal);
        Assert.Contains("4 requests, 0 findings", table.Output, StringComparison.Ordinal);

        var page = Path.Combine(root, "ballast.html");
        Assert.Equal(0, tool.RunIn(root, $"\"{project}\" --format html --output \"{page}\"").ExitCode);
        var html = File.ReadAllText(page);
        Assert.Contains("id=\"no-dots\"", html, StringComparison.Ordinal);
        Assert.Contains("4 requests not plotted", html, StringComparison.Ordinal);
        Assert.Contains("unknown (from configuration key &#39;Llm:Temperature&#39;)", html, StringComparison.Ordinal);
    }

    private static string? GitShortHead(string folder)
    {
        try
        {
            var start = new System.Diagnostics.ProcessStartInfo("git", "rev-parse --short HEAD") { WorkingDirectory = folder, RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
            using var git = System.Diagnostics.Process.Start(start)!;
            var output = git.StandardOutput.ReadToEnd().Trim();
            git.WaitForExit();
            return git.ExitCode == 0 && output.Length > 0 ? output : null;
        }
        catch (System.ComponentModel.Win32Exception)
        {
            return null;
        }
    }
}
