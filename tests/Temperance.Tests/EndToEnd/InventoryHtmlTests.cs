using System.Text.Json;
using System.Text.RegularExpressions;

namespace Temperance.Tests.EndToEnd;

/// <summary>
/// The HTML page, rendered by headless Chromium at a desktop width (1280 px) and a phone width (390 px). Chromium's
/// headless window is never narrower than 500 px, so each page is shown in an iframe of the exact width inside a small
/// harness page; a probe script injected into a copy of the report measures the page from inside and posts what it found
/// to the harness, whose DOM Chromium dumps. Screenshots (PNG) are written under the test's temp folder.
/// </summary>
public partial class InventoryToolTests
{
    private static readonly int[] Widths = { 1280, 390 };

    [Fact]
    public void Html_Demo_IsSelfContained_AndReadableAtDesktopAndPhoneWidths()
    {
        var page = Path.Combine(tool.Output, "report.html");
        var run = tool.Run($"\"{tool.Demo}\" --format html --output \"{page}\"");
        Assert.True(run.ExitCode == 0, run.ToString());
        var html = File.ReadAllText(page);

        // Self-contained: nothing is fetched. The only web addresses are the SVG namespace and links to the rule pages.
        Assert.DoesNotContain("<link", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("@import", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("url(", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotMatch("src=\"(https?:)?//", html);
        foreach (Match address in Regex.Matches(html, "https?://[^\"'<> ]+"))
        {
            var ok = address.Value == "http://www.w3.org/2000/svg"
                || Regex.IsMatch(address.Value, @"^https://github\.com/temperance-analyzers/temperance/blob/main/rules/SAMP\d{3}\.md$");
            Assert.True(ok, "an address the page would fetch or link: " + address.Value);
            if (address.Value.StartsWith("https", StringComparison.Ordinal))
            {
                Assert.Contains($"href=\"{address.Value}\"", html, StringComparison.Ordinal);
            }
        }

        Assert.Contains("@media print", html, StringComparison.Ordinal);
        Assert.Contains("<script>", html, StringComparison.Ordinal);
        Assert.Contains("unset (left to the client)", html, StringComparison.Ordinal);
        Assert.DoesNotContain("usually", html, StringComparison.Ordinal);

        var jsonFile = Path.Combine(tool.Output, "report-for-html.json");
        Assert.Equal(0, tool.Run($"\"{tool.Demo}\" --format json --output \"{jsonFile}\"").ExitCode);
        using var json = JsonDocument.Parse(File.ReadAllText(jsonFile));
        var requests = json.RootElement.GetProperty("requests").EnumerateArray().ToList();
        var plotted = requests.Count(r => r.GetProperty("settings").GetProperty("temperature").GetProperty("value").ValueKind == JsonValueKind.Number);
        var withSamp001 = requests.Count(r => r.GetProperty("findings").EnumerateArray().Any(f => f.GetProperty("id").GetString() == "SAMP001"));
        var rules = requests.SelectMany(r => r.GetProperty("findings").EnumerateArray().Select(f => f.GetProperty("id").GetString()!)).Distinct().Order(StringComparer.Ordinal).ToList();

        if (Chromium() is not { } chromium)
        {
            return;
        }

        foreach (var width in Widths)
        {
            var probe = Probe(chromium, page, width);
            string Show() => $"at {width} px: {probe}";

            // No horizontal overflow of the page itself.
            Assert.True(probe.GetProperty("bodyScroll").GetInt32() <= probe.GetProperty("bodyClient").GetInt32(), "body overflows " + Show());
            Assert.True(probe.GetProperty("docScroll").GetInt32() <= probe.GetProperty("docClient").GetInt32(), "page overflows " + Show());
            Assert.Equal(width, probe.GetProperty("docClient").GetInt32());

            // The summary: requests, findings by severity and by rule, projects, date, commit, tool version.
            Assert.Equal(requests.Count.ToString(System.Globalization.CultureInfo.InvariantCulture), probe.GetProperty("statRequests").GetString());
            Assert.Contains("warning", probe.GetProperty("bySeverity").GetString(), StringComparison.Ordinal);
            Assert.Equal(rules, probe.GetProperty("byRule").EnumerateArray().Select(r => r.GetString()!).ToList());
            Assert.Equal("HarbourDesk", probe.GetProperty("projects").GetString());
            Assert.True(probe.GetProperty("generated").GetBoolean(), Show());
            Assert.StartsWith("temperance-inventory ", probe.GetProperty("version").GetString(), StringComparison.Ordinal);
            if (json.RootElement.GetProperty("commit").GetString() is { } commit)
            {
                Assert.Equal(commit, probe.GetProperty("commit").GetString());
            }

            // The dot plot: the chart for this width, one focusable dot with a title naming the call site per plotted request.
            Assert.True(probe.GetProperty(width > 720 ? "wideVisible" : "compactVisible").GetBoolean(), Show());
            Assert.False(probe.GetProperty(width > 720 ? "compactVisible" : "wideVisible").GetBoolean(), Show());
            Assert.Equal(plotted, probe.GetProperty("dots").GetInt32());
            Assert.Equal(plotted, probe.GetProperty("dotsWithTitle").GetInt32());
            Assert.Equal(plotted, probe.GetProperty("dotsFocusable").GetInt32());
            Assert.True(probe.GetProperty("chartFits").GetBoolean(), "the chart fits its box " + Show());
            var lanes = probe.GetProperty("lanes").EnumerateArray().Select(l => l.GetString()).ToList();
            Assert.Contains("extraction", lanes);
            Assert.Contains("no task", lanes);
            var ceilings = probe.GetProperty("ceilings").EnumerateArray().Select(c => c.GetString()).ToList();
            Assert.Contains("extraction=0.3", ceilings);
            Assert.Contains("evaluation=0.2", ceilings);
            Assert.Equal(new[] { "none", "info", "warning", "error", "default", "silent", "ceiling" },
                probe.GetProperty("legend").EnumerateArray().Select(l => l.GetString()).ToArray());
            Assert.Contains($"{requests.Count - plotted} request", probe.GetProperty("leftOut").GetString(), StringComparison.Ordinal);
            Assert.Contains("not plotted", probe.GetProperty("leftOut").GetString(), StringComparison.Ordinal);
            Assert.Contains("unset (left to the client)", probe.GetProperty("leftOut").GetString(), StringComparison.Ordinal);

            // Findings grouped by rule, each group linking to its rule page and each finding to its source line.
            var groups = probe.GetProperty("ruleGroups").EnumerateArray().ToList();
            Assert.Equal(rules, groups.Select(g => g.GetProperty("id").GetString()!).ToList());
            foreach (var group in groups)
            {
                var id = group.GetProperty("id").GetString();
                Assert.EndsWith($"/rules/{id}.md", group.GetProperty("href").GetString(), StringComparison.Ordinal);
                Assert.True(group.GetProperty("items").GetInt32() > 0, Show());
                // Call sites in C# and in settings files (a prompt directory's config.json, an agent definition's YAML).
                Assert.All(group.GetProperty("sources").EnumerateArray(), s => Assert.Matches(@"^[\w./-]+\.(cs|json|ya?ml):\d+$", s.GetString()!));
                Assert.All(group.GetProperty("sourceLinks").EnumerateArray(), s => Assert.Matches(@"\.(cs|json|ya?ml)$", s.GetString()!));
            }

            // The requests: a row (or card) each, with a project column, filters that filter and a sort that sorts.
            Assert.Equal(requests.Count, probe.GetProperty("rows").GetInt32());
            Assert.Equal(new[] { "project", "task", "rule", "sdk" }, probe.GetProperty("filters").EnumerateArray().Select(f => f.GetString()).ToArray());
            Assert.Contains("Project", probe.GetProperty("headers").EnumerateArray().Select(h => h.GetString()));
            Assert.Equal(withSamp001, probe.GetProperty("shownForSamp001").GetInt32());
            Assert.Equal($"{withSamp001} of {requests.Count} requests shown", probe.GetProperty("shownText").GetString());
            var sorted = probe.GetProperty("sortedTemperatures").EnumerateArray().Select(t => t.GetString()!).ToList();
            var numbers = sorted.TakeWhile(t => t.Length > 0).Select(t => double.Parse(t, System.Globalization.CultureInfo.InvariantCulture)).ToList();
            Assert.Equal(numbers.OrderByDescending(n => n).ToList(), numbers);
            Assert.All(sorted.Skip(numbers.Count), t => Assert.Equal(string.Empty, t));
            Assert.Equal(0, probe.GetProperty("cutCells").GetInt32());
            Assert.True(probe.GetProperty("tableFits").GetBoolean(), "the table fits without scrolling " + Show());
            Assert.Equal(width <= 720, probe.GetProperty("cards").GetBoolean());
            Assert.True(probe.GetProperty("severityText").GetInt32() >= rules.Count, "severities are written as words, not colour alone " + Show());

            var top = Screenshot(chromium, page, width, 0, Math.Min(2000, probe.GetProperty("height").GetInt32()), $"inventory-{width}-top.png");
            var table = probe.GetProperty("requestsTop").GetInt32();
            var bottom = Screenshot(chromium, page, width, table, Math.Min(2000, probe.GetProperty("height").GetInt32() - table), $"inventory-{width}-requests.png");
            log.WriteLine($"{width} px: {top}, {bottom}");
        }
    }

    [Fact]
    public void EmptySolution_SaysSoInWords_InEveryFormat()
    {
        var root = tool.NewFolder("quiet");
        InventoryFixture.WriteProject(root, "Lighthouse", string.Empty, ("Lamp.cs", """
            namespace Lighthouse;
            public static class Lamp
            {
                public static string Signal() => "all clear";
            }
            """));
        Assert.Equal(0, DotNet.Run(root, "new sln -n Quiet --format sln").ExitCode);
        Assert.Equal(0, DotNet.Run(root, "sln Quiet.sln add Lighthouse/Lighthouse.csproj").ExitCode);
        var restore = InventoryFixture.Restore(root, "Quiet.sln");
        Assert.True(restore.ExitCode == 0, restore.ToString());

        var table = tool.RunIn(root, "Quiet.sln");
        Assert.True(table.ExitCode == 0, table.ToString());
        Assert.Contains("No LLM requests were found in Quiet.sln (1 project analysed: Lighthouse).", table.Output, StringComparison.Ordinal);

        var markdown = tool.RunIn(root, "Quiet.sln --format markdown");
        Assert.Contains("No LLM requests were found in Quiet.sln", markdown.Output, StringComparison.Ordinal);

        var file = Path.Combine(root, "quiet.json");
        Assert.Equal(0, tool.RunIn(root, $"Quiet.sln --format json --output \"{file}\"").ExitCode);
        using (var json = JsonDocument.Parse(File.ReadAllText(file)))
        {
            Assert.Equal(0, json.RootElement.GetProperty("requests").GetArrayLength());
            Assert.Equal(new[] { "Lighthouse" }, json.RootElement.GetProperty("summary").GetProperty("projects").EnumerateArray().Select(p => p.GetString()).ToArray());
        }

        var page = Path.Combine(root, "quiet.html");
        Assert.Equal(0, tool.RunIn(root, $"Quiet.sln --format html --output \"{page}\"").ExitCode);
        var html = File.ReadAllText(page);
        Assert.Contains("No LLM requests were found in Quiet.sln (1 project analysed: Lighthouse).", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<svg id=\"chart\"", html, StringComparison.Ordinal);

        if (Chromium() is not { } chromium)
        {
            return;
        }

        foreach (var width in Widths)
        {
            var probe = Probe(chromium, page, width);
            Assert.StartsWith("Nothing to show", probe.GetProperty("noRequests").GetString(), StringComparison.Ordinal);
            Assert.Contains("No LLM requests were found in Quiet.sln", probe.GetProperty("noRequests").GetString(), StringComparison.Ordinal);
            Assert.Equal(0, probe.GetProperty("dots").GetInt32());
            Assert.Equal(0, probe.GetProperty("rows").GetInt32());
            Assert.Equal("0", probe.GetProperty("statRequests").GetString());
            Assert.True(probe.GetProperty("bodyScroll").GetInt32() <= probe.GetProperty("bodyClient").GetInt32(), $"body overflows at {width}: {probe}");
            var shot = Screenshot(chromium, page, width, 0, Math.Min(1200, probe.GetProperty("height").GetInt32()), $"inventory-empty-{width}.png", minimumBytes: 5_000);
            log.WriteLine($"{width} px: {shot}");
        }
    }

    // ---------------------------------------------------------------- Chromium

    private static string? Chromium()
    {
        var chromium = new[] { "/usr/bin/chromium", "/usr/bin/chromium-browser" }.FirstOrDefault(File.Exists);
        // CI installs Chromium (.ci/run); a developer machine without it checks the page text only.
        Assert.True(chromium != null || Environment.GetEnvironmentVariable("CI") != "true", "Chromium is missing in CI");
        return chromium;
    }

    /// <summary>Measures the page at a width, from inside an iframe of exactly that width; returns what the probe found.</summary>
    private JsonElement Probe(string chromium, string page, int width)
    {
        var folder = Path.GetDirectoryName(page)!;
        var name = Path.GetFileNameWithoutExtension(page);
        var probed = Path.Combine(folder, $"{name}-probe.html");
        File.WriteAllText(probed, File.ReadAllText(page).Replace("</body>", "<script>" + ProbeScript + "</script></body>", StringComparison.Ordinal));
        var harness = Path.Combine(folder, $"{name}-probe-{width}.html");
        File.WriteAllText(harness, $$"""
            <!DOCTYPE html><html><body style="margin:0"><pre id="probe"></pre>
            <iframe src="{{Path.GetFileName(probed)}}" style="border:0;display:block;width:{{width}}px;height:900px"></iframe>
            <script>window.addEventListener('message', function (e) { document.getElementById('probe').textContent = e.data; });</script>
            </body></html>
            """);
        var dom = RunChromium(chromium, $"--window-size={Math.Max(width, 500)},900 --virtual-time-budget=5000 --dump-dom \"file://{harness}\"");
        var found = Regex.Match(dom, "<pre id=\"probe\">(.*?)</pre>", RegexOptions.Singleline);
        Assert.True(found.Success && found.Groups[1].Value.Length > 0, $"the probe did not report at {width} px:\n{dom[..Math.Min(dom.Length, 2000)]}");
        using var document = JsonDocument.Parse(System.Net.WebUtility.HtmlDecode(found.Groups[1].Value));
        return document.RootElement.Clone();
    }

    /// <summary>
    /// A PNG of the page at a width, from <paramref name="offset"/> down for <paramref name="height"/> pixels. The window is
    /// as wide as the page (Chromium lays out at least 500 px, but the image is cut at the window's width).
    /// </summary>
    private string Screenshot(string chromium, string page, int width, int offset, int height, string file, int minimumBytes = 20_000)
    {
        var folder = Path.Combine(tool.Output, "screenshots");
        Directory.CreateDirectory(folder);
        var harness = Path.Combine(Path.GetDirectoryName(page)!, Path.GetFileNameWithoutExtension(file) + "-harness.html");
        File.WriteAllText(harness, $"""
            <!DOCTYPE html><html><body style="margin:0;overflow:hidden;background:#fff">
            <iframe src="{Path.GetFileName(page)}" style="border:0;display:block;width:{width}px;height:{offset + height}px;margin-top:-{offset}px"></iframe>
            </body></html>
            """);
        var png = Path.Combine(folder, file);
        File.Delete(png);
        RunChromium(chromium, $"--window-size={width},{height} --virtual-time-budget=3000 --screenshot=\"{png}\" \"file://{harness}\"");
        Assert.True(File.Exists(png), "no screenshot " + png);
        var bytes = File.ReadAllBytes(png);
        Assert.True(bytes.Length >= minimumBytes && bytes.Length < 6_000_000, $"{png}: {bytes.Length} bytes");
        Assert.Equal(new byte[] { 0x89, (byte)'P', (byte)'N', (byte)'G' }, bytes[..4]);
        var shownWidth = (bytes[16] << 24) | (bytes[17] << 16) | (bytes[18] << 8) | bytes[19];
        var shownHeight = (bytes[20] << 24) | (bytes[21] << 16) | (bytes[22] << 8) | bytes[23];
        Assert.Equal(width, shownWidth);
        Assert.Equal(height, shownHeight);
        return png;
    }

    private string RunChromium(string chromium, string arguments)
    {
        var profile = Path.Combine(tool.Output, "profile-" + Guid.NewGuid().ToString("N")[..8]);
        var flags = $"--headless --no-sandbox --disable-gpu --hide-scrollbars --disable-background-networking --disable-component-update --disable-sync --no-first-run --user-data-dir=\"{profile}\"";
        var start = new System.Diagnostics.ProcessStartInfo(chromium, $"{flags} {arguments}") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        using var process = System.Diagnostics.Process.Start(start)!;
        var output = process.StandardOutput.ReadToEndAsync();
        _ = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(120_000))
        {
            process.Kill(entireProcessTree: true);
        }

        return output.Result;
    }

    /// <summary>Runs inside the report (in the iframe) once it has loaded, and posts its measurements to the harness.</summary>
    private const string ProbeScript = """
        window.addEventListener('load', function () {
          var r = {};
          var de = document.documentElement, b = document.body;
          function text(sel) { var e = document.querySelector(sel); return e ? e.textContent.trim() : null; }
          function visible(el) { return !!(el && el.getClientRects().length); }
          r.bodyScroll = b.scrollWidth; r.bodyClient = b.clientWidth; r.docScroll = de.scrollWidth; r.docClient = de.clientWidth;
          r.height = de.scrollHeight;
          r.statRequests = text('#stat-requests .num');
          r.bySeverity = text('#by-severity');
          r.byRule = [].map.call(document.querySelectorAll('#by-rule .rule-id'), function (e) { return e.textContent; });
          r.projects = text('#stat-projects .sub');
          r.generated = !!document.querySelector('time#generated[datetime]');
          r.commit = text('#commit');
          r.version = text('#tool-version');
          var wide = document.getElementById('chart'), compact = document.getElementById('chart-compact');
          r.wideVisible = visible(wide); r.compactVisible = visible(compact);
          var chart = r.wideVisible ? wide : (r.compactVisible ? compact : null);
          var dots = chart ? [].slice.call(chart.querySelectorAll('.dot')) : [];
          r.dots = dots.length;
          r.dotsWithTitle = dots.filter(function (d) { var t = d.querySelector('title'); return !!t && /\.(cs|json|ya?ml|prompty?|md):\d+/.test(t.textContent); }).length;
          r.dotsFocusable = dots.filter(function (d) { return d.getAttribute('tabindex') === '0'; }).length;
          r.chartFits = chart ? chart.parentNode.scrollWidth <= chart.parentNode.clientWidth + 1 : true;
          r.lanes = chart ? [].map.call(chart.querySelectorAll('.lane'), function (l) { return l.getAttribute('data-task'); }) : [];
          r.ceilings = chart ? [].map.call(chart.querySelectorAll('line.ceiling'), function (l) { return l.parentNode.getAttribute('data-task') + '=' + l.getAttribute('data-ceiling'); }) : [];
          r.legend = [].map.call(document.querySelectorAll('#legend li[data-mark]'), function (li) { return li.getAttribute('data-mark'); });
          r.leftOut = text('#left-out');
          r.ruleGroups = [].map.call(document.querySelectorAll('#findings .rule-group'), function (g) {
            var link = g.querySelector('a.rule-link');
            return { id: g.getAttribute('data-rule'), href: link ? link.getAttribute('href') : null, items: g.querySelectorAll('li').length,
              sources: [].map.call(g.querySelectorAll('a.src'), function (a) { return a.textContent; }),
              sourceLinks: [].map.call(g.querySelectorAll('a.src'), function (a) { return a.getAttribute('href'); }) };
          });
          var rows = [].slice.call(document.querySelectorAll('#requests tbody tr'));
          r.rows = rows.length;
          r.headers = [].map.call(document.querySelectorAll('#requests thead th'), function (th) { return th.textContent; });
          r.filters = [].map.call(document.querySelectorAll('select[data-filter]'), function (s) { return s.getAttribute('data-filter'); });
          r.cutCells = [].filter.call(document.querySelectorAll('#requests td .v'), function (v) { return v.scrollWidth > v.clientWidth + 1; }).length;
          var box = document.querySelector('.table-box');
          r.tableFits = box ? box.scrollWidth <= box.clientWidth + 1 : true;
          r.cards = rows.length > 0 && getComputedStyle(rows[0]).display === 'block';
          r.severityText = [].filter.call(document.querySelectorAll('#requests .sev'), function (s) { return /warning|info|error|no finding|not judged/.test(s.textContent); }).length;
          var section = document.getElementById('requests-section');
          r.requestsTop = section ? Math.round(section.getBoundingClientRect().top + window.scrollY) : 0;
          var rule = document.getElementById('filter-rule');
          if (rule) {
            rule.value = 'SAMP001'; rule.dispatchEvent(new Event('change'));
            r.shownForSamp001 = rows.filter(function (tr) { return !tr.hidden; }).length;
            r.shownText = text('#shown');
            rule.value = ''; rule.dispatchEvent(new Event('change'));
          }
          var sort = document.getElementById('sort-by');
          if (sort) {
            sort.value = 'temperature:desc'; sort.dispatchEvent(new Event('change'));
            r.sortedTemperatures = [].map.call(document.querySelectorAll('#requests tbody tr'), function (tr) { return tr.getAttribute('data-sort-temperature'); });
            sort.value = 'where:asc'; sort.dispatchEvent(new Event('change'));
          }
          r.noRequests = text('#no-requests');
          parent.postMessage(JSON.stringify(r), '*');
        });
        """;
}
