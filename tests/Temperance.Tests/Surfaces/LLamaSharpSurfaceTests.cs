using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>LLamaSharp <c>DefaultSamplingPipeline</c> (init-only, non-nullable float, uint seed) inside <c>InferenceParams</c>.</summary>
public class LLamaSharpSurfaceTests
{
    [Fact]
    public async Task PipelineInsideInferenceParams_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using LLama.Common;
            using LLama.Sampling;

            class FieldNotes
            {
                InferenceParams Params() => new InferenceParams
                {
                    MaxTokens = 256,
                    SamplingPipeline = new DefaultSamplingPipeline { {|SAMP009:Temperature = 2.2f|}, {|SAMP005:FrequencyPenalty = 3f|} },
                };
            }
            """);
    }

    [Fact]
    public void Grammar_IsTheResponseShape()
    {
        var request = Extract.Single("""
            using LLama.Sampling;

            class FieldNotes
            {
                DefaultSamplingPipeline Pipeline() => new DefaultSamplingPipeline
                {
                    Temperature = 0.2f,
                    Seed = 9u,
                    Grammar = new Grammar("root ::= \"yes\" | \"no\"", "root"),
                };
            }
            """);
        Assert.Equal("llamasharp", request.Provider);
        Assert.Equal(ResponseShape.Grammar, request.ResponseShape);
        Assert.Equal((ValueKind.Known, 9d), request.Setting(Setting.Seed));
    }
}
