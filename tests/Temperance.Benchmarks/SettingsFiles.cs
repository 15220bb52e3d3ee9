using System.Collections.Immutable;
using System.Diagnostics;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Text;
using Temperance.Files;
using Temperance.Policy;
using Temperance.Surfaces;

namespace Temperance.Benchmarks;

/// <summary>
/// What settings files passed as additional files cost: Temperance alone (no other analyzer) on the same C# with and
/// without them, in the compiler's driver; then each kind of file on its own beside a one-line C# file, how the cost
/// per prompt directory grows with their number, and the pieces of the work warm and outside the driver.
/// </summary>
public static class SettingsFiles
{
    private static bool Serial => Environment.GetCommandLineArgs().Contains("--serial");

    /// <summary>The full measurement (<c>--settings-files</c>).</summary>
    public static async Task Run(int lines, int directories, List<MetadataReference> framework, List<MetadataReference> withSdks, AnalyzerConfigOptionsProvider table, int runs)
    {
        var set = SettingsFileSet.Generate(directories, yamlFiles: 100, appSettingsKeys: 5_000);
        var appSize = set.AppSettings.GetText()!.Length;
        Console.WriteLine($"settings files: {set.Directories} prompt directories (config.json with 1-3 services + skprompt.txt), {set.Yaml.Count} YAML files"
            + $" without sampling keys ({set.Yaml.Count(f => FileSurfaces.MayHoldSettings(f.GetText()!.ToString()))} pass the cheap scan),"
            + $" appsettings.json of {appSize / 1024.0:N0} KB ({SettingsFileSet.CountKeys(set.AppSettings.GetText()!.ToString()):N0} keys, comments, trailing commas;"
            + " one section binds a temperature and a top_p, so it is parsed)");
        var main = await Compare(SyntheticProject.Generate(lines, ProjectKind.Quiet), withSdks, table, set.All.ToImmutableArray(), runs, null);
        Console.WriteLine();
        Console.WriteLine($"Temperance alone, quiet C# of {main.Lines:N0} lines, median of {runs} runs (allocation: the whole analysis, the driver's binding included)");
        Console.WriteLine($"{"",-26} {"telemetry ms",13} {"process CPU ms",15} {"allocated MB",13} {"GC pauses ms",13} {"findings",9}");
        Console.WriteLine($"{"C# alone",-26} {main.Without.Telemetry,13:N1} {main.Without.CpuMs,15:N0} {main.Without.AllocatedMb,13:N0} {main.Without.GcPauseMs,13:N0} {main.Without.Findings,9:N0}");
        Console.WriteLine($"{"C# + settings files",-26} {main.With.Telemetry,13:N1} {main.With.CpuMs,15:N0} {main.With.AllocatedMb,13:N0} {main.With.GcPauseMs,13:N0} {main.With.Findings,9:N0}");
        Console.WriteLine($"{"settings files (diff.)",-26} {main.FilesMs,13:N1} {main.FilesCpuMs,15:N0} {main.With.AllocatedMb - main.Without.AllocatedMb,13:N1}"
            + $" {main.With.GcPauseMs - main.Without.GcPauseMs,13:N0} {main.FileFindings,9:N0}  ({main.ByRule})");
        Console.WriteLine($"compile (bind all) {main.CompileMs:N0} ms; settings files / compile {main.FilesMs / main.CompileMs * 100:N2} %;"
            + $" settings files / Temperance on the C# alone {main.FilesMs / main.Without.Telemetry:N2} x; analysis wall {main.Without.Wall:N0} ms without, {main.With.Wall:N0} ms with");

        // Each kind on its own, beside one line of C# (no SDK: Temperance registers nothing for code), against the same compilation without files.
        var tiny = new List<string> { "namespace Bakery; public sealed class Placeholder { }" };
        var empty = await Compare(tiny, framework, table, ImmutableArray<AdditionalText>.Empty, runs, null, measureCompile: false);
        var baseline = empty.Without;
        async Task<(double Ms, double CpuMs, double Kb, int Findings)> Alone(IEnumerable<AdditionalText> files)
        {
            var result = await Compare(tiny, framework, table, files.ToImmutableArray(), runs, baseline, measureCompile: false);
            return (result.FilesMs, result.FilesCpuMs, (result.With.AllocatedMb - baseline.AllocatedMb) * 1024, result.FileFindings);
        }

        Console.WriteLine();
        Console.WriteLine($"each kind alone beside one line of C#, minus the same without files (median of {runs}): telemetry, and the process's CPU time"
            + " (steadier on a shared machine: time the thread was not running is not counted)");
        var all = await Alone(set.All);
        Console.WriteLine($"  all of them together:      telemetry {all.Ms,7:N1} ms, CPU {all.CpuMs,7:N1} ms, {all.Kb / 1024,5:N1} MB allocated; telemetry = {all.Ms / main.CompileMs * 100:N2} % of the compile"
            + $" time above, {all.Ms / main.Without.Telemetry:N2} x Temperance on that C# (beside the C# being bound the same callbacks measured {main.FilesMs / Math.Max(all.Ms, 0.001):N1} x this)");
        var dirs = await Alone(set.PromptDirectories);
        Console.WriteLine($"  per prompt directory:      telemetry {dirs.Ms * 1000 / set.Directories,7:N1} µs, CPU {dirs.CpuMs * 1000 / set.Directories,7:N1} µs, {dirs.Kb / set.Directories,5:N1} KB allocated"
            + $" (config.json read and judged, skprompt.txt looked up; {dirs.Findings} findings in {set.Directories})");
        var yaml = await Alone(set.Yaml);
        Console.WriteLine($"  per YAML, no sampling key: telemetry {yaml.Ms * 1000 / set.Yaml.Count,7:N1} µs, CPU {yaml.CpuMs * 1000 / set.Yaml.Count,7:N1} µs, {yaml.Kb / set.Yaml.Count,5:N1} KB allocated (the cheap scan only)");
        var app = await Alone(new[] { set.AppSettings });
        Console.WriteLine($"  appsettings.json, {appSize / 1024.0:N0} KB:  telemetry {app.Ms,7:N2} ms, CPU {app.CpuMs,7:N2} ms, {app.Kb / 1024,5:N1} MB allocated (sampling keys found by the scan, so parsed)");
        var quietApp = new TextFile(set.AppSettings.Path, SettingsFileSet.WithoutSamplingKeys(set.AppSettings.GetText()!.ToString()));
        var appScan = await Alone(new[] { quietApp });
        Console.WriteLine($"  the same without them:     telemetry {appScan.Ms,7:N2} ms, CPU {appScan.CpuMs,7:N2} ms (the scan only)");

        Console.WriteLine();
        Console.WriteLine("prompt directories alone, by count (skprompt.txt found through the index SettingsFileContext builds once):");
        foreach (var count in new[] { 50, 200, 800 })
        {
            var scaled = SettingsFileSet.Generate(count, 0, 0).PromptDirectories;
            var result = await Alone(scaled);
            Console.WriteLine($"  {count,4} directories ({scaled.Count,5} files): telemetry {result.Ms,7:N1} ms ({result.Ms * 1000 / count,6:N1} µs per directory),"
                + $" CPU {result.CpuMs,7:N1} ms ({result.CpuMs * 1000 / count,6:N1} µs per directory)");
        }

        Warm(runs);
    }

    /// <summary>The small version in the default run: one line, for the summary.</summary>
    /// <param name="compileMs">The compile time of this quiet project when the caller has measured it already.</param>
    public static async Task<string> Short(int lines, double? compileMs, List<MetadataReference> withSdks, AnalyzerConfigOptionsProvider table, int runs)
    {
        var watch = Stopwatch.StartNew();
        var set = SettingsFileSet.Generate(50, yamlFiles: 25, appSettingsKeys: 1_250);
        var r = await Compare(SyntheticProject.Generate(lines, ProjectKind.Quiet), withSdks, table, set.All.ToImmutableArray(), runs, null, measureCompile: compileMs == null);
        r = r with { CompileMs = compileMs ?? r.CompileMs };
        return $"settings files ({set.Directories} prompt dirs, {set.Yaml.Count} YAML, {set.AppSettings.GetText()!.Length / 1024:N0} KB appsettings; quiet C# {r.Lines:N0} lines; Temperance alone):"
            + $" telemetry +{r.FilesMs:N1} ms = {r.FilesMs / r.CompileMs * 100:N1}% of compile, {r.FilesMs / r.Without.Telemetry:N1} x Temperance on the C#; process CPU +{r.FilesCpuMs:N0} ms; {r.FileFindings} findings in files ({watch.Elapsed.TotalSeconds:N1} s)";
    }

    /// <summary>One analysis: Temperance's telemetry (wall clock inside its callbacks), the process's CPU time and allocation, GC pauses.</summary>
    private sealed record Sample(double Telemetry, double AllocatedMb, int Findings, double Wall, double GcPauseMs, double CpuMs);

    private sealed record Comparison(int Lines, double CompileMs, Sample Without, Sample With, int FileFindings, string ByRule)
    {
        public double FilesMs => With.Telemetry - Without.Telemetry;
        public double FilesCpuMs => With.CpuMs - Without.CpuMs;
    }

    /// <summary>
    /// The same C# with and without the files, runs interleaved so drift on a shared machine lands on both; each figure
    /// the median of its runs. A known baseline (the files-alone cases) is measured once and passed in.
    /// </summary>
    private static async Task<Comparison> Compare(List<string> sources, List<MetadataReference> references, AnalyzerConfigOptionsProvider table,
        ImmutableArray<AdditionalText> files, int runs, Sample? knownWithout, bool measureCompile = true)
    {
        var trees = sources.Select((s, i) => CSharpSyntaxTree.ParseText(s, new CSharpParseOptions(LanguageVersion.Latest), path: $"/bench/settings/File{i}.cs")).ToList();
        var options = new CSharpCompilationOptions(OutputKind.DynamicallyLinkedLibrary, nullableContextOptions: NullableContextOptions.Enable);
        CSharpCompilation Fresh() => CSharpCompilation.Create("BenchSettings", trees, references, options);

        var compile = new List<double>();
        if (measureCompile)
        {
            _ = Fresh().GetDiagnostics();
            for (var i = 0; i < runs; i++)
            {
                var watch = Stopwatch.StartNew();
                _ = Fresh().GetDiagnostics();
                compile.Add(watch.Elapsed.TotalMilliseconds);
            }
        }

        // One warm-up of each, then the runs.
        await Once(Fresh(), table, files);
        var without = new List<Sample>();
        var with = new List<Sample>();
        ImmutableArray<Diagnostic> diagnostics = default;
        for (var i = 0; i < runs; i++)
        {
            if (knownWithout == null)
            {
                without.Add((await Once(Fresh(), table, ImmutableArray<AdditionalText>.Empty)).Run);
            }

            var (run, found) = await Once(Fresh(), table, files);
            with.Add(run);
            diagnostics = found;
        }

        var inFiles = diagnostics.Where(d => d.Location.Kind == LocationKind.ExternalFile).ToList();
        var byRule = string.Join(", ", inFiles.GroupBy(d => d.Id).OrderBy(g => g.Key).Select(g => $"{g.Key} {g.Count()}"));
        return new Comparison(sources.Sum(s => s.Split('\n').Length), compile.Count == 0 ? double.NaN : Median(compile),
            knownWithout ?? Mid(without), Mid(with), inFiles.Count, byRule.Length == 0 ? "none" : byRule);
    }

    private static Sample Mid(List<Sample> runs) => new(Median(runs.Select(r => r.Telemetry)), Median(runs.Select(r => r.AllocatedMb)), runs[^1].Findings, Median(runs.Select(r => r.Wall)), Median(runs.Select(r => r.GcPauseMs)), Median(runs.Select(r => r.CpuMs)));

    private static async Task<(Sample Run, ImmutableArray<Diagnostic> Diagnostics)> Once(Compilation compilation, AnalyzerConfigOptionsProvider table, ImmutableArray<AdditionalText> files)
    {
        GC.Collect();
        GC.WaitForPendingFinalizers();
        GC.Collect();
        var temperance = new TemperanceAnalyzer();
        var analysis = compilation.WithAnalyzers(ImmutableArray.Create<DiagnosticAnalyzer>(temperance), new CompilationWithAnalyzersOptions(
            new AnalyzerOptions(files, table), onAnalyzerException: null, concurrentAnalysis: !Serial, logAnalyzerExecutionTime: true));
        var allocated = GC.GetTotalAllocatedBytes(precise: true);
        var paused = GC.GetTotalPauseDuration();
        var cpu = Process.GetCurrentProcess().TotalProcessorTime;
        var watch = Stopwatch.StartNew();
        var found = await analysis.GetAnalyzerDiagnosticsAsync();
        var wall = watch.Elapsed.TotalMilliseconds;
        allocated = GC.GetTotalAllocatedBytes(precise: true) - allocated;
        var pause = (GC.GetTotalPauseDuration() - paused).TotalMilliseconds;
        cpu = Process.GetCurrentProcess().TotalProcessorTime - cpu;
        var info = await analysis.GetAnalyzerTelemetryInfoAsync(temperance, CancellationToken.None);
        return (new Sample(info.ExecutionTime.TotalMilliseconds, allocated / (1024.0 * 1024), found.Length, wall, pause, cpu.TotalMilliseconds), found);
    }

    /// <summary>
    /// The pieces, warm and outside the driver (median of the runs): the sibling lookup as SettingsFileAnalysis.Sibling
    /// does it (copied here, since it needs the driver's context) and with an index built once, reading and judging a
    /// config.json, the scan of a YAML file, and scanning and parsing appsettings.json.
    /// </summary>
    private static void Warm(int runs)
    {
        Console.WriteLine();
        Console.WriteLine($"warm, outside the driver, one thread (median of {runs}, thread CPU time):");
        var table = new Temperance.Inventory.RulesTableOptions(Temperance.Inventory.RulesTableOptions.FindTable());
        foreach (var count in new[] { 200, 800, 2_000 })
        {
            // The additional files as a project passes them: the prompt directories, then 100 other files.
            var set = SettingsFileSet.Generate(count, 100, 0);
            var files = set.PromptDirectories.Concat(set.Yaml).ToImmutableArray();
            var configs = set.PromptDirectories.Take(count).ToList();
            var written = Time(runs, () =>
            {
                foreach (var config in configs)
                {
                    _ = SiblingAsWritten(files, config.Path, "skprompt.txt") ?? throw new InvalidOperationException("no sibling");
                }
            });
            // The shipped lookup: SettingsFileContext indexes the additional files once per compilation.
            var indexed = Time(runs, () =>
            {
                var siblings = new SettingsFileContext(files);
                foreach (var config in configs)
                {
                    _ = siblings.Find(config.Path, "skprompt.txt", CancellationToken.None) ?? throw new InvalidOperationException("no sibling");
                }
            });
            var allocatedWritten = Allocated(() =>
            {
                foreach (var config in configs)
                {
                    _ = SiblingAsWritten(files, config.Path, "skprompt.txt");
                }
            });
            Console.WriteLine($"  sibling lookup, {count,5:N0} directories ({files.Length,5:N0} additional files): a scan per file (the first version) {written,8:N2} ms ({written * 1000 / count,6:N1} µs and"
                + $" {allocatedWritten / 1024.0 / count,5:N1} KB per directory); SettingsFileContext (shipped, indexed once) {indexed,6:N2} ms ({indexed * 1000 / count,4:N1} µs per directory)");
        }

        var sample = SettingsFileSet.Generate(200, 100, 5_000);
        var prompts = sample.PromptDirectories.Take(200).Zip(sample.PromptDirectories.Skip(200)).ToList();
        // config.json in steps: the scan, Json.NET into the file tree, the requests (task signals from the sibling text
        // included), then the rules: with a new policy per file as SettingsFileAnalysis does, and with one shared policy (shipped: one per set of temperance.* keys).
        var texts = prompts.Select(p => (Path: p.First.Path, Text: p.First.GetText()!, Sibling: p.Second.GetText()!.ToString())).ToList();
        var scanMs = Time(runs, () => texts.ForEach(t => FileSurfaces.MayHoldSettings(t.Text.ToString())));
        var parseMs = Time(runs, () => texts.ForEach(t => JsonFileReader.Read(t.Text, out _)));
        var requests = texts.Select(t => (t.Path, Requests: FileRequestReader.Read(t.Path, t.Text, FileSurfaces.PromptDirectory, t.Sibling, inTestProject: false, out _))).ToList();
        var readMs = Time(runs, () => texts.ForEach(t => FileRequestReader.Read(t.Path, t.Text, FileSurfaces.PromptDirectory, t.Sibling, inTestProject: false, out _)));
        var findings = 0;
        var judgeMs = Time(runs, () =>
        {
            findings = 0;
            foreach (var (path, found) in requests)
            {
                TemperanceAnalyzer.Judge(found, new TemperancePolicy(table.GlobalOptions, table.GlobalOptions), _ => findings++);
            }
        });
        // In a build the rules table comes through GlobalOptions and a file's own options hold only its editorconfig
        // sections (often nothing); this harness, like the C# one, passes the table as both.
        var emptyJudgeMs = Time(runs, () => requests.ForEach(r => TemperanceAnalyzer.Judge(r.Requests, new TemperancePolicy(NoOptions.Instance, table.GlobalOptions), _ => { })));
        var shared = new TemperancePolicy(table.GlobalOptions, table.GlobalOptions);
        var sharedMs = Time(runs, () => requests.ForEach(r => TemperanceAnalyzer.Judge(r.Requests, shared, _ => { })));
        var readBytes = Allocated(() => texts.ForEach(t => FileRequestReader.Read(t.Path, t.Text, FileSurfaces.PromptDirectory, t.Sibling, inTestProject: false, out _)));
        var judgeBytes = Allocated(() => requests.ForEach(r => TemperanceAnalyzer.Judge(r.Requests, new TemperancePolicy(table.GlobalOptions, table.GlobalOptions), _ => { })));
        double Each(double ms) => ms * 1000 / texts.Count;
        Console.WriteLine($"  config.json, per file ({requests.Sum(r => r.Requests.Count) / (double)texts.Count:N1} services on average, {findings} findings in {texts.Count}): scan {Each(scanMs):N1} µs;"
            + $" Json.NET into the file tree {Each(parseMs):N1} µs; read into requests (parse included) {Each(readMs):N1} µs, {readBytes / 1024.0 / texts.Count:N1} KB;"
            + $" rules with a new policy per file (the first version) {Each(judgeMs):N1} µs, {judgeBytes / 1024.0 / texts.Count:N1} KB (file options empty, as in most builds: {Each(emptyJudgeMs):N1} µs);"
            + $" with one shared policy (shipped: one per set of temperance.* keys) {Each(sharedMs):N1} µs");
        var yamlTexts = sample.Yaml.Select(f => f.GetText()!.ToString()).ToList();
        var scan = Time(runs, () =>
        {
            foreach (var text in yamlTexts)
            {
                _ = FileSurfaces.MayHoldSettings(text);
            }
        });
        Console.WriteLine($"  YAML scan (MayHoldSettings): {scan * 1000 / yamlTexts.Count:N1} µs per file of {yamlTexts.Average(t => t.Length):N0} characters");
        var app = sample.AppSettings.GetText()!;
        var withoutKeys = SettingsFileSet.WithoutSamplingKeys(app.ToString());
        var appScan = Time(runs, () => FileSurfaces.MayHoldSettings(withoutKeys));
        var appParse = Time(runs, () => JsonFileReader.Read(app, out _));
        var appBytes = Allocated(() => JsonFileReader.Read(app, out _));
        // What the analyzer does with an appsettings file: a plain reader pass (JsonFileReader.Validate) over its text.
        var appText = app.ToString();
        var readerOnly = Time(runs, () => JsonFileReader.Validate(appText));
        Console.WriteLine($"  appsettings.json, {app.Length / 1024.0:N0} KB: scan {appScan:N2} ms (without sampling keys: every key searched to the end);"
            + $" JsonFileReader.Read {appParse:N2} ms, {appBytes / (1024.0 * 1024):N1} MB (a tree of every key); JsonFileReader.Validate (shipped: whether it parses) {readerOnly:N2} ms");
    }

    /// <summary>SettingsFileAnalysis.Sibling as of this commit, with the additional files passed in.</summary>
    private static string? SiblingAsWritten(ImmutableArray<AdditionalText> files, string path, string name)
    {
        var directory = Path.GetDirectoryName(path);
        foreach (var other in files)
        {
            if (Path.GetFileName(other.Path).Equals(name, StringComparison.OrdinalIgnoreCase)
                && string.Equals(Path.GetDirectoryName(other.Path), directory, StringComparison.Ordinal))
            {
                return other.GetText()?.ToString();
            }
        }

        return null;
    }

    /// <summary>The suggested fix: the sibling files by directory, built once per compilation.</summary>

    /// <summary>Median thread CPU milliseconds of <paramref name="runs"/> runs after one warm-up (wall clock where the OS gives no thread time).</summary>
    private static double Time(int runs, Action action)
    {
        action();
        var times = new List<double>();
        for (var i = 0; i < runs; i++)
        {
            var start = ThreadCpuMs();
            action();
            times.Add(ThreadCpuMs() - start);
        }

        return Median(times);
    }

    private static double ThreadCpuMs()
    {
        if (OperatingSystem.IsLinux() && clock_gettime(3 /* CLOCK_THREAD_CPUTIME_ID */, out var now) == 0)
        {
            return now.Seconds * 1000.0 + now.Nanoseconds / 1_000_000.0;
        }

        return Stopwatch.GetTimestamp() * 1000.0 / Stopwatch.Frequency;
    }

    [System.Runtime.InteropServices.DllImport("libc")]
    private static extern int clock_gettime(int clock, out TimeSpec time);

    private struct TimeSpec
    {
        public long Seconds;
        public long Nanoseconds;
    }

    private static long Allocated(Action action)
    {
        var before = GC.GetAllocatedBytesForCurrentThread();
        action();
        return GC.GetAllocatedBytesForCurrentThread() - before;
    }

    private static double Median(IEnumerable<double> values)
    {
        var sorted = values.OrderBy(v => v).ToList();
        return sorted.Count == 0 ? double.NaN : sorted[sorted.Count / 2];
    }

    private sealed class NoOptions : AnalyzerConfigOptions
    {
        public static readonly NoOptions Instance = new();

        public override bool TryGetValue(string key, out string value)
        {
            value = string.Empty;
            return false;
        }

        public override IEnumerable<string> Keys => Array.Empty<string>();
    }
}
