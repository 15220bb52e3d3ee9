using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Diagnostics;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Reachability;

/// <summary>Hosts that do not implement <c>AnalyzerConfigOptions.Keys</c> (some throw NotImplementedException there).</summary>
public class HostTests
{
    [Fact]
    public async Task OptionsWhoseKeysThrow_AreReadByName_WithoutAnAnalyzerException()
    {
        var compilation = DirectRun.Compile(new[]
        {
            """
            using OpenAI.Chat;

            class Beacon
            {
                ChatCompletionOptions Options() => new ChatCompletionOptions { Temperature = 2.5f };
            }
            """,
        });
        var table = new Temperance.Inventory.RulesTableOptions(TestReferences.RulesTable);
        var exceptions = new List<Exception>();
        var options = new CompilationWithAnalyzersOptions(
            new AnalyzerOptions(ImmutableArray<AdditionalText>.Empty, new KeylessProvider(table)),
            onAnalyzerException: (e, _, _) => exceptions.Add(e), concurrentAnalysis: false, logAnalyzerExecutionTime: false);

        var diagnostics = await compilation.WithAnalyzers(ImmutableArray.Create<DiagnosticAnalyzer>(new TemperanceAnalyzer()), options).GetAnalyzerDiagnosticsAsync();

        Assert.Empty(exceptions);
        Assert.Contains(diagnostics, d => d.Id == "SAMP005");
    }

    private sealed class KeylessProvider : AnalyzerConfigOptionsProvider
    {
        private readonly KeylessOptions options;

        public KeylessProvider(Temperance.Inventory.RulesTableOptions table) => options = new KeylessOptions(table);

        public override AnalyzerConfigOptions GlobalOptions => options;

        public override AnalyzerConfigOptions GetOptions(SyntaxTree tree) => options;

        public override AnalyzerConfigOptions GetOptions(AdditionalText textFile) => options;
    }

    private sealed class KeylessOptions : AnalyzerConfigOptions
    {
        private readonly Temperance.Inventory.RulesTableOptions table;

        public KeylessOptions(Temperance.Inventory.RulesTableOptions table) => this.table = table;

        public override bool TryGetValue(string key, out string value) => table.TryGetValue(key, out value);

        public override IEnumerable<string> Keys => throw new NotImplementedException();
    }
}
