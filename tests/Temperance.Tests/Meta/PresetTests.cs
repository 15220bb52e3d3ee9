using System.Text;
using Temperance.Rules;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Meta;

/// <summary>The preset files are generated from the descriptors: this test holds the generator and fails on drift.</summary>
public class PresetTests
{
    public static TheoryData<string> Presets => new() { "relaxed", "strict" };

    [Theory]
    [MemberData(nameof(Presets))]
    public void PresetFile_MatchesTheDescriptors(string preset)
    {
        var path = Path.Combine(TestReferences.RulesDirectory, "presets", $"temperance.{preset}.globalconfig");
        var actual = File.ReadAllText(path).Replace("\r\n", "\n", StringComparison.Ordinal);
        var expected = Generate(preset, actual);
        Assert.True(expected == actual, $"{path} drifted from the descriptors; expected:\n{expected}");
    }

    private static string Generate(string preset, string current)
    {
        // The header comment is prose; the settings below it are generated.
        var header = string.Concat(current.Split('\n').TakeWhile(l => l.StartsWith('#')).Select(l => l + "\n"));
        var text = new StringBuilder(header).Append("is_global = true\nglobal_level = -90\n\n");
        foreach (var descriptor in Descriptors.All)
        {
            var severity = preset == "strict" ? "error"
                : Descriptors.NoKnownFalsePositives.Contains(descriptor.Id) ? "warning" : "suggestion";
            text.Append($"dotnet_diagnostic.{descriptor.Id}.severity = {severity}\n");
        }

        return text.ToString();
    }
}
