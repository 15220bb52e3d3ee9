using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.Diagnostics;

namespace Temperance.Tests.Infrastructure;

/// <summary>
/// Runs the analyzer straight through CompilationWithAnalyzers (no test framework), with the shipped rules table as
/// global options, and collects analyzer exceptions instead of hiding them.
/// </summary>
public static class DirectRun
{
    private static readonly Lazy<Temperance.Inventory.RulesTableOptions> Table = new(() => new Temperance.Inventory.RulesTableOptions(TestReferences.RulesTable));

    public sealed record Outcome(ImmutableArray<Diagnostic> Diagnostics, IReadOnlyList<Exception> AnalyzerExceptions);

    public static CSharpCompilation Compile(IEnumerable<string> sources) =>
        CSharpCompilation.Create(
            "Robustness",
            sources.Select((s, i) => CSharpSyntaxTree.ParseText(s, new CSharpParseOptions(LanguageVersion.Latest), path: $"/src/File{i}.cs")),
            TestReferences.All,
            new CSharpCompilationOptions(OutputKind.DynamicallyLinkedLibrary, nullableContextOptions: NullableContextOptions.Enable));

    public static async Task<Outcome> AnalyzeAsync(Compilation compilation, bool concurrent = true)
    {
        var exceptions = new List<Exception>();
        var options = new CompilationWithAnalyzersOptions(
            new AnalyzerOptions(ImmutableArray<AdditionalText>.Empty, Table.Value),
            onAnalyzerException: (exception, _, _) => { lock (exceptions) { exceptions.Add(exception); } },
            concurrentAnalysis: concurrent,
            logAnalyzerExecutionTime: false);
        var analyzers = ImmutableArray.Create<DiagnosticAnalyzer>(new TemperanceAnalyzer());
        var diagnostics = await compilation.WithAnalyzers(analyzers, options).GetAnalyzerDiagnosticsAsync();
        return new Outcome(diagnostics, exceptions);
    }
}
