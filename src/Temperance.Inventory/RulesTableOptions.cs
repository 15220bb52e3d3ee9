using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Diagnostics;

namespace Temperance.Inventory;

/// <summary>
/// The shipped rules table as analyzer-config options for every file: the inventory tool falls back to it for projects
/// that do not reference the package, and the robustness tests and the benchmark link this file.
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

    /// <summary>The rules table shipped next to the binaries, else the repository's rules/temperance.globalconfig above them.</summary>
    public static string FindTable()
    {
        var shipped = Path.Combine(AppContext.BaseDirectory, "temperance.globalconfig");
        if (File.Exists(shipped))
        {
            return File.ReadAllText(shipped);
        }

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

    /// <summary>The table's value for a key (used under a project's own options, which win).</summary>
    public bool TryGetValue(string key, out string value) => options.TryGetValue(key, out value);

    public IEnumerable<string> Keys => options.Keys;

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
