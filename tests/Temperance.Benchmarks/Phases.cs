using System.Diagnostics;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.Diagnostics;
using Temperance.Extraction;
using Temperance.Model;
using Temperance.Policy;
using Temperance.Rules;
using Temperance.Surfaces;

namespace Temperance.Benchmarks;

/// <summary>
/// Temperance's three phases run directly over a bound compilation, outside the compiler's driver and warm, so each
/// phase's own cost per block or request can be seen (the driver's telemetry also holds cold caches, the report
/// path and whatever other analyzers leave behind).
/// </summary>
public static class Phases
{
    public static void Print(List<string> sources, List<MetadataReference> references, AnalyzerConfigOptionsProvider table, int runs)
    {
        var trees = sources.Select((s, i) => CSharpSyntaxTree.ParseText(s, new CSharpParseOptions(LanguageVersion.Latest), path: $"/bench/phases/File{i}.cs")).ToList();
        var compilation = CSharpCompilation.Create("Phases", trees, references, new CSharpCompilationOptions(OutputKind.DynamicallyLinkedLibrary));
        var blocks = trees.SelectMany(t => MemberBlocks.Of(t, compilation.GetSemanticModel(t)).Select(b => (b.Block, b.Owner, Tree: t))).ToList();
        var catalog = SurfaceCatalog.Resolve(compilation);
        var tests = TestFrameworks.Resolve(compilation);

        var walkBytes = 0L;
        var buildBytes = 0L;
        var judgeBytes = 0L;
        var walk = new List<double>();
        var build = new List<double>();
        var judge = new List<double>();
        var candidates = 0;
        var requestCount = 0;
        var findings = 0;
        for (var run = 0; run <= runs; run++)
        {
            var allocated = GC.GetAllocatedBytesForCurrentThread();
            var watch = Stopwatch.StartNew();
            var collected = new List<(BlockCollector Collector, IOperation Block, ISymbol? Owner, SyntaxTree Tree)>();
            foreach (var (block, owner, tree) in blocks)
            {
                if (BlockCollector.Collect(catalog, new[] { block }) is { } collector)
                {
                    collected.Add((collector, block, owner, tree));
                }
            }

            var walkMs = watch.Elapsed.TotalMilliseconds;
            walkBytes = GC.GetAllocatedBytesForCurrentThread() - allocated;
            allocated = GC.GetAllocatedBytesForCurrentThread();
            watch.Restart();
            var requests = new List<(ExtractedRequest Request, SyntaxTree Tree)>();
            foreach (var (collector, block, owner, tree) in collected)
            {
                var context = new CallContext(owner, owner?.ContainingType, tests.IsTest(owner));
                requests.AddRange(RequestBuilder.Build(catalog, context, collector, new[] { block }).Select(r => (r, tree)));
            }

            var buildMs = watch.Elapsed.TotalMilliseconds;
            buildBytes = GC.GetAllocatedBytesForCurrentThread() - allocated;
            allocated = GC.GetAllocatedBytesForCurrentThread();
            watch.Restart();
            var policies = new Dictionary<SyntaxTree, TemperancePolicy>();
            var reported = 0;
            foreach (var (request, tree) in requests)
            {
                if (!policies.TryGetValue(tree, out var policy))
                {
                    policies[tree] = policy = new TemperancePolicy(table.GetOptions(tree), table.GlobalOptions);
                }

                foreach (var finding in Temperance.Rules.RuleCatalog.Judge(new Temperance.Rules.RuleInput(request, policy)))
                {
                    _ = finding.ToDiagnostic();
                    reported++;
                }
            }

            judgeBytes = GC.GetAllocatedBytesForCurrentThread() - allocated;
            if (run > 0)
            {
                walk.Add(walkMs);
                build.Add(buildMs);
                judge.Add(watch.Elapsed.TotalMilliseconds);
            }

            (candidates, requestCount, findings) = (collected.Count, requests.Count, reported);
        }

        static double Median(List<double> values) => values.OrderBy(v => v).ElementAt(values.Count / 2);
        Console.WriteLine($"phases, warm, outside the driver (median of {runs}): {blocks.Count:N0} blocks walked in {Median(walk):N1} ms ({Median(walk) * 1000 / blocks.Count:N1} µs each);"
            + $" {candidates:N0} candidate blocks built into {requestCount:N0} requests in {Median(build):N1} ms ({Median(build) * 1000 / Math.Max(requestCount, 1):N1} µs per request);"
            + $" rules and {findings:N0} diagnostics in {Median(judge):N1} ms ({Median(judge) * 1000 / Math.Max(requestCount, 1):N1} µs per request)");
        // Allocation matters as much as time here: inside the compiler every gen0 collection walks a heap holding the whole
        // bound compilation, and whoever allocates when it is due pays for it.
        Console.WriteLine($"allocated (last run): walk {walkBytes / 1024.0:N0} KiB ({(double)walkBytes / blocks.Count:N0} B per block),"
            + $" build {buildBytes / 1024.0:N0} KiB ({(double)buildBytes / Math.Max(requestCount, 1):N0} B per request),"
            + $" rules and diagnostics {judgeBytes / 1024.0:N0} KiB ({(double)judgeBytes / Math.Max(requestCount, 1):N0} B per request)");
    }
}
