using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;

namespace Temperance.Inventory;

/// <summary>The four report formats. Each is a pure function of the rows, so tests can check them without a terminal.</summary>
public static class Formats
{
    private static string Value(SettingRow setting) =>
        setting.Value is { } v ? v.ToString("0.###", CultureInfo.InvariantCulture) + (setting.Source == "literal" ? string.Empty : $" ({setting.Source})") : setting.Source;

    private static string Where(RequestRow row, string root) => $"{Path.GetRelativePath(root, row.File)}:{row.Line}";

    /// <summary>A request that never reaches a model is listed with the reason it is not judged (the double, the serialiser …).</summary>
    private static string Findings(RequestRow row, Func<FindingRow, string> show, string separator) =>
        row.NotJudged != null ? "not judged: " + row.NotJudged
        : row.Findings.Count == 0 ? "-"
        : string.Join(separator, row.Findings.Select(show).Distinct());

    private static string Summary(IReadOnlyList<RequestRow> rows)
    {
        var notJudged = rows.Count(r => r.NotJudged != null);
        return $"{rows.Count} requests, {rows.Sum(r => r.Findings.Count)} findings" + (notJudged == 0 ? string.Empty : $" ({notJudged} requests not judged: never sent to a model or sent to a test double)");
    }

    public static string Table(IReadOnlyList<RequestRow> rows, string root)
    {
        var header = new[] { "where", "sdk", "model", "task", "temperature", "top_p", "seed", "findings" };
        var lines = rows.Select(r => new[]
        {
            Where(r, root), r.Sdk, r.Model ?? "-", r.Task ?? "-", Value(r.Settings[0]), Value(r.Settings[1]), Value(r.Settings[3]),
            Findings(r, f => f.Id, " "),
        }).ToList();
        var widths = header.Select((h, i) => Math.Min(48, Math.Max(h.Length, lines.Select(l => l[i].Length).DefaultIfEmpty(0).Max()))).ToArray();
        var text = new StringBuilder();
        void Line(string[] cells) => text.AppendLine(string.Join("  ", cells.Select((c, i) => (c.Length > widths[i] ? c[..(widths[i] - 1)] + "…" : c).PadRight(widths[i]))).TrimEnd());
        Line(header);
        Line(widths.Select(w => new string('-', w)).ToArray());
        lines.ForEach(Line);
        text.AppendLine(Summary(rows));
        return text.ToString();
    }

    public static string Markdown(IReadOnlyList<RequestRow> rows, string root)
    {
        var text = new StringBuilder("| where | SDK | model | task (evidence) | temperature | top-p | seed | findings |\n|---|---|---|---|---|---|---|---|\n");
        foreach (var r in rows)
        {
            var task = r.Task == null ? "-" : $"{r.Task} ({r.TaskEvidence})";
            var findings = Findings(r, f => $"{f.Id} {f.Message}", "<br>");
            text.AppendLine($"| `{Where(r, root)}` | {r.Sdk} | {r.Model ?? "-"} | {Escape(task)} | {Value(r.Settings[0])} | {Value(r.Settings[1])} | {Value(r.Settings[3])} | {Escape(findings)} |");
        }

        return text.ToString();

        static string Escape(string s) => s.Replace("|", "\\|", StringComparison.Ordinal);
    }

    public static string Json(IReadOnlyList<RequestRow> rows, string root) =>
        JsonSerializer.Serialize(rows.Select(r => new
        {
            file = Path.GetRelativePath(root, r.File),
            line = r.Line,
            project = r.Project,
            sdk = r.Sdk,
            provider = r.Provider,
            model = r.Model,
            task = r.Task == null ? null : new { kind = r.Task, evidence = r.TaskEvidence },
            settings = r.Settings.ToDictionary(s => s.Name, s => new { value = s.Value, source = s.Source }),
            findings = r.Findings.Select(f => new { id = f.Id, severity = f.Severity, message = f.Message }),
            not_judged = r.NotJudged,
        }), new JsonSerializerOptions { WriteIndented = true });

    /// <summary>A self-contained page: a bar chart of temperature by task (inline SVG) and a sortable table (inline script).</summary>
    public static string Html(IReadOnlyList<RequestRow> rows, string root)
    {
        var byTask = rows.Where(r => r.Settings[0].Value != null)
            .GroupBy(r => r.Task ?? "unknown task")
            .Select(g => (Task: g.Key, Max: g.Max(r => r.Settings[0].Value!.Value), Count: g.Count()))
            .OrderBy(t => t.Task, StringComparer.Ordinal)
            .ToList();
        var svg = new StringBuilder();
        const int barHeight = 22, width = 520, label = 140;
        svg.Append($"<svg id=\"chart\" role=\"img\" aria-label=\"Highest temperature by task\" width=\"{width + label + 60}\" height=\"{byTask.Count * (barHeight + 8) + 30}\" xmlns=\"http://www.w3.org/2000/svg\">");
        for (var i = 0; i < byTask.Count; i++)
        {
            var y = 10 + i * (barHeight + 8);
            var w = (int)(Math.Min(byTask[i].Max, 2.0) / 2.0 * width);
            svg.Append($"<text x=\"0\" y=\"{y + 16}\" font-size=\"13\">{WebUtility.HtmlEncode(byTask[i].Task)} ({byTask[i].Count})</text>");
            svg.Append($"<rect class=\"bar\" x=\"{label}\" y=\"{y}\" width=\"{Math.Max(w, 2)}\" height=\"{barHeight}\" fill=\"{(byTask[i].Max > 1.5 ? "#c0392b" : byTask[i].Max > 1 ? "#e67e22" : "#2e86c1")}\"/>");
            svg.Append($"<text x=\"{label + w + 6}\" y=\"{y + 16}\" font-size=\"13\">{byTask[i].Max.ToString("0.##", CultureInfo.InvariantCulture)}</text>");
        }

        svg.Append("</svg>");
        var table = new StringBuilder("<table id=\"requests\"><thead><tr>");
        foreach (var h in new[] { "where", "SDK", "model", "task", "temperature", "top-p", "seed", "findings" })
        {
            table.Append($"<th onclick=\"sortBy(this)\">{h}</th>");
        }

        table.Append("</tr></thead><tbody>");
        foreach (var r in rows)
        {
            var cells = new[]
            {
                Where(r, root), r.Sdk, r.Model ?? "-", r.Task == null ? "-" : $"{r.Task} ({r.TaskEvidence})", Value(r.Settings[0]), Value(r.Settings[1]), Value(r.Settings[3]),
                Findings(r, f => $"{f.Id}: {f.Message}", "; "),
            };
            table.Append("<tr>").Append(string.Concat(cells.Select(c => $"<td>{WebUtility.HtmlEncode(c)}</td>"))).Append("</tr>");
        }

        table.Append("</tbody></table>");
        return $$"""
            <!DOCTYPE html>
            <html lang="en"><head><meta charset="utf-8"><title>Temperance inventory</title>
            <style>body{font-family:sans-serif;margin:2em}table{border-collapse:collapse;font-size:13px}td,th{border:1px solid #ccc;padding:4px 8px;vertical-align:top}th{cursor:pointer;background:#f4f4f4}</style>
            </head><body>
            <h1>Temperance inventory</h1>
            <p id="summary">{{WebUtility.HtmlEncode(Summary(rows))}}</p>
            <h2>Highest temperature by task</h2>
            {{svg}}
            <h2>Requests</h2>
            {{table}}
            <script>
            function sortBy(th){const table=th.closest('table');const i=[...th.parentNode.children].indexOf(th);const body=table.tBodies[0];
            const asc=th.dataset.asc!=='true';th.dataset.asc=asc;const rows=[...body.rows];
            rows.sort((a,b)=>{const x=a.cells[i].textContent,y=b.cells[i].textContent;const nx=parseFloat(x),ny=parseFloat(y);
            const c=!isNaN(nx)&&!isNaN(ny)?nx-ny:x.localeCompare(y);return asc?c:-c;});rows.forEach(r=>body.appendChild(r));}
            </script>
            </body></html>
            """;
    }
}
