using System.Collections.Generic;

namespace Temperance.Surfaces
{
    /// <summary>
    /// How clients are spelled across the SDKs: where a client's model id is written, how client factories are named,
    /// which builders wrap a client in middleware, which send overloads take raw protocol content, and how options are copied.
    /// </summary>
    internal static class ClientShapes
    {
        /// <summary>Parameters of a client's creation or factory that take the model id (or an Azure deployment name).</summary>
        public static readonly HashSet<string> ModelParameterNames = new HashSet<string>(System.StringComparer.Ordinal)
        {
            "model", "modelId", "deploymentName", "defaultModel", "defaultModelId",
        };

        /// <summary>
        /// Where a client is pointed at a server: a member of its options (<c>OpenAIClientOptions.Endpoint</c>) or a
        /// constructor parameter (<c>new AzureOpenAIClient(endpoint, …)</c>), given a constant <c>new Uri("…")</c> or string.
        /// </summary>
        public static readonly HashSet<string> EndpointMembers = new HashSet<string>(System.StringComparer.Ordinal) { "Endpoint" };
        public static readonly HashSet<string> EndpointParameterNames = new HashSet<string>(System.StringComparer.Ordinal) { "endpoint", "uri", "baseUri" };

        /// <summary>Client factories are <c>Get…Client</c> (<c>GetChatClient("gpt-4o")</c>, <c>GetResponsesClient</c>): their first string is the model.</summary>
        public const string ClientFactoryPrefix = "Get";
        public const string ClientFactorySuffix = "Client";

        /// <summary>Middleware builders and the constructor argument that holds the client underneath (M.E.AI <c>new ChatClientBuilder(inner)</c>).</summary>
        public static readonly IReadOnlyDictionary<string, int> MiddlewareBuilders = new Dictionary<string, int>(System.StringComparer.Ordinal)
        {
            ["Microsoft.Extensions.AI.ChatClientBuilder"] = 0,
        };

        /// <summary>The first parameter type of protocol overloads that send raw content (OpenAI's <c>CompleteChat(BinaryContent, …)</c>): not typed requests.</summary>
        public const string ProtocolContentType = "BinaryContent";

        /// <summary>An options copy (<c>options.Clone()</c>): the copy starts with the original's writes.</summary>
        public const string CopyMethod = "Clone";
    }
}
