using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Rules;

/// <summary>SAMP010: a value the model's publisher advises against (Gemini 3 below temperature 1.0).</summary>
public class SAMP010Tests
{
    [Fact]
    public async Task Gemini3BelowOne_Triggers_WithMessage()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class PilotageNotes
            {
                ChatOptions Options() => new ChatOptions { ModelId = "gemini-3-flash", {|#0:Temperature = 0.2f|} };
            }
            """,
            Verify.Diagnostic("SAMP010").WithLocation(0).WithMessage(
                "Temperature = 0.2 is below 1, the value the publisher advises keeping for model 'gemini-3-flash' (family 'gemini_3', temperance.model.gemini_3.recommended_temperature)"));
    }

    [Fact]
    public async Task OtherModels_AndUnknownModels_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class PilotageNotes
            {
                ChatOptions Older() => new ChatOptions { ModelId = "gemini-2.5-pro", Temperature = 0.2f };
                ChatOptions NoModel() => new ChatOptions { Temperature = 0.2f };
                ChatOptions Higher() => new ChatOptions { ModelId = "gemini-3-pro-preview", Temperature = 1.3f };
            }
            """);
    }

    [Fact]
    public async Task Fix_WritesTheAdvisedValue()
    {
        await Verify.FixAsync("""
            using Microsoft.Extensions.AI;

            class PilotageNotes
            {
                ChatOptions Options() => new ChatOptions { ModelId = "gemini-3-flash", {|SAMP010:Temperature = 0.2f|} };
            }
            """, """
            using Microsoft.Extensions.AI;

            class PilotageNotes
            {
                ChatOptions Options() => new ChatOptions { ModelId = "gemini-3-flash", Temperature = 1.0f };
            }
            """);
    }

    [Fact]
    public async Task DeploymentMappedToGemini3_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class PilotageNotes
            {
                ChatOptions Options() => new ChatOptions { ModelId = "pilotage-notes", {|SAMP010:Temperature = 0.4f|} };
            }
            """, "temperance.deployment.pilotage-notes = gemini-3-pro-preview\n");
    }
}
