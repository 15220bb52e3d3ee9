using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>OllamaSharp: <c>RequestOptions</c> inside <c>ChatRequest</c>/<c>GenerateRequest</c>.</summary>
public class OllamaSurfaceTests
{
    [Fact]
    public async Task NestedRequestOptions_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using OllamaSharp.Models.Chat;
            using OllamaSharp.Models;

            class Recipes
            {
                ChatRequest Request() => new ChatRequest
                {
                    Model = "llama3.2",
                    Options = new RequestOptions { {|SAMP009:Temperature = 2.5f|}, {|SAMP005:TopP = 1.1f|}, {|SAMP005:TopK = -1|} },
                };
            }
            """);
    }

    [Fact]
    public async Task OllamaAcceptsTemperatureAboveTwo_SoOnlyExtremeApplies()
    {
        await Verify.AnalyzerAsync("""
            using OllamaSharp.Models;

            class Recipes
            {
                RequestOptions Options() => new RequestOptions { {|SAMP009:Temperature = 3f|} };
                RequestOptions Sensible() => new RequestOptions { Temperature = 0.8f, TopK = 40, TopP = 0.9f, MinP = 0.05f };
            }
            """);
    }

    [Fact]
    public void ChatRequest_CapturesModelFormatAndNestedOptions()
    {
        var request = Extract.Single("""
            using OllamaSharp.Models.Chat;
            using OllamaSharp.Models;

            class Recipes
            {
                ChatRequest Request() => new ChatRequest
                {
                    Model = "llama3.2",
                    Format = "json",
                    Options = new RequestOptions { Temperature = 0.1f, Seed = 5 },
                };
            }
            """);
        Assert.Equal("ollama", request.Provider);
        Assert.Equal("llama3.2", request.ModelId);
        Assert.Equal(ResponseShape.JsonObject, request.ResponseShape);
        Assert.Equal((ValueKind.Known, 0.1), request.Setting(Setting.Temperature));
        Assert.Equal((ValueKind.Known, 5d), request.Setting(Setting.Seed));
    }
}
