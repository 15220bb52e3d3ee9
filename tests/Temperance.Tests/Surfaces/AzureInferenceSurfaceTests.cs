using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>Azure.AI.Inference <c>ChatCompletionsOptions</c>: temperature [0, 1], top-p is <c>NucleusSamplingFactor</c>.</summary>
public class AzureInferenceSurfaceTests
{
    [Fact]
    public async Task TemperatureAboveOne_TriggersBecauseTheServiceAcceptsOnlyZeroToOne()
    {
        await Verify.AnalyzerAsync("""
            using Azure.AI.Inference;

            class Warehouse
            {
                ChatCompletionsOptions Options() => new ChatCompletionsOptions { Model = "phi-4", {|SAMP005:Temperature = 1.2f|}, {|SAMP005:NucleusSamplingFactor = 1.3f|} };
            }
            """);
    }

    [Fact]
    public void NucleusSamplingFactor_IsTopP()
    {
        var request = Extract.Single("""
            using Azure.AI.Inference;

            class Warehouse
            {
                ChatCompletionsOptions Options() => new ChatCompletionsOptions { Model = "phi-4", NucleusSamplingFactor = 0.5f, Seed = 3 };
            }
            """);
        Assert.Equal("azure_inference", request.Provider);
        Assert.Equal("phi-4", request.ModelId);
        Assert.Equal((ValueKind.Known, 0.5), request.Setting(Setting.TopP));
    }
}
