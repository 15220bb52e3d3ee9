using System.Text.Json;
using Temperance.Tests.Infrastructure;

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

    public DotNet.Result Run(string arguments) =>
        DotNet.Run(TestReferences.RepositoryRoot, $"\"{Path.Combine(Output, "tool", "Temperance.Inventory.dll")}\" {arguments}");
}

[Trait("Category", "EndToEnd")]
public class InventoryToolTests : IClassFixture<InventoryFixture>
{
    private readonly InventoryFixture tool;

    public InventoryToolTests(InventoryFixture tool)
    {
        this.tool = tool;
    }

    [Fact]
    public void Json_ListsEveryDemoRequest_WithValuesSourcesTasksAndFindings()
    {
        var file = Path.Combine(tool.Output, "report.json");
        var run = tool.Run($"\"{tool.Demo}\" --format json --output \"{file}\"");
        Assert.True(run.ExitCode == 0, run.ToString());

        using var json = JsonDocument.Parse(File.ReadAllText(file));
        var requests = json.RootElement.EnumerateArray().ToList();
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
    }

    [Fact]
    public void TableAndMarkdown_ShowTheSameRequests()
    {
        var table = tool.Run($"\"{tool.Demo}\"");
        Assert.True(table.ExitCode == 0, table.ToString());
        Assert.Contains("Extraction/CrewManifest.cs:11", table.Output, StringComparison.Ordinal);
        Assert.Matches(@"\d+ requests, \d+ findings", table.Output);

        var markdown = tool.Run($"\"{tool.Demo}\" --format markdown");
        Assert.True(markdown.ExitCode == 0, markdown.ToString());
        Assert.Contains("| where | SDK | model | task (evidence) |", markdown.Output, StringComparison.Ordinal);
        Assert.Contains("`Program.cs:40`", markdown.Output, StringComparison.Ordinal);
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
    public void Html_RendersInHeadlessChromium_WithTheChartAndTheTable()
    {
        var page = Path.Combine(tool.Output, "report.html");
        var run = tool.Run($"\"{tool.Demo}\" --format html --output \"{page}\"");
        Assert.True(run.ExitCode == 0, run.ToString());
        var html = File.ReadAllText(page);
        Assert.DoesNotContain("http://", html.Replace("http://www.w3.org/2000/svg", string.Empty, StringComparison.Ordinal), StringComparison.Ordinal);
        Assert.DoesNotContain("https://", html, StringComparison.Ordinal);

        var chromium = new[] { "/usr/bin/chromium", "/usr/bin/chromium-browser" }.FirstOrDefault(File.Exists);
        if (chromium == null)
        {
            // CI installs Chromium (.ci/run); a developer machine without it checks the page text only.
            Assert.True(Environment.GetEnvironmentVariable("CI") != "true", "Chromium is missing in CI");
            return;
        }

        var flags = $"--headless --no-sandbox --disable-gpu --disable-background-networking --disable-component-update --disable-sync --no-first-run --user-data-dir=\"{Path.Combine(tool.Output, "profile")}\"";
        var dom = Process(chromium, $"{flags} --dump-dom \"file://{page}\"");
        Assert.Contains("<svg id=\"chart\"", dom, StringComparison.Ordinal);
        Assert.True(System.Text.RegularExpressions.Regex.Matches(dom, "<rect class=\"bar\"").Count >= 3, "the chart has bars");
        Assert.True(System.Text.RegularExpressions.Regex.Matches(dom, "<tr>").Count >= 19, "the table has the demo's rows");

        var shot = Path.Combine(tool.Output, "report.png");
        Process(chromium, $"{flags} --window-size=1400,1000 --screenshot=\"{shot}\" \"file://{page}\"");
        Assert.True(File.Exists(shot) && new FileInfo(shot).Length > 10_000, "a screenshot of the rendered page");
    }

    private static string Process(string file, string arguments)
    {
        var start = new System.Diagnostics.ProcessStartInfo(file, arguments) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        using var process = System.Diagnostics.Process.Start(start)!;
        var output = process.StandardOutput.ReadToEndAsync();
        _ = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(120_000))
        {
            process.Kill(entireProcessTree: true);
        }

        return output.Result;
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
        var listed = json.RootElement.EnumerateArray()
            .Select(r => (Project: r.GetProperty("project").GetString()!, File: Path.GetFileName(r.GetProperty("file").GetString()!),
                Temperature: Math.Round(r.GetProperty("settings").GetProperty("temperature").GetProperty("value").GetDouble(), 1)))
            .OrderBy(r => r.Project).ThenBy(r => r.File)
            .ToList();
        Assert.Equal(expected.OrderBy(r => r.Project).ThenBy(r => r.File).ToList(), listed);
    }
}
