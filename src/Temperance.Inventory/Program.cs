using Microsoft.Build.Locator;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.MSBuild;

namespace Temperance.Inventory;

public static class Program
{
    private const string Usage = """
        temperance-inventory PATH [--format table|markdown|json|html] [--output FILE] [--fail-on info|warning|error]

        Lists every LLM request in a solution (.sln, .slnx) or project (.csproj): file and line, SDK, model (when
        constant), task with evidence, each sampling setting with its value and where it came from, and findings.
          --format    table (default), markdown, json, or html (a self-contained page with a chart)
          --output    write the report to FILE instead of the terminal
          --fail-on   exit with code 2 when a finding at or above this severity exists
        Exit codes: 0 ok, 1 bad arguments or the path cannot be opened, 2 findings at or above --fail-on.
        """;

    public static async Task<int> Main(string[] args) => await RunAsync(args, Console.Out, Console.Error);

    public static async Task<int> RunAsync(string[] args, TextWriter output, TextWriter progress)
    {
        if (args.Length == 0 || args.Contains("--help") || args.Contains("-h"))
        {
            await output.WriteLineAsync(Usage);
            return args.Length == 0 ? 1 : 0;
        }

        var path = Path.GetFullPath(args[0]);
        var format = Option(args, "--format") ?? "table";
        var file = Option(args, "--output");
        var failOn = Option(args, "--fail-on");
        if (format is not ("table" or "markdown" or "json" or "html") || failOn is not (null or "info" or "warning" or "error") || !File.Exists(path))
        {
            await progress.WriteLineAsync($"temperance-inventory: bad arguments or missing path.\n{Usage}");
            return 1;
        }

        if (!MSBuildLocator.IsRegistered)
        {
            MSBuildLocator.RegisterDefaults();
        }

        return await RunCoreAsync(path, format, file, failOn, output, progress);
    }

    // Kept apart from RunAsync so no MSBuild type is loaded before the locator has run.
    private static async Task<int> RunCoreAsync(string path, string format, string? file, string? failOn, TextWriter output, TextWriter progress)
    {
        using var workspace = MSBuildWorkspace.Create();
        var projects = new List<Project>();
        await progress.WriteLineAsync($"loading {Path.GetFileName(path)} …");
        if (path.EndsWith(".csproj", StringComparison.OrdinalIgnoreCase))
        {
            projects.Add(await workspace.OpenProjectAsync(path));
        }
        else
        {
            projects.AddRange((await workspace.OpenSolutionAsync(path)).Projects.Where(p => p.Language == LanguageNames.CSharp));
        }

        var table = new RulesTableOptions(RulesTableOptions.FindTable());
        var rows = new List<RequestRow>();
        for (var i = 0; i < projects.Count; i++)
        {
            await progress.WriteLineAsync($"[{i + 1}/{projects.Count}] {projects[i].Name}");
            rows.AddRange(await Inventory.CollectAsync(projects[i], table, CancellationToken.None));
        }

        rows = rows.OrderBy(r => r.File, StringComparer.Ordinal).ThenBy(r => r.Line).ToList();
        var root = Path.GetDirectoryName(path)!;
        var report = format switch
        {
            "markdown" => Formats.Markdown(rows, root),
            "json" => Formats.Json(rows, root),
            "html" => Formats.Html(rows, root),
            _ => Formats.Table(rows, root),
        };
        if (file != null)
        {
            await File.WriteAllTextAsync(file, report);
            await progress.WriteLineAsync($"wrote {rows.Count} requests to {file}");
        }
        else
        {
            await output.WriteAsync(report);
        }

        var threshold = failOn switch { "info" => 1, "warning" => 2, "error" => 3, _ => int.MaxValue };
        var worst = rows.SelectMany(r => r.Findings).Select(f => f.Severity switch { "Info" => 1, "Warning" => 2, "Error" => 3, _ => 0 }).DefaultIfEmpty(0).Max();
        return worst >= threshold ? 2 : 0;
    }

    private static string? Option(string[] args, string name)
    {
        var index = Array.IndexOf(args, name);
        return index >= 0 && index + 1 < args.Length ? args[index + 1] : null;
    }
}
