using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>Microsoft.Extensions.AI <c>ChatOptions</c>, alone and inside Microsoft.Agents.AI run/agent options.</summary>
public class MicrosoftExtensionsAISurfaceTests
{
    [Fact]
    public async Task NegativeTemperatureAndTopPAboveOne_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Concierge
            {
                ChatOptions Options() => new ChatOptions { {|SAMP005:Temperature = -0.5f|}, {|SAMP005:TopP = 1.5f|} };
            }
            """);
    }

    [Fact]
    public async Task TemperatureAboveTwo_IsExtremeNotOutOfRange_BecauseSomeProvidersAcceptIt()
    {
        // ChatOptions is provider-agnostic: Ollama and llama.cpp accept temperature 2.5, so SAMP005 stays silent
        // (widest common range) and SAMP009 speaks instead.
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Concierge
            {
                ChatOptions Options() => new ChatOptions { {|SAMP009:Temperature = 2.5f|} };
            }
            """);
    }

    [Fact]
    public async Task TypicalOptions_DoNotTrigger()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Concierge
            {
                ChatOptions Options() => new ChatOptions { Temperature = 0.7f, TopK = 40, Seed = 42, ModelId = "gpt-4o-mini" };
            }
            """);
    }

    [Fact]
    public async Task AdditionalPropertiesCandidateCountZero_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Extensions.AI;

            class Concierge
            {
                ChatOptions Options() => new ChatOptions
                {
                    AdditionalProperties = new AdditionalPropertiesDictionary { {|SAMP005:["N"] = 0|} },
                };
            }
            """);
    }

    [Fact]
    public void StructuredOutputCall_MakesTheShapeStructured()
    {
        var request = Extract.Single("""
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            record Booking(string Guest, int Nights);

            class Reservations
            {
                async Task<Booking> Parse(IChatClient client, string email)
                {
                    var options = new ChatOptions { Temperature = 0f, ModelId = "gpt-4o-mini" };
                    var response = await client.GetResponseAsync<Booking>(email, options);
                    return response.Result;
                }
            }
            """);
        Assert.Equal(ResponseShape.Structured, request.ResponseShape);
        Assert.Equal("gpt-4o-mini", request.ModelId);
        Assert.Equal("generic", request.Provider);
    }

    [Fact]
    public void JsonResponseFormat_IsJsonObject()
    {
        var request = Extract.Single("""
            using Microsoft.Extensions.AI;

            class Reservations
            {
                ChatOptions Options() => new ChatOptions { ResponseFormat = ChatResponseFormat.Json };
            }
            """);
        Assert.Equal(ResponseShape.JsonObject, request.ResponseShape);
        Assert.Equal(ValueKind.Unset, request.Setting(Setting.Temperature).Kind);
    }

    [Fact]
    public async Task AgentRunOptionsWithChatOptions_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.Agents.AI;
            using Microsoft.Extensions.AI;

            class Itinerary
            {
                ChatClientAgentRunOptions Options() => new ChatClientAgentRunOptions
                {
                    ChatOptions = new ChatOptions { {|SAMP009:Temperature = 1.9f|} },
                };

                ChatClientAgentRunOptions ViaConstructor() => new ChatClientAgentRunOptions(new ChatOptions { {|SAMP005:TopP = 2f|} });
            }
            """);
    }
}
