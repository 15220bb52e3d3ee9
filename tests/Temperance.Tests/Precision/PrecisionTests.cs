using System.Collections.Immutable;
using System.Globalization;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.Diagnostics;
using Temperance.Tests.Infrastructure;
using Xunit.Abstractions;

namespace Temperance.Tests.Precision;

/// <summary>
/// Precision of the analyzer on <see cref="PrecisionCorpus"/>: every case compiles without errors against the real SDKs,
/// is analysed with the shipped rules table (plus the case's own global-config lines), and must report exactly the
/// findings it expects; over the whole corpus, at least nine reported findings in ten are true and none is lost.
/// </summary>
public class PrecisionTests
{
    /// <summary>Experimental-API diagnostics of the SDKs (errors by default), suppressed as in <see cref="TemperanceTest"/>.</summary>
    private static readonly string[] SdkExperimentalIds = { "OPENAI001", "SCME0001", "SCME0002", "SKEXP0001", "SKEXP0010", "MEAI001", "AOAI001" };

    private readonly ITestOutputHelper output;

    public PrecisionTests(ITestOutputHelper output) => this.output = output;

    public static TheoryData<string> CaseNames => PrecisionCase.Names(PrecisionCorpus.Cases);

    [Theory]
    [MemberData(nameof(CaseNames))]
    public async Task Case_ReportsExactlyTheExpectedFindings(string name)
    {
        var @case = PrecisionCorpus.Find(name);
        var run = await RunAsync(@case);

        Assert.True(run.CompileErrors.Count == 0, "The snippet does not compile:\n" + string.Join("\n", run.CompileErrors));
        Assert.True(run.AnalyzerExceptions.Count == 0, "The analyzer threw:\n" + string.Join("\n", run.AnalyzerExceptions));

        var score = Score(@case, run.Findings);
        foreach (var line in Describe(@case, score))
        {
            output.WriteLine(line);
        }

        Assert.True(score.False.Count == 0 && score.Lost.Count == 0, string.Join("\n", Describe(@case, score)));
    }

    [Fact]
    public async Task Precision_OnTheCorpus_IsAtLeastNinetyPercent_WithNoTrueFindingLost()
    {
        int truePositives = 0, falsePositives = 0, lost = 0;
        var broken = new List<string>();
        var details = new List<string>();
        foreach (var @case in PrecisionCorpus.Cases)
        {
            var run = await RunAsync(@case);
            if (run.CompileErrors.Count > 0 || run.AnalyzerExceptions.Count > 0)
            {
                broken.Add($"{@case.Name}: {run.CompileErrors.Count} compile error(s), {run.AnalyzerExceptions.Count} analyzer exception(s)");
                continue;
            }

            var score = Score(@case, run.Findings);
            truePositives += score.True.Count;
            falsePositives += score.False.Count;
            lost += score.Lost.Count;
            if (score.False.Count > 0 || score.Lost.Count > 0)
            {
                details.AddRange(Describe(@case, score));
            }
        }

        var reported = truePositives + falsePositives;
        var precision = reported == 0 ? 1.0 : truePositives / (double)reported;
        var cases = PrecisionCorpus.Cases;
        output.WriteLine($"cases: {cases.Count} ({cases.Count(c => c.IsSilent)} silent, {cases.Count(c => !c.IsSilent)} with true findings)");
        output.WriteLine($"expected findings: {cases.Sum(c => c.Expected.Count)}");
        output.WriteLine($"true findings (expected and reported): {truePositives}");
        output.WriteLine($"false findings (reported, not expected): {falsePositives}");
        output.WriteLine($"lost findings (expected, not reported): {lost}");
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"precision: {precision:P1} ({truePositives}/{reported})"));
        foreach (var line in broken.Concat(details))
        {
            output.WriteLine(line);
        }

        Assert.Empty(broken);
        Assert.True(precision >= 0.90, string.Create(CultureInfo.InvariantCulture, $"precision {precision:P1} is below 90%:\n") + string.Join("\n", details));
        Assert.True(lost == 0, $"{lost} true finding(s) lost:\n" + string.Join("\n", details));
    }

    // ---- running one case ------------------------------------------------------------------------------------------

    /// <summary>A reported finding: the diagnostic and the text of the source line it starts on.</summary>
    public sealed record Finding(Diagnostic Diagnostic, string FilePath, int Line, string LineText)
    {
        public override string ToString() =>
            $"{Diagnostic.Id} ({Diagnostic.Severity}) {FilePath}:{Line}: {Diagnostic.GetMessage(CultureInfo.InvariantCulture)} | line: {LineText.Trim()}";
    }

    public sealed record Run(IReadOnlyList<string> CompileErrors, IReadOnlyList<Exception> AnalyzerExceptions, IReadOnlyList<Finding> Findings);

    public sealed record CaseScore(IReadOnlyList<Finding> True, IReadOnlyList<Finding> False, IReadOnlyList<ExpectedFinding> Lost);

    /// <summary>
    /// Compiles the case like <see cref="DirectRun.Compile"/>, under the case's own assembly name (test projects are
    /// recognised by it), with the SDKs' experimental diagnostics suppressed.
    /// </summary>
    public static CSharpCompilation Compile(IEnumerable<string> sources, string assemblyName) =>
        CSharpCompilation.Create(
            assemblyName,
            sources.Select((s, i) => CSharpSyntaxTree.ParseText(s, new CSharpParseOptions(LanguageVersion.Latest), path: $"/src/{assemblyName}/File{i}.cs")),
            TestReferences.All,
            new CSharpCompilationOptions(
                OutputKind.DynamicallyLinkedLibrary,
                nullableContextOptions: NullableContextOptions.Enable,
                specificDiagnosticOptions: SdkExperimentalIds.Select(id => new KeyValuePair<string, ReportDiagnostic>(id, ReportDiagnostic.Suppress))));

    public static async Task<Run> RunAsync(PrecisionCase @case)
    {
        var compilation = Compile(@case.Sources, @case.AssemblyName);
        var errors = compilation.GetDiagnostics()
            .Where(d => d.Severity == DiagnosticSeverity.Error)
            .Select(d => d.ToString())
            .ToList();

        // The shipped rules table, with the case's own lines appended (a later key wins, as in RulesTableOptions).
        var globalConfig = TestReferences.RulesTable + "\n" + string.Join("\n", @case.GlobalConfig) + "\n";
        var exceptions = new List<Exception>();
        var options = new CompilationWithAnalyzersOptions(
            new AnalyzerOptions(ImmutableArray<AdditionalText>.Empty, new Temperance.Inventory.RulesTableOptions(globalConfig)),
            onAnalyzerException: (exception, _, _) => { lock (exceptions) { exceptions.Add(exception); } },
            concurrentAnalysis: true,
            logAnalyzerExecutionTime: false);
        var diagnostics = await compilation.WithAnalyzers(ImmutableArray.Create<DiagnosticAnalyzer>(new TemperanceAnalyzer()), options).GetAnalyzerDiagnosticsAsync();

        var findings = diagnostics
            .Where(d => d.Id.StartsWith("SAMP", StringComparison.Ordinal) && d.Severity is DiagnosticSeverity.Warning or DiagnosticSeverity.Info)
            .OrderBy(d => d.Location.SourceTree?.FilePath, StringComparer.Ordinal)
            .ThenBy(d => d.Location.SourceSpan.Start)
            .Select(ToFinding)
            .ToList();
        return new Run(errors, exceptions, findings);
    }

    private static Finding ToFinding(Diagnostic diagnostic)
    {
        var tree = diagnostic.Location.SourceTree;
        if (tree == null)
        {
            return new Finding(diagnostic, "(no file)", 0, string.Empty);
        }

        var line = diagnostic.Location.GetLineSpan().StartLinePosition.Line;
        return new Finding(diagnostic, tree.FilePath, line + 1, tree.GetText().Lines[line].ToString());
    }

    /// <summary>Pairs each reported finding with an expected one of the same rule whose text is on its line.</summary>
    public static CaseScore Score(PrecisionCase @case, IReadOnlyList<Finding> findings)
    {
        var open = @case.Expected.ToList();
        var truePositives = new List<Finding>();
        var falsePositives = new List<Finding>();
        foreach (var finding in findings)
        {
            var match = open.FindIndex(e => e.Id == finding.Diagnostic.Id && finding.LineText.Contains(e.LineContains, StringComparison.Ordinal));
            if (match >= 0)
            {
                truePositives.Add(finding);
                open.RemoveAt(match);
            }
            else
            {
                falsePositives.Add(finding);
            }
        }

        return new CaseScore(truePositives, falsePositives, open);
    }

    private static IEnumerable<string> Describe(PrecisionCase @case, CaseScore score)
    {
        yield return $"{@case.Name} ({@case.AssemblyName}): {score.True.Count} true, {score.False.Count} false, {score.Lost.Count} lost";
        foreach (var finding in score.False)
        {
            yield return "  false: " + finding;
        }

        foreach (var expected in score.Lost)
        {
            yield return "  lost:  " + expected;
        }
    }
}
