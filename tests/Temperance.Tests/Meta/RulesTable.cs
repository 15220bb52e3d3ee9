using System.Globalization;

namespace Temperance.Tests.Meta;

/// <summary>The shipped rules table parsed into key, value and the source comment above it.</summary>
public static class RulesTable
{
    public sealed record Entry(string Key, string Value, string Source, int Line);

    public static IReadOnlyList<Entry> Entries { get; } = Parse(Infrastructure.TestReferences.RulesTable);

    public static double Number(string key) =>
        double.Parse(Entries.Single(e => e.Key == key).Value, CultureInfo.InvariantCulture);

    private static List<Entry> Parse(string text)
    {
        var entries = new List<Entry>();
        var comments = new List<string>();
        var lines = text.Split('\n');
        for (var i = 0; i < lines.Length; i++)
        {
            var line = lines[i].Trim();
            if (line.Length == 0)
            {
                comments.Clear();
                continue;
            }

            if (line.StartsWith('#'))
            {
                comments.Add(line.TrimStart('#').Trim());
                continue;
            }

            var equals = line.IndexOf('=');
            entries.Add(new Entry(line[..equals].Trim(), line[(equals + 1)..].Trim(), string.Join(" ", comments), i + 1));
        }

        return entries;
    }
}
