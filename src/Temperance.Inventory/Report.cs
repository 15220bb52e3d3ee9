using System.Diagnostics;
using System.Reflection;

namespace Temperance.Inventory;

/// <summary>Where and when a report was made, and by which tool.</summary>
/// <param name="Scope">What was analysed, as the user named it (<c>HarbourDesk.csproj</c>).</param>
/// <param name="Root">The folder paths are shown relative to.</param>
/// <param name="Commit">The short commit of the git work tree holding the path; null outside git.</param>
/// <param name="Projects">Every project analysed, with or without requests.</param>
/// <param name="LinkBase">The folder the HTML page is written to, so its links to source files are relative to it; null: the root.</param>
public sealed record ReportInfo(
    string Scope, string Root, DateTimeOffset Generated, string? Commit, string ToolName, string ToolVersion,
    IReadOnlyList<string> Projects, string? LinkBase = null)
{
    public const string Name = "temperance-inventory";

    /// <summary>A report made now by this tool over the given projects.</summary>
    public static ReportInfo Create(string scope, string root, IReadOnlyList<string> projects, string? linkBase = null) =>
        new(scope, root, DateTimeOffset.UtcNow, GitCommit(root), Name, CurrentToolVersion(), projects, linkBase);

    /// <summary>The assembly's informational version ("0.1.0+3f2a…"), else its version.</summary>
    public static string CurrentToolVersion()
    {
        var assembly = typeof(ReportInfo).Assembly;
        return assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion
            ?? assembly.GetName().Version?.ToString()
            ?? "unknown";
    }

    /// <summary><c>git rev-parse --short HEAD</c> in the folder, with a timeout; null when it is not a work tree or git is missing.</summary>
    public static string? GitCommit(string folder, int timeoutMilliseconds = 5000)
    {
        try
        {
            var start = new ProcessStartInfo("git")
            {
                WorkingDirectory = folder,
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                UseShellExecute = false,
            };
            foreach (var argument in new[] { "rev-parse", "--short", "HEAD" })
            {
                start.ArgumentList.Add(argument);
            }

            start.Environment["GIT_TERMINAL_PROMPT"] = "0";
            using var git = Process.Start(start);
            if (git == null)
            {
                return null;
            }

            var output = git.StandardOutput.ReadToEndAsync();
            _ = git.StandardError.ReadToEndAsync();
            if (!git.WaitForExit(timeoutMilliseconds))
            {
                git.Kill(entireProcessTree: true);
                return null;
            }

            var commit = output.Result.Trim();
            return git.ExitCode == 0 && commit.Length > 0 && commit.All(Uri.IsHexDigit) ? commit : null;
        }
        catch (System.ComponentModel.Win32Exception)
        {
            return null; // no git on the machine
        }
        catch (InvalidOperationException)
        {
            return null;
        }
    }
}

/// <summary>One finding once, with the request it was reported on (a finding shared by two requests is counted once).</summary>
public sealed record ListedFinding(FindingRow Finding, RequestRow Request);

/// <summary>The rows of a report with their metadata and the totals every format shows.</summary>
public sealed class Report
{
    /// <summary>Severities from the worst down, as the analyzer names them.</summary>
    public static readonly string[] Severities = { "Error", "Warning", "Info" };

    public Report(IReadOnlyList<RequestRow> rows, ReportInfo info)
    {
        Rows = rows;
        Info = info;
        var seen = new HashSet<(string, string?, int, string)>();
        var findings = new List<ListedFinding>();
        foreach (var row in rows)
        {
            foreach (var finding in row.Findings)
            {
                if (seen.Add((finding.Id, finding.File ?? row.File, finding.Line == 0 ? row.Line : finding.Line, finding.Message)))
                {
                    findings.Add(new ListedFinding(finding, row));
                }
            }
        }

        Findings = findings;
        ByRule = findings.GroupBy(f => f.Finding.Id).OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => (g.Key, g.Count())).ToList();
        BySeverity = Severities.Select(s => (s, findings.Count(f => f.Finding.Severity == s))).Where(s => s.Item2 > 0).ToList();
        NotJudged = rows.Count(r => r.NotJudged != null);
        Projects = info.Projects.Count > 0 ? info.Projects : rows.Select(r => r.Project).Distinct().OrderBy(p => p, StringComparer.Ordinal).ToList();
    }

    public IReadOnlyList<RequestRow> Rows { get; }
    public ReportInfo Info { get; }

    /// <summary>Every distinct finding, in the order of the rows.</summary>
    public IReadOnlyList<ListedFinding> Findings { get; }

    public IReadOnlyList<(string Id, int Count)> ByRule { get; }

    /// <summary>Only the severities that occur, worst first.</summary>
    public IReadOnlyList<(string Severity, int Count)> BySeverity { get; }

    public int NotJudged { get; }
    public IReadOnlyList<string> Projects { get; }

    /// <summary>The one-line total the terminal and the page share: "20 requests, 18 findings (1 request not judged …)".</summary>
    public string Headline => Formats.Headline(Rows.Count, Findings.Count, NotJudged);

    /// <summary>A worst-first severity rank: 3 error, 2 warning, 1 info, 0 none.</summary>
    public static int Rank(string? severity) => severity switch { "Error" => 3, "Warning" => 2, "Info" => 1, _ => 0 };

    /// <summary>The worst severity among a row's findings, or null.</summary>
    public static string? Worst(RequestRow row) =>
        row.Findings.Count == 0 ? null : row.Findings.OrderByDescending(f => Rank(f.Severity)).First().Severity;

    public string Relative(string file) => Path.GetRelativePath(Info.Root, file);
}
