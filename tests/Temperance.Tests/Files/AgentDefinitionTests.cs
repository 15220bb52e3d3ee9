using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Files;

/// <summary>Declarative agent definitions: model → id and model → options (camel-case keys such as topP).</summary>
public class AgentDefinitionTests
{
    [Fact]
    public async Task TemperatureAndTopPBothMoved_Triggers()
    {
        const string agent = """
            kind: Prompt
            name: QuaysideConcierge
            description: Answers passengers' questions at the quayside kiosk.
            instructions: You help passengers find their ferry, the ticket office and the cafe.
            model:
              id: gpt-4.1-mini
              options:
                temperature: 0.6
                {|SAMP004:topP: 0.8|}
            """;
        await Verify.FilesAsync(new[] { ("/Agents/concierge.agent.yaml", agent) }, null);
    }

    [Fact]
    public async Task ReasoningModel_WithTemperature_Triggers()
    {
        const string agent = """
            type: chat_completion_agent
            name: CargoPlanner
            instructions: Plan the loading order of the vehicles on the deck.
            model:
              id: o4-mini
              options:
                {|SAMP007:temperature: 0.2|}
            """;
        await Verify.FilesAsync(new[] { ("/Agents/cargo-planner.yaml", agent) }, null);
    }

    [Fact]
    public async Task FineOptions_AreSilent()
    {
        const string agent = """
            kind: Prompt
            name: QuaysideConcierge
            instructions: You help passengers find their ferry.
            model:
              id: gpt-4.1-mini
              options:
                temperature: 0.6
                maxOutputTokens: 400
            """;
        await Verify.FilesAsync(new[] { ("/Agents/concierge.yaml", agent) }, null);
    }

    [Fact]
    public async Task ComputedModelAndValue_AreUnknown_AndSilent()
    {
        const string agent = """
            kind: Prompt
            name: CargoPlanner
            model:
              id: ${env:PLANNER_MODEL}
              options:
                temperature: =Env.PLANNER_TEMPERATURE
                topP: 0.9
            """;
        await Verify.FilesAsync(new[] { ("/Agents/cargo-planner.yaml", agent) }, null);
    }

    [Fact]
    public async Task MalformedAgent_GivesOneSamp100()
    {
        const string agent = "kind: Prompt\nmodel:\n  options:\n    temperature: 0.6\n   topP: 0.8\n";
        await Verify.FilesAsync(new[] { ("/Agents/broken.yaml", agent) }, null,
            Verify.Diagnostic("SAMP100").WithSpan("/Agents/broken.yaml", 5, 4, 5, 4));
    }
}
