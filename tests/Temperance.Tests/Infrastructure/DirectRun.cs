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
    private static readonly Lazy<ImmutableDictionary<string, string>> Table = new(() =>
    {
        var builder = ImmutableDictionary.CreateBuilder<string, string>(StringComparer.OrdinalIgnoreCase);
        foreach (var line in TestReferences.RulesTable.Split('\n'))
        {
            var text = line.Trim();
            var equals = text.IndexOf('=');
            if (text.Length == 0 || text.StartsWith('#') || equals < 0)
            {
                continue;
            }

            builder[text[..equals].Trim()] = text[(equals + 1)..].Trim();
        }

        return builder.ToImmutable();
    });

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
            new AnalyzerOptions(ImmutableArray<AdditionalText>.Empty, new TableOptionsProvider(Table.Value)),
            onAnalyzerException: (exception, _, _) => { lock (exceptions) { exceptions.Add(exception); } },
            concurrentAnalysis: concurrent,
            logAnalyzerExecutionTime: false);
        var analyzers = ImmutableArray.Create<DiagnosticAnalyzer>(new TemperanceAnalyzer());
        var diagnostics = await compilation.WithAnalyzers(analyzers, options).GetAnalyzerDiagnosticsAsync();
        return new Outcome(diagnostics, exceptions);
    }

    private sealed class TableOptionsProvider : AnalyzerConfigOptionsProvider
    {
        private readonly DictionaryOptions options;

        public TableOptionsProvider(ImmutableDictionary<string, string> values) => options = new DictionaryOptions(values);

        public override AnalyzerConfigOptions GlobalOptions => options;

        public override AnalyzerConfigOptions GetOptions(SyntaxTree tree) => options;

        public override AnalyzerConfigOptions GetOptions(AdditionalText textFile) => options;
    }

    private sealed class DictionaryOptions : AnalyzerConfigOptions
    {
        private readonly ImmutableDictionary<string, string> values;

        public DictionaryOptions(ImmutableDictionary<string, string> values) => this.values = values;

        public override bool TryGetValue(string key, out string value) => values.TryGetValue(key, out value!);

        public override IEnumerable<string> Keys => values.Keys;
    }
}
