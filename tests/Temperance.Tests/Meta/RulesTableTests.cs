using System.Globalization;
using System.Text.RegularExpressions;
using System.Xml.Linq;

namespace Temperance.Tests.Meta;

/// <summary>
/// The rules table against the sources it cites. Values pinned to an SDK's XML documentation are checked against
/// the XML file restored with the real package: a change to the table that contradicts its source fails here.
/// </summary>
public class RulesTableTests
{
    /// <summary>(table key, value, XML file, member id, the published text that states the value).</summary>
    public static TheoryData<string, double, string, string, string> XmlPins => new()
    {
        { "temperance.provider.openai.temperature.min", 0, "Betalgo.Ranul.OpenAI.xml", "P:Betalgo.Ranul.OpenAI.ObjectModels.RequestModels.ChatCompletionCreateRequest.Temperature", "between 0 and 2" },
        { "temperance.provider.openai.temperature.max", 2, "Betalgo.Ranul.OpenAI.xml", "P:Betalgo.Ranul.OpenAI.ObjectModels.RequestModels.ChatCompletionCreateRequest.Temperature", "between 0 and 2" },
        { "temperance.provider.openai.temperature.default", 1, "Microsoft.SemanticKernel.Connectors.OpenAI.xml", "P:Microsoft.SemanticKernel.Connectors.OpenAI.OpenAIPromptExecutionSettings.Temperature", "Default is 1.0" },
        { "temperance.provider.openai.top_p.default", 1, "Microsoft.SemanticKernel.Connectors.OpenAI.xml", "P:Microsoft.SemanticKernel.Connectors.OpenAI.OpenAIPromptExecutionSettings.TopP", "Default is 1.0" },
        { "temperance.provider.openai.frequency_penalty.min", -2, "Betalgo.Ranul.OpenAI.xml", "P:Betalgo.Ranul.OpenAI.ObjectModels.RequestModels.ChatCompletionCreateRequest.FrequencyPenalty", "Number between -2.0 and 2.0" },
        { "temperance.provider.openai.frequency_penalty.max", 2, "Betalgo.Ranul.OpenAI.xml", "P:Betalgo.Ranul.OpenAI.ObjectModels.RequestModels.ChatCompletionCreateRequest.FrequencyPenalty", "Number between -2.0 and 2.0" },
        { "temperance.provider.openai.presence_penalty.min", -2, "Betalgo.Ranul.OpenAI.xml", "P:Betalgo.Ranul.OpenAI.ObjectModels.RequestModels.ChatCompletionCreateRequest.PresencePenalty", "Number between -2.0 and 2.0" },
        { "temperance.provider.openai.presence_penalty.max", 2, "Betalgo.Ranul.OpenAI.xml", "P:Betalgo.Ranul.OpenAI.ObjectModels.RequestModels.ChatCompletionCreateRequest.PresencePenalty", "Number between -2.0 and 2.0" },
        { "temperance.provider.azure_inference.temperature.min", 0, "Azure.AI.Inference.xml", "P:Azure.AI.Inference.ChatCompletionsOptions.Temperature", "Supported range is [0, 1]" },
        { "temperance.provider.azure_inference.temperature.max", 1, "Azure.AI.Inference.xml", "P:Azure.AI.Inference.ChatCompletionsOptions.Temperature", "Supported range is [0, 1]" },
        { "temperance.provider.azure_inference.top_p.min", 0, "Azure.AI.Inference.xml", "P:Azure.AI.Inference.ChatCompletionsOptions.NucleusSamplingFactor", "Supported range is [0, 1]" },
        { "temperance.provider.azure_inference.top_p.max", 1, "Azure.AI.Inference.xml", "P:Azure.AI.Inference.ChatCompletionsOptions.NucleusSamplingFactor", "Supported range is [0, 1]" },
        { "temperance.provider.azure_inference.frequency_penalty.min", -2, "Azure.AI.Inference.xml", "P:Azure.AI.Inference.ChatCompletionsOptions.FrequencyPenalty", "Supported range is [-2, 2]" },
        { "temperance.provider.azure_inference.frequency_penalty.max", 2, "Azure.AI.Inference.xml", "P:Azure.AI.Inference.ChatCompletionsOptions.FrequencyPenalty", "Supported range is [-2, 2]" },
        { "temperance.provider.azure_inference.presence_penalty.min", -2, "Azure.AI.Inference.xml", "P:Azure.AI.Inference.ChatCompletionsOptions.PresencePenalty", "Supported range is [-2, 2]" },
        { "temperance.provider.azure_inference.presence_penalty.max", 2, "Azure.AI.Inference.xml", "P:Azure.AI.Inference.ChatCompletionsOptions.PresencePenalty", "Supported range is [-2, 2]" },
        { "temperance.provider.ollama.temperature.default", 0.8, "OllamaSharp.xml", "P:OllamaSharp.Models.RequestOptions.Temperature", "(Default: 0.8)" },
        { "temperance.provider.ollama.top_p.default", 0.9, "OllamaSharp.xml", "P:OllamaSharp.Models.RequestOptions.TopP", "(Default: 0.9)" },
        { "temperance.provider.ollama.top_k.default", 40, "OllamaSharp.xml", "P:OllamaSharp.Models.RequestOptions.TopK", "(Default: 40)" },
    };

    [Theory]
    [MemberData(nameof(XmlPins))]
    public void PinnedValue_MatchesTheSdkDocumentation(string key, double expected, string xmlFile, string member, string quote)
    {
        Assert.Equal(expected, RulesTable.Number(key));

        var path = Path.Combine(AppContext.BaseDirectory, xmlFile);
        Assert.True(File.Exists(path), $"{xmlFile} was not restored next to the tests (CopyDocumentationFilesFromPackages)");
        var doc = XDocument.Load(path).Descendants("member").SingleOrDefault(m => (string?)m.Attribute("name") == member);
        Assert.NotNull(doc);
        var text = Regex.Replace(doc!.Value, @"\s+", " ");
        Assert.Contains(quote, text, StringComparison.Ordinal);

        // The quote must itself state the pinned number, so the pin cannot drift from its evidence.
        var numbers = Regex.Matches(quote, @"-?\d+(\.\d+)?").Select(m => double.Parse(m.Value, CultureInfo.InvariantCulture));
        Assert.Contains(expected, numbers);

        // And the table cites this source next to the value.
        Assert.Contains(xmlFile.Replace(".xml", string.Empty, StringComparison.Ordinal), RulesTable.Entries.Single(e => e.Key == key).Source, StringComparison.Ordinal);
    }

    [Fact]
    public void EveryValue_NamesItsSource()
    {
        var tags = new[] { "[xml:", "[api:", "[il:", "[spec:", "[issues:", "[paper:", "[common practice, no source]", "[from memory]" };
        var unsourced = RulesTable.Entries
            .Where(e => e.Key.StartsWith("temperance.", StringComparison.Ordinal))
            .Where(e => !tags.Any(t => e.Source.Contains(t, StringComparison.Ordinal)))
            .Select(e => $"line {e.Line}: {e.Key}")
            .ToList();
        Assert.True(unsourced.Count == 0, "values without a source comment:\n" + string.Join("\n", unsourced));
    }

    [Fact]
    public void Table_IsAGlobalConfigThatTeamsOverride()
    {
        Assert.Equal("true", RulesTable.Entries.Single(e => e.Key == "is_global").Value);
        // Lower than any default level (user .globalconfig files default to 100), so a team's config always wins.
        Assert.True(int.Parse(RulesTable.Entries.Single(e => e.Key == "global_level").Value, CultureInfo.InvariantCulture) < 0);
    }

    [Fact]
    public void EveryValue_IsANumber_AndRangesAreOrdered()
    {
        foreach (var entry in RulesTable.Entries.Where(e => e.Key.StartsWith("temperance.", StringComparison.Ordinal)))
        {
            if (entry.Key.EndsWith(".unset_means_default", StringComparison.Ordinal) || entry.Key.EndsWith(".drops_bag_keys", StringComparison.Ordinal))
            {
                Assert.True(bool.TryParse(entry.Value, out _), entry.Key);
            }
            else if (entry.Key == "temperance.require_seed")
            {
                Assert.Contains(entry.Value, new[] { "tests", "always", "never" });
            }
            else if (entry.Key == "temperance.raw_json")
            {
                Assert.Contains(entry.Value, new[] { "auto", "always", "never" });
            }
            else if (entry.Key.StartsWith("temperance.endpoint.", StringComparison.Ordinal))
            {
                // Hosts, and a provider the table has rows for.
                Assert.False(string.IsNullOrWhiteSpace(entry.Value), entry.Key);
                if (entry.Key.EndsWith(".provider", StringComparison.Ordinal))
                {
                    Assert.Contains(RulesTable.Entries, e => e.Key == $"temperance.provider.{entry.Value}.temperature.default");
                }
            }
            else if (!entry.Key.StartsWith("temperance.model.", StringComparison.Ordinal) && !entry.Key.EndsWith(".drops", StringComparison.Ordinal))
            {
                Assert.True(double.TryParse(entry.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out _), entry.Key);
            }
        }

        foreach (var min in RulesTable.Entries.Where(e => e.Key.EndsWith(".min", StringComparison.Ordinal)))
        {
            var maxKey = min.Key[..^".min".Length] + ".max";
            if (RulesTable.Entries.Any(e => e.Key == maxKey))
            {
                Assert.True(RulesTable.Number(min.Key) <= RulesTable.Number(maxKey), min.Key);
            }
        }
    }

    [Fact]
    public void EveryProvider_HasATemperatureFloorAndDefault()
    {
        foreach (var provider in Temperance.Surfaces.Providers.All)
        {
            Assert.Contains(RulesTable.Entries, e => e.Key == $"temperance.provider.{provider}.temperature.min");
            Assert.Contains(RulesTable.Entries, e => e.Key == $"temperance.provider.{provider}.temperature.default");
        }
    }
}
