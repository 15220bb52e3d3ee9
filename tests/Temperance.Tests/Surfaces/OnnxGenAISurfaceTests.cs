using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>ONNX Runtime GenAI: <c>GeneratorParams.SetSearchOption("key", value)</c>.</summary>
public class OnnxGenAISurfaceTests
{
    [Fact]
    public async Task SearchOptions_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.ML.OnnxRuntimeGenAI;

            class Glossary
            {
                void Configure(Model model)
                {
                    var generatorParams = new GeneratorParams(model);
                    {|SAMP009:generatorParams.SetSearchOption("temperature", 2.0)|};
                    {|SAMP005:generatorParams.SetSearchOption("top_p", 1.5)|};
                    generatorParams.SetSearchOption("max_length", 2048);
                    using var generator = new Generator(model, generatorParams);
                }
            }
            """);
    }

    [Fact]
    public void SearchOptionsAndGuidance_AreRead()
    {
        var request = Extract.Single("""
            using Microsoft.ML.OnnxRuntimeGenAI;

            class Glossary
            {
                void Configure(Model model)
                {
                    var generatorParams = new GeneratorParams(model);
                    generatorParams.SetSearchOption("temperature", 0.0);
                    generatorParams.SetSearchOption("random_seed", 12);
                    generatorParams.SetGuidance("json_schema", "{}");
                }
            }
            """);
        Assert.Equal("onnx_genai", request.Provider);
        Assert.Equal((ValueKind.Known, 0d), request.Setting(Setting.Temperature));
        Assert.Equal((ValueKind.Known, 12d), request.Setting(Setting.Seed));
        Assert.Equal(ResponseShape.JsonSchema, request.ResponseShape);
    }
}
