using System.Collections.Generic;
using System.Linq;

namespace Temperance.Surfaces
{
    /// <summary>
    /// An IChatClient adapter: how its creation looks in code. Which ChatOptions settings it drops is data in the
    /// rules table (<c>temperance.adapter.&lt;name&gt;.drops</c>), not here.
    /// </summary>
    internal sealed class AdapterDefinition
    {
        public AdapterDefinition(string name, string display, string declaringType, string? method, string? receiverType)
        {
            Name = name;
            Display = display;
            DeclaringType = declaringType;
            Method = method;
            ReceiverType = receiverType;
        }

        /// <summary>Key in the rules table.</summary>
        public string Name { get; }
        /// <summary>For messages: "the OpenAI adapter (AsIChatClient)".</summary>
        public string Display { get; }
        /// <summary>The extension class of an adapter method, or the adapter type itself when it is created with <c>new</c>.</summary>
        public string DeclaringType { get; }
        /// <summary>The adapter method (<c>AsIChatClient</c>); null for adapters created with <c>new</c>.</summary>
        public string? Method { get; }
        /// <summary>The type the extension method extends, to tell the OpenAI chat adapter from the Responses one.</summary>
        public string? ReceiverType { get; }

        /// <summary>
        /// Methods of <see cref="DeclaringType"/> that take <see cref="ConvertedOptions"/> themselves and convert them the same
        /// way (MCP's <c>SampleAsync(messages, options)</c>): a request sent through one goes through this adapter.
        /// </summary>
        public string[] Sends { get; set; } = System.Array.Empty<string>();

        /// <summary>The options type (metadata name) an adapter converts: what a send of <see cref="Sends"/> must be given.</summary>
        public string ConvertedOptions { get; set; } = "Microsoft.Extensions.AI.ChatOptions";
    }

    internal static class AdapterSurfaces
    {
        public static readonly IReadOnlyList<AdapterDefinition> All = new List<AdapterDefinition>
        {
            new AdapterDefinition("openai_chat", "the OpenAI chat adapter (AsIChatClient)", "Microsoft.Extensions.AI.OpenAIClientExtensions", "AsIChatClient", "OpenAI.Chat.ChatClient"),
            new AdapterDefinition("openai_responses", "the OpenAI Responses adapter (AsIChatClient)", "Microsoft.Extensions.AI.OpenAIClientExtensions", "AsIChatClient", "OpenAI.Responses.ResponsesClient"),
            new AdapterDefinition("anthropic", "the Anthropic adapter (AsIChatClient)", "Microsoft.Extensions.AI.AnthropicClientExtensions", "AsIChatClient", null),
            new AdapterDefinition("betalgo", "Betalgo's OpenAIService as IChatClient", "Betalgo.Ranul.OpenAI.Managers.OpenAIService", null, null),
            new AdapterDefinition("onnx_genai", "the ONNX Runtime GenAI chat client", "Microsoft.ML.OnnxRuntimeGenAI.OnnxRuntimeGenAIChatClient", null, null),
        }.Concat(McpSurfaces.Adapters()).ToList();
    }
}
