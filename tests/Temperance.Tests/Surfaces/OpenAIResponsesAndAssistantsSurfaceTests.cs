using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>OpenAI Responses (<c>CreateResponseOptions</c>) and Assistants (<c>RunCreationOptions</c>, top-p as NucleusSamplingFactor).</summary>
public class OpenAIResponsesAndAssistantsSurfaceTests
{
    [Fact]
    public async Task ResponsesTemperatureAboveTwo_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Responses;

            class Drafts
            {
                CreateResponseOptions Options() => new CreateResponseOptions { Model = "gpt-4.1", {|SAMP005:Temperature = 2.2f|} };
            }
            """);
    }

    [Fact]
    public void Responses_CapturesModelAndSchemaShape()
    {
        var request = Extract.Single("""
            using System;
            using OpenAI.Responses;

            class Drafts
            {
                CreateResponseOptions Options() => new CreateResponseOptions
                {
                    Model = "gpt-4.1-mini",
                    Temperature = 0.1f,
                    TextOptions = new ResponseTextOptions { TextFormat = ResponseTextFormat.CreateJsonSchemaFormat("order", BinaryData.FromString("{}")) },
                };
            }
            """);
        Assert.Equal("gpt-4.1-mini", request.ModelId);
        Assert.Equal(ResponseShape.JsonSchema, request.ResponseShape);
        Assert.Equal((ValueKind.Known, 0.1), request.Setting(Setting.Temperature));
    }

    [Fact]
    public async Task AssistantsNucleusSamplingFactorAboveOne_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using OpenAI.Assistants;

            class Runs
            {
                RunCreationOptions Options() => new RunCreationOptions { {|SAMP005:NucleusSamplingFactor = 1.5f|} };
            }
            """);
    }
}
