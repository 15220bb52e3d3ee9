using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Rules;

/// <summary>In-house wrappers declared in configuration get every rule like a built-in surface; bad declarations are SAMP100.</summary>
public class TeamSurfaceTests
{
    private const string Wrapper = """
        namespace Contoso.Llm
        {
            public sealed class GenerationSettings
            {
                public double? Heat { get; set; }
                public float? Nucleus { get; set; }
                public long? RandomSeed { get; set; }
                public string? Engine { get; set; }
                public string Label { get; set; } = "";
            }

            public sealed class Gateway
            {
                public string Complete(string prompt, GenerationSettings? settings = null) => prompt;
                public string CompleteRaw(string prompt) => prompt;
            }
        }
        """;

    private const string Config = """
        temperance.surface.contoso.type = Contoso.Llm.GenerationSettings
        temperance.surface.contoso.provider = openai
        temperance.surface.contoso.temperature = Heat
        temperance.surface.contoso.top_p = Nucleus
        temperance.surface.contoso.seed = RandomSeed
        temperance.surface.contoso.model = Engine
        temperance.surface.contoso.sends = Contoso.Llm.Gateway.CompleteRaw

        """;

    [Fact]
    public async Task DeclaredWrapper_GetsRangeExtremeAndTaskRules()
    {
        await Verify.AnalyzerAsync(Wrapper + """

            namespace Harbour
            {
                using Contoso.Llm;

                class Desk
                {
                    GenerationSettings Wild() => new GenerationSettings { {|SAMP005:Heat = 2.5|} };
                    GenerationSettings Hot() => new GenerationSettings { {|SAMP009:Heat = 1.7|} };
                    GenerationSettings ExtractCargo() => new GenerationSettings { Engine = "gpt-4o-mini", {|SAMP001:Heat = 0.9|} };
                    GenerationSettings Both() => new GenerationSettings { Heat = 0.6, {|SAMP004:Nucleus = 0.8f|} };
                    GenerationSettings Reasoning() => new GenerationSettings { Engine = "o3-mini", {|SAMP007:Heat = 0.2|} };
                }
            }
            """, Config);
    }

    [Fact]
    public async Task DeclaredSendMethods_AreRequestsWithoutOptions_AndGetTheAddArgumentFix()
    {
        await Verify.FixAsync(Wrapper + """

            namespace Harbour
            {
                using Contoso.Llm;

                class Desk
                {
                    string ExtractCrew(Gateway gateway, string text) => {|SAMP001:gateway.Complete(text)|};
                }
            }
            """, Wrapper + """

            namespace Harbour
            {
                using Contoso.Llm;

                class Desk
                {
                    string ExtractCrew(Gateway gateway, string text) => gateway.Complete(text, settings: new GenerationSettings { Heat = 0.0 });
                }
            }
            """, Config);

        // A declared send method without an options parameter is a request too; there is nothing to add options to.
        await Verify.AnalyzerAsync(Wrapper + """

            namespace Harbour
            {
                using Contoso.Llm;

                class Desk
                {
                    string ExtractCargo(Gateway gateway, string text) => {|SAMP001:gateway.CompleteRaw(text)|};
                }
            }
            """, Config);
    }

    [Fact]
    public async Task MissingType_NonNumericMember_UnknownProvider_AndMisspeltKeys_AreSAMP100()
    {
        await Verify.AnalyzerAsync(Wrapper, """
            temperance.surface.ghost.type = Contoso.Llm.NoSuchSettings
            temperance.surface.contoso.type = Contoso.Llm.GenerationSettings
            temperance.surface.contoso.temperature = Label
            temperance.surface.other.type = Contoso.Llm.GenerationSettings
            temperance.surface.other.provider = mistery
            temperance.extreme_temprature = 1.3

            """,
            Verify.Diagnostic("SAMP100").WithMessage("Temperance configuration 'temperance.surface.contoso.temperature' has the value 'Label'; expected the name of a settable numeric property of Contoso.Llm.GenerationSettings. The rule that needs it is skipped until this is fixed."),
            Verify.Diagnostic("SAMP100").WithMessage("Temperance configuration 'temperance.surface.ghost.type' has the value 'Contoso.Llm.NoSuchSettings'; expected the full metadata name of a type in this compilation or its references (e.g. Contoso.Llm.GenerationSettings). The rule that needs it is skipped until this is fixed."),
            Verify.Diagnostic("SAMP100").WithMessage("Temperance configuration 'temperance.surface.other.provider' has the value 'mistery'; expected one of openai, azure_inference, ollama, llamasharp, onnx_genai, anthropic, generic. The rule that needs it is skipped until this is fixed."),
            Verify.Diagnostic("SAMP100").WithMessage("Temperance configuration 'temperance.extreme_temprature' has the value '1.3'; expected a key Temperance knows (did you mean 'temperance.extreme_temperature'?) (a misspelt key is ignored until fixed; see the README's Configuration section). The rule that needs it is skipped until this is fixed."));
    }
}
