using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Files;

/// <summary>Fixes in settings files: a value rewritten in place, an entry removed so the file stays valid.</summary>
public class SettingsFileFixTests
{
    /// <summary>The marked diagnostic is reported exactly there, and its fix (action <paramref name="index"/>) gives <paramref name="after"/>.</summary>
    private static async Task AssertFixAsync(string path, string before, string after, int index = 0)
    {
        await Verify.FilesAsync(new[] { (path, before) }, null);
        var marked = System.Text.RegularExpressions.Regex.Match(before, @"\{\|(SAMP\d{3}):");
        var plain = System.Text.RegularExpressions.Regex.Replace(before, @"\{\|SAMP\d{3}:|\|\}", string.Empty);
        Assert.Equal(after, await FileFixRunner.ApplyAsync(path, plain, marked.Groups[1].Value, index));
    }

    [Fact]
    public async Task OutOfRange_InJson_SetsTheValue()
    {
        const string before = """
            {
              "execution_settings": {
                "gpt": { "model_id": "gpt-4o-mini", {|SAMP005:"top_p": 1.7|} }
              }
            }
            """;
        const string after = """
            {
              "execution_settings": {
                "gpt": { "model_id": "gpt-4o-mini", "top_p": 1.0 }
              }
            }
            """;
        await AssertFixAsync("/Prompts/Poem/config.json", before, after);
    }

    [Fact]
    public async Task RejectedSetting_InYaml_RemovesTheLine()
    {
        const string before = """
            name: CargoPlanner
            instructions: Plan the loading order of the car deck.
            model:
              id: o4-mini
              options:
                {|SAMP007:temperature: 0.2|}
                maxOutputTokens: 800
            """;
        const string after = """
            name: CargoPlanner
            instructions: Plan the loading order of the car deck.
            model:
              id: o4-mini
              options:
                maxOutputTokens: 800
            """;
        await AssertFixAsync("/Agents/cargo-planner.yaml", before, after);
        Assert.Equal(new[] { "Remove temperature" }, await FileFixRunner.TitlesAsync("/Agents/cargo-planner.yaml", before.Replace("{|SAMP007:", "").Replace("|}", ""), "SAMP007"));
    }

    [Fact]
    public async Task TopPRemoved_AsTheLastJsonEntry_TakesTheCommaBeforeIt()
    {
        const string before = """
            {
              "execution_settings": {
                "default": {
                  "temperature": 0.9,
                  {|SAMP004:"top_p": 0.5|}
                }
              }
            }
            """;
        const string after = """
            {
              "execution_settings": {
                "default": {
                  "temperature": 0.9
                }
              }
            }
            """;
        await AssertFixAsync("/Prompts/Poem/config.json", before, after);
    }

    [Fact]
    public async Task TopPRemoved_InTheMiddle_TakesItsLineAndComma()
    {
        const string before = """
            {
              "execution_settings": {
                "default": {
                  "temperature": 0.9,
                  {|SAMP004:"top_p": 0.5|},
                  "max_tokens": 90
                }
              }
            }
            """;
        const string after = """
            {
              "execution_settings": {
                "default": {
                  "temperature": 0.9,
                  "max_tokens": 90
                }
              }
            }
            """;
        await AssertFixAsync("/Prompts/Poem/config.json", before, after);
    }

    [Fact]
    public async Task SecondFix_OfTemperatureAndTopP_RemovesTheTemperature()
    {
        const string before = "kind: Prompt\nmodel:\n  options:\n    temperature: 0.6\n    {|SAMP004:topP: 0.8|}\n";
        const string after = "kind: Prompt\nmodel:\n  options:\n    topP: 0.8\n";
        await AssertFixAsync("/Agents/concierge.yaml", before, after, 1);
    }

    [Fact]
    public async Task FlowStyleYaml_OffersNoRemoval_ButStillSetsValues()
    {
        // In a flow mapping a removal could leave a stray comma: only the value is rewritten.
        const string before = "execution_settings:\n  gpt: { model_id: gpt-4o-mini, {|SAMP005:top_p: 1.7|} }\n";
        const string after = "execution_settings:\n  gpt: { model_id: gpt-4o-mini, top_p: 1.0 }\n";
        await AssertFixAsync("/Prompts/poem.yaml", before, after);
        Assert.Equal(new[] { "Set top_p to 1.0" }, await FileFixRunner.TitlesAsync("/Prompts/poem.yaml", before.Replace("{|SAMP005:", "").Replace("|}", ""), "SAMP005"));
    }
}
