using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Robustness;

/// <summary>The same diagnostics, in the same order once sorted, with concurrent execution on and off.</summary>
public class DeterminismTests
{
    [Fact]
    public async Task DemoAndTestSnippets_GiveTheSameDiagnostics_ConcurrentOrNot()
    {
        var sources = TypingRobustnessTests.DemoFiles();
        var compilation = DirectRun.Compile(sources);
        var serial = await DirectRun.AnalyzeAsync(compilation, concurrent: false);
        var parallel = await DirectRun.AnalyzeAsync(compilation, concurrent: true);
        var again = await DirectRun.AnalyzeAsync(compilation, concurrent: true);

        Assert.Empty(serial.AnalyzerExceptions);
        Assert.True(serial.Diagnostics.Length >= 10, "the demo should raise many diagnostics: " + serial.Diagnostics.Length);
        Assert.Equal(Render(serial), Render(parallel));
        Assert.Equal(Render(parallel), Render(again));
    }

    [Fact]
    public async Task SyntheticDenseProject_GivesTheSameDiagnostics_ConcurrentOrNot()
    {
        var compilation = DirectRun.Compile(Temperance.Benchmarks.SyntheticProject.Generate(3_000, Temperance.Benchmarks.ProjectKind.Dense));
        var serial = await DirectRun.AnalyzeAsync(compilation, concurrent: false);
        var parallel = await DirectRun.AnalyzeAsync(compilation, concurrent: true);

        Assert.Empty(serial.AnalyzerExceptions);
        Assert.True(serial.Diagnostics.Length >= 50, "the dense project has a request every ~45 lines: " + serial.Diagnostics.Length);
        Assert.Equal(Render(serial), Render(parallel));
    }

    private static string[] Render(DirectRun.Outcome outcome) =>
        outcome.Diagnostics
            .Select(d => $"{d.Location.GetLineSpan()} {d.Id} {d.GetMessage(System.Globalization.CultureInfo.InvariantCulture)} [{string.Join(",", d.Properties.OrderBy(p => p.Key).Select(p => p.Key + "=" + p.Value))}]")
            .OrderBy(s => s, StringComparer.Ordinal)
            .ToArray();
}
