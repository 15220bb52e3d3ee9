using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Rules;

/// <summary>SAMP006 (Info): a setting another setting makes inert.</summary>
public class SAMP006Tests
{
    [Fact]
    public async Task TemperatureZeroWithTopPAndTopK_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Gates
            {
                ChatOptions A() => new ChatOptions { Temperature = 0f, {|#0:TopP = 0.9f|}, {|SAMP006:TopK = 20|} };
            }
            """,
            Verify.Diagnostic("SAMP006").WithLocation(0).WithMessage(
                "TopP = 0.9 has no effect because temperature is 0: decoding is greedy and always takes the most likely token"));
    }

    [Fact]
    public async Task TopKOneWithTemperature_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using OllamaSharp.Models;

            class Gates
            {
                RequestOptions A() => new RequestOptions { {|SAMP006:Temperature = 0.6f|}, TopK = 1 };
            }
            """);
    }

    [Fact]
    public async Task OnnxDoSampleFalse_MakesSamplingInert()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.ML.OnnxRuntimeGenAI;

            class Gates
            {
                void A(Model model)
                {
                    var p = new GeneratorParams(model);
                    p.SetSearchOption("do_sample", false);
                    {|SAMP006:p.SetSearchOption("temperature", 0.6)|};
                    {|SAMP006:p.SetSearchOption("top_k", 30)|};
                    using var generator = new Generator(model, p);
                }
            }
            """);
    }

    [Fact]
    public async Task ExplicitDefaultsAndUnknowns_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Gates
            {
                ChatOptions TopPOne() => new ChatOptions { Temperature = 0f, TopP = 1f, TopK = 1 };
                ChatOptions UnknownTemperature(float t) => new ChatOptions { Temperature = t, TopK = 1 };
                ChatOptions UnsetTemperature() => new ChatOptions { TopK = 1 };
            }
            """);
    }

    [Fact]
    public async Task Fix_RemovesTheInertMember_FromAStatement()
    {
        await Verify.FixAsync("""
            using Microsoft.ML.OnnxRuntimeGenAI;

            class Gates
            {
                void A(Model model)
                {
                    var p = new GeneratorParams(model);
                    p.SetSearchOption("do_sample", false);
                    // sampling knobs below are ignored
                    {|SAMP006:p.SetSearchOption("top_p", 0.9)|};
                    using var generator = new Generator(model, p);
                }
            }
            """, """
            using Microsoft.ML.OnnxRuntimeGenAI;

            class Gates
            {
                void A(Model model)
                {
                    var p = new GeneratorParams(model);
                    p.SetSearchOption("do_sample", false);
                    // sampling knobs below are ignored
                    using var generator = new Generator(model, p);
                }
            }
            """);
    }

    [Fact]
    public async Task Fix_RemovesAnAnonymousPayloadMember()
    {
        await Verify.FixAsync("""
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;

            class Gates
            {
                Task<HttpResponseMessage> A(HttpClient http) => http.PostAsJsonAsync("v1/chat/completions", new { model = "gpt-4o-mini", temperature = 0, {|SAMP006:top_p = 0.5|} });
            }
            """, """
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;

            class Gates
            {
                Task<HttpResponseMessage> A(HttpClient http) => http.PostAsJsonAsync("v1/chat/completions", new { model = "gpt-4o-mini", temperature = 0 });
            }
            """);
    }
}
