using Temperance.Tests.Infrastructure;
using static Temperance.Rules.FixProperties;

namespace Temperance.Tests.Rules;

/// <summary>SAMP008: several candidates at temperature 0 are all the same.</summary>
public class SAMP008Tests
{
    private const string Betalgo = """
        using Betalgo.Ranul.OpenAI.ObjectModels.RequestModels;

        class Taglines
        {
            ChatCompletionCreateRequest Request() => new ChatCompletionCreateRequest { Model = "gpt-4o-mini", Temperature = 0f, {|#0:N = 3|} };
        }
        """;

    [Fact]
    public async Task BetalgoN_Triggers_WithMessage()
    {
        await Verify.AnalyzerAsync(Betalgo.Replace("Temperature = 0f", "Temperature = 0f", StringComparison.Ordinal).Replace("Temperature = 0f", "Temperature = 0f", StringComparison.Ordinal),
            Verify.Diagnostic("SAMP008").WithLocation(0).WithMessage(
                "3 candidates are requested at temperature 0: greedy decoding makes every candidate the same"));
    }

    [Fact]
    public async Task FirstFix_SetsCandidatesToOne()
    {
        var test = new TemperanceTest(
            Betalgo.Replace("{|#0:N = 3|}", "{|SAMP008:N = 3|}", StringComparison.Ordinal),
            fixedSource: Betalgo.Replace("{|#0:N = 3|}", "N = 1", StringComparison.Ordinal));
        test.CodeActionEquivalenceKey = PrimaryKey;
        await test.RunAsync();
    }

    [Fact]
    public async Task SecondFix_RaisesTheTemperatureToTheTableValue()
    {
        var test = new TemperanceTest(
            Betalgo.Replace("{|#0:N = 3|}", "{|SAMP008:N = 3|}", StringComparison.Ordinal),
            fixedSource: Betalgo.Replace("{|#0:N = 3|}", "N = 3", StringComparison.Ordinal).Replace("Temperature = 0f", "Temperature = 0.8f", StringComparison.Ordinal));
        test.CodeActionEquivalenceKey = Key("SAMP008", SetValue, 1);
        test.CodeActionIndex = 1;
        await test.RunAsync();
    }

    [Fact]
    public async Task RawPayloadN_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;

            class Proxy
            {
                Task<HttpResponseMessage> Send(HttpClient http) =>
                    http.PostAsJsonAsync("v1/chat/completions", new { model = "gpt-4o-mini", temperature = 0, {|SAMP008:n = 4|} });
            }
            """);
    }

    [Fact]
    public async Task OneCandidateOrNonZeroTemperature_DoesNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using Betalgo.Ranul.OpenAI.ObjectModels.RequestModels;

            class Taglines
            {
                ChatCompletionCreateRequest One() => new ChatCompletionCreateRequest { Temperature = 0f, N = 1 };
                ChatCompletionCreateRequest Warm() => new ChatCompletionCreateRequest { Temperature = 0.9f, N = 3 };
                ChatCompletionCreateRequest Unset() => new ChatCompletionCreateRequest { N = 3 };
                ChatCompletionCreateRequest FromCaller(float t) => new ChatCompletionCreateRequest { Temperature = t, N = 3 };
            }
            """);
    }
}
