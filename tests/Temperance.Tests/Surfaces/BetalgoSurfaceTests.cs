using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>Betalgo.Ranul.OpenAI <c>ChatCompletionCreateRequest</c>, including the candidate count <c>N</c>.</summary>
public class BetalgoSurfaceTests
{
    [Fact]
    public async Task TemperatureAndCandidates_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using Betalgo.Ranul.OpenAI.ObjectModels.RequestModels;

            class Taglines
            {
                ChatCompletionCreateRequest Request() => new ChatCompletionCreateRequest
                {
                    Model = "gpt-4o-mini",
                    {|SAMP005:Temperature = 2.1f|},
                    {|SAMP005:N = 0|},
                };
            }
            """);
    }

    [Fact]
    public void Candidates_AreCaptured()
    {
        var request = Extract.Single("""
            using Betalgo.Ranul.OpenAI.ObjectModels.RequestModels;

            class Taglines
            {
                ChatCompletionCreateRequest Request() => new ChatCompletionCreateRequest { Model = "gpt-4o-mini", N = 3, Temperature = 0.9f };
            }
            """);
        Assert.Equal("openai", request.Provider);
        Assert.Equal("gpt-4o-mini", request.ModelId);
        Assert.Equal((ValueKind.Known, 3d), request.Setting(Setting.Candidates));
    }
}
