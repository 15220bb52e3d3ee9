using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>
    /// Model Context Protocol C# SDK (ModelContextProtocol.Core 2.4.0): a server asks the connected client's model to
    /// sample (<c>sampling/createMessage</c>). The client picks the model and the specification publishes no range ("Valid
    /// range depends upon the model provider"), so its requests are judged as provider-agnostic (<see cref="Providers.Generic"/>).
    /// Sources, read 2026-12-02: the 2.4.0 assembly and its XML docs; the specification's schema (2024-11-05 … 2026-07-28)
    /// and <c>client/sampling.mdx</c> of 2026-07-28. Sampling is [Obsolete] (MCP9005) in 2.4.0: the specification deprecates
    /// it as of 2026-07-28 (SEP-2577), and it stays recognised while code uses it.
    /// </summary>
    internal static class McpSurfaces
    {
        private const string Server = "ModelContextProtocol.Server.McpServer";

        public static SurfaceDefinition[] All() => new[]
        {
            // Temperature (float?) is the one sampling member; ModelPreferences holds hints the client MAY ignore, not a model id.
            // SampleAsync(CreateMessageRequestParams) sends it; SampleAsync(messages, ChatOptions) sends ChatOptions (declared send
            // of this client type, so the value flow follows ChatOptions there too).
            new SurfaceDefinition("ModelContextProtocol.Protocol.CreateMessageRequestParams", Providers.Generic)
                .Map("Temperature", Setting.Temperature)
                .Sends(Server, "SampleAsync"),
        };

        /// <summary>
        /// <c>McpServer.SampleAsync(messages, ChatOptions)</c> and the IChatClient from <c>AsSamplingChatClient()</c> copy only
        /// Temperature, MaxOutputTokens, StopSequences, ModelId (as a hint), tools and instructions into the request; the
        /// other ChatOptions settings are dropped and AdditionalProperties go to <c>_meta</c> (2.4.0, McpServer.SampleAsync).
        /// </summary>
        public static AdapterDefinition[] Adapters() => new[]
        {
            new AdapterDefinition("mcp_sampling", "MCP sampling (McpServer.SampleAsync / AsSamplingChatClient)", Server, "AsSamplingChatClient", null)
            {
                Sends = new[] { "SampleAsync" },
            },
        };
    }
}
