using System.Collections.Immutable;
using System.Diagnostics;
using System.Reflection;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CodeActions;
using Microsoft.CodeAnalysis.CodeFixes;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Text;
using Temperance;
using Temperance.Benchmarks;
using Temperance.CodeFixes;

// Usage: dotnet run -c Release --project tests/Temperance.Benchmarks [-- --lines 100000] [--serial] [--only-temperance]
//        [--only dense|quiet|none] [--phases] [--real-build [--real-build-runs 3]] [--real-build-only]
//        [--settings-files [--settings-dirs 200]] (quiet C# of 20,000 lines unless --lines is given)
var settingsFiles = args.Contains("--settings-files");
var lines = args.SkipWhile(a => a != "--lines").Skip(1).Select(int.Parse).DefaultIfEmpty(settingsFiles ? 20_000 : 100_000).First();
Console.WriteLine($"Temperance benchmark: {lines:N0} lines, {Environment.ProcessorCount} cores, {RuntimeInformationText()}");

var framework = Basic.Reference.Assemblies.Net100.References.All.Cast<MetadataReference>().ToList();
var sdks = new[] { "OpenAI", "System.ClientModel", "System.Memory.Data", "Microsoft.Extensions.AI.Abstractions", "OllamaSharp" }
    .Select(n => MetadataReference.CreateFromFile(Path.Combine(AppContext.BaseDirectory, n + ".dll"))).Cast<MetadataReference>().ToList();
var onlyTemperance = args.Contains("--only-temperance");
// The second harness (real dotnet build of three projects): minutes at 100,000 lines, so only when asked for.
var realBuildRuns = args.SkipWhile(a => a != "--real-build-runs").Skip(1).Select(int.Parse).DefaultIfEmpty(3).First();
if (args.Contains("--real-build-only"))
{
    return RealBuild.Run(lines, realBuildRuns) == null ? 1 : 0;
}

const int Runs = 5; // each measurement is the median of this many runs
var table = new Temperance.Inventory.RulesTableOptions(Temperance.Inventory.RulesTableOptions.FindTable());
if (settingsFiles)
{
    // Temperance alone: settings files are its own cost, and NetAnalyzers only add noise to it on two cores.
    var directories = args.SkipWhile(a => a != "--settings-dirs").Skip(1).Select(int.Parse).DefaultIfEmpty(200).First();
    await SettingsFiles.Run(lines, directories, framework, framework.Concat(sdks).ToList(), table, Runs);
    return 0;
}

var netAnalyzers = onlyTemperance ? ImmutableArray<DiagnosticAnalyzer>.Empty : LoadNetAnalyzers();
Console.WriteLine($"NetAnalyzers 11.0.100: {netAnalyzers.Length} analyzers, every rule enabled");

if (args.Contains("--phases"))
{
    Phases.Print(SyntheticProject.Generate(lines, ProjectKind.Dense), framework.Concat(sdks).ToList(), table, Runs);
    Phases.Print(SyntheticProject.Generate(lines, ProjectKind.Quiet), framework.Concat(sdks).ToList(), table, Runs);
    return 0;
}

// --only dense|quiet|none measures one project (for profiling); the summary needs all three.
var only = args.SkipWhile(a => a != "--only").Skip(1).FirstOrDefault();
if (only != null)
{
    var kind = Enum.Parse<ProjectKind>(only, ignoreCase: true);
    await Measure(only, SyntheticProject.Generate(lines, kind), kind == ProjectKind.None ? framework : framework.Concat(sdks).ToList(), netAnalyzers, table);
    return 0;
}

var dense = await Measure("dense", SyntheticProject.Generate(lines, ProjectKind.Dense), framework.Concat(sdks).ToList(), netAnalyzers, table);
var quiet = await Measure("quiet", SyntheticProject.Generate(lines, ProjectKind.Quiet), framework.Concat(sdks).ToList(), netAnalyzers, table);
var none = await Measure("none", SyntheticProject.Generate(lines, ProjectKind.None), framework, netAnalyzers, table);
// A small settings-files measurement (the full one: --settings-files); printed under the table, in CI's last 12 lines.
var settingsLine = await SettingsFiles.Short(Math.Min(lines, 2_000), lines <= 2_000 ? quiet.CompileMs : null, framework.Concat(sdks).ToList(), table, Runs);

Console.WriteLine();
Console.WriteLine($"{"project",-7} {"compile ms",10} {"telemetry ms",13} {"telemetry/compile",18} {"NetAnalyzers median ms",23} {"telemetry/median",17} {"floor ms",9} {"floor/compile",14} {"above floor/compile",20} {"diagnostics",12}");
foreach (var r in new[] { dense, quiet, none })
{
    Console.WriteLine($"{r.Name,-7} {r.CompileMs,10:N0} {r.TemperanceMs,13:N1} {r.TemperanceMs / r.CompileMs * 100,17:N2}% {r.MedianMs,23:N1} {r.TemperanceMs / Math.Max(r.MedianMs, 0.001),17:N2} {r.FloorMs,9:N1} {r.FloorMs / r.CompileMs * 100,13:N2}% {(r.TemperanceActions == 0 ? "n/a (no actions)" : $"{(r.TemperanceMs - r.FloorMs) / r.CompileMs * 100:N2}%"),20} {r.Diagnostics,12:N0}");
}

Console.WriteLine(settingsLine);
// The wall-time difference is printed for information only: on a 2-core machine it moves by a second between runs.
Console.WriteLine($"target: Temperance telemetry <= 2% of compile time (dense): {(dense.TemperanceMs / dense.CompileMs <= 0.02 ? "met" : "NOT met")} ({dense.TemperanceMs / dense.CompileMs * 100:N1}%)");
Console.WriteLine($"target: Temperance telemetry <= median NetAnalyzers analyzer (dense): {(dense.TemperanceMs <= dense.MedianMs ? "met" : "NOT met")}");
// Whether the targets can be met at all: the floor is what the driver charges before any work of Temperance's own.
Console.WriteLine($"floor (dense): {dense.FloorMs / dense.CompileMs * 100:N1}% of compile time, {dense.FloorMs / Math.Max(dense.MedianMs, 0.001):N1} x the median NetAnalyzers analyzer");
Console.WriteLine($"target: no actions without an LLM SDK (none): {(none.TemperanceActions == 0 ? "met" : $"NOT met ({none.TemperanceActions} actions)")}");
Console.WriteLine($"peak working set: {Process.GetCurrentProcess().PeakWorkingSet64 / (1024 * 1024):N0} MiB");
await TimeCodeFix(framework.Concat(sdks).ToList(), table);
if (args.Contains("--real-build"))
{
    return RealBuild.Run(lines, realBuildRuns) == null ? 1 : 0;
}

Console.WriteLine("real build (dotnet build, ReportAnalyzer): skipped; pass --real-build (or --real-build-only)");
return 0;

static async Task<Result> Measure(string name, List<string> sources, List<MetadataReference> references, ImmutableArray<DiagnosticAnalyzer> netAnalyzers, AnalyzerConfigOptionsProvider table)
{
    var serial = Environment.GetCommandLineArgs().Contains("--serial"); // analyzers one at a time: steadier telemetry
    var trees = sources.Select((s, i) => CSharpSyntaxTree.ParseText(s, new CSharpParseOptions(LanguageVersion.Latest), path: $"/bench/{name}/File{i}.cs")).ToList();
    var options = new CSharpCompilationOptions(OutputKind.DynamicallyLinkedLibrary, nullableContextOptions: NullableContextOptions.Enable)
        .WithSpecificDiagnosticOptions(netAnalyzers.SelectMany(a => a.SupportedDiagnostics).Select(d => d.Id).Distinct()
            .Select(id => new KeyValuePair<string, ReportDiagnostic>(id, ReportDiagnostic.Warn)));
    CSharpCompilation Fresh() => CSharpCompilation.Create("Bench" + name, trees, references, options);

    // Compile time without analyzers: bind every declaration and method body (warm once, then the median of the runs).
    _ = Fresh().GetDiagnostics();
    var compileTimes = new List<double>();
    for (var i = 0; i < Runs; i++)
    {
        var watch = Stopwatch.StartNew();
        _ = Fresh().GetDiagnostics();
        compileTimes.Add(watch.Elapsed.TotalMilliseconds);
    }

    var gcShare = new List<double>();
    // Wall time of NetAnalyzers + Temperance minus NetAnalyzers alone, each on a fresh compilation: printed for
    // information, since on two cores it moves by more than Temperance costs.
    async Task<(double Wall, ImmutableArray<Diagnostic> Diagnostics, CompilationWithAnalyzers Run)> Analyze(ImmutableArray<DiagnosticAnalyzer> set)
    {
        // Each run starts from a collected heap, so the earlier runs' garbage is not collected inside this one's callbacks.
        GC.Collect();
        GC.WaitForPendingFinalizers();
        GC.Collect();
        var run = Fresh().WithAnalyzers(set, new CompilationWithAnalyzersOptions(
            new AnalyzerOptions(ImmutableArray<AdditionalText>.Empty, table), onAnalyzerException: null, concurrentAnalysis: !serial, logAnalyzerExecutionTime: true));
        var pausedBefore = GC.GetTotalPauseDuration();
        var watch = Stopwatch.StartNew();
        var found = await run.GetAnalyzerDiagnosticsAsync();
        gcShare.Add((GC.GetTotalPauseDuration() - pausedBefore).TotalMilliseconds / watch.Elapsed.TotalMilliseconds);
        return (watch.Elapsed.TotalMilliseconds, found, run);
    }

    // Telemetry is taken from every run and each analyzer's median kept: a single run charges whichever analyzer first
    // needs a lazily built compiler structure, which moves between runs.
    var temperance = new TemperanceAnalyzer();
    // One pass of Temperance alone tells the floor analyzer where to report (see ReportingFloorAnalyzer).
    var firstPass = await Fresh().WithAnalyzers(ImmutableArray.Create<DiagnosticAnalyzer>(temperance),
        new AnalyzerOptions(ImmutableArray<AdditionalText>.Empty, table)).GetAnalyzerDiagnosticsAsync();
    var floor = new ReportingFloorAnalyzer(firstPass);
    var all = netAnalyzers.Add(temperance).Add(floor);
    var baseline = new List<double>();
    var with = new List<double>();
    var telemetry = all.ToDictionary(a => a, _ => new List<double>());
    ImmutableArray<Diagnostic> diagnostics = default;
    var actions = 0;
    for (var i = 0; i < Runs; i++)
    {
        if (!netAnalyzers.IsEmpty)
        {
            baseline.Add((await Analyze(netAnalyzers)).Wall);
        }

        var run = await Analyze(all);
        with.Add(run.Wall);
        diagnostics = run.Diagnostics;
        foreach (var analyzer in all)
        {
            var info = await run.Run.GetAnalyzerTelemetryInfoAsync(analyzer, CancellationToken.None);
            telemetry[analyzer].Add(info.ExecutionTime.TotalMilliseconds);
            if (analyzer == temperance)
            {
                actions = info.OperationBlockStartActionsCount + info.OperationBlockActionsCount + info.OperationActionsCount + info.SyntaxNodeActionsCount
                    + info.SymbolActionsCount + info.CompilationEndActionsCount + info.SemanticModelActionsCount + info.SyntaxTreeActionsCount;
            }
        }
    }

    var times = netAnalyzers.Select(a => Median(telemetry[a])).OrderBy(t => t).ToList();
    if (times.Count == 0)
    {
        times.Add(double.NaN);
    }

    var ourTime = Median(telemetry[temperance]);
    if (netAnalyzers.Length > 0)
    {
        var rank = times.Count(t => t > ourTime);
        Console.WriteLine($"{name}: NetAnalyzers telemetry per analyzer (median of {Runs} runs): p25 {times[times.Count / 4]:N1} ms, median {times[times.Count / 2]:N1} ms,"
            + $" p75 {times[times.Count * 3 / 4]:N1} ms, p90 {times[times.Count * 9 / 10]:N1} ms, max {times[^1]:N1} ms; {rank} of {times.Count} cost more than Temperance ({ourTime:N1} ms)");
    }

    else
    {
        Console.WriteLine($"{name}: Temperance telemetry (median of {Runs} runs) {ourTime:N1} ms");
    }

    var floorTime = Median(telemetry[floor]);
    Console.WriteLine($"{name}: reporting floor (Temperance's shape, no work of its own, the same findings) {floorTime:N1} ms"
        + (actions == 0 ? "; Temperance registered no actions" : $"; Temperance above it {ourTime - floorTime:N1} ms"));
    var ours = diagnostics.Count(d => d.Id.StartsWith("SAMP", StringComparison.Ordinal));
    Console.WriteLine($"{name}: {trees.Count} files, {sources.Sum(s => s.Split('\n').Length):N0} lines, {ours:N0} Temperance diagnostics, {diagnostics.Length:N0} in all;"
        + $" analyzers wall {Median(baseline):N0} ms without Temperance, {Median(with):N0} ms with; GC pauses {Median(gcShare) * 100:N0}% of analysis wall time");
    return new Result(name, Median(compileTimes), ourTime, times[times.Count / 2], ours, actions, floorTime);
}

static ImmutableArray<DiagnosticAnalyzer> LoadNetAnalyzers()
{
    var packages = Environment.GetEnvironmentVariable("NUGET_PACKAGES") is { Length: > 0 } custom
        ? custom : Path.Combine(Environment.GetFolderPath(Environment.SpecialFolder.UserProfile), ".nuget", "packages");
    var folder = Path.Combine(packages, "microsoft.codeanalysis.netanalyzers", "11.0.100", "analyzers", "dotnet", "cs");
    var loader = new Loader();
    return Directory.GetFiles(folder, "*.dll")
        .SelectMany(path => new AnalyzerFileReference(path, loader).GetAnalyzers(LanguageNames.CSharp))
        .ToImmutableArray();
}

static async Task TimeCodeFix(List<MetadataReference> references, AnalyzerConfigOptionsProvider table)
{
    // A 5,000-line file with requests throughout: time one SAMP005 fix, computed and applied.
    var source = string.Join("\n", SyntheticProject.Generate(5_000, ProjectKind.Dense));
    source = string.Join("\n", source.Split('\n').Where(l => !l.StartsWith("using ", StringComparison.Ordinal) && !l.StartsWith("namespace ", StringComparison.Ordinal)));
    source = "using System; using System.Collections.Generic; using System.Linq; using OpenAI.Chat; using Microsoft.Extensions.AI; using OllamaSharp.Models;\nnamespace Ferry;\n" + source;
    using var workspace = new AdhocWorkspace();
    var project = workspace.AddProject("Fix", LanguageNames.CSharp).WithMetadataReferences(references)
        .WithCompilationOptions(new CSharpCompilationOptions(OutputKind.DynamicallyLinkedLibrary));
    var document = project.AddDocument("Large.cs", SourceText.From(source));
    var compilation = await document.Project.GetCompilationAsync();
    var diagnostics = await compilation!.WithAnalyzers(ImmutableArray.Create<DiagnosticAnalyzer>(new TemperanceAnalyzer()),
        new AnalyzerOptions(ImmutableArray<AdditionalText>.Empty, table)).GetAnalyzerDiagnosticsAsync();
    var target = diagnostics.First(d => d.Id == "SAMP005");
    var provider = new TemperanceCodeFixProvider();
    var watch = Stopwatch.StartNew();
    var actions = new List<CodeAction>();
    await provider.RegisterCodeFixesAsync(new CodeFixContext(document, target, (a, _) => actions.Add(a), CancellationToken.None));
    var operations = await actions[0].GetOperationsAsync(CancellationToken.None);
    var changed = operations.OfType<ApplyChangesOperation>().Single().ChangedSolution.GetDocument(document.Id)!;
    _ = await changed.GetTextAsync();
    Console.WriteLine($"code fix on a {source.Split('\n').Length:N0}-line file: {watch.Elapsed.TotalMilliseconds:N0} ms ({actions[0].Title})");
}

static string RuntimeInformationText() => System.Runtime.InteropServices.RuntimeInformation.FrameworkDescription;

static double Median(List<double> values) => values.Count == 0 ? double.NaN : values.OrderBy(v => v).ElementAt(values.Count / 2);

internal sealed record Result(string Name, double CompileMs, double TemperanceMs, double MedianMs, int Diagnostics, int TemperanceActions, double FloorMs);

internal sealed class Loader : IAnalyzerAssemblyLoader
{
    public void AddDependencyLocation(string fullPath) { }

    public Assembly LoadFromPath(string fullPath) => Assembly.LoadFrom(fullPath);
}
