using System;
using System.Collections.Generic;
using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>
    /// Hand-built JSON payloads (anonymous objects, string-keyed dictionaries, JsonObject). Recognised only when they
    /// carry a "model" key and at least one sampling key, so ordinary dictionaries stay silent.
    /// </summary>
    /// <summary><c>temperance.raw_json</c>: auto (when an LLM SDK or declared surface is referenced), always, never.</summary>
    internal enum RawJsonMode
    {
        Auto,
        Always,
        Never,
    }

    internal static class RawJsonSurface
    {
        public const string ModelKey = "model";

        /// <summary>
        /// Sampling keys of the chat-completions wire format and its local cousins: the trade names, plus <c>n</c> (candidates)
        /// and Ollama's <c>repeat_penalty</c>. Case-sensitive, as JSON is.
        /// </summary>
        public static readonly IReadOnlyDictionary<string, Setting> Keys = WireKeys();

        private static Dictionary<string, Setting> WireKeys()
        {
            var keys = new Dictionary<string, Setting>(StringComparer.Ordinal) { ["n"] = Setting.Candidates, ["repeat_penalty"] = Setting.RepetitionPenalty };
            foreach (var setting in new[] { Setting.Temperature, Setting.TopP, Setting.TopK, Setting.MinP, Setting.Seed, Setting.FrequencyPenalty, Setting.PresencePenalty })
            {
                keys[setting.KeyName()] = setting;
            }

            return keys;
        }

        /// <summary>
        /// Keys only a model request carries. A payload with "model" and a single sampling key must have one of these too:
        /// { model = "Corolla", temperature = 21.5 } is a car's telemetry, not a request.
        /// </summary>
        public static readonly HashSet<string> RequestKeys = new HashSet<string>(StringComparer.Ordinal)
        {
            "messages", "prompt", "input", "system", "instructions", "max_tokens", "max_completion_tokens", "max_output_tokens",
            "num_predict", "stream", "options", "response_format", "format", "tools", "stop",
        };

        /// <summary>Ollama's native API nests sampling under this key: <c>new { model, options = new { temperature } }</c>.</summary>
        public const string NestedOptionsKey = "options";

        /// <summary>Keys that put a request in a mode: a string value, or a nested object and the member that holds it.</summary>
        public static readonly IReadOnlyDictionary<string, (string Mode, string? Member)> ModeKeys = new Dictionary<string, (string, string?)>(StringComparer.Ordinal)
        {
            ["reasoning_effort"] = (Modes.ReasoningEffort, null), // chat completions
            ["reasoning"] = (Modes.ReasoningEffort, "effort"),    // responses: "reasoning": { "effort": "low" }
            ["thinking"] = (Modes.Thinking, "type"),              // messages: "thinking": { "type": "enabled", "budget_tokens": … }
        };

        /// <summary>Keys that say what shape of answer a payload asks for.</summary>
        public static readonly HashSet<string> FormatKeys = new HashSet<string>(StringComparer.Ordinal) { "response_format", "format" };

        /// <summary>Static factories that wrap a payload value (<c>BinaryData.FromObjectAsJson(40)</c>, <c>JsonValue.Create(0.2)</c>): the value is the argument.</summary>
        public static readonly (string Type, string Method)[] ValueWrappers = { ("BinaryData", "FromObjectAsJson"), ("JsonValue", "Create") };

        /// <summary>Types whose methods serialise or post a payload, and the namespaces they must live in.</summary>
        public static readonly HashSet<string> SerialiserTypes = new HashSet<string>(StringComparer.Ordinal)
        {
            "HttpClientJsonExtensions", "JsonSerializer", "JsonContent", "JsonConvert", "JsonNode", "JsonObject",
        };

        public static readonly string[] SerialiserNamespaces = { "System.Net.Http.Json", "System.Text.Json", "Newtonsoft.Json" };

        /// <summary>Types a payload can be built with (metadata names).</summary>
        public static readonly string[] PayloadTypes =
        {
            "System.Text.Json.Nodes.JsonObject",
            "System.Collections.Generic.Dictionary`2",
        };
    }
}
