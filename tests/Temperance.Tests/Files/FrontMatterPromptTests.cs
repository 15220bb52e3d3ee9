using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Files;

/// <summary>Prompt files with a front matter of model parameters (Prompty; the .prompt format's config).</summary>
public class FrontMatterPromptTests
{
    [Fact]
    public async Task PromptyParameters_OutOfRange_TriggersAtTheKey()
    {
        const string prompty = """
            ---
            name: LostPropertyReply
            description: Replies to a passenger who lost something on board.
            model:
              api: chat
              configuration:
                type: azure_openai
                azure_deployment: gpt-4o
              parameters:
                max_tokens: 400
                {|SAMP005:frequency_penalty: 2.5|}
            ---
            system:
            You answer passengers of the island ferry kindly and briefly.
            user:
            {{question}}
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/lost-property.prompty", prompty) }, null);
    }

    [Fact]
    public async Task TaskFromTheBody_Classification_Triggers()
    {
        const string prompt = """
            ---
            model: googleai/gemini-2.5-flash
            config:
              {|SAMP001:temperature: 1.3|}
            ---
            Classify the passenger's message as one of the following labels: refund, delay, lost_property, other.
            {{message}}
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/triage.prompt", prompt) }, null);
    }

    [Fact]
    public async Task NoFrontMatter_OrNoParameters_IsSilent()
    {
        await Verify.FilesAsync(new[]
        {
            ("/Prompts/plain.prompt.md", "Say hello to the passengers at temperature 2.5, said nobody.\n"),
            ("/Prompts/meta.prompty", "---\nname: Greeting\nmodel:\n  api: chat\n---\nsystem:\nGreet the passenger. Keep the temperature of the talk low.\n"),
        }, null);
    }

    [Fact]
    public async Task ComputedParameter_IsUnknown_AndSilent()
    {
        const string prompty = "---\nname: Reply\nmodel:\n  parameters:\n    temperature: ${env:REPLY_TEMPERATURE}\n    top_p: 0.4\n---\nuser:\n{{question}}\n";
        await Verify.FilesAsync(new[] { ("/Prompts/reply.prompty", prompty) }, null);
    }

    [Fact]
    public async Task MalformedFrontMatter_GivesOneSamp100_AtTheFilesLine()
    {
        const string prompty = "---\nname: Reply\nmodel:\n  parameters:\n    temperature: [0.4\n---\nuser:\n{{question}}\n";
        await Verify.FilesAsync(new[] { ("/Prompts/reply.prompty", prompty) }, null,
            Verify.Diagnostic("SAMP100").WithSpan("/Prompts/reply.prompty", 6, 1, 6, 1));
    }
}
