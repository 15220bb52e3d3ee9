using System.Text.RegularExpressions;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Robustness;

/// <summary>
/// Half-typed code, as the IDE sees it on every keystroke: every snippet of the test suite and every demo file, cut at
/// token boundaries and with random tokens deleted, must analyse without an analyzer exception. Bounded for CI; set
/// TEMPERANCE_TYPING_FULL=1 to try every prefix.
/// </summary>
public class TypingRobustnessTests
{
    private static readonly bool Full = Environment.GetEnvironmentVariable("TEMPERANCE_TYPING_FULL") == "1";
    private const int PrefixesPerSource = 24;
    private const int DeletionsPerSource = 8;

    public static TheoryData<string> Corpora => new() { "tests", "demo" };

    [Theory]
    [MemberData(nameof(Corpora))]
    public async Task EveryPrefixAndDeletion_AnalysesWithoutException(string corpus)
    {
        var sources = corpus == "tests" ? TestSnippets() : DemoFiles();
        Assert.NotEmpty(sources);
        var random = new Random(20261201);
        var failures = new List<string>();
        var variants = 0;

        await Parallel.ForEachAsync(sources, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, async (source, _) =>
        {
            foreach (var variant in Variants(source, random))
            {
                var outcome = await DirectRun.AnalyzeAsync(DirectRun.Compile(new[] { variant }));
                Interlocked.Increment(ref variants);
                if (outcome.AnalyzerExceptions.Count > 0)
                {
                    lock (failures)
                    {
                        failures.Add($"{outcome.AnalyzerExceptions[0]}\n--- source ---\n{variant}");
                    }

                    return;
                }
            }
        });

        Assert.True(failures.Count == 0, $"{failures.Count} analyzer exceptions in {variants} variants; first:\n{failures.FirstOrDefault()}");
        Assert.True(variants > sources.Count, "no variants were analysed");
    }

    private static IEnumerable<string> Variants(string source, Random shared)
    {
        var tokens = CSharpSyntaxTree.ParseText(source).GetRoot().DescendantTokens().Where(t => t.Span.Length > 0).ToList();
        if (tokens.Count == 0)
        {
            yield break;
        }

        var step = Full ? 1 : Math.Max(1, tokens.Count / PrefixesPerSource);
        for (var i = 0; i < tokens.Count; i += step)
        {
            yield return source[..tokens[i].Span.End];
        }

        int[] picks;
        lock (shared)
        {
            picks = Enumerable.Range(0, Full ? tokens.Count : DeletionsPerSource).Select(_ => shared.Next(tokens.Count)).ToArray();
        }

        foreach (var pick in picks)
        {
            var token = tokens[pick];
            yield return source[..token.SpanStart] + source[token.Span.End..];
        }
    }

    /// <summary>The raw-string C# snippets of this test suite (the sources every rule test compiles).</summary>
    internal static List<string> TestSnippets()
    {
        var root = Path.Combine(TestReferences.RepositoryRoot, "tests", "Temperance.Tests");
        var snippet = new Regex("\"\"\"\\s*\\n(?<body>.*?)\\n\\s*\"\"\"", RegexOptions.Singleline);
        return Directory.GetFiles(root, "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)
                && !f.Contains($"{Path.DirectorySeparatorChar}bin{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .SelectMany(f => snippet.Matches(File.ReadAllText(f)).Select(m => m.Groups["body"].Value))
            .Where(s => s.Contains("class ", StringComparison.Ordinal))
            .Select(s => Regex.Replace(s, @"\{\|(#\d+|SAMP\d{3}):|\|\}", string.Empty))
            .Distinct()
            .ToList();
    }

    internal static List<string> DemoFiles() =>
        Directory.GetFiles(Path.Combine(TestReferences.RepositoryRoot, "samples"), "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .Select(File.ReadAllText)
            .ToList();
}
