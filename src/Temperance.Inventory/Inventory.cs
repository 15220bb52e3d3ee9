using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Extraction;
using Temperance.Model;
using Temperance.Policy;
using Temperance.Surfaces;

namespace Temperance.Inventory;

/// <summary>One setting of a request as the report shows it.</summary>
public sealed record SettingRow(string Name, double? Value, string Source);

/// <summary>One finding on a request.</summary>
public sealed record FindingRow(string Id, string Severity, string Message);

/// <summary>One LLM request found in the code.</summary>
public sealed record RequestRow(
    string Project, string File, int Line, string Sdk, string Provider, string? Model,
    string? Task, string? TaskEvidence, IReadOnlyList<SettingRow> Settings, IReadOnlyList<FindingRow> Findings,
    string? NotJudged = null);

/// <summary>
/// Runs the analyzer's own extraction and rules over a project: the same Surfaces, RequestBuilder, TaskInference and
/// analyzer, so the report and the build never disagree.
/// </summary>
public static class Inventory
{
    private static readonly Setting[] Reported = { Setting.Temperature, Setting.TopP, Setting.TopK, Setting.Seed, Setting.Candidates };

    public static async Task<List<RequestRow>> CollectAsync(Project project, RulesTableOptions table, CancellationToken cancellationToken)
    {
        var rows = new List<RequestRow>();
        var compilation = await project.GetCompilationAsync(cancellationToken).ConfigureAwait(false);
        if (compilation == null)
        {
            return rows;
        }

        var options = new FallbackOptions(project.AnalyzerOptions.AnalyzerConfigOptionsProvider, table);
        var analyzer = new TemperanceAnalyzer();
        var withAnalyzer = compilation.WithAnalyzers(ImmutableArray.Create<DiagnosticAnalyzer>(analyzer),
            new AnalyzerOptions(ImmutableArray<AdditionalText>.Empty, options));
        var diagnostics = (await withAnalyzer.GetAnalyzerDiagnosticsAsync(cancellationToken).ConfigureAwait(false))
            .Where(d => d.Id.StartsWith("SAMP", StringComparison.Ordinal) && d.Severity != DiagnosticSeverity.Hidden)
            .ToList();

        var config = CompilationConfig.Read(compilation, options);
        var catalog = SurfaceCatalog.Resolve(compilation, config.Surfaces, config.RawJson);
        var tests = TestFrameworks.Resolve(compilation, options.GlobalOptions);
        var generated = new GeneratedCode(compilation, options);
        foreach (var tree in compilation.SyntaxTrees)
        {
            var model = compilation.GetSemanticModel(tree);
            var policy = new TemperancePolicy(options.GetOptions(tree), options.GlobalOptions);
            foreach (var (operation, owner) in MemberBlocks.Of(tree, model, cancellationToken))
            {
                var collector = generated.Contains(tree, owner, cancellationToken) ? null : BlockCollector.Collect(catalog, new[] { operation });
                if (collector == null)
                {
                    continue;
                }

                if (owner == null)
                {
                    continue;
                }

                var context = tests.ContextOf(owner, policy.TestAttributes);
                foreach (var request in RequestBuilder.Build(catalog, context, collector, new[] { operation }))
                {
                    rows.Add(Row(project, request, policy, diagnostics));
                }
            }
        }

        return rows;
    }

    private static RequestRow Row(Project project, Request request, TemperancePolicy policy, List<Diagnostic> diagnostics)
    {
        var span = request.Location.GetLineSpan();
        var task = TaskInference.Infer(request, policy);
        var settings = new List<SettingRow>();
        foreach (var setting in Reported)
        {
            var kind = request.KindOf(setting, out var value);
            var last = request.LastWrite(setting);
            settings.Add(kind switch
            {
                ValueKind.Known => new SettingRow(setting.KeyName(), value, last?.Origin ?? (last?.FromConditional == true ? "conditional (worst branch)" : "literal")),
                ValueKind.Unset when policy.Default(request.Provider, setting) is { } fallback => new SettingRow(setting.KeyName(), fallback.Value,
                    setting != Setting.Temperature || policy.UnsetMeansDefault(request.Provider) ? "default of the provider" : "unset; the provider's default is usually this"),
                ValueKind.Unset => new SettingRow(setting.KeyName(), null, "unset"),
                _ => new SettingRow(setting.KeyName(), null, "unknown"),
            });
        }

        var places = new HashSet<(string, int)> { Key(request.Location) };
        foreach (var write in request.Writes)
        {
            places.Add(Key(write.Location));
        }

        if (request.SendingCallLocation != null)
        {
            places.Add(Key(request.SendingCallLocation));
        }

        var findings = diagnostics
            .Where(d => d.Location.IsInSource && (places.Contains(Key(d.Location)) || Within(d.Location, request.Location)))
            .Select(d => new FindingRow(d.Id, d.Severity.ToString(), d.GetMessage(System.Globalization.CultureInfo.InvariantCulture)))
            .Distinct()
            .ToList();
        return new RequestRow(project.Name, span.Path, span.StartLinePosition.Line + 1, request.Surface, request.Provider,
            request.EffectiveModelId, task?.Kind, task?.Because, settings, findings, request.SilentBecause);
    }

    private static (string, int) Key(Location location) => (location.SourceTree?.FilePath ?? string.Empty, location.SourceSpan.Start);

    private static bool Within(Location inner, Location outer) =>
        inner.SourceTree == outer.SourceTree && outer.SourceSpan.Contains(inner.SourceSpan);

    /// <summary>The project's own configuration first, the shipped table under it (for projects without the package).</summary>
    private sealed class FallbackOptions : AnalyzerConfigOptionsProvider
    {
        private readonly AnalyzerConfigOptionsProvider project;
        private readonly RulesTableOptions table;

        public FallbackOptions(AnalyzerConfigOptionsProvider project, RulesTableOptions table)
        {
            this.project = project;
            this.table = table;
        }

        public override AnalyzerConfigOptions GlobalOptions => new Layered(project.GlobalOptions, table);

        public override AnalyzerConfigOptions GetOptions(SyntaxTree tree) => new Layered(project.GetOptions(tree), table);

        public override AnalyzerConfigOptions GetOptions(AdditionalText textFile) => new Layered(project.GetOptions(textFile), table);

        private sealed class Layered : AnalyzerConfigOptions
        {
            private readonly AnalyzerConfigOptions top;
            private readonly RulesTableOptions bottom;

            public Layered(AnalyzerConfigOptions top, RulesTableOptions bottom)
            {
                this.top = top;
                this.bottom = bottom;
            }

            public override bool TryGetValue(string key, out string value) => top.TryGetValue(key, out value!) || bottom.TryGetValue(key, out value!);

            public override IEnumerable<string> Keys => top.Keys.Concat(bottom.Keys).Distinct(StringComparer.OrdinalIgnoreCase);
        }
    }
}
