using System.Reflection;
using System.Runtime.Loader;

namespace Temperance.Tests.EndToEnd;

/// <summary>
/// The terminal table as a pure function of rows: Formats.Table of the tool the fixture built, loaded into a context of
/// its own (the tool uses a newer Roslyn than this test project, and nothing here needs Roslyn).
/// </summary>
public partial class InventoryToolTests
{
    private const string LongFinding =
        "Temperature 0.9 is above the ceiling 0.3 for task 'extraction' (task from the method name 'ExtractLuggageClaimOptions' and the "
        + "JSON-schema response format (ChatResponseFormat.CreateJsonSchemaFormat(\"luggage_claim\", schema)); ceiling from "
        + "temperance.task.extraction.max_temperature)";

    [Fact]
    public void Table_WrapsALongFindingAtWordBoundaries_InsteadOfCuttingIt()
    {
        var inventory = InventoryAssembly.Load(Path.GetDirectoryName(tool.Tool)!);
        var root = Path.Combine(Path.GetTempPath(), "harbour");
        var file = Path.Combine(root, "Operations", "Passengers", "Claims", "LuggageClaimExtraction.cs");
        var text = inventory.Table(new[] { inventory.Row(file, 19, LongFinding) }, root);
        var lines = text.Split('\n').Select(l => l.TrimEnd('\r')).ToList();

        Assert.DoesNotContain("…", text, StringComparison.Ordinal);
        var column = lines[0].IndexOf("findings", StringComparison.Ordinal);
        Assert.True(column > 0, text);
        var findingLines = lines.Skip(2).TakeWhile(l => !l.StartsWith("1 request", StringComparison.Ordinal))
            .Where(l => l.Length > column).Select(l => l[column..].TrimEnd()).ToList();

        // Continuation lines: the finding spans several lines of the findings column, none wider than the column.
        Assert.True(findingLines.Count >= 4, text);
        Assert.All(findingLines, l => Assert.True(l.Length <= 64, $"'{l}' is wider than the column"));
        Assert.True(findingLines.Max(l => l.Length) > 40, "the column is used, not squeezed:\n" + text);

        // At word boundaries: read back line by line, the column is the finding word for word; every word is whole on a line.
        var expected = "SAMP001 warning: " + LongFinding;
        Assert.Equal(expected, string.Join(" ", findingLines.Select(l => l.Trim())));
        foreach (var word in expected.Split(' '))
        {
            Assert.True(findingLines.Any(l => l.Split(' ').Contains(word)), $"'{word}' was cut:\n{text}");
        }

        // Cells to the left are blank on continuation lines; a path longer than its column breaks after a '/'.
        Assert.StartsWith("Operations/Passengers/Claims/", lines[2], StringComparison.Ordinal);
        Assert.StartsWith("LuggageClaimExtraction.cs:19", lines[3], StringComparison.Ordinal);
        Assert.All(lines.Skip(4).Where(l => l.Length > column && !l.StartsWith("1 request", StringComparison.Ordinal)),
            l => Assert.True(string.IsNullOrWhiteSpace(l[..column]), $"'{l}'"));
        Assert.Contains("1 request, 1 finding", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Wrap_BreaksAtSpaces_AndALongWordAfterASeparator()
    {
        var inventory = InventoryAssembly.Load(Path.GetDirectoryName(tool.Tool)!);
        Assert.Equal(new[] { "alpha beta", "gamma", "delta" }, inventory.Wrap("alpha beta gamma delta", 10));
        Assert.Equal(new[] { "one", "two three" }, inventory.Wrap("one\ntwo three", 20));

        var path = "samples/HarbourDesk/Extraction/CrewManifest.cs:11";
        var wrapped = inventory.Wrap(path, 20);
        Assert.All(wrapped, l => Assert.True(l.Length <= 20, l));
        Assert.Equal(path, string.Concat(wrapped));
        Assert.Equal("samples/HarbourDesk/", wrapped[0]);

        var unbroken = new string('x', 25);
        Assert.Equal(new[] { new string('x', 10), new string('x', 10), new string('x', 5) }, inventory.Wrap(unbroken, 10));
    }

    /// <summary>The tool's own assembly, loaded beside this test's Roslyn; rows are built through the records' constructors.</summary>
    private sealed class InventoryAssembly
    {
        private readonly Assembly assembly;

        private InventoryAssembly(Assembly assembly) => this.assembly = assembly;

        public static InventoryAssembly Load(string folder)
        {
            var context = new AssemblyLoadContext("inventory-" + Guid.NewGuid().ToString("N")[..8]);
            context.Resolving += (c, name) => Path.Combine(folder, name.Name + ".dll") is var path && File.Exists(path) ? c.LoadFromAssemblyPath(path) : null;
            return new InventoryAssembly(context.LoadFromAssemblyPath(Path.Combine(folder, "Temperance.Inventory.dll")));
        }

        private Type Type(string name) => assembly.GetType("Temperance.Inventory." + name, throwOnError: true)!;

        private object Create(string type, params object?[] arguments) =>
            Type(type).GetConstructors().Single(c => c.GetParameters().Length == arguments.Length).Invoke(arguments);

        private Array List(string type, params object[] items)
        {
            var array = Array.CreateInstance(Type(type), items.Length);
            for (var i = 0; i < items.Length; i++)
            {
                array.SetValue(items[i], i);
            }

            return array;
        }

        public object Row(string file, int line, string finding)
        {
            var settings = List("SettingRow",
                Create("SettingRow", "temperature", 0.9, "literal", "known"),
                Create("SettingRow", "top_p", 1.0, "default of the provider", "default"),
                Create("SettingRow", "top_k", null, "unset", "unset"),
                Create("SettingRow", "seed", null, "unset", "unset"),
                Create("SettingRow", "candidates", null, "unset", "unset"));
            var findings = List("FindingRow",
                Create("FindingRow", "SAMP001", "Warning", finding, "https://example.invalid/rules/SAMP001.md", "Temperature above the ceiling", file, line));
            return Create("RequestRow", "Harbour", file, line, "ChatCompletionOptions", "openai", null, "extraction", "the method name",
                settings, findings, null, "OpenAI", 0.3, "temperance.task.extraction.max_temperature", null, null, null);
        }

        public string Table(object[] rows, string root)
        {
            var rowType = Type("RequestRow");
            var list = Array.CreateInstance(rowType, rows.Length);
            for (var i = 0; i < rows.Length; i++)
            {
                list.SetValue(rows[i], i);
            }

            var table = Type("Formats").GetMethod("Table", new[] { typeof(IReadOnlyList<>).MakeGenericType(rowType), typeof(string) })!;
            return (string)table.Invoke(null, new object[] { list, root })!;
        }

        public string[] Wrap(string text, int width) =>
            ((List<string>)Type("Formats").GetMethod("Wrap")!.Invoke(null, new object[] { text, width })!).ToArray();
    }
}
