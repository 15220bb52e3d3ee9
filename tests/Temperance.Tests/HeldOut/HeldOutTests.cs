using System.Globalization;
using Temperance.Tests.Precision;
using Xunit.Abstractions;

namespace Temperance.Tests.HeldOut;

/// <summary>
/// Precision of the analyzer on <see cref="HeldOutCorpus"/>, a corpus written independently of the analyzer and of
/// <see cref="PrecisionCorpus"/>, modelled on the shapes of public .NET LLM code bases (Semantic Kernel connector
/// unit and integration tests, Microsoft.Extensions.AI tests, openai-dotnet tests and examples, OllamaSharp tests,
/// the Anthropic SDK examples). Each case compiles against the real SDKs and must report exactly its findings.
/// </summary>
public class HeldOutTests
{
    private readonly ITestOutputHelper output;

    public HeldOutTests(ITestOutputHelper output) => this.output = output;

    public static TheoryData<string> CaseNames => PrecisionCase.Names(HeldOutCorpus.Cases);

    [Theory]
    [MemberData(nameof(CaseNames))]
    public async Task HeldOutCase_ReportsExactlyTheExpectedFindings(string name)
    {
        var @case = HeldOutCorpus.Find(name);
        var run = await PrecisionTests.RunAsync(@case);

        Assert.True(run.CompileErrors.Count == 0, "The snippet does not compile:\n" + string.Join("\n", run.CompileErrors));
        Assert.True(run.AnalyzerExceptions.Count == 0, "The analyzer threw:\n" + string.Join("\n", run.AnalyzerExceptions));

        var score = PrecisionTests.Score(@case, run.Findings);
        foreach (var line in Describe(@case, score, run.Findings))
        {
            output.WriteLine(line);
        }

        Assert.True(score.False.Count == 0 && score.Lost.Count == 0, string.Join("\n", Describe(@case, score, run.Findings)));
    }

    [Fact]
    public async Task HeldOutPrecision_IsReported()
    {
        int truePositives = 0, falsePositives = 0, lost = 0;
        var broken = new List<string>();
        var details = new List<string>();
        foreach (var @case in HeldOutCorpus.Cases)
        {
            var run = await PrecisionTests.RunAsync(@case);
            if (run.CompileErrors.Count > 0 || run.AnalyzerExceptions.Count > 0)
            {
                broken.Add($"{@case.Name}: {run.CompileErrors.Count} compile error(s), {run.AnalyzerExceptions.Count} analyzer exception(s)");
                broken.AddRange(run.CompileErrors.Select(e => "  " + e));
                broken.AddRange(run.AnalyzerExceptions.Select(e => "  " + e.Message));
                continue;
            }

            var score = PrecisionTests.Score(@case, run.Findings);
            truePositives += score.True.Count;
            falsePositives += score.False.Count;
            lost += score.Lost.Count;
            if (score.False.Count > 0 || score.Lost.Count > 0)
            {
                details.AddRange(Describe(@case, score, run.Findings));
            }
        }

        var reported = truePositives + falsePositives;
        var precision = reported == 0 ? 1.0 : truePositives / (double)reported;
        var cases = HeldOutCorpus.Cases;
        output.WriteLine($"held-out cases: {cases.Count} ({cases.Count(c => c.IsSilent)} silent, {cases.Count(c => !c.IsSilent)} with true findings)");
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

    private static IEnumerable<string> Describe(PrecisionCase @case, PrecisionTests.CaseScore score, IReadOnlyList<PrecisionTests.Finding> all)
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

        if (score.False.Count > 0 || score.Lost.Count > 0)
        {
            foreach (var finding in all)
            {
                yield return "  reported: " + finding;
            }
        }
    }
}
