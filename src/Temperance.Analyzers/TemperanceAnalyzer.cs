using System.Collections.Concurrent;
using System.Collections.Generic;
using System.Collections.Immutable;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Extraction;
using Temperance.Files;
using Temperance.Model;
using Temperance.Policy;
using Temperance.Rules;
using Temperance.Surfaces;

namespace Temperance
{
    /// <summary>
    /// The one analyzer. Per compilation: resolve the surfaces once. Per operation block: collect the few operations
    /// that touch options, build requests once, and let every rule look at them.
    /// </summary>
    [DiagnosticAnalyzer(LanguageNames.CSharp)]
    public sealed class TemperanceAnalyzer : DiagnosticAnalyzer
    {
        public override ImmutableArray<DiagnosticDescriptor> SupportedDiagnostics => Descriptors.All;

        public override void Initialize(AnalysisContext context)
        {
            context.EnableConcurrentExecution();
            // Generated code is skipped by GeneratedCode below, per matching block, instead of by the driver per diagnostic (see there why).
            context.ConfigureGeneratedCodeAnalysis(GeneratedCodeAnalysisFlags.Analyze | GeneratedCodeAnalysisFlags.ReportDiagnostics);
            context.RegisterCompilationStartAction(OnCompilationStart);
        }

        private static void OnCompilationStart(CompilationStartAnalysisContext context)
        {
            var config = CompilationConfig.Read(context.Compilation, context.Options.AnalyzerConfigOptionsProvider);
            if (config.Problems.Count > 0)
            {
                // Compilation-wide configuration (unknown keys, team surfaces) has no source location: report it once, by key.
                // Compilation-wide configuration points at the config file line that holds the key, when the build passed the
                // config files as additional files (the package does); else it has no location.
                context.RegisterCompilationEndAction(end =>
                {
                    foreach (var problem in config.Problems)
                    {
                        var location = ConfigSource.Find(end.Options.AdditionalFiles, problem.Key, end.CancellationToken) ?? Location.None;
                        end.ReportDiagnostic(Diagnostic.Create(Descriptors.InvalidConfiguration, location, problem.Key, problem.Value, problem.Expected));
                    }
                });
            }

            // Settings files (prompt directories, YAML templates, agent definitions, front-matter prompts) hold requests too;
            // they are judged whether or not an SDK is referenced here, since the loader may live in another project.
            var tests = TestFrameworks.Resolve(context.Compilation, context.Options.AnalyzerConfigOptionsProvider.GlobalOptions);
            var settingsFiles = new SettingsFileContext(context.Options.AdditionalFiles);
            context.RegisterAdditionalFileAction(file => SettingsFileAnalysis.Analyze(file, tests.InTestProject, settingsFiles));

            var catalog = SurfaceCatalog.Resolve(context.Compilation, config.Surfaces, config.RawJson);
            if (!catalog.HasSdkSurfaces && !catalog.RawJsonEnabled)
            {
                return; // no LLM SDK, no declared surface, raw JSON not asked for: register nothing, zero cost
            }

            var options = context.Options.AnalyzerConfigOptionsProvider;
            var states = new ConcurrentDictionary<SyntaxTree, TreeState>();
            var generated = new GeneratedCode(context.Compilation, options);
            // Reads nothing now: the binding scan and appsettings files are read once, when a request first reads a project class's property.
            var configuration = new ProjectConfiguration(context.Compilation, context.Options.AdditionalFiles,
                options.GlobalOptions.TryGetValue("build_property.MSBuildProjectDirectory", out var projectDirectory) ? projectDirectory : null);

            // Per block: one operation action over the few kinds that create, change or send options, behind a filter that
            // is a handful of symbol comparisons. The driver walks each block's operations once for every analyzer, so
            // riding on its walk is cheaper than a walk of our own (measured with the benchmark's quiet project). Only a
            // block where something matched is turned into requests, at its end, so every diagnostic stays local to the
            // block (the IDE can re-run one member at a time).
            context.RegisterOperationBlockStartAction(start =>
            {
                BlockCollector? collector = null;
                start.RegisterOperationAction(
                    c =>
                    {
                        if (BlockCollector.IsCandidate(catalog, c.Operation))
                        {
                            lock (start)
                            {
                                (collector ??= new BlockCollector()).OfferCandidate(c.Operation);
                            }
                        }
                    },
                    CandidateKinds);
                start.RegisterOperationBlockEndAction(block =>
                {
                    if (collector == null || block.OperationBlocks.Length == 0)
                    {
                        return;
                    }

                    // Generated code is asked about only here, for the few blocks where something matched: most blocks never
                    // have a candidate, and the filter alone reports nothing.
                    var tree = block.OperationBlocks[0].Syntax.SyntaxTree;
                    if (generated.Contains(tree, block.OwningSymbol, block.CancellationToken))
                    {
                        return;
                    }

                    var state = states.GetOrAdd(tree, t => new TreeState(new TemperancePolicy(options.GetOptions(t), options.GlobalOptions)));
                    var owner = OwnerOf(block.OwningSymbol);
                    var callContext = tests.ContextOf(owner, state.Policy.TestAttributes);
                    var requests = RequestBuilder.Build(catalog, callContext, collector, block.OperationBlocks, configuration, block.CancellationToken);
                    if (requests.Count > 0)
                    {
                        Judge(requests, state, block.ReportDiagnostic);
                    }
                });
            });
        }

        /// <summary>
        /// The operation kinds <see cref="BlockCollector.IsCandidate"/> can accept; made once, not per block (the params
        /// overload of RegisterOperationAction copies its array on every call).
        /// </summary>
        internal static readonly ImmutableArray<OperationKind> CandidateKinds = ImmutableArray.Create(
            OperationKind.ObjectCreation, OperationKind.AnonymousObjectCreation, OperationKind.With, OperationKind.SimpleAssignment, OperationKind.Invocation);

        /// <summary>The member a block belongs to: lambdas and local functions count as their containing member.</summary>
        private static ISymbol OwnerOf(ISymbol symbol)
        {
            while (symbol is IMethodSymbol { MethodKind: MethodKind.AnonymousFunction or MethodKind.LocalFunction } && symbol.ContainingSymbol != null)
            {
                symbol = symbol.ContainingSymbol;
            }

            return symbol;
        }

        internal static void Judge(IReadOnlyList<ExtractedRequest> requests, TemperancePolicy policy, System.Action<Diagnostic> report) =>
            Judge(requests, new TreeState(policy), report);

        private static void Judge(IReadOnlyList<ExtractedRequest> requests, TreeState state, System.Action<Diagnostic> report)
        {
            // A location is judged once; copies of a request per configuration environment are told apart by their message,
            // which names the file that decided the value (one report per rule, location and deciding file).
            var reported = new HashSet<(string, Location, string?)>();
            foreach (var extracted in requests)
            {
                var request = extracted.Request;
                if (!request.IsJudged)
                {
                    continue; // never reaches a model (Request.SilentBecause says why)
                }

                foreach (var found in Rules.RuleCatalog.Judge(new RuleInput(extracted, state.Policy)))
                {
                    var finding = found;
                    if (request.BorrowedFrom != null)
                    {
                        if (!Rules.RuleCatalog.DependsOnCallSite(finding.Descriptor))
                        {
                            continue;
                        }

                        // A value written in the helper is reported where this call sends it.
                        finding = finding.Location == request.SendingCallLocation ? finding : finding.At(request.Location);
                    }

                    // Clone and with inherit writes; a location is judged once. Code under #line hidden is generated
                    // (Razor, T4) and silent, as the driver would have made it (GeneratedCode.cs says why we decide).
                    var variant = request.Variant == null ? null : string.Join("\u001f", finding.MessageArgs);
                    if (!GeneratedCode.IsHidden(finding.Location) && reported.Add((finding.Descriptor.Id, finding.Location, variant)))
                    {
                        report(finding.ToDiagnostic());
                    }
                }
            }

            // Configuration problems the rules ran into, once per file and key, on the block's first request.
            foreach (var problem in state.Policy.Problems)
            {
                if (state.FirstReport(problem.Key))
                {
                    report(Diagnostic.Create(Descriptors.InvalidConfiguration, requests[0].Request.Location, problem.Key, problem.Value, problem.Expected));
                }
            }
        }

        /// <summary>Policy of one tree, plus which configuration problems were already reported in it.</summary>
        private sealed class TreeState
        {
            private readonly ConcurrentDictionary<string, bool> reportedProblems = new ConcurrentDictionary<string, bool>();

            public TreeState(TemperancePolicy policy)
            {
                Policy = policy;
            }

            public TemperancePolicy Policy { get; }

            public bool FirstReport(string key) => reportedProblems.TryAdd(key, true);
        }
    }
}
