using System.Globalization;
using System.Net;
using System.Text;

namespace Temperance.Inventory;

/// <summary>
/// The HTML page: one self-contained file (inline CSS, script and SVG; nothing fetched) for a tech lead. A headline
/// summary, a dot plot of every request's temperature per task against the task's ceiling, the findings grouped by rule,
/// and the requests as a filterable, sortable table that turns into cards on a phone. It prints on paper too.
/// </summary>
public static class HtmlReport
{
    private static string H(string? text) => WebUtility.HtmlEncode(text ?? string.Empty);

    private static string N(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);

    private static string Px(double value) => value.ToString("0.#", CultureInfo.InvariantCulture);

    /// <summary>The marks a dot can have: its worst finding, or none; requests not judged are drawn apart.</summary>
    private sealed record Mark(string Key, string Label, string Colour);

    private static readonly Mark None = new("none", "no finding", "#2d7d57");
    private static readonly Mark Info = new("info", "info", "#2c63a8");
    private static readonly Mark Warning = new("warning", "warning", "#b3590b");
    private static readonly Mark Error = new("error", "error", "#b4232c");
    private static readonly Mark Silent = new("silent", "not judged", "#7c828c");

    private static Mark MarkOf(RequestRow row) =>
        row.NotJudged != null ? Silent
        : Report.Worst(row) switch { "Error" => Error, "Warning" => Warning, "Info" => Info, _ => None };

    private static Mark MarkOf(string severity) => severity switch { "Error" => Error, "Warning" => Warning, "Info" => Info, _ => None };

    /// <summary>A text symbol per severity, so a severity never rests on colour alone.</summary>
    private static string Symbol(Mark mark) => mark.Key switch { "error" => "◆", "warning" => "▲", "info" => "■", "silent" => "○", _ => "●" };

    /// <summary>An SVG path of the mark's shape centred on (x, y): circle, square, triangle, diamond.</summary>
    private static string Shape(Mark mark, double x, double y, double r)
    {
        string P(params (double X, double Y)[] points) =>
            "M" + string.Join("L", points.Select(p => $"{Px(x + p.X)},{Px(y + p.Y)}")) + "Z";
        return mark.Key switch
        {
            "info" => P((-r * .85, -r * .85), (r * .85, -r * .85), (r * .85, r * .85), (-r * .85, r * .85)),
            "warning" => P((0, -r * 1.1), (r * 1.05, r * .8), (-r * 1.05, r * .8)),
            "error" => P((0, -r * 1.15), (r * 1.15, 0), (0, r * 1.15), (-r * 1.15, 0)),
            _ => $"M{Px(x - r)},{Px(y)}a{Px(r)},{Px(r)} 0 1,0 {Px(2 * r)},0a{Px(r)},{Px(r)} 0 1,0 {Px(-2 * r)},0Z",
        };
    }

    public static string Render(Report report)
    {
        var page = new StringBuilder();
        page.Append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">")
            .Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">")
            .Append($"<title>LLM request inventory: {H(report.Info.Scope)}</title><style>{Css}</style></head><body>\n");
        Header(report, page);
        page.Append("<main>\n");
        Summary(report, page);
        if (report.Rows.Count == 0)
        {
            page.Append($"<section id=\"no-requests\" class=\"panel empty\"><h2>Nothing to show</h2><p>{H(Formats.NoRequests(report))}</p>")
                .Append("<p>The tool looks for the request options of the LLM SDKs Temperance knows (OpenAI, Microsoft.Extensions.AI, Semantic Kernel, ")
                .Append("OllamaSharp, Anthropic, Azure AI Inference and others) and for hand-built JSON payloads. A project that uses none of them has no requests to list.</p></section>\n");
        }
        else
        {
            Chart(report, page);
            FindingsByRule(report, page);
            Requests(report, page);
        }

        page.Append("</main>\n<footer><p>Made by ").Append(H(report.Info.ToolName)).Append(' ').Append(H(report.Info.ToolVersion))
            .Append(". Every number comes from the same extraction and rules as the analyzer, so this page and the build agree.</p></footer>\n");
        page.Append("<script>").Append(Script).Append("</script>\n</body></html>\n");
        return page.ToString();
    }

    private static void Header(Report report, StringBuilder page)
    {
        var info = report.Info;
        page.Append("<header class=\"masthead\"><p class=\"kicker\">Temperance · LLM request inventory</p>")
            .Append($"<h1>{H(info.Scope)}</h1><p class=\"meta\">")
            .Append($"<span>generated <time id=\"generated\" datetime=\"{H(info.Generated.ToUniversalTime().ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture))}\">")
            .Append(H(info.Generated.ToUniversalTime().ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture))).Append("</time></span>");
        if (info.Commit != null)
        {
            page.Append($"<span>commit <code id=\"commit\">{H(info.Commit)}</code></span>");
        }

        page.Append($"<span>tool <code id=\"tool-version\">{H(info.ToolName)} {H(info.ToolVersion)}</code></span></p>");
        if (report.Rows.Count > 0)
        {
            page.Append("<nav aria-label=\"Sections\"><a href=\"#summary\">Summary</a><a href=\"#temperature\">Temperature by task</a>")
                .Append("<a href=\"#findings\">Findings by rule</a><a href=\"#requests-section\">Requests</a></nav>");
        }

        page.Append("</header>\n");
    }

    private static void Summary(Report report, StringBuilder page)
    {
        page.Append("<section id=\"summary\" class=\"panel\" aria-labelledby=\"summary-title\"><h2 id=\"summary-title\">Summary</h2><div class=\"stats\">");
        page.Append($"<div class=\"stat\" id=\"stat-requests\"><span class=\"num\">{report.Rows.Count}</span><span class=\"label\">{Formats.Plural(report.Rows.Count, "request")}</span>")
            .Append(report.NotJudged == 0 ? string.Empty : $"<span class=\"sub\">{report.NotJudged} not judged (never sent to a model, or sent to a test double)</span>")
            .Append("</div>");
        page.Append($"<div class=\"stat\" id=\"stat-findings\"><span class=\"num\">{report.Findings.Count}</span><span class=\"label\">{Formats.Plural(report.Findings.Count, "finding")}</span>");
        if (report.BySeverity.Count > 0)
        {
            page.Append("<ul class=\"sev-tally\" id=\"by-severity\" aria-label=\"Findings by severity\">");
            foreach (var (severity, count) in report.BySeverity)
            {
                var mark = MarkOf(severity);
                page.Append($"<li class=\"sev sev-{mark.Key}\"><span aria-hidden=\"true\">{Symbol(mark)}</span> {count} {H(mark.Label)}</li>");
            }

            page.Append("</ul>");
        }

        page.Append("</div>");
        page.Append($"<div class=\"stat\" id=\"stat-projects\"><span class=\"num\">{report.Projects.Count}</span><span class=\"label\">{Formats.Plural(report.Projects.Count, "project")}</span>")
            .Append($"<span class=\"sub\">{H(string.Join(", ", report.Projects))}</span></div>");
        page.Append("</div>");
        if (report.ByRule.Count > 0)
        {
            page.Append("<h3 class=\"minor\">Findings by rule</h3><ul class=\"rule-tally\" id=\"by-rule\">");
            var max = report.ByRule.Max(r => r.Count);
            foreach (var (id, count) in report.ByRule)
            {
                var first = report.Findings.First(f => f.Finding.Id == id).Finding;
                var worst = MarkOf(report.Findings.Where(f => f.Finding.Id == id).OrderByDescending(f => Report.Rank(f.Finding.Severity)).First().Finding.Severity);
                page.Append($"<li><a href=\"#rule-{H(id)}\"><span class=\"rule-id\">{H(id)}</span><span class=\"rule-name\">{H(first.Title)}</span>")
                    .Append($"<span class=\"bar-track\" aria-hidden=\"true\"><span class=\"bar sev-{worst.Key}\" style=\"width:{Px(100.0 * count / max)}%\"></span></span>")
                    .Append($"<span class=\"rule-count\">{count}</span></a></li>");
            }

            page.Append("</ul>");
        }

        page.Append("</section>\n");
    }

    // ---------------------------------------------------------------- the dot plot

    private sealed record Dot(RequestRow Row, int Index, double Value, Mark Mark, bool Default);

    private sealed record Lane(string Task, string Label, List<Dot> Dots, IReadOnlyList<(double Value, string? Key)> Ceilings, int Requests);

    /// <summary>Task rows in the order of the rules table's task kinds, then any other kind, then requests without a task.</summary>
    private static readonly string[] TaskOrder =
    {
        "extraction", "classification", "evaluation", "code", "tool_use", "translation", "summarization", "conversation", "creative", "brainstorming",
    };

    private const string NoTask = "no task";

    private static List<Lane> Lanes(Report report)
    {
        var indexed = report.Rows.Select((row, i) => (row, i)).ToList();
        return indexed.GroupBy(x => x.row.Task ?? NoTask)
            .OrderBy(g => g.Key == NoTask ? int.MaxValue : Array.IndexOf(TaskOrder, g.Key) is var i && i >= 0 ? i : TaskOrder.Length)
            .ThenBy(g => g.Key, StringComparer.Ordinal)
            .Select(g =>
            {
                var dots = g.Where(x => x.row.Temperature.Value != null)
                    .Select(x => new Dot(x.row, x.i, x.row.Temperature.Value!.Value, MarkOf(x.row), x.row.Temperature.State == SettingState.Default))
                    .OrderBy(d => d.Value).ToList();
                var ceilings = g.Where(x => x.row.Ceiling != null).Select(x => (x.row.Ceiling!.Value, x.row.CeilingKey)).Distinct().OrderBy(c => c.Value).ToList();
                var label = g.Key == NoTask ? "no task inferred" : g.Key.Replace('_', ' ');
                return new Lane(g.Key, label, dots, ceilings, g.Count());
            })
            .ToList();
    }

    /// <summary>Vertical offsets so dots at nearly the same temperature sit side by side rather than on top of each other.</summary>
    private static List<int> Stack(IReadOnlyList<Dot> dots, Func<double, double> x, double gap)
    {
        var lanes = new List<double>();
        var result = new List<int>();
        foreach (var dot in dots)
        {
            var position = x(dot.Value);
            var lane = lanes.FindIndex(last => position - last >= gap);
            if (lane < 0)
            {
                lanes.Add(position);
                lane = lanes.Count - 1;
            }
            else
            {
                lanes[lane] = position;
            }

            result.Add(lane);
        }

        return result;
    }

    private static double Offset(int lane, double step) => (lane % 2 == 0 ? 1 : -1) * Math.Ceiling(lane / 2.0) * step;

    private static void Chart(Report report, StringBuilder page)
    {
        var lanes = Lanes(report);
        var plotted = lanes.Sum(l => l.Dots.Count);
        var top = lanes.SelectMany(l => l.Dots.Select(d => d.Value).Concat(l.Ceilings.Select(c => c.Value))).DefaultIfEmpty(0).Max();
        var domain = Math.Max(2.0, Math.Ceiling(top * 2) / 2);

        page.Append("<section id=\"temperature\" class=\"panel\" aria-labelledby=\"temperature-title\"><h2 id=\"temperature-title\">Temperature by task</h2>")
            .Append("<p class=\"lede\">Each dot is one request, placed at the temperature it runs with. The dashed line in a row is that task's ceiling ")
            .Append("from the rules table (<code>temperance.task.&lt;kind&gt;.max_temperature</code>); a dot to its right is above it.</p>");
        if (plotted > 0)
        {
            page.Append(Svg(lanes, domain, wide: true)).Append(Svg(lanes, domain, wide: false));
            page.Append("<p id=\"dot-detail\" class=\"dot-detail\" aria-live=\"polite\">Point at a dot, or move to it with Tab, to see its call site; Enter jumps to its row in the table.</p>");
        }
        else
        {
            page.Append("<p id=\"no-dots\" class=\"empty\">No request has a temperature the code fixes, so there is nothing to plot.</p>");
        }

        Legend(page);
        LeftOut(report, plotted, page);
        page.Append("</section>\n");
    }

    private static string Svg(List<Lane> lanes, double domain, bool wide)
    {
        // The wide chart keeps labels in a column on the left; the compact one (phones) puts each label above its row.
        double width = wide ? 1000 : 360, left = wide ? 190 : 14, right = wide ? 28 : 14, step = wide ? 12 : 11, radius = wide ? 5.5 : 5;
        var pad = radius + 3; // a dot at 0 or at the top of the scale stays whole
        double X(double value) => left + pad + (width - left - right - 2 * pad) * Math.Min(value, domain) / domain;
        var svg = new StringBuilder();
        var body = new StringBuilder();
        double y = wide ? 10 : 6;
        foreach (var lane in lanes)
        {
            var stack = Stack(lane.Dots, X, radius * 2 + 2);
            var depth = stack.Count == 0 ? 0 : stack.Max();
            var bandHeight = Math.Max(wide ? 48 : 34, (depth + 1) * step + 18);
            var labelHeight = wide ? 0 : 18;
            var bandTop = y + labelHeight;
            var middle = bandTop + bandHeight / 2;
            body.Append($"<g class=\"lane\" data-task=\"{H(lane.Task)}\">");
            body.Append($"<rect class=\"band\" x=\"{Px(left)}\" y=\"{Px(bandTop)}\" width=\"{Px(width - left - right)}\" height=\"{Px(bandHeight)}\"/>");
            var ceilingText = lane.Ceilings.Count == 0 ? "no ceiling" : "ceiling " + string.Join(" / ", lane.Ceilings.Select(c => N(c.Value)));
            var count = $"{lane.Requests} {Formats.Plural(lane.Requests, "request")}" + (lane.Dots.Count == lane.Requests ? string.Empty : $" ({lane.Dots.Count} plotted)");
            if (wide)
            {
                body.Append($"<text class=\"lane-label\" x=\"{Px(left - 12)}\" y=\"{Px(middle - 7)}\" text-anchor=\"end\">{H(lane.Label)}</text>")
                    .Append($"<text class=\"lane-sub\" x=\"{Px(left - 12)}\" y=\"{Px(middle + 7)}\" text-anchor=\"end\">{H(count)}</text>")
                    .Append($"<text class=\"lane-sub\" x=\"{Px(left - 12)}\" y=\"{Px(middle + 20)}\" text-anchor=\"end\">{H(ceilingText)}</text>");
            }
            else
            {
                body.Append($"<text class=\"lane-label\" x=\"{Px(left)}\" y=\"{Px(y + 13)}\">{H(lane.Label)}<tspan class=\"lane-sub\" dx=\"8\">{H(count)} · {H(ceilingText)}</tspan></text>");
            }

            foreach (var (value, key) in lane.Ceilings)
            {
                var cx = X(value);
                body.Append($"<rect class=\"over\" x=\"{Px(cx)}\" y=\"{Px(bandTop)}\" width=\"{Px(width - right - cx)}\" height=\"{Px(bandHeight)}\"/>")
                    .Append($"<line class=\"ceiling\" data-ceiling=\"{N(value)}\" x1=\"{Px(cx)}\" x2=\"{Px(cx)}\" y1=\"{Px(bandTop + 2)}\" y2=\"{Px(bandTop + bandHeight - 2)}\">")
                    .Append($"<title>Ceiling for {H(lane.Label)}: {N(value)}{(key == null ? string.Empty : $" ({H(key)})")}</title></line>");
            }

            for (var i = 0; i < lane.Dots.Count; i++)
            {
                var dot = lane.Dots[i];
                var cx = X(dot.Value);
                var cy = middle + Offset(stack[i], step);
                var detail = Detail(dot, lane);
                var classes = $"dot mark-{dot.Mark.Key}{(dot.Default ? " is-default" : string.Empty)}";
                var fill = dot.Default || dot.Mark == Silent ? "#ffffff" : dot.Mark.Colour;
                body.Append($"<g class=\"{classes}\" tabindex=\"0\" role=\"button\" data-row=\"req-{dot.Index + 1}\" data-detail=\"{H(detail.Replace('\n', ' '))}\" aria-label=\"{H(detail.Replace("\n", "; ", StringComparison.Ordinal))}\">")
                    .Append($"<title>{H(detail)}</title>")
                    .Append($"<path d=\"{Shape(dot.Mark, cx, cy, radius)}\" fill=\"{fill}\" stroke=\"{dot.Mark.Colour}\" stroke-width=\"{(dot.Default || dot.Mark == Silent ? "2" : "1.2")}\"{(dot.Mark == Silent ? " stroke-dasharray=\"2 2\"" : string.Empty)}/></g>");
            }

            body.Append("</g>");
            y = bandTop + bandHeight + (wide ? 6 : 8);
        }

        // The axis: a tick every 0.5 (0.25 on the wide chart), labelled every 0.5.
        var axisTop = y + 2;
        var tick = wide ? 0.25 : 0.5;
        var axis = new StringBuilder($"<g class=\"axis\"><line class=\"axis-line\" x1=\"{Px(left)}\" x2=\"{Px(width - right)}\" y1=\"{Px(axisTop)}\" y2=\"{Px(axisTop)}\"/>");
        var grid = new StringBuilder("<g class=\"grid\">");
        for (var t = 0.0; t <= domain + 1e-9; t += tick)
        {
            var major = Math.Abs(t * 2 - Math.Round(t * 2)) < 1e-9;
            grid.Append($"<line class=\"{(major ? "grid-major" : "grid-minor")}\" x1=\"{Px(X(t))}\" x2=\"{Px(X(t))}\" y1=\"{Px(wide ? 6 : 4)}\" y2=\"{Px(axisTop)}\"/>");
            axis.Append($"<line x1=\"{Px(X(t))}\" x2=\"{Px(X(t))}\" y1=\"{Px(axisTop)}\" y2=\"{Px(axisTop + (major ? 6 : 3))}\"/>");
            if (major)
            {
                axis.Append($"<text x=\"{Px(X(t))}\" y=\"{Px(axisTop + 19)}\" text-anchor=\"middle\">{N(t)}</text>");
            }
        }

        axis.Append($"<text class=\"axis-title\" x=\"{Px(width - right)}\" y=\"{Px(axisTop + 36)}\" text-anchor=\"end\">temperature →</text></g>");
        grid.Append("</g>");
        var height = axisTop + 44;
        var id = wide ? "chart" : "chart-compact";
        svg.Append($"<div class=\"chart-box {(wide ? "chart-wide" : "chart-narrow")}\"><svg id=\"{id}\" class=\"dotplot\" viewBox=\"0 0 {Px(width)} {Px(height)}\" ")
            .Append($"width=\"{Px(width)}\" height=\"{Px(height)}\" role=\"group\" aria-label=\"Temperature of each request by task, with each task's ceiling\" xmlns=\"http://www.w3.org/2000/svg\">")
            .Append(grid).Append(body).Append(axis).Append("</svg></div>");
        return svg.ToString();
    }

    private static string Detail(Dot dot, Lane lane)
    {
        var row = dot.Row;
        var text = new StringBuilder($"{Path.GetFileName(row.File)}:{row.Line} ({row.Project})\n");
        text.Append($"temperature {N(dot.Value)}{(dot.Default ? " (the provider's default: not set in the code)" : string.Empty)} · {lane.Label}");
        if (row.NotJudged != null)
        {
            text.Append($"\nnot judged: {row.NotJudged}");
        }
        else if (row.Findings.Count == 0)
        {
            text.Append("\nno finding");
        }
        else
        {
            foreach (var finding in row.Findings.OrderByDescending(f => Report.Rank(f.Severity)))
            {
                text.Append($"\n{finding.Id} ({Formats.Lower(finding.Severity)}): {finding.Title ?? finding.Message}");
            }
        }

        return text.ToString();
    }

    private static void Legend(StringBuilder page)
    {
        static string Swatch(Mark mark, bool hollow = false) =>
            $"<svg class=\"swatch\" viewBox=\"0 0 16 16\" width=\"16\" height=\"16\" aria-hidden=\"true\"><path d=\"{Shape(mark, 8, 8, 5.5)}\" fill=\"{(hollow ? "#ffffff" : mark.Colour)}\" stroke=\"{mark.Colour}\" stroke-width=\"{(hollow ? "2" : "1.2")}\"{(mark == Silent ? " stroke-dasharray=\"2 2\"" : string.Empty)}/></svg>";

        page.Append("<ul id=\"legend\" class=\"legend\" aria-label=\"Legend\">");
        page.Append("<li class=\"legend-head\">Each dot is marked by the worst finding on its request:</li>");
        foreach (var mark in new[] { None, Info, Warning, Error })
        {
            page.Append($"<li data-mark=\"{mark.Key}\">{Swatch(mark)} {H(mark.Key == "none" ? "no finding" : mark.Label)}</li>");
        }

        page.Append($"<li data-mark=\"default\">{Swatch(Warning, hollow: true)} hollow: not set in the code, the provider's default applies</li>");
        page.Append($"<li data-mark=\"silent\">{Swatch(Silent, hollow: true)} grey, dashed: not judged (never sent to a model, or sent to a test double)</li>");
        page.Append("<li data-mark=\"ceiling\"><svg class=\"swatch\" viewBox=\"0 0 16 16\" width=\"16\" height=\"16\" aria-hidden=\"true\"><rect x=\"8\" y=\"1\" width=\"8\" height=\"14\" class=\"over\"/><line x1=\"8\" x2=\"8\" y1=\"1\" y2=\"15\" class=\"ceiling\"/></svg> dashed line: the task's ceiling; shaded: above it</li>");
        page.Append("</ul>");
    }

    /// <summary>Requests whose temperature is not a number (read at run time, or left to the client) are counted, with why.</summary>
    private static void LeftOut(Report report, int plotted, StringBuilder page)
    {
        var missing = report.Rows.Where(r => r.Temperature.Value == null).ToList();
        page.Append("<p id=\"left-out\" class=\"left-out\">");
        if (missing.Count == 0)
        {
            page.Append($"All {plotted} {Formats.Plural(plotted, "request")} are plotted.</p>");
            return;
        }

        var reasons = missing.GroupBy(r => r.Temperature.Source).OrderByDescending(g => g.Count()).ThenBy(g => g.Key, StringComparer.Ordinal)
            .Select(g => $"{g.Count()} {H(g.Key)}");
        page.Append($"<strong>{missing.Count} {Formats.Plural(missing.Count, "request")} not plotted</strong>, because the code does not fix the temperature as a number: ")
            .Append(string.Join("; ", reasons))
            .Append(". Unknown values are read at run time and never judged; an unset value is left to the client or the model's own configuration.</p>");
    }

    // ---------------------------------------------------------------- findings by rule

    private static void FindingsByRule(Report report, StringBuilder page)
    {
        page.Append("<section id=\"findings\" class=\"panel\" aria-labelledby=\"findings-title\"><h2 id=\"findings-title\">Findings by rule</h2>");
        if (report.Findings.Count == 0)
        {
            page.Append("<p class=\"empty\">No findings: every judged request is within the rules.</p></section>\n");
            return;
        }

        foreach (var group in report.Findings.GroupBy(f => f.Finding.Id).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var first = group.First().Finding;
            var worst = MarkOf(group.OrderByDescending(f => Report.Rank(f.Finding.Severity)).First().Finding.Severity);
            var id = H(first.Id);
            var link = first.HelpLink != null
                ? $"<a class=\"rule-link\" href=\"{H(first.HelpLink)}\" title=\"The rule's page: why it matters and how to fix it\">{id}</a>"
                : $"<span class=\"rule-link\">{id}</span>";
            page.Append($"<details class=\"rule-group\" id=\"rule-{id}\" data-rule=\"{id}\" open><summary>")
                .Append($"<span class=\"sev sev-{worst.Key}\"><span aria-hidden=\"true\">{Symbol(worst)}</span> {H(worst.Label)}</span> ")
                .Append(link).Append($" <span class=\"rule-title\">{H(first.Title)}</span> <span class=\"count\">{group.Count()} {Formats.Plural(group.Count(), "finding")}</span></summary><ol>");
            foreach (var listed in group)
            {
                var where = Formats.WhereOf(listed.Finding, listed.Request, report.Info.Root);
                var row = $"req-{IndexOf(report, listed.Request) + 1}";
                page.Append("<li>")
                    .Append($"<a class=\"src\" href=\"{H(SourceHref(report, listed.Finding.File ?? listed.Request.File))}\" title=\"Open the file (line {(listed.Finding.Line == 0 ? listed.Request.Line : listed.Finding.Line)})\"><code>{H(where)}</code></a> ")
                    .Append($"<span class=\"msg\">{Prose(listed.Finding.Message)}</span> ")
                    .Append($"<a class=\"row-link\" href=\"#{row}\">see the request</a></li>");
            }

            page.Append("</ol></details>");
        }

        page.Append("</section>\n");
    }

    private static int IndexOf(Report report, RequestRow row)
    {
        for (var i = 0; i < report.Rows.Count; i++)
        {
            if (ReferenceEquals(report.Rows[i], row))
            {
                return i;
            }
        }

        return 0;
    }

    /// <summary>A link to a source file, relative to the page's folder so it works from a clone on any machine.</summary>
    private static string SourceHref(Report report, string file)
    {
        var relative = Path.GetRelativePath(report.Info.LinkBase ?? report.Info.Root, file).Replace('\\', '/');
        return string.Join('/', relative.Split('/').Select(Uri.EscapeDataString));
    }

    // ---------------------------------------------------------------- the requests table

    private static readonly (string Key, string Label)[] Headers =
    {
        ("where", "Where"), ("project", "Project"), ("sdk", "SDK"), ("model", "Model"), ("task", "Task"),
        ("temperature", "Temperature"), ("top_p", "Top-p"), ("seed", "Seed"), ("severity", "Findings"),
    };

    private static void Requests(Report report, StringBuilder page)
    {
        var rows = report.Rows;
        page.Append("<section id=\"requests-section\" class=\"panel\" aria-labelledby=\"requests-title\"><h2 id=\"requests-title\">Requests</h2>");
        page.Append("<form class=\"filters\" id=\"filters\" aria-label=\"Filter and sort the requests\" onsubmit=\"return false\">");
        Filter(page, "project", "Project", rows.Select(r => r.Project));
        Filter(page, "task", "Task", rows.Select(r => r.Task ?? NoTask));
        Filter(page, "rule", "Rule", rows.SelectMany(r => r.Findings.Select(f => f.Id)).Append("none"));
        Filter(page, "sdk", "SDK", rows.Select(r => r.Library));
        page.Append("<label>Sort <select id=\"sort-by\"><option value=\"where:asc\">file and line</option><option value=\"temperature:desc\">temperature, highest first</option>")
            .Append("<option value=\"severity:desc\">worst finding first</option><option value=\"project:asc\">project</option><option value=\"task:asc\">task</option></select></label>")
            .Append("<button type=\"button\" id=\"filter-reset\">Show all</button>")
            .Append($"<output id=\"shown\" aria-live=\"polite\">{rows.Count} of {rows.Count} requests shown</output></form>");
        page.Append("<div class=\"table-box\"><table id=\"requests\"><caption class=\"sr-only\">Every LLM request; the header buttons sort</caption><thead><tr>");
        foreach (var (key, label) in Headers)
        {
            page.Append($"<th scope=\"col\" data-key=\"{key}\" aria-sort=\"{(key == "where" ? "ascending" : "none")}\"><button type=\"button\">{label}</button></th>");
        }

        page.Append("</tr></thead><tbody>");
        for (var i = 0; i < rows.Count; i++)
        {
            Row(report, rows[i], i, page);
        }

        page.Append("</tbody></table></div>");
        page.Append($"<p class=\"headline\">{H(report.Headline)}</p></section>\n");
    }

    private static void Filter(StringBuilder page, string key, string label, IEnumerable<string> values)
    {
        var options = values.Distinct(StringComparer.Ordinal).OrderBy(v => v == "none" || v == NoTask ? 1 : 0).ThenBy(v => v, StringComparer.Ordinal).ToList();
        page.Append($"<label>{label} <select id=\"filter-{key}\" data-filter=\"{key}\"><option value=\"\">all</option>");
        foreach (var value in options)
        {
            var shown = key == "rule" && value == "none" ? "no finding" : value;
            page.Append($"<option value=\"{H(value)}\">{H(shown)}</option>");
        }

        page.Append("</select></label>");
    }

    private static string Bag(IEnumerable<string> values) => "|" + string.Join("|", values.Distinct(StringComparer.Ordinal)) + "|";

    private static void Row(Report report, RequestRow row, int index, StringBuilder page)
    {
        var mark = MarkOf(row);
        var where = Formats.Where(row, report.Info.Root);
        var rules = row.Findings.Count == 0 ? new[] { "none" } : row.Findings.Select(f => f.Id).ToArray();
        var temperature = row.Temperature.Value;
        page.Append($"<tr id=\"req-{index + 1}\" class=\"worst-{mark.Key}\"")
            .Append($" data-project=\"{H(Bag(new[] { row.Project }))}\" data-task=\"{H(Bag(new[] { row.Task ?? NoTask }))}\" data-rule=\"{H(Bag(rules))}\" data-sdk=\"{H(Bag(new[] { row.Library }))}\"")
            .Append($" data-sort-where=\"{H(Path.GetRelativePath(report.Info.Root, row.File).Replace('\\', '/'))}:{row.Line:D6}\" data-sort-project=\"{H(row.Project)}\"")
            .Append($" data-sort-sdk=\"{H(row.Library + " " + row.Sdk)}\" data-sort-model=\"{H(row.Model)}\" data-sort-task=\"{H(row.Task)}\"")
            .Append($" data-sort-temperature=\"{(temperature is { } t ? N(t) : string.Empty)}\" data-sort-top_p=\"{(row.Setting("top_p")?.Value is { } p ? N(p) : string.Empty)}\"")
            .Append($" data-sort-seed=\"{(row.Setting("seed")?.Value is { } s ? N(s) : string.Empty)}\" data-sort-severity=\"{(row.NotJudged != null ? 0 : Report.Rank(Report.Worst(row)))}\">");
        page.Append($"<td data-label=\"Where\"><div class=\"v\"><a class=\"src\" href=\"{H(SourceHref(report, row.File))}\"><code>{Soft(where, dots: false)}</code></a></div></td>");
        page.Append($"<td data-label=\"Project\"><div class=\"v\">{Soft(row.Project)}</div></td>");
        page.Append($"<td data-label=\"SDK\"><div class=\"v\">{Soft(row.Library)}<small>{Soft(row.Sdk)}</small>{(row.LayerLine == null ? string.Empty : $"<small class=\"evidence\">settings from {H(row.LayerLine)}</small>")}</div></td>");
        page.Append($"<td data-label=\"Model\"><div class=\"v\">{(row.Model == null ? "<span class=\"muted\">not constant</span>" : $"<code>{Soft(row.Model)}</code>{(row.Family == null ? string.Empty : $"<small>family {H(row.Family)}</small>")}{(row.ModelSource == null ? string.Empty : $"<small class=\"evidence\">{Prose(row.ModelSource)}</small>")}")}</div></td>");
        page.Append($"<td data-label=\"Task\"><div class=\"v\">{(row.Task == null ? "<span class=\"muted\">no task inferred</span>" : $"{H(row.Task)}<small class=\"evidence\">{Prose(row.TaskEvidence)}</small>")}</div></td>");
        page.Append($"<td data-label=\"Temperature\"><div class=\"v\">{Setting(row.Temperature)}</div></td>");
        page.Append($"<td data-label=\"Top-p\"><div class=\"v\">{Setting(row.Setting("top_p"))}</div></td>");
        page.Append($"<td data-label=\"Seed\"><div class=\"v\">{Setting(row.Setting("seed"))}</div></td>");
        page.Append("<td data-label=\"Findings\" class=\"findings-cell\"><div class=\"v\">");
        if (row.NotJudged != null)
        {
            page.Append($"<span class=\"sev sev-silent\"><span aria-hidden=\"true\">{Symbol(Silent)}</span> not judged</span> <span class=\"msg\">{Prose(row.NotJudged)}</span>");
        }
        else if (row.Findings.Count == 0)
        {
            page.Append($"<span class=\"sev sev-none\"><span aria-hidden=\"true\">{Symbol(None)}</span> no finding</span>");
        }
        else
        {
            page.Append("<ul class=\"finding-list\">");
            foreach (var finding in row.Findings.OrderByDescending(f => Report.Rank(f.Severity)))
            {
                var fm = MarkOf(finding.Severity);
                var id = finding.HelpLink != null ? $"<a href=\"{H(finding.HelpLink)}\">{H(finding.Id)}</a>" : H(finding.Id);
                page.Append($"<li><span class=\"sev sev-{fm.Key}\"><span aria-hidden=\"true\">{Symbol(fm)}</span> {H(fm.Label)}</span> {id} <span class=\"msg\">{Prose(finding.Message)}</span></li>");
            }

            page.Append("</ul>");
        }

        page.Append("</div></td></tr>");
    }

    /// <summary>Text that may break after '/', '.', '_' and between the words of a CamelCase name, and nowhere else.</summary>
    private static string Soft(string? text, bool dots = true)
    {
        var result = new StringBuilder();
        var value = text ?? string.Empty;
        for (var i = 0; i < value.Length; i++)
        {
            var c = value[i];
            if (i > 0 && char.IsUpper(c) && char.IsLower(value[i - 1]))
            {
                result.Append("<wbr>");
            }

            result.Append(H(c.ToString()));
            if ((c is '/' or '_' or '\\' or ':' || (dots && c == '.')) && i < value.Length - 1)
            {
                result.Append("<wbr>");
            }
        }

        return result.ToString();
    }

    /// <summary>
    /// Message text whose long dotted keys (<c>temperance.task.extraction.max_temperature</c>) and calls may break after a
    /// '.', '_', '/' or '(' that a letter follows, or between the words of a CamelCase name, so a narrow column wraps them
    /// at a sensible place, never mid-word.
    /// </summary>
    private static string Prose(string? text)
    {
        var value = text ?? string.Empty;
        var result = new StringBuilder(value.Length + 16);
        for (var i = 0; i < value.Length; i++)
        {
            if (i > 0 && char.IsUpper(value[i]) && char.IsLower(value[i - 1]))
            {
                result.Append("<wbr>"); // between the words of a CamelCase name
            }

            result.Append(H(value[i].ToString()));
            var call = value[i] == '(' && i > 0 && char.IsLetterOrDigit(value[i - 1]);
            if ((value[i] is '.' or '_' or '/' || call) && i + 1 < value.Length && (char.IsLetter(value[i + 1]) || value[i + 1] == '"'))
            {
                result.Append("<wbr>");
            }
        }

        return result.ToString();
    }

    private static string Setting(SettingRow? setting)
    {
        if (setting == null)
        {
            return "<span class=\"muted\">-</span>";
        }

        if (setting.Value is { } value)
        {
            var note = setting.Source == "literal" ? string.Empty : $"<small>{Soft(setting.Source)}</small>";
            return $"<span class=\"num\">{N(value)}</span>{note}";
        }

        return $"<span class=\"state state-{H(setting.State)}\">{Soft(setting.Source)}</span>";
    }

    // ---------------------------------------------------------------- style and script

    private const string Css = """
        :root{--ink:#1f2430;--soft:#5b6170;--paper:#f7f5f0;--card:#ffffff;--line:#dcd8cf;--accent:#21535c;--band:#f1efe9;
          --none:#2d7d57;--info:#2c63a8;--warning:#b3590b;--error:#b4232c;--silent:#7c828c;--over:#b4232c}
        *{box-sizing:border-box}
        html{-webkit-text-size-adjust:100%}
        body{margin:0;background:var(--paper);color:var(--ink);font:15px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,"Noto Sans",sans-serif}
        code{font-family:ui-monospace,"SFMono-Regular",Menlo,Consolas,"DejaVu Sans Mono",monospace;font-size:.9em;overflow-wrap:anywhere}
        a{color:var(--accent)}
        .masthead{background:var(--accent);color:#fff;padding:20px 24px 14px}
        .masthead a{color:#fff}
        .kicker{margin:0;font-size:12px;letter-spacing:.12em;text-transform:uppercase;opacity:.8}
        h1{margin:2px 0 6px;font-size:26px;line-height:1.2;overflow-wrap:anywhere}
        .meta{margin:0;display:flex;flex-wrap:wrap;gap:4px 18px;font-size:13px;opacity:.92}
        .meta code{background:rgba(255,255,255,.14);padding:1px 5px;border-radius:3px}
        nav{display:flex;flex-wrap:wrap;gap:2px 18px;margin:12px 0 -6px;padding:8px 0 0;border-top:1px solid rgba(255,255,255,.25);font-size:14px}
        nav a{text-decoration:none;border-bottom:2px solid transparent}
        nav a:hover,nav a:focus{border-bottom-color:#fff}
        main{max-width:1240px;margin:0 auto;padding:16px 24px 8px}
        .panel{background:var(--card);border:1px solid var(--line);border-radius:10px;padding:16px 20px;margin:0 0 18px}
        h2{margin:0 0 10px;font-size:19px}
        h3.minor{margin:16px 0 6px;font-size:14px;color:var(--soft);font-weight:600}
        .lede{margin:0 0 10px;color:var(--soft);max-width:75ch}
        .stats{display:grid;grid-template-columns:repeat(auto-fit,minmax(180px,1fr));gap:12px}
        .stat{border-left:4px solid var(--accent);padding:4px 12px;min-width:0}
        .stat .num{display:block;font-size:32px;font-weight:700;line-height:1.1;font-variant-numeric:tabular-nums}
        .stat .label{font-weight:600}
        .stat .sub{display:block;color:var(--soft);font-size:13px;overflow-wrap:anywhere}
        .sev-tally{list-style:none;margin:6px 0 0;padding:0;display:flex;flex-wrap:wrap;gap:6px}
        .sev{display:inline-block;border-radius:999px;padding:0 8px;font-size:12.5px;font-weight:600;border:1px solid currentColor;white-space:nowrap;background:#fff}
        .sev-none{color:var(--none)}.sev-info{color:var(--info)}.sev-warning{color:var(--warning)}.sev-error{color:var(--error)}.sev-silent{color:var(--silent)}
        .rule-tally{list-style:none;margin:0;padding:0;display:grid;gap:4px}
        .rule-tally a{display:grid;grid-template-columns:5.5em minmax(0,1fr) minmax(60px,180px) 2.5em;gap:10px;align-items:center;text-decoration:none;color:var(--ink);padding:2px 4px;border-radius:4px}
        .rule-tally a:hover,.rule-tally a:focus{background:var(--band)}
        .rule-id{font-weight:700;font-family:ui-monospace,Menlo,Consolas,monospace}
        .rule-name{overflow-wrap:anywhere}
        .bar-track{height:10px;background:var(--band);border-radius:5px;overflow:hidden}
        .bar{display:block;height:100%;background:currentColor}
        .rule-count{text-align:right;font-variant-numeric:tabular-nums;font-weight:600}
        .chart-box{overflow-x:auto;max-width:100%}
        .dotplot{display:block;max-width:100%;height:auto;font-family:inherit}
        .chart-narrow{display:none}
        .band{fill:var(--band)}
        .over{fill:var(--over);fill-opacity:.06}
        .ceiling{stroke:#3b2f2f;stroke-width:2;stroke-dasharray:5 3}
        .grid-major{stroke:#d9d5cc;stroke-width:1}.grid-minor{stroke:#ebe8e1;stroke-width:1}
        .axis line{stroke:#8c8a84}.axis text{font-size:12px;fill:var(--soft)}.axis-title{font-style:italic}
        .lane-label{font-size:13.5px;font-weight:600;fill:var(--ink)}
        .lane-sub{font-size:11.5px;font-weight:400;fill:var(--soft)}
        .dot{cursor:pointer;outline:none}
        .dot:hover path,.dot:focus path{stroke:#111;stroke-width:2.5}
        .dot:focus-visible path{stroke:#111;stroke-width:3}
        .dot-detail{min-height:1.5em;margin:6px 0 0;font-size:13.5px;color:var(--soft)}
        .legend{list-style:none;margin:10px 0 0;padding:10px 0 0;border-top:1px dashed var(--line);display:flex;flex-wrap:wrap;gap:4px 18px;font-size:13px;color:var(--soft)}
        .legend li{display:flex;align-items:center;gap:6px}
        .legend .legend-head{flex-basis:100%;font-weight:600;color:var(--ink)}
        .swatch{flex:none}
        .left-out{margin:10px 0 0;font-size:13.5px}
        .empty{color:var(--soft);font-size:15px}
        .rule-group{border-top:1px solid var(--line);padding:8px 0}
        .rule-group:first-of-type{border-top:0}
        .rule-group summary{cursor:pointer;font-size:15px;line-height:1.8}
        .rule-link{font-weight:700;font-family:ui-monospace,Menlo,Consolas,monospace}
        .rule-title{font-weight:600}
        .count{color:var(--soft);font-size:13px;white-space:nowrap}
        .rule-group ol{margin:4px 0 4px;padding-left:1.6em}
        .rule-group li{margin:3px 0;overflow-wrap:anywhere}
        .row-link{font-size:12.5px;white-space:nowrap}
        .filters{display:flex;flex-wrap:wrap;gap:8px 14px;align-items:end;margin:0 0 12px}
        .filters label{display:flex;flex-direction:column;font-size:12px;font-weight:600;color:var(--soft);min-width:0}
        .filters select{font:inherit;font-size:14px;padding:4px 6px;border:1px solid var(--line);border-radius:6px;background:#fff;color:var(--ink);max-width:100%}
        .filters button{font:inherit;font-size:14px;padding:5px 12px;border:1px solid var(--accent);background:#fff;color:var(--accent);border-radius:6px;cursor:pointer}
        #shown{font-size:13px;color:var(--soft);padding-bottom:6px}
        .table-box{overflow-x:auto;max-width:100%}
        table{border-collapse:collapse;width:100%;font-size:13.5px}
        th{text-align:left;background:var(--band);border-bottom:2px solid var(--line);padding:0;white-space:nowrap}
        th button{font:inherit;font-weight:700;color:var(--ink);background:none;border:0;padding:7px 8px;cursor:pointer;width:100%;text-align:left}
        th[aria-sort=ascending] button::after{content:" ↑"}th[aria-sort=descending] button::after{content:" ↓"}
        td{padding:7px 8px;border-bottom:1px solid var(--line);vertical-align:top;overflow-wrap:break-word}
        td .evidence,.findings-cell{overflow-wrap:break-word}
        .findings-cell{min-width:290px}
        td small{display:block;color:var(--soft);font-size:12px}
        td code{overflow-wrap:break-word}
        #requests th[data-key=where]{min-width:9.5em}#requests th[data-key=project]{min-width:6.5em}#requests th[data-key=sdk]{min-width:8.5em}
        #requests th[data-key=model]{min-width:6.5em}#requests th[data-key=task]{min-width:9.5em}#requests th[data-key=temperature]{min-width:7em}
        #requests th[data-key=top_p],#requests th[data-key=seed]{min-width:5.5em}
        tr.worst-none td:first-child{box-shadow:inset 5px 0 0 var(--none)}
        tr.worst-info td:first-child{box-shadow:inset 5px 0 0 var(--info)}
        tr.worst-warning td:first-child{box-shadow:inset 5px 0 0 var(--warning)}
        tr.worst-error td:first-child{box-shadow:inset 5px 0 0 var(--error)}
        tr.worst-silent td:first-child{box-shadow:inset 5px 0 0 var(--silent)}
        td:first-child{padding-left:14px}
        tr.flash td{background:#fff6d6}
        .finding-list{list-style:none;margin:0;padding:0}
        .finding-list li{margin:0 0 5px}
        .muted,.state{color:var(--soft);font-style:italic}
        .state-unknown{color:#6a4c93;font-style:normal}
        .num{font-variant-numeric:tabular-nums;font-weight:600}
        .headline{color:var(--soft);font-size:13px;margin:10px 0 0}
        .sr-only{position:absolute;width:1px;height:1px;overflow:hidden;clip:rect(0 0 0 0);white-space:nowrap}
        footer{max-width:1240px;margin:0 auto;padding:0 24px 24px;color:var(--soft);font-size:12.5px}
        @media (max-width:720px){
          body{font-size:14.5px}
          .masthead{padding:14px 14px 10px}
          .stats{grid-template-columns:repeat(auto-fit,minmax(100px,1fr));gap:8px}
          .stat{padding:2px 8px}
          .stat .num{font-size:26px}
          .sev-tally .sev{white-space:normal}
          h1{font-size:21px}
          main{padding:12px 10px 4px}
          footer{padding:0 12px 20px}
          .panel{padding:12px 12px;border-radius:8px}
          .chart-wide{display:none}
          .chart-narrow{display:block}
          .rule-tally a{grid-template-columns:5em minmax(0,1fr) 2em}
          .rule-tally .bar-track{display:none}
          .filters label{flex:1 1 40%}
          .filters select{width:100%}
          #requests thead{position:absolute;width:1px;height:1px;overflow:hidden;clip:rect(0 0 0 0)}
          #requests,#requests tbody,#requests tr,#requests td{display:block;width:100%}
          #requests tr{border:1px solid var(--line);border-radius:8px;margin:0 0 10px;padding:6px 10px 6px 14px;background:#fff}
          #requests tr.worst-none{box-shadow:inset 5px 0 0 var(--none)}
          #requests tr.worst-info{box-shadow:inset 5px 0 0 var(--info)}
          #requests tr.worst-warning{box-shadow:inset 5px 0 0 var(--warning)}
          #requests tr.worst-error{box-shadow:inset 5px 0 0 var(--error)}
          #requests tr.worst-silent{box-shadow:inset 5px 0 0 var(--silent)}
          #requests tr[hidden]{display:none}
          #requests td{display:grid;grid-template-columns:7.4em minmax(0,1fr);gap:8px;border:0;padding:3px 0;min-width:0}
          #requests td.findings-cell{min-width:0}
          #requests td:first-child{box-shadow:none;padding-left:0}
          #requests td::before{content:attr(data-label);font-weight:600;color:var(--soft);font-size:12.5px;overflow-wrap:normal}
          #requests td .v{min-width:0;overflow-wrap:anywhere}
          #requests td .v code{overflow-wrap:anywhere}
          .table-box{overflow:visible}
        }
        @media print{
          body{background:#fff;font-size:11pt}
          .masthead{background:#fff;color:#000;border-bottom:2px solid #000;padding:0 0 8px}
          .masthead a{color:#000}
          nav,.filters,.dot-detail,.row-link,th button::after{display:none!important}
          main{max-width:none;padding:8px 0}
          .panel{border:0;padding:0;margin:0 0 14px}
          .chart-wide{display:block!important}.chart-narrow{display:none!important}
          .chart-box{overflow:visible}
          #requests tr[hidden]{display:table-row!important}
          tr{break-inside:avoid}
          h2{break-after:avoid}
          a{color:inherit;text-decoration:none}
          .table-box{overflow:visible}
          table{font-size:9pt}
        }
        """;

    private const string Script = """
        (function(){
          var table=document.getElementById('requests');
          var detail=document.getElementById('dot-detail');
          var selects=[].slice.call(document.querySelectorAll('select[data-filter]'));
          var rows=table?[].slice.call(table.tBodies[0].rows):[];
          var shown=document.getElementById('shown');
          function apply(){
            var n=0;
            rows.forEach(function(r){
              var ok=selects.every(function(s){return !s.value||(r.getAttribute('data-'+s.getAttribute('data-filter'))||'').indexOf('|'+s.value+'|')>=0;});
              r.hidden=!ok; if(ok){n++;}
            });
            if(shown){shown.textContent=n+' of '+rows.length+' requests shown';}
          }
          function sortBy(key,desc){
            if(!table){return;}
            var body=table.tBodies[0];
            rows.slice().sort(function(a,b){
              var x=a.getAttribute('data-sort-'+key)||'',y=b.getAttribute('data-sort-'+key)||'';
              var tie=(a.getAttribute('data-sort-where')||'').localeCompare(b.getAttribute('data-sort-where')||'');
              if(x===''&&y===''){return tie;} if(x===''){return 1;} if(y===''){return -1;}
              var nx=parseFloat(x),ny=parseFloat(y);
              var c=(!isNaN(nx)&&!isNaN(ny)&&String(nx)===x&&String(ny)===y)?nx-ny:x.localeCompare(y);
              return (desc?-c:c)||tie;
            }).forEach(function(r){body.appendChild(r);});
            [].forEach.call(table.tHead.rows[0].cells,function(th){
              th.setAttribute('aria-sort',th.getAttribute('data-key')===key?(desc?'descending':'ascending'):'none');
            });
          }
          selects.forEach(function(s){s.addEventListener('change',apply);});
          var reset=document.getElementById('filter-reset');
          if(reset){reset.addEventListener('click',function(){selects.forEach(function(s){s.value='';});apply();});}
          var sortSelect=document.getElementById('sort-by');
          if(sortSelect){sortSelect.addEventListener('change',function(){var p=sortSelect.value.split(':');sortBy(p[0],p[1]==='desc');});}
          if(table){[].forEach.call(table.tHead.rows[0].cells,function(th){
            th.querySelector('button').addEventListener('click',function(){
              var key=th.getAttribute('data-key');
              var desc=th.getAttribute('aria-sort')==='ascending';
              sortBy(key,desc);
            });
          });}
          function goTo(id){
            var r=document.getElementById(id); if(!r){return;}
            if(r.hidden){selects.forEach(function(s){s.value='';});apply();}
            r.scrollIntoView({block:'center'});
            r.classList.add('flash'); setTimeout(function(){r.classList.remove('flash');},1600);
          }
          [].forEach.call(document.querySelectorAll('.dot'),function(d){
            function show(){if(detail){detail.textContent=d.getAttribute('data-detail');}}
            d.addEventListener('focus',show); d.addEventListener('mouseenter',show);
            d.addEventListener('click',function(){goTo(d.getAttribute('data-row'));});
            d.addEventListener('keydown',function(e){if(e.key==='Enter'||e.key===' '){e.preventDefault();goTo(d.getAttribute('data-row'));}});
          });
          window.addEventListener('beforeprint',function(){
            [].forEach.call(document.querySelectorAll('details'),function(x){x.open=true;});
            rows.forEach(function(r){r.hidden=false;});
          });
          window.addEventListener('afterprint',apply);
        })();
        """;
}
