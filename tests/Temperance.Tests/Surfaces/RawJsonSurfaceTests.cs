using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>Hand-built JSON payloads: anonymous objects, dictionaries and JsonObject sent with HttpClient or serialised.</summary>
public class RawJsonSurfaceTests
{
    [Fact]
    public async Task AnonymousPayloadPostedAsJson_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;

            class Proxy
            {
                Task<HttpResponseMessage> Send(HttpClient http, string text) =>
                    http.PostAsJsonAsync("v1/chat/completions", new { model = "gpt-4o-mini", {|SAMP005:temperature = -1.0|}, {|SAMP005:top_p = 1.2|}, messages = new[] { new { role = "user", content = text } } });
            }
            """);
    }

    [Fact]
    public async Task DictionaryPayloadSerialised_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Collections.Generic;
            using System.Text.Json;

            class Proxy
            {
                string Body()
                {
                    var payload = new Dictionary<string, object> { ["model"] = "mistral-small", {|SAMP009:["temperature"] = 1.9|} };
                    {|SAMP005:payload["n"] = 0|};
                    return JsonSerializer.Serialize(payload);
                }
            }
            """);
    }

    [Fact]
    public async Task JsonObjectPayload_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Text.Json.Nodes;

            class Proxy
            {
                string Body()
                {
                    var body = new JsonObject { ["model"] = "llama3.2", {|SAMP009:["temperature"] = 2.5|}, ["stream"] = false };
                    return body.ToJsonString();
                }
            }
            """);
    }

    [Fact]
    public async Task OllamaNativeOptionsObject_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;

            class Proxy
            {
                Task<HttpResponseMessage> Send(HttpClient http) =>
                    http.PostAsJsonAsync("api/chat", new { model = "llama3.2", options = new { {|SAMP009:temperature = 1.6|}, top_k = 20 } });
            }
            """);
    }

    [Fact]
    public async Task DictionaryWithoutModelKey_DoesNotTrigger()
    {
        // A "temperature" key alone is ordinary data (a weather reading); without "model" it is no LLM payload.
        await Verify.AnalyzerAsync("""
            using System.Collections.Generic;
            using System.Text.Json;

            class Weather
            {
                string Reading() => JsonSerializer.Serialize(new Dictionary<string, object> { ["temperature"] = 31.5, ["station"] = "pier-4" });
            }
            """);
    }

    [Fact]
    public async Task CarTelemetryWithModelAndTemperature_DoesNotTrigger()
    {
        // Regression: "model" and one "temperature" alone are a car's telemetry; a model request also carries
        // messages, a prompt, max_tokens, a second sampling key or the like.
        await Verify.AnalyzerAsync("""
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;

            class Fleet
            {
                Task<HttpResponseMessage> Report(HttpClient http) => http.PostAsJsonAsync("telemetry", new { model = "Corolla", temperature = 21.5, odometer = 48210 });
            }
            """);
    }

    [Fact]
    public async Task PayloadNeverSentOrSerialised_DoesNotTrigger()
    {
        // A model/temperature pair that never reaches a JSON call is not known to be a request (e.g. a view model).
        await Verify.AnalyzerAsync("""
            class Dashboard
            {
                object Row() => new { model = "thermostat-x2", temperature = 48.0 };
            }
            """);
    }

    [Fact]
    public void Payload_CapturesModelAndCandidates()
    {
        var request = Extract.Single("""
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;

            class Proxy
            {
                Task<HttpResponseMessage> Send(HttpClient http) =>
                    http.PostAsJsonAsync("v1/chat/completions", new { model = "gpt-4o-mini", n = 2, temperature = 0.0, response_format = new { type = "json_object" } });
            }
            """);
        Assert.Equal("gpt-4o-mini", request.ModelId);
        Assert.Equal((ValueKind.Known, 2d), request.Setting(Setting.Candidates));
        Assert.Equal(ResponseShape.JsonObject, request.ResponseShape);
    }

    private const string PlainHttpClient = """
        using System.Net.Http;
        using System.Net.Http.Json;
        using System.Threading.Tasks;

        class Proxy
        {
            Task<HttpResponseMessage> Send(HttpClient http) => http.PostAsJsonAsync("v1/chat/completions", new { model = "gpt-4o-mini", top_p = 1.5, max_tokens = 200 });
        }
        """;

    [Fact]
    public async Task ProjectWithoutAnySdk_IsSilentByDefault_ZeroCost()
    {
        var test = new TemperanceTest(PlainHttpClient);
        test.TestState.AdditionalReferences.Clear();
        test.TestState.AdditionalReferences.AddRange(TestReferences.Framework);
        await test.RunAsync();
    }

    [Fact]
    public async Task ProjectWithoutAnySdk_RawJsonAlways_Triggers()
    {
        var test = new TemperanceTest(PlainHttpClient.Replace("top_p = 1.5", "{|SAMP005:top_p = 1.5|}", StringComparison.Ordinal), "temperance.raw_json = always\n");
        test.TestState.AdditionalReferences.Clear();
        test.TestState.AdditionalReferences.AddRange(TestReferences.Framework);
        await test.RunAsync();
    }
}
