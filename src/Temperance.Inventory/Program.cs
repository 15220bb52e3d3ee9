using Microsoft.Build.Locator;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.MSBuild;

namespace Temperance.Inventory;

/// <summary>What the command line asked for, once every argument has been checked.</summary>
public sealed record Arguments(string Path, string Format, string? Output, string? FailOn);

public static class Program
{
    public const int Ok = 0;
    public const int BadArguments = 1;
    public const int FindingsAtThreshold = 2;
    public const int NotAnalysable = 3;

    private static readonly string[] FormatNames = { "table", "markdown", "json", "html" };
    private static readonly string[] SeverityNames = { "info", "warning", "error" };
    private static readonly string[] PathKinds = { ".sln", ".slnx", ".csproj" };

    private const string Usage = """
        temperance-inventory PATH [--format table|markdown|json|html] [--output FILE] [--fail-on info|warning|error]

        Lists every LLM request in a solution (.sln, .slnx) or project (.csproj): file and line, SDK, model (when
        constant), task with evidence, each sampling setting with its value and where it came from, and findings.
          PATH        a .sln, .slnx or .csproj file, restored ('dotnet restore PATH' first)
          --format    table (default), markdown, json, or html (a self-contained page: summary, temperature by task,
                      findings by rule, and a filterable, sortable table of the requests)
          --output    write the report to FILE instead of the terminal
          --fail-on   exit with code 2 when a finding at or above this severity exists
          --help, -h  show this text

        Exit codes:
          0  the report was made (and no finding reached --fail-on)
          1  bad arguments: the message names the argument and the values it accepts
          2  a finding at or above the --fail-on severity
          3  a project could not be analysed: not restored, not loaded, or compile errors hide its LLM SDK.
             Each such project is named on its own line, and no report is written (it would miss its requests).
        """;

    public static async Task<int> Main(string[] args) => await RunAsync(args, Console.Out, Console.Error);

    public static async Task<int> RunAsync(string[] args, TextWriter output, TextWriter progress)
    {
        if (args.Length == 0)
        {
            await progress.WriteLineAsync("temperance-inventory: PATH is missing: give a .sln, .slnx or .csproj file.\n");
            await progress.WriteLineAsync(Usage);
            return BadArguments;
        }

        if (args.Contains("--help") || args.Contains("-h"))
        {
            await output.WriteLineAsync(Usage);
            return Ok;
        }

        var (arguments, error) = Parse(args);
        if (arguments == null)
        {
            await progress.WriteLineAsync($"temperance-inventory: {error}");
            await progress.WriteLineAsync("Run 'temperance-inventory --help' for the options and exit codes.");
            return BadArguments;
        }

        if (!MSBuildLocator.IsRegistered)
        {
            MSBuildLocator.RegisterDefaults();
        }

        return await RunCoreAsync(arguments, output, progress);
    }

    /// <summary>Checks the command line; on a mistake, a one-line reason that names the argument and what it accepts.</summary>
    public static (Arguments? Arguments, string? Error) Parse(IReadOnlyList<string> args)
    {
        string? path = null;
        var options = new Dictionary<string, string>(StringComparer.Ordinal);
        var accepted = new Dictionary<string, string>(StringComparer.Ordinal)
        {
            ["--format"] = "table, markdown, json or html",
            ["--output"] = "a file to write the report to",
            ["--fail-on"] = "info, warning or error",
        };
        for (var i = 0; i < args.Count; i++)
        {
            var arg = args[i];
            if (arg.StartsWith('-') && arg.Length > 1)
            {
                var name = arg;
                string? value = null;
                var equals = arg.IndexOf('=', StringComparison.Ordinal);
                if (arg.StartsWith("--", StringComparison.Ordinal) && equals > 2)
                {
                    name = arg[..equals];
                    value = arg[(equals + 1)..];
                }

                if (!accepted.TryGetValue(name, out var what))
                {
                    return (null, $"unknown option '{arg}'; the options are --format, --output, --fail-on and --help");
                }

                if (value == null)
                {
                    if (i + 1 >= args.Count || args[i + 1].StartsWith("--", StringComparison.Ordinal))
                    {
                        return (null, $"{name} needs a value: {what}");
                    }

                    value = args[++i];
                }

                if (value.Length == 0)
                {
                    return (null, $"{name} needs a value: {what}");
                }

                if (!options.TryAdd(name, value))
                {
                    return (null, $"{name} is given twice ('{options[name]}' and '{value}'); give it once: {what}");
                }

                continue;
            }

            if (path != null)
            {
                return (null, $"only one PATH is accepted; got '{path}' and '{arg}'");
            }

            path = arg;
        }

        if (path == null)
        {
            return (null, "PATH is missing: give a .sln, .slnx or .csproj file");
        }

        var format = options.GetValueOrDefault("--format", "table").ToLowerInvariant();
        if (!FormatNames.Contains(format))
        {
            return (null, $"--format must be table, markdown, json or html; got '{options["--format"]}'");
        }

        var failOn = options.GetValueOrDefault("--fail-on")?.ToLowerInvariant();
        if (failOn != null && !SeverityNames.Contains(failOn))
        {
            return (null, $"--fail-on must be info, warning or error; got '{options["--fail-on"]}'");
        }

        var full = System.IO.Path.GetFullPath(path);
        if (Directory.Exists(full))
        {
            var inside = Directory.EnumerateFiles(full).Where(f => PathKinds.Contains(System.IO.Path.GetExtension(f).ToLowerInvariant()))
                .Select(f => System.IO.Path.Combine(path, System.IO.Path.GetFileName(f))).Order(StringComparer.Ordinal).ToList();
            var hint = inside.Count switch
            {
                0 => "; it holds none",
                1 => $"; it holds one: '{inside[0]}'",
                _ => $"; it holds {inside.Count}: {string.Join(", ", inside.Select(f => $"'{f}'"))}",
            };
            return (null, $"PATH '{path}' is a folder; give a .sln, .slnx or .csproj file{hint}");
        }

        if (!File.Exists(full))
        {
            return (null, $"PATH '{path}' does not exist");
        }

        if (!PathKinds.Contains(System.IO.Path.GetExtension(full).ToLowerInvariant()))
        {
            return (null, $"PATH '{path}' must be a .sln, .slnx or .csproj file; got a '{System.IO.Path.GetExtension(full)}' file");
        }

        var output = options.GetValueOrDefault("--output");
        if (output != null)
        {
            var target = System.IO.Path.GetFullPath(output);
            if (Directory.Exists(target))
            {
                return (null, $"--output '{output}' is a folder; give a file name such as '{System.IO.Path.Combine(output, "inventory." + Extension(format))}'");
            }

            var folder = System.IO.Path.GetDirectoryName(target);
            if (folder != null && !Directory.Exists(folder))
            {
                return (null, $"--output '{output}': the folder '{System.IO.Path.GetDirectoryName(output)}' does not exist");
            }
        }

        return (new Arguments(full, format, output, failOn), null);

        static string Extension(string format) => format switch { "markdown" => "md", "table" => "txt", _ => format };
    }

    // Kept apart from RunAsync so no MSBuild type is loaded before the locator has run.
    private static async Task<int> RunCoreAsync(Arguments arguments, TextWriter output, TextWriter progress)
    {
        var path = arguments.Path;
        using var workspace = MSBuildWorkspace.Create();
        var failures = new List<WorkspaceDiagnostic>();
        using var registration = workspace.RegisterWorkspaceFailedHandler(e =>
        {
            lock (failures)
            {
                failures.Add(e.Diagnostic);
            }
        });

        var projects = new List<Project>();
        await progress.WriteLineAsync($"loading {Path.GetFileName(path)} …");
        try
        {
            if (path.EndsWith(".csproj", StringComparison.OrdinalIgnoreCase))
            {
                projects.Add(await workspace.OpenProjectAsync(path));
            }
            else
            {
                projects.AddRange((await workspace.OpenSolutionAsync(path)).Projects.Where(p => p.Language == LanguageNames.CSharp));
            }
        }
        catch (Exception e) when (e is not OperationCanceledException)
        {
            await progress.WriteLineAsync($"temperance-inventory: cannot analyse '{Path.GetFileName(path)}' ({path}): it does not load: {FirstLine(e.Message)}");
            return NotAnalysable;
        }

        var problems = new List<string>();
        var failed = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        List<WorkspaceDiagnostic> reported;
        lock (failures)
        {
            reported = failures.ToList();
        }

        // A failure counts when it is about a project this run analyses, or one the solution lists that did not load at all.
        // Others (a project referenced only as an analyzer, say) are noted: their own problems do not hide any request.
        var analysed = new HashSet<string>(projects.Select(p => p.FilePath).OfType<string>(), StringComparer.OrdinalIgnoreCase);
        var solutionText = path.EndsWith(".csproj", StringComparison.OrdinalIgnoreCase) ? null : await File.ReadAllTextAsync(path);
        foreach (var diagnostic in reported.Where(d => d.Kind == WorkspaceDiagnosticKind.Failure))
        {
            if (!ProjectCheck.IsAboutCSharpProject(diagnostic.Message, out var projectPath))
            {
                await progress.WriteLineAsync($"note: skipped {projectPath}: {FirstLine(diagnostic.Message)}");
                continue;
            }

            var counts = projectPath == null ? projects.Count == 0
                : analysed.Contains(projectPath) || (solutionText != null && Listed(solutionText, path, projectPath));
            if (!counts)
            {
                await progress.WriteLineAsync($"note: {FirstLine(diagnostic.Message)}");
                continue;
            }

            var name = projectPath != null ? $"project '{Path.GetFileNameWithoutExtension(projectPath)}' ({projectPath})" : $"'{Path.GetFileName(path)}' ({path})";
            var reason = Reason(diagnostic.Message, projectPath);
            var restore = diagnostic.Message.Contains("NETSDK1004", StringComparison.Ordinal) || diagnostic.Message.Contains("project.assets.json", StringComparison.Ordinal);
            problems.Add(restore ? $"{name} is not restored: {reason}; run 'dotnet restore' on it first" : $"{name} does not load: {reason}");
            failed.Add(projectPath ?? path);
        }

        var table = new RulesTableOptions(RulesTableOptions.FindTable());
        var rows = new List<RequestRow>();
        for (var i = 0; i < projects.Count; i++)
        {
            var project = projects[i];
            if (project.FilePath != null && failed.Contains(project.FilePath))
            {
                continue;
            }

            await progress.WriteLineAsync($"[{i + 1}/{projects.Count}] {project.Name}");
            var collected = await Inventory.CollectAsync(project, table, CancellationToken.None);
            if (collected.Problem != null)
            {
                problems.Add(collected.Problem);
                continue;
            }

            rows.AddRange(collected.Rows);
        }

        if (problems.Count > 0)
        {
            foreach (var problem in problems.Distinct(StringComparer.Ordinal))
            {
                await progress.WriteLineAsync($"temperance-inventory: cannot analyse {problem}");
            }

            await progress.WriteLineAsync($"No report was written: it would miss the requests of the {Formats.Plural(problems.Distinct(StringComparer.Ordinal).Count(), "project")} above (exit code {NotAnalysable}).");
            return NotAnalysable;
        }

        rows = rows.OrderBy(r => r.File, StringComparer.Ordinal).ThenBy(r => r.Line).ToList();
        var root = Path.GetDirectoryName(path)!;
        var linkBase = arguments.Output != null ? Path.GetDirectoryName(Path.GetFullPath(arguments.Output)) : Directory.GetCurrentDirectory();
        var info = ReportInfo.Create(Path.GetFileName(path), root, projects.Select(p => p.Name).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToList(), linkBase);
        var report = new Report(rows, info);
        var text = arguments.Format switch
        {
            "markdown" => Formats.Markdown(report),
            "json" => Formats.Json(report),
            "html" => Formats.Html(report),
            _ => Formats.Table(report),
        };
        if (arguments.Output != null)
        {
            await File.WriteAllTextAsync(arguments.Output, text);
            await progress.WriteLineAsync($"wrote {rows.Count} {Formats.Plural(rows.Count, "request")} to {arguments.Output}");
        }
        else
        {
            await output.WriteAsync(text);
        }

        var threshold = arguments.FailOn switch { "info" => 1, "warning" => 2, "error" => 3, _ => int.MaxValue };
        var worst = rows.SelectMany(r => r.Findings).Select(f => Report.Rank(f.Severity)).DefaultIfEmpty(0).Max();
        return worst >= threshold ? FindingsAtThreshold : Ok;
    }

    /// <summary>Whether a solution file lists a project (by its path relative to the solution, either slash).</summary>
    private static bool Listed(string solutionText, string solution, string project)
    {
        var relative = Path.GetRelativePath(Path.GetDirectoryName(solution)!, project);
        return solutionText.Contains(relative.Replace('/', '\\'), StringComparison.OrdinalIgnoreCase)
            || solutionText.Contains(relative.Replace('\\', '/'), StringComparison.OrdinalIgnoreCase);
    }

    /// <summary>The useful part of a workspace message: what MSBuild said, without the wrapper that repeats the path.</summary>
    private static string Reason(string message, string? projectPath)
    {
        const string Marker = "with message: ";
        var index = message.IndexOf(Marker, StringComparison.Ordinal);
        var reason = index >= 0 ? message[(index + Marker.Length)..] : message;
        if (projectPath != null && reason.Contains($"'{projectPath}'", StringComparison.Ordinal) && reason.StartsWith("Project file not found", StringComparison.Ordinal))
        {
            reason = "the project file is missing";
        }

        return FirstLine(reason);
    }

    private static string FirstLine(string text)
    {
        var line = text.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries).FirstOrDefault() ?? text;
        return line.Length <= 300 ? line : line[..299] + "…";
    }
}
