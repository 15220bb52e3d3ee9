using System.Collections.Immutable;
using System.Globalization;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Extraction;
using Temperance.Model;
using Temperance.Policy;
using Temperance.Surfaces;

namespace Temperance.Inventory;

/// <summary>The requests of one project, or why it could not be analysed (then there are none to trust).</summary>
public sealed record ProjectInventory(List<RequestRow> Rows, string? Problem);

/// <summary>
/// Runs the analyzer's own extraction and rules over a project: the same Surfaces, RequestBuilder, TaskInference and
/// analyzer, so the report and the build never disagree.
/// </summary>
public static class Inventory
{
    private static readonly Setting[] Reported = { Setting.Temperature, Setting.TopP, Setting.TopK, Setting.Seed, Setting.Candidates };

    /// <summary>
    /// The project's requests, or (with no rows) the reason it cannot be analysed: not restored, or compile errors that hide
    /// its LLM SDK. A project the tool cannot read is never reported as one without requests.
    /// </summary>
    public static async Task<ProjectInventory> CollectAsync(Project project, RulesTableOptions table, CancellationToken cancellationToken)
    {
        var rows = new List<RequestRow>();
        if (ProjectCheck.NotRestored(project) is { } notRestored)
        {
            return new ProjectInventory(rows, notRestored);
        }

        var compilation = await project.GetCompilationAsync(cancellationToken).ConfigureAwait(false);
        if (compilation == null)
        {
            return new ProjectInventory(rows, $"{ProjectCheck.Describe(project)} gives no compilation (is it a C# project?)");
        }

        var options = new FallbackOptions(project.AnalyzerOptions.AnalyzerConfigOptionsProvider, table);
        var config = CompilationConfig.Read(compilation, options);
        var teamNamespaces = config.Surfaces.Select(s => s.MetadataName.Contains('.', StringComparison.Ordinal) ? s.MetadataName[..s.MetadataName.LastIndexOf('.')] : string.Empty)
            .Where(n => n.Length > 0);
        if (ProjectCheck.SdkHidden(project, compilation, teamNamespaces, cancellationToken) is { } hidden)
        {
            return new ProjectInventory(rows, hidden);
        }

        var analyzer = new TemperanceAnalyzer();
        var settingsFiles = SettingsFiles.Of(project);
        var withAnalyzer = compilation.WithAnalyzers(ImmutableArray.Create<DiagnosticAnalyzer>(analyzer),
            new AnalyzerOptions(settingsFiles, options));
        var diagnostics = (await withAnalyzer.GetAnalyzerDiagnosticsAsync(cancellationToken).ConfigureAwait(false))
            .Where(d => d.Id.StartsWith("SAMP", StringComparison.Ordinal) && d.Severity != DiagnosticSeverity.Hidden)
            .ToList();

        var catalog = SurfaceCatalog.Resolve(compilation, config.Surfaces, config.RawJson);
        var tests = TestFrameworks.Resolve(compilation, options.GlobalOptions);
        var libraries = Libraries(SurfaceCatalog.Definitions.Concat(config.Surfaces));
        var models = new Dictionary<SyntaxTree, SemanticModel>();
        SemanticModel ModelOf(SyntaxTree tree) => models.TryGetValue(tree, out var known) ? known : models[tree] = compilation.GetSemanticModel(tree);
        var generated = new GeneratedCode(compilation, options);
        // appsettings values copied into requests, as the analyzer reads them (one row per environment that changes a value).
        var configuration = new ProjectConfiguration(compilation, settingsFiles, Path.GetDirectoryName(project.FilePath));
        foreach (var tree in compilation.SyntaxTrees)
        {
            var model = ModelOf(tree);
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
                foreach (var request in RequestBuilder.Build(catalog, context, collector, new[] { operation }, configuration, cancellationToken).Select(r => r.Request))
                {
                    rows.Add(Row(project, request, policy, diagnostics, ModelOf, libraries));
                }
            }
        }

        // Requests written in settings files (prompt directories, templates, agent definitions, prompt files), read by the
        // analyzer's own file front end and judged with the file's own policy.
        foreach (var (file, request) in SettingsFiles.Requests(settingsFiles, tests.InTestProject, cancellationToken))
        {
            rows.Add(Row(project, request, new TemperancePolicy(options.GetOptions(file), options.GlobalOptions), diagnostics, ModelOf, libraries));
        }

        return new ProjectInventory(rows, null);
    }

    private static RequestRow Row(Project project, Request request, TemperancePolicy policy, List<Diagnostic> diagnostics, Func<SyntaxTree, SemanticModel> models,
        IReadOnlyDictionary<string, string> libraries)
    {
        var span = request.Location.GetLineSpan();
        var task = TaskInference.Infer(request, policy);
        var settings = new List<SettingRow>();
        foreach (var setting in Reported)
        {
            var effective = request.Value(setting);
            var (kind, value) = (effective.Kind, effective.Value);
            var last = request.LastWrite(setting);
            var name = setting.KeyName();
            settings.Add(kind switch
            {
                ValueKind.Known => new SettingRow(name, value, last?.Origin ?? (last?.FromConditional == true ? "worst branch of a conditional" : "literal")),
                // The analyzer's own policy: only where an unset value really means the provider's default is it shown (and judged) as a number.
                ValueKind.Unset when policy.UnsetMeansDefault(request.Provider) && policy.Default(request.Provider, setting) is { } fallback =>
                    new SettingRow(name, fallback.Value, "default of the provider", SettingState.Default),
                ValueKind.Unset when !policy.UnsetMeansDefault(request.Provider) => new SettingRow(name, null, "unset (left to the client)", SettingState.Unset),
                ValueKind.Unset => new SettingRow(name, null, "unset", SettingState.Unset),
                _ when last?.InFile != null => new SettingRow(name, null, $"unknown ({last.Origin})", SettingState.Unknown),
                _ => new SettingRow(name, null, $"unknown ({UnknownOrigin.Describe(request, setting, models)})", SettingState.Unknown),
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
            .Where(d => (d.Location.IsInSource || d.Location.Kind == LocationKind.ExternalFile) && (places.Contains(Key(d.Location)) || Within(d.Location, request.Location)))
            .Select(Finding)
            .Distinct()
            .ToList();
        var ceiling = task?.Kind is { } taskKind ? policy.TaskCeiling(taskKind) : null;
        // The model, its family and the provider exactly as the rules see them.
        var seen = new Temperance.Rules.RuleInput(new ExtractedRequest(request, FixAnchors.None), policy);
        var family = seen.Family;
        var modelSource = request.EffectiveModelId == null ? null
            : (request.ModelId != null ? "from the options" : "from the client") + (seen.ModelMappedBy is { } mappedBy ? $"; '{request.EffectiveModelId}' mapped by {mappedBy}" : string.Empty)
              + (family == null ? string.Empty : $"; family from {family.Key}");
        return new RequestRow(project.Name, span.Path, span.StartLinePosition.Line + 1, request.Surface, request.Provider,
            seen.ModelId, task?.Kind, task?.Because, settings, findings, request.SilentBecause,
            SettingsFiles.IsFileRequest(request) ? "settings file" : libraries.TryGetValue(request.Surface, out var library) ? library : request.Provider, ceiling?.Value, ceiling?.Key,
            family?.Name, modelSource, Layers(request));
    }

    private static FindingRow Finding(Diagnostic diagnostic)
    {
        var span = diagnostic.Location.GetLineSpan();
        var help = diagnostic.Descriptor.HelpLinkUri;
        return new FindingRow(diagnostic.Id, diagnostic.Severity.ToString(), diagnostic.GetMessage(CultureInfo.InvariantCulture),
            string.IsNullOrEmpty(help) ? null : help, diagnostic.Descriptor.Title.ToString(CultureInfo.InvariantCulture),
            span.Path, span.StartLinePosition.Line + 1);
    }

    /// <summary>The SDK each options type belongs to, by the short name requests carry (<c>ChatOptions</c> → Microsoft.Extensions.AI).</summary>
    private static Dictionary<string, string> Libraries(IEnumerable<SurfaceDefinition> surfaces)
    {
        var libraries = new Dictionary<string, string>(StringComparer.Ordinal) { ["JSON payload"] = "hand-built JSON" };
        foreach (var surface in surfaces)
        {
            libraries.TryAdd(surface.ShortName, LibraryOf(surface.MetadataName));
        }

        return libraries;
    }

    private static readonly string[] KnownLibraries =
    {
        "Microsoft.Extensions.AI", "Microsoft.SemanticKernel", "Microsoft.Agents.AI", "Microsoft.ML.OnnxRuntimeGenAI", "Azure.AI.Inference",
        "Azure.AI.OpenAI", "Betalgo.Ranul.OpenAI", "OpenAI", "OllamaSharp", "Anthropic", "LLama",
    };

    private static string LibraryOf(string metadataName)
    {
        foreach (var library in KnownLibraries)
        {
            if (metadataName.StartsWith(library + ".", StringComparison.Ordinal))
            {
                return library == "LLama" ? "LLamaSharp" : library;
            }
        }

        var parts = metadataName.Split('.');
        return parts.Length > 2 ? parts[0] + "." + parts[1] : parts[0];
    }

    private static (string, int) Key(Location location) => (location.SourceTree?.FilePath ?? location.GetLineSpan().Path, location.SourceSpan.Start);

    private static bool Within(Location inner, Location outer) =>
        inner.GetLineSpan().Path == outer.GetLineSpan().Path && outer.SourceSpan.Contains(inner.SourceSpan);

    /// <summary>
    /// Where a request's effective settings come from: a settings file, code, configuration (appsettings values copied into
    /// it). More than one layer is where a value can be lost or overridden without anyone seeing it.
    /// </summary>
    private static IReadOnlyList<string> Layers(Request request)
    {
        // A C# request is built in code even when every value it sends is read from configuration.
        var layers = new List<string> { SettingsFiles.IsFileRequest(request) ? "file" : "code" };

        if (request.Writes.Any(SettingsFiles.FromConfiguration))
        {
            layers.Add("configuration");
        }

        return layers;
    }

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
