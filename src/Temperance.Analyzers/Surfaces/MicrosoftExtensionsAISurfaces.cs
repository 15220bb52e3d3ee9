using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>Microsoft.Extensions.AI <c>ChatOptions</c> (also what Microsoft.Agents.AI run options carry).</summary>
    internal static class MicrosoftExtensionsAISurfaces
    {
        public static SurfaceDefinition[] All() => new[]
        {
            // Provider-agnostic: the adapter behind IChatClient decides, so ranges are the widest any provider accepts.
            new SurfaceDefinition("Microsoft.Extensions.AI.ChatOptions", Providers.Generic)
                {
                    ModelMember = "ModelId",
                    ResponseFormatMember = "ResponseFormat",
                    BagMember = "AdditionalProperties",
                }
                .OpenAIShape()
                .Map("TopK", Setting.TopK)
                .Map("Seed", Setting.Seed)
                .Mode("Reasoning.Effort", Modes.ReasoningEffort)
                // Keys adapters read from AdditionalProperties: OllamaSharp's option names, Betalgo's "N".
                .TradeNameKeys(Setting.Temperature, Setting.TopP, Setting.TopK, Setting.MinP, Setting.Seed)
                .Key("repeat_penalty", Setting.RepetitionPenalty)
                .Key("N", Setting.Candidates)
                .Sends("Microsoft.Extensions.AI.IChatClient", "GetResponseAsync", "GetStreamingResponseAsync")
                .Sends("Microsoft.Extensions.AI.ChatClientExtensions", "GetResponseAsync", "GetStreamingResponseAsync")
                .Sends("Microsoft.Extensions.AI.ChatClientStructuredOutputExtensions", "GetResponseAsync"),
            // Agents: per-run options go with a run; agent options are stored in the agent, so creating it is the send.
            new SurfaceDefinition("Microsoft.Agents.AI.ChatClientAgentRunOptions", Providers.Generic)
                .Nested("ChatOptions")
                .Sends("Microsoft.Agents.AI.AIAgent", "RunAsync", "RunStreamingAsync"),
            new SurfaceDefinition("Microsoft.Agents.AI.ChatClientAgentOptions", Providers.Generic)
                .Nested("ChatOptions")
                .Sends("Microsoft.Agents.AI.ChatClientAgent", SendSite.Constructor)
                .Sends("Microsoft.Extensions.AI.ChatClientExtensions", "AsAIAgent"),
        };
    }
}
