using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Diagnostics;

namespace Temperance.Testing;

/// <summary>
/// The shipped rules table as analyzer-config options for every file, for harnesses that run the analyzer directly
/// (robustness tests, the benchmark). Shared as a linked source file by the test and benchmark projects.
/// </summary>
public sealed class RulesTableOptions : AnalyzerConfigOptionsProvider
{
    private readonly DictionaryOptions options;

    public RulesTableOptions(string globalConfigText)
    {
        var builder = ImmutableDictionary.CreateBuilder<string, string>(StringComparer.OrdinalIgnoreCase);
        foreach (var line in globalConfigText.Split('\n'))
        {
            var text = line.Trim();
            var equals = text.IndexOf('=');
            if (text.Length == 0 || text.StartsWith('#') || equals < 0)
            {
                continue;
            }

            builder[text[..equals].Trim()] = text[(equals + 1)..].Trim();
        }

        options = new DictionaryOptions(builder.ToImmutable());
    }

    /// <summary>The repository's rules/temperance.globalconfig, found above the running binaries.</summary>
    public static string FindTable()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir != null; dir = dir.Parent)
        {
            var path = Path.Combine(dir.FullName, "rules", "temperance.globalconfig");
            if (File.Exists(path))
            {
                return File.ReadAllText(path);
            }
        }

        throw new FileNotFoundException("rules/temperance.globalconfig not found above " + AppContext.BaseDirectory);
    }

    public override AnalyzerConfigOptions GlobalOptions => options;

    public override AnalyzerConfigOptions GetOptions(SyntaxTree tree) => options;

    public override AnalyzerConfigOptions GetOptions(AdditionalText textFile) => options;

    private sealed class DictionaryOptions : AnalyzerConfigOptions
    {
        private readonly ImmutableDictionary<string, string> values;

        public DictionaryOptions(ImmutableDictionary<string, string> values) => this.values = values;

        public override bool TryGetValue(string key, out string value) => values.TryGetValue(key, out value!);

        public override IEnumerable<string> Keys => values.Keys;
    }
}
