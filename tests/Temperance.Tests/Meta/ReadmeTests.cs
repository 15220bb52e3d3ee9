using System.Text.RegularExpressions;
using Temperance.Rules;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Meta;

/// <summary>The README's rule and configuration tables against the descriptors and the rules table: CI fails on drift.</summary>
public class ReadmeTests
{
    private static readonly string Readme = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "README.md"));

    [Fact]
    public void RuleTable_ListsEveryDescriptorWithItsSeverityAndPage()
    {
        var rows = Regex.Matches(Readme, @"^\| \[(?<id>SAMP\d{3})\]\(rules/(?<page>SAMP\d{3})\.md\) \|[^|]+\| (?<severity>\w+) \|", RegexOptions.Multiline)
            .ToDictionary(m => m.Groups["id"].Value, m => (Page: m.Groups["page"].Value, Severity: m.Groups["severity"].Value));
        Assert.Equal(Descriptors.All.Select(d => d.Id).OrderBy(i => i), rows.Keys.OrderBy(i => i));
        foreach (var descriptor in Descriptors.All)
        {
            Assert.Equal(descriptor.Id, rows[descriptor.Id].Page);
            Assert.Equal(descriptor.DefaultSeverity.ToString(), rows[descriptor.Id].Severity);
        }
    }

    [Fact]
    public void ConfigurationTable_ShippedValuesMatchTheRulesTable()
    {
        // Rows whose shipped value is a single number must equal the table's value for that key.
        foreach (Match row in Regex.Matches(Readme, @"^\| `(?<key>temperance\.[a-z_.]+)` \|[^|]+\| (?<value>-?\d+(\.\d+)?) \|", RegexOptions.Multiline))
        {
            var key = row.Groups["key"].Value;
            Assert.Equal(RulesTable.Number(key), double.Parse(row.Groups["value"].Value, System.Globalization.CultureInfo.InvariantCulture));
        }
    }

    [Fact]
    public void PresetNamesInTheReadme_ExistAsFiles()
    {
        foreach (var preset in new[] { "relaxed", "strict" })
        {
            Assert.Contains($"TemperancePreset", Readme, StringComparison.Ordinal);
            Assert.True(File.Exists(Path.Combine(TestReferences.RulesDirectory, "presets", $"temperance.{preset}.globalconfig")));
        }
    }
}
