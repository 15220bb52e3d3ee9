using System.Globalization;
using System.Text;
using System.Text.Json;

namespace Temperance.Inventory;

/// <summary>The four report formats. Each is a pure function of the report, so tests can check them without a terminal.</summary>
public static class Formats
{
    /// <summary>A setting as one cell: "0.9", "1.8 (constant 'NewsletterMood')", "unset (left to the client)", "unknown (from parameter 'heat')".</summary>
    public static string Value(SettingRow? setting) =>
        setting == null ? "-"
        : setting.Value is { } v ? Number(v) + (setting.Source == "literal" ? string.Empty : $" ({setting.Source})")
        : setting.Source;

    public static string Number(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);

    internal static string Where(RequestRow row, string root) => $"{Path.GetRelativePath(root, row.File).Replace('\\', '/')}:{row.Line}";

    internal static string WhereOf(FindingRow finding, RequestRow row, string root) =>
        $"{Path.GetRelativePath(root, finding.File ?? row.File).Replace('\\', '/')}:{(finding.Line == 0 ? row.Line : finding.Line)}";

    /// <summary>A request that never reaches a model is listed with the reason it is not judged (the double, the serialiser …).</summary>
    private static string Findings(RequestRow row, Func<FindingRow, string> show, string separator) =>
        row.NotJudged != null ? "not judged: " + row.NotJudged
        : row.Findings.Count == 0 ? "-"
        : string.Join(separator, row.Findings.Select(show).Distinct());

    internal static string Headline(int requests, int findings, int notJudged) =>
        $"{requests} {Plural(requests, "request")}, {findings} {Plural(findings, "finding")}"
        + (notJudged == 0 ? string.Empty : $" ({notJudged} {Plural(notJudged, "request")} not judged: never sent to a model or sent to a test double)");

    internal static string Plural(int count, string word) => count == 1 ? word : word + "s";

    internal static string Lower(string severity) => severity.ToLowerInvariant();

    /// <summary>"No LLM requests were found in HarbourDesk.csproj (1 project analysed: HarbourDesk)."</summary>
    internal static string NoRequests(Report report) =>
        $"No LLM requests were found in {report.Info.Scope} ({report.Projects.Count} {Plural(report.Projects.Count, "project")} analysed"
        + (report.Projects.Count == 0 ? ")." : $": {string.Join(", ", report.Projects)}).");

    /// <summary>The totals as lines of text: requests, findings by severity and by rule, projects, date, commit, tool.</summary>
    private static IEnumerable<(string Label, string Text)> Facts(Report report)
    {
        var info = report.Info;
        yield return ("Requests", report.Rows.Count + (report.NotJudged == 0 ? string.Empty : $" ({report.NotJudged} not judged)"));
        yield return ("Findings", report.Findings.Count == 0 ? "none"
            : report.Findings.Count + ": " + string.Join(", ", report.BySeverity.Select(s => $"{s.Count} {Lower(s.Severity)}")));
        if (report.ByRule.Count > 0)
        {
            yield return ("By rule", string.Join(", ", report.ByRule.Select(r => $"{r.Id} {r.Count}")));
        }

        yield return (Plural(report.Projects.Count, "Project"), report.Projects.Count + (report.Projects.Count == 0 ? string.Empty : ": " + string.Join(", ", report.Projects)));
        yield return ("Generated", info.Generated.ToUniversalTime().ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture));
        if (info.Commit != null)
        {
            yield return ("Commit", info.Commit);
        }

        yield return ("Tool", $"{info.ToolName} {info.ToolVersion}");
    }

    // ---------------------------------------------------------------- terminal table

    private static readonly (string Header, int Max)[] Columns =
    {
        ("where", 44), ("sdk", 30), ("model", 20), ("task", 16), ("temperature", 36), ("top_p", 30), ("seed", 26), ("findings", 64),
    };

    /// <summary>The terminal table over bare rows (paths relative to <paramref name="root"/>).</summary>
    public static string Table(IReadOnlyList<RequestRow> rows, string root) =>
        Table(new Report(rows, new ReportInfo(Path.GetFileName(Path.TrimEndingDirectorySeparator(root)), root, DateTimeOffset.UtcNow, null,
            ReportInfo.Name, ReportInfo.CurrentToolVersion(), Array.Empty<string>())));

    /// <summary>
    /// A plain-text table: long cells wrap onto continuation lines at word boundaries (a word longer than its column breaks
    /// after a '/', '.' or '-' where it can), so nothing is cut. Each finding starts on a line of its own.
    /// </summary>
    public static string Table(Report report)
    {
        var text = new StringBuilder();
        if (report.Rows.Count == 0)
        {
            text.AppendLine(NoRequests(report));
            text.AppendLine(report.Headline);
            return text.ToString();
        }

        var cells = report.Rows.Select(r => new[]
        {
            Where(r, report.Info.Root), r.Sdk, r.Model == null ? "-" : r.Model + (r.Family == null ? string.Empty : $" ({r.Family})"), r.Task ?? "-", Value(r.Setting("temperature")), Value(r.Setting("top_p")), Value(r.Setting("seed")),
            Findings(r, f => $"{f.Id} {Lower(f.Severity)}: {f.Message}", "\n"),
        }).ToList();
        var widths = Columns.Select((c, i) => Math.Min(c.Max, Math.Max(c.Header.Length, cells.Select(l => Longest(l[i])).DefaultIfEmpty(0).Max()))).ToArray();
        var wrapped = cells.Select(row => row.Select((cell, i) => Wrap(cell, widths[i])).ToArray()).ToList();
        var spacious = wrapped.Any(row => row.Any(c => c.Count > 1));

        void Line(IReadOnlyList<string> line) =>
            text.AppendLine(string.Join("  ", line.Select((c, i) => c.PadRight(widths[i]))).TrimEnd());

        Line(Columns.Select(c => c.Header).ToArray());
        Line(widths.Select(w => new string('-', w)).ToArray());
        for (var r = 0; r < wrapped.Count; r++)
        {
            if (spacious && r > 0)
            {
                text.AppendLine();
            }

            var height = wrapped[r].Max(c => c.Count);
            for (var k = 0; k < height; k++)
            {
                Line(wrapped[r].Select(c => k < c.Count ? c[k] : string.Empty).ToArray());
            }
        }

        text.AppendLine(report.Headline);
        return text.ToString();

        static int Longest(string cell) => cell.Split('\n').Max(l => l.Length);
    }

    /// <summary>
    /// Wraps text to a width at spaces; each '\n' starts a new line. A word longer than the width is broken after the last
    /// '/', '\', '.', '-', '_', ':' or ',' that fits, else at the width. No line is longer than the width.
    /// </summary>
    public static List<string> Wrap(string text, int width)
    {
        width = Math.Max(width, 4);
        var lines = new List<string>();
        foreach (var paragraph in text.Split('\n'))
        {
            var line = new StringBuilder();
            foreach (var piece in paragraph.Split(' ', StringSplitOptions.RemoveEmptyEntries))
            {
                var word = piece;
                if (line.Length > 0 && line.Length + 1 + word.Length > width)
                {
                    lines.Add(line.ToString());
                    line.Clear();
                }

                while (word.Length > width)
                {
                    var cut = word.LastIndexOfAny(new[] { '/', '\\', '.', '-', '_', ':', ',' }, width - 1) + 1;
                    cut = cut <= 0 ? width : cut;
                    lines.Add(word[..cut]);
                    word = word[cut..];
                }

                if (line.Length > 0)
                {
                    line.Append(' ');
                }

                line.Append(word);
            }

            lines.Add(line.ToString());
        }

        return lines;
    }

    // ---------------------------------------------------------------- markdown

    public static string Markdown(Report report)
    {
        var root = report.Info.Root;
        var text = new StringBuilder();
        text.AppendLine($"# LLM request inventory: {Escape(report.Info.Scope)}").AppendLine();
        if (report.Rows.Count == 0)
        {
            text.AppendLine(Escape(NoRequests(report))).AppendLine();
        }

        text.AppendLine("| | |").AppendLine("|---|---|");
        foreach (var (label, value) in Facts(report))
        {
            text.AppendLine($"| **{label}** | {Escape(value)} |");
        }

        if (report.Rows.Count == 0)
        {
            return text.ToString();
        }

        text.AppendLine().AppendLine("## Findings by rule").AppendLine();
        if (report.Findings.Count == 0)
        {
            text.AppendLine("No findings.");
        }

        foreach (var group in report.Findings.GroupBy(f => f.Finding.Id).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var first = group.First().Finding;
            var id = first.HelpLink != null ? $"[{first.Id}]({first.HelpLink})" : first.Id;
            var severities = string.Join(", ", group.Select(f => Lower(f.Finding.Severity)).Distinct());
            text.AppendLine($"### {id}: {Escape(first.Title ?? string.Empty)} ({group.Count()} {Plural(group.Count(), "finding")}, {severities})").AppendLine();
            foreach (var finding in group)
            {
                text.AppendLine($"- `{WhereOf(finding.Finding, finding.Request, root)}` {Escape(finding.Finding.Message)}");
            }

            text.AppendLine();
        }

        text.AppendLine("## Requests").AppendLine();
        var several = report.Projects.Count > 1;
        text.Append("| where | SDK | model | task (evidence) | temperature | top-p | seed | findings |").AppendLine(several ? " project |" : string.Empty);
        text.Append("|---|---|---|---|---|---|---|---|").AppendLine(several ? "---|" : string.Empty);
        foreach (var r in report.Rows)
        {
            var task = r.Task == null ? "-" : $"{r.Task} ({r.TaskEvidence})";
            var findings = Findings(r, f => $"{f.Id} {f.Message}", "<br>");
            text.Append($"| `{Where(r, root)}` | {Escape(r.Sdk + (r.LayerLine == null ? string.Empty : $" (settings from {r.LayerLine})"))} | {Escape(r.ModelLine ?? "-")} | {Escape(task)} | {Escape(Value(r.Setting("temperature")))} | {Escape(Value(r.Setting("top_p")))} | {Escape(Value(r.Setting("seed")))} | {Escape(findings)} |")
                .AppendLine(several ? $" {Escape(r.Project)} |" : string.Empty);
        }

        text.AppendLine().AppendLine(report.Headline);
        return text.ToString();

        static string Escape(string s) => s.Replace("|", "\\|", StringComparison.Ordinal).Replace("\n", " ", StringComparison.Ordinal);
    }

    /// <summary>The self-contained HTML page (see <see cref="HtmlReport"/>).</summary>
    public static string Html(Report report) => HtmlReport.Render(report);

    // ---------------------------------------------------------------- json

    public static string Json(Report report)
    {
        var root = report.Info.Root;
        var document = new
        {
            tool = new { name = report.Info.ToolName, version = report.Info.ToolVersion },
            generated = report.Info.Generated.ToUniversalTime().ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture),
            commit = report.Info.Commit,
            path = report.Info.Scope,
            summary = new
            {
                requests = report.Rows.Count,
                findings = new
                {
                    total = report.Findings.Count,
                    by_rule = report.ByRule.ToDictionary(r => r.Id, r => r.Count),
                    by_severity = report.BySeverity.ToDictionary(s => Lower(s.Severity), s => s.Count),
                },
                projects = report.Projects,
                not_judged = report.NotJudged,
            },
            requests = report.Rows.Select(r => new
            {
                file = Path.GetRelativePath(root, r.File),
                line = r.Line,
                project = r.Project,
                sdk = r.Sdk,
                library = r.Library,
                provider = r.Provider,
                model = r.Model,
                model_family = r.Family,
                model_source = r.ModelSource,
                layers = r.Layers,
                task = r.Task == null ? null : new { kind = r.Task, evidence = r.TaskEvidence, ceiling = r.Ceiling, ceiling_key = r.CeilingKey },
                settings = r.Settings.ToDictionary(s => s.Name, s => new { value = s.Value, source = s.Source, state = s.State }),
                findings = r.Findings.Select(f => new
                {
                    id = f.Id,
                    severity = f.Severity,
                    message = f.Message,
                    help = f.HelpLink,
                    file = f.File == null ? null : Path.GetRelativePath(root, f.File),
                    line = f.Line,
                }),
                not_judged = r.NotJudged,
            }),
        };
        return JsonSerializer.Serialize(document, new JsonSerializerOptions { WriteIndented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping });
    }
}
