using System.Diagnostics;
using System.Globalization;
using System.Text.RegularExpressions;

namespace Temperance.Benchmarks;

/// <summary>
/// The second harness: three real SDK-style projects built with <c>dotnet build -p:ReportAnalyzer=true</c>, next to
/// every NetAnalyzers rule (<c>AnalysisMode=All</c>), with Temperance referenced the way its package does (the analyzer
/// dll, the rules table as a global analyzer config, the package's buildTransitive props and targets). Figures come from
/// the compiler's own report: per-analyzer execution time, and the Csc task time of a build without analyzers.
/// </summary>
public static partial class RealBuild
{
    private const string TfmOfProjects = "net10.0";

    /// <summary>Package versions as tests/Temperance.Tests/Temperance.Tests.csproj uses them.</summary>
    private static readonly (string Id, string Version)[] SdkPackages =
    {
        ("OpenAI", "2.15.0"),
        ("Microsoft.Extensions.AI.Abstractions", "10.11.0"),
        ("OllamaSharp", "5.5.2"),
    };

    /// <summary>
    /// --real-build-cold: a fresh csc process per build, so Temperance's JIT and first-use costs land in every build (CI
    /// machines that set UseSharedCompilation=false). Default: the compiler server, warm after the warm-up build, as
    /// <c>dotnet build</c> runs on a developer machine.
    /// </summary>
    private static bool Cold => Environment.GetCommandLineArgs().Contains("--real-build-cold");

    public static List<RealResult>? Run(int lines, int runs)
    {
        var root = FindRepositoryRoot();
        var analyzer = Path.Combine(root, "src", "Temperance.Analyzers", "bin", "Release", "netstandard2.0", "Temperance.Analyzers.dll");
        if (!File.Exists(analyzer))
        {
            Console.WriteLine($"real build: {analyzer} not found; build the solution in Release first");
            return null;
        }

        var work = Path.Combine(Path.GetTempPath(), $"temperance-realbuild-{Environment.ProcessId}");
        Directory.CreateDirectory(work);
        try
        {
            // Stop MSBuild's upward search for Directory.Build.* at the temp directory.
            File.WriteAllText(Path.Combine(work, "Directory.Build.props"), "<Project />\n");
            File.WriteAllText(Path.Combine(work, "Directory.Build.targets"), "<Project />\n");
            var package = LayOutPackage(root, work);
            // A copy, so the solution can be rebuilt while this runs.
            var analyzerCopy = Path.Combine(work, "package", "analyzers", "dotnet", "cs", "Temperance.Analyzers.dll");
            Directory.CreateDirectory(Path.GetDirectoryName(analyzerCopy)!);
            File.Copy(analyzer, analyzerCopy);
            Console.WriteLine();
            Console.WriteLine($"real build: dotnet build of three {TfmOfProjects} projects of {lines:N0} lines each in {work}, AnalysisMode=All, Temperance from {analyzer};"
                + $" {(Cold ? "a fresh csc process per build (UseSharedCompilation=false)" : "the compiler server (UseSharedCompilation=true)")}; median of {runs} build(s) each, after a warm-up build");
            // Warm-up on a small dense project: the compiler server loads and jits every analyzer once (it keeps them
            // across builds), so no measured build pays for that. At 100,000 lines a build with analyzers takes minutes here.
            Measure(work, "warmup", analyzerCopy, ProjectKind.Dense, 2_000, runs: 1, quiet: true, package);
            var results = new List<RealResult>();
            // --only dense|quiet|none builds one project (for profiling); the summary needs all three.
            var only = Environment.GetCommandLineArgs().SkipWhile(a => a != "--only").Skip(1).FirstOrDefault();
            foreach (var kind in new[] { ProjectKind.Dense, ProjectKind.Quiet, ProjectKind.None })
            {
                if (only == null || string.Equals(only, kind.ToString(), StringComparison.OrdinalIgnoreCase))
                {
                    results.Add(Measure(work, kind.ToString().ToLowerInvariant(), analyzerCopy, kind, lines, runs, quiet: false, package));
                }
            }

            if (results.Count == 3)
            {
                Print(results, runs);
            }

            return results;
        }
        finally
        {
            try
            {
                if (Environment.GetCommandLineArgs().Contains("--real-build-keep"))
                {
                    Console.WriteLine($"real build: projects and logs kept in {work}");
                }
                else
                {
                    Directory.Delete(work, recursive: true);
                }
            }
            catch (IOException)
            {
                // Left behind in the temp directory; harmless.
            }
        }
    }

    /// <summary>The package's buildTransitive folder as it ships: props, targets, the rules table and the presets next to them.</summary>
    private static string LayOutPackage(string root, string work)
    {
        var folder = Path.Combine(work, "package", "buildTransitive");
        Directory.CreateDirectory(Path.Combine(folder, "presets"));
        foreach (var file in Directory.GetFiles(Path.Combine(root, "src", "Temperance.Package", "buildTransitive")))
        {
            File.Copy(file, Path.Combine(folder, Path.GetFileName(file)));
        }

        File.Copy(Path.Combine(root, "rules", "temperance.globalconfig"), Path.Combine(folder, "temperance.globalconfig"));
        foreach (var preset in Directory.GetFiles(Path.Combine(root, "rules", "presets"), "*.globalconfig"))
        {
            File.Copy(preset, Path.Combine(folder, "presets", Path.GetFileName(preset)));
        }

        return folder;
    }

    private static RealResult Measure(string work, string name, string analyzer, ProjectKind kind, int lines, int runs, bool quiet, string package)
    {
        var folder = Path.Combine(work, name);
        Directory.CreateDirectory(folder);
        var sources = SyntheticProject.Generate(lines, kind);
        for (var i = 0; i < sources.Count; i++)
        {
            File.WriteAllText(Path.Combine(folder, $"File{i}.cs"), sources[i]);
        }

        var project = Path.Combine(folder, $"Bench.{name}.csproj");
        File.WriteAllText(project, ProjectFile(package, analyzer, kind));
        var restore = Dotnet(folder, "restore", $"\"{project}\"", "-nologo", "-v:q");
        if (restore.ExitCode != 0)
        {
            throw new InvalidOperationException($"real build: restore of {name} failed:\n{restore.Output}");
        }

        var withAnalyzers = new List<BuildReport>();
        var withoutAnalyzers = new List<BuildReport>();
        for (var i = 0; i < runs; i++)
        {
            withoutAnalyzers.Add(Build(folder, project, runAnalyzers: false, $"off{i}"));
            withAnalyzers.Add(Build(folder, project, runAnalyzers: true, $"on{i}"));
        }

        var compile = Median(withoutAnalyzers.Select(r => r.CscMs));
        var temperance = Median(withAnalyzers.Select(r => r.TemperanceMs));
        var netMedian = Median(withAnalyzers.Select(r => r.NetAnalyzersMedianMs));
        var last = withAnalyzers[^1];
        if (quiet)
        {
            return new RealResult(name, compile, temperance, netMedian, last.Warnings, last.TotalAnalyzerMs);
        }

        Console.WriteLine($"real build {name}: {sources.Count} files, {sources.Sum(s => s.Split('\n').Length):N0} lines; Csc without analyzers {compile:N0} ms,"
            + $" with {Median(withAnalyzers.Select(r => r.CscMs)):N0} ms; analyzers total {Median(withAnalyzers.Select(r => r.TotalAnalyzerMs)):N0} ms;"
            + $" Temperance {temperance:N0} ms ({string.Join(", ", withAnalyzers.Select(r => r.TemperanceMs.ToString("N0", CultureInfo.InvariantCulture)))});"
            + $" NetAnalyzers {last.NetAnalyzersCount} analyzers, median {netMedian:N1} ms, p90 {Median(withAnalyzers.Select(r => r.NetAnalyzersP90Ms)):N0} ms;"
            + $" {last.Warnings:N0} SAMP warnings");
        return new RealResult(name, compile, temperance, netMedian, last.Warnings, Median(withAnalyzers.Select(r => r.TotalAnalyzerMs)));
    }

    private static string ProjectFile(string package, string analyzer, ProjectKind kind)
    {
        var references = kind == ProjectKind.None ? string.Empty
            : string.Concat(SdkPackages.Select(p => $"    <PackageReference Include=\"{p.Id}\" Version=\"{p.Version}\" />\n"));
        return $"""
            <Project Sdk="Microsoft.NET.Sdk">
              <Import Project="{package}/Temperance.Analyzers.props" />
              <PropertyGroup>
                <TargetFramework>{TfmOfProjects}</TargetFramework>
                <Nullable>enable</Nullable>
                <ImplicitUsings>disable</ImplicitUsings>
                <!-- Every NetAnalyzers rule, as warnings; a warning never fails this build. -->
                <AnalysisMode>All</AnalysisMode>
                <TreatWarningsAsErrors>false</TreatWarningsAsErrors>
                <CodeAnalysisTreatWarningsAsErrors>false</CodeAnalysisTreatWarningsAsErrors>
                <NoWarn>$(NoWarn);NU1603;NU1608;NU1701</NoWarn>
                <GenerateDocumentationFile>false</GenerateDocumentationFile>
              </PropertyGroup>
              <ItemGroup>
            {references}    <Analyzer Include="{analyzer}" />
              </ItemGroup>
              <Import Project="{package}/Temperance.Analyzers.targets" />
            </Project>

            """;
    }

    private static BuildReport Build(string folder, string project, bool runAnalyzers, string tag)
    {
        var log = Path.Combine(folder, $"build-{tag}.log");
        var result = Dotnet(folder, "build", $"\"{project}\"", "--no-restore", "--no-incremental", "-c", "Release", "-nologo",
            $"-p:RunAnalyzers={(runAnalyzers ? "true" : "false")}", "-p:ReportAnalyzer=true", $"-p:UseSharedCompilation={(Cold ? "false" : "true")}", "-clp:ErrorsOnly",
            $"\"-flp:v=d;logfile={log};performancesummary\"");
        if (result.ExitCode != 0)
        {
            throw new InvalidOperationException($"real build: {project} ({tag}) failed, see {log}:\n{result.Output}");
        }

        return BuildReport.Parse(File.ReadAllLines(log));
    }

    private static (int ExitCode, string Output) Dotnet(string folder, params string[] arguments)
    {
        var start = new ProcessStartInfo("dotnet", string.Join(' ', arguments))
        {
            WorkingDirectory = folder,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
        };
        start.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        start.Environment["DOTNET_NOLOGO"] = "1";
        using var process = Process.Start(start)!;
        var stderr = process.StandardError.ReadToEndAsync();
        var stdout = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        return (process.ExitCode, stdout + stderr.Result);
    }

    private static void Print(List<RealResult> results, int runs)
    {
        Console.WriteLine();
        Console.WriteLine($"{"real build",-10} {"Csc no analyzers ms",20} {"Temperance ms",14} {"of compile",11} {"NetAnalyzers median ms",23} {"Temperance/median",18} {"SAMP warnings",14}");
        foreach (var r in results)
        {
            Console.WriteLine($"{r.Name,-10} {r.CompileMs,20:N0} {r.TemperanceMs,14:N0} {r.Share * 100,10:N2}% {r.NetMedianMs,23:N1} {r.RatioToMedian,18:N1} {r.Warnings,14:N0}");
        }

        var dense = results.Single(r => r.Name == "dense");
        var quiet = results.Single(r => r.Name == "quiet");
        var none = results.Single(r => r.Name == "none");
        Console.WriteLine($"real build target dense <= 2% of compile: {Met(dense.Share <= 0.02)} ({dense.Share * 100:N2}%)");
        Console.WriteLine($"real build target quiet <= 0.3% of compile and <= 2 x NetAnalyzers median: {Met(quiet.Share <= 0.003 && quiet.RatioToMedian <= 2)}"
            + $" ({quiet.Share * 100:N2}%, {quiet.RatioToMedian:N1} x)");
        Console.WriteLine($"real build target none <= 0.1% of compile: {Met(none.Share <= 0.001)} ({none.Share * 100:N2}%)");
        Console.WriteLine("real build: times are the compiler's ReportAnalyzer figures, 1 ms resolution ('<0.001 s' counted as 0.5 ms)");
    }

    private static string Met(bool met) => met ? "met" : "NOT met";

    private static double Median(IEnumerable<double> values)
    {
        var sorted = values.OrderBy(v => v).ToList();
        return sorted.Count == 0 ? double.NaN : sorted[sorted.Count / 2];
    }

    private static string FindRepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir != null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "Analyzers.sln")))
            {
                return dir.FullName;
            }
        }

        throw new InvalidOperationException("real build: Analyzers.sln not found above " + AppContext.BaseDirectory);
    }

    /// <summary>What one build's detailed log says: Csc task time, and the analyzer execution report.</summary>
    internal sealed partial record BuildReport(double CscMs, double TotalAnalyzerMs, double TemperanceMs, double NetAnalyzersMedianMs, double NetAnalyzersP90Ms,
        int NetAnalyzersCount, int Warnings)
    {
        public static BuildReport Parse(IReadOnlyList<string> log)
        {
            double csc = double.NaN, total = 0, temperance = 0;
            var net = new List<double>();
            string? assembly = null;
            var inReport = false;
            var warnings = new HashSet<string>(StringComparer.Ordinal);
            foreach (var line in log)
            {
                if (CscTask().Match(line) is { Success: true } task)
                {
                    csc = double.Parse(task.Groups[1].Value, NumberStyles.Number, CultureInfo.InvariantCulture);
                    continue;
                }

                if (line.Contains(": warning SAMP", StringComparison.Ordinal))
                {
                    warnings.Add(NodePrefix().Replace(line, string.Empty)); // MSBuild repeats each warning in its summary
                    continue;
                }

                if (TotalLine().Match(line) is { Success: true } totalMatch)
                {
                    total = Seconds(totalMatch.Groups[1].Value);
                    inReport = true;
                    assembly = null;
                    continue;
                }

                if (!inReport)
                {
                    continue;
                }

                if (ReportLine().Match(line) is not { Success: true } row)
                {
                    if (line.Contains("Done executing task", StringComparison.Ordinal) || line.Contains("generator execution time", StringComparison.Ordinal))
                    {
                        inReport = false;
                    }

                    continue;
                }

                var time = Seconds(row.Groups[1].Value);
                var label = row.Groups[3].Value;
                if (label.Contains(", Version=", StringComparison.Ordinal))
                {
                    assembly = label[..label.IndexOf(',')];
                    if (assembly == "Temperance.Analyzers")
                    {
                        temperance = time;
                    }
                }
                else if (assembly != null && assembly.Contains("NetAnalyzers", StringComparison.Ordinal))
                {
                    net.Add(time);
                }
            }

            net.Sort();
            var median = net.Count == 0 ? double.NaN : net[net.Count / 2];
            var p90 = net.Count == 0 ? double.NaN : net[net.Count * 9 / 10];
            return new BuildReport(csc, total, temperance, median, p90, net.Count, warnings.Count);
        }

        /// <summary>Seconds as the compiler prints them ("0.123", "&lt;0.001") to milliseconds; below resolution counts as half of it.</summary>
        private static double Seconds(string text) => text.StartsWith('<') ? 0.5 : double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture) * 1000;

        [GeneratedRegex(@"^\s+(\d[\d,]*) ms\s+Csc\s+\d+ calls")]
        private static partial Regex CscTask();

        [GeneratedRegex(@"^\s*(\d+(:\d+)?>)?")]
        private static partial Regex NodePrefix();

        [GeneratedRegex(@"Total analyzer execution time: ([\d.]+) seconds")]
        private static partial Regex TotalLine();

        [GeneratedRegex(@"^\s+(<?\d+\.\d+)\s+(<?\d+)\s+(\S.*)$")]
        private static partial Regex ReportLine();
    }
}

public sealed record RealResult(string Name, double CompileMs, double TemperanceMs, double NetMedianMs, int Warnings, double TotalAnalyzerMs)
{
    public double Share => TemperanceMs / CompileMs;

    public double RatioToMedian => TemperanceMs / NetMedianMs;
}
