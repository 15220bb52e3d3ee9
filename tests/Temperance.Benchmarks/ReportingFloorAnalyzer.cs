using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Text;

namespace Temperance.Benchmarks;

/// <summary>
/// The yardstick for what the driver charges before any of Temperance's own work: an analyzer with Temperance's shape
/// (a block start, an operation action on the same kinds, a block end) that decides nothing and reports a plain
/// diagnostic wherever Temperance reported one in an earlier pass. Its telemetry is the floor any analyzer pays for
/// finding these requests block by block and reporting these findings; Temperance's telemetry above it is its own work.
/// </summary>
[DiagnosticAnalyzer(LanguageNames.CSharp)]
internal sealed class ReportingFloorAnalyzer : DiagnosticAnalyzer
{
    private static readonly DiagnosticDescriptor Finding = new("FLOOR001", "Reporting floor", "Reported where Temperance reports",
        "Benchmark", DiagnosticSeverity.Warning, isEnabledByDefault: true);

    private readonly Dictionary<string, TextSpan[]> spansByFile;

    public ReportingFloorAnalyzer(IEnumerable<Diagnostic> temperanceFindings)
    {
        spansByFile = temperanceFindings.Where(d => d.Location.IsInSource)
            .GroupBy(d => d.Location.SourceTree!.FilePath)
            .ToDictionary(g => g.Key, g => g.Select(d => d.Location.SourceSpan).ToArray());
    }

    public override ImmutableArray<DiagnosticDescriptor> SupportedDiagnostics => ImmutableArray.Create(Finding);

    public override void Initialize(AnalysisContext context)
    {
        context.EnableConcurrentExecution();
        context.ConfigureGeneratedCodeAnalysis(GeneratedCodeAnalysisFlags.Analyze | GeneratedCodeAnalysisFlags.ReportDiagnostics);
        context.RegisterOperationBlockStartAction(start =>
        {
            start.RegisterOperationAction(static _ => { }, TemperanceAnalyzer.CandidateKinds);
            start.RegisterOperationBlockEndAction(end =>
            {
                if (end.OperationBlocks.Length == 0)
                {
                    return;
                }

                var tree = end.OperationBlocks[0].Syntax.SyntaxTree;
                if (!spansByFile.TryGetValue(tree.FilePath, out var spans))
                {
                    return;
                }

                foreach (var block in end.OperationBlocks)
                {
                    foreach (var span in spans)
                    {
                        if (block.Syntax.Span.Contains(span))
                        {
                            end.ReportDiagnostic(Diagnostic.Create(Finding, Location.Create(tree, span)));
                        }
                    }
                }
            });
        });
    }
}
