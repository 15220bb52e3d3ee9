using System.Text.RegularExpressions;
using Temperance.Extraction;

namespace Temperance.Tests.Extraction;

/// <summary>
/// The identifier splitter runs for every request, so it is hand-written; a regular expression of the same PascalCase
/// split is kept here as the oracle it must agree with.
/// </summary>
public class TaskWordTests
{
    private static readonly Regex Words = new("[A-Z]+(?![a-z])|[A-Z]?[a-z]+", RegexOptions.CultureInvariant);

    // Only a leading verb names a task; nouns anywhere in a name do not (a box label is not a classification).
    private static readonly Dictionary<string, string> Expected = new(StringComparer.Ordinal)
    {
        ["ExtractInvoiceFields"] = "extraction",
        ["TryExtractCrewList"] = "extraction",
        ["classifyTicket"] = "classification",
        ["Grade2Essays"] = "evaluation",
        ["TranslateMenu"] = "translation",
        ["BrainstormIDEAS"] = "brainstorming",
        ["SQLQueryWriter"] = "",
        ["GenerateSQL"] = "",
        ["ticketClassifier"] = "",
        ["_summarizer"] = "",
        ["ABTranslate"] = "",
        ["MakeBoxLabelAsync"] = "",
        ["LabelWriter"] = "",
        ["Tally7"] = "",
        ["options"] = "",
        ["Extracted"] = "",
        ["XMLParser"] = "",
        ["SLOGAN"] = "",
        ["Try"] = "",
    };

    [Fact]
    public void KnownNames_GiveTheirTask()
    {
        foreach (var (name, kind) in Expected)
        {
            Assert.Equal(kind, TaskSignalReader.KindOfName(name) ?? "");
        }
    }

    [Fact]
    public void Splitter_AgreesWithThePascalCaseExpression_OnGeneratedNames()
    {
        var parts = new[] { "Extract", "sql", "SQL", "Query", "A", "ab", "X9", "_", "Label", "LABEL", "judge", "Poem", "IDs", "url", "Tr", "Summary", "Parse", "ideas", "Try", "classify", "Grade" };
        var random = new Random(20261201);
        for (var i = 0; i < 5_000; i++)
        {
            var name = string.Concat(Enumerable.Range(0, random.Next(1, 5)).Select(_ => parts[random.Next(parts.Length)]));
            Assert.True(Oracle(name) == TaskSignalReader.KindOfName(name), $"'{name}': expected {Oracle(name) ?? "none"}, got {TaskSignalReader.KindOfName(name) ?? "none"}");
        }
    }

    private static string? Oracle(string name)
    {
        var words = Words.Matches(name).Select(m => m.Value.ToLowerInvariant()).ToList();
        if (words.Count > 1 && words[0] == "try")
        {
            words.RemoveAt(0);
        }

        return words.Count > 0 && TaskSignalReader.NameWords.TryGetValue(words[0], out var kind) ? kind : null;
    }
}
