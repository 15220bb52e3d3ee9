using Temperance.Model;

namespace Temperance.Policy
{
    /// <summary>Every option key Temperance reads. All live under <c>temperance.</c>, lower case, words joined by '_'.</summary>
    internal static class OptionKeys
    {
        public const string Prefix = "temperance.";
        public const string ExtremeTemperature = "temperance.extreme_temperature";
        public const string Task = "temperance.task";

        /// <summary><c>temperance.provider.openai.temperature.max</c> and its siblings <c>.min</c> and <c>.default</c>.</summary>
        public static string ProviderLimit(string provider, Setting setting, string bound) =>
            $"temperance.provider.{provider}.{setting.KeyName()}.{bound}";

        /// <summary><c>temperance.task.extraction.temperature</c>: the value fixes write for that task.</summary>
        public static string TaskTemperature(string kind) => $"temperance.task.{kind}.temperature";

        /// <summary><c>temperance.task.extraction.max_temperature</c>: the SAMP001 ceiling for that task.</summary>
        public static string TaskCeiling(string kind) => $"temperance.task.{kind}.max_temperature";

        public const string TestSeed = "temperance.test_seed";
        public const string RawJson = "temperance.raw_json";
        public const string RequireSeed = "temperance.require_seed";
        public const string TestAttributes = "temperance.test_attributes";

        public const string CandidatesTemperature = "temperance.candidates_temperature";

        public static string UnsetMeansDefault(string provider) => $"temperance.provider.{provider}.unset_means_default";

        public const string ModelPrefix = "temperance.model.";

        /// <summary><c>temperance.model.&lt;family&gt;.match</c>: comma-separated model-id prefixes of the family.</summary>
        public static string ModelMatch(string family) => $"{ModelPrefix}{family}.match";

        /// <summary><c>temperance.model.&lt;family&gt;.except</c>: prefixes that match but are not in the family.</summary>
        public static string ModelExcept(string family) => $"{ModelPrefix}{family}.except";

        /// <summary><c>temperance.model.&lt;family&gt;.rejects</c>: the settings the family rejects.</summary>
        public static string ModelRejects(string family) => $"{ModelPrefix}{family}.rejects";

        /// <summary><c>temperance.model.&lt;family&gt;.provider</c>: the provider whose ranges apply when the request does not say (a raw payload).</summary>
        public static string ModelProvider(string family) => $"{ModelPrefix}{family}.provider";

        /// <summary><c>temperance.model.&lt;family&gt;.reasoning_default</c>: the reasoning effort when the request sets none.</summary>
        public static string ModelReasoningDefault(string family) => $"{ModelPrefix}{family}.reasoning_default";

        /// <summary><c>temperance.model.&lt;family&gt;.reasoning_rejects</c>: settings rejected at any reasoning effort but <c>none</c>.</summary>
        public static string ModelReasoningRejects(string family) => $"{ModelPrefix}{family}.reasoning_rejects";

        /// <summary><c>temperance.model.&lt;family&gt;.thinking_rejects</c>: settings rejected (other than at their default) with extended thinking on.</summary>
        public static string ModelThinkingRejects(string family) => $"{ModelPrefix}{family}.thinking_rejects";

        /// <summary><c>temperance.model.&lt;family&gt;.exclusive</c>: settings the model rejects when more than one of them is set.</summary>
        public static string ModelExclusive(string family) => $"{ModelPrefix}{family}.exclusive";

        /// <summary><c>temperance.model.&lt;family&gt;.recommended_temperature</c>: the publisher advises against a lower temperature (SAMP010).</summary>
        public static string ModelRecommendedTemperature(string family) => $"{ModelPrefix}{family}.recommended_temperature";

        public const string EndpointPrefix = "temperance.endpoint.";

        /// <summary><c>temperance.endpoint.&lt;name&gt;.match</c>: hosts (host or host:port) of servers of one kind.</summary>
        public static string EndpointMatch(string name) => $"{EndpointPrefix}{name}.match";

        /// <summary><c>temperance.endpoint.&lt;name&gt;.provider</c>: the provider a client pointed at such a server talks to.</summary>
        public static string EndpointProvider(string name) => $"{EndpointPrefix}{name}.provider";

        public const string DeploymentPrefix = "temperance.deployment.";

        /// <summary>
        /// <c>temperance.deployment.&lt;name&gt; = &lt;model id&gt;</c>: a deployment or alias name the code uses in place of a model
        /// id (<c>GetChatClient("extractor-prod")</c>). Matched case-insensitively (configuration keys are lower case).
        /// </summary>
        public static string Deployment(string name) => DeploymentPrefix + name.ToLowerInvariant();

        /// <summary><c>temperance.adapter.openai_chat.drops</c>: ChatOptions settings an IChatClient adapter ignores.</summary>
        public static string AdapterDrops(string adapter) => $"temperance.adapter.{adapter}.drops";

        /// <summary><c>temperance.adapter.openai_chat.drops_bag_keys</c>: whether it ignores sampling keys in AdditionalProperties.</summary>
        public static string AdapterDropsBagKeys(string adapter) => $"temperance.adapter.{adapter}.drops_bag_keys";

        /// <summary>
        /// Every key Temperance reads, once: the keys that take no name part, then the key families (a pattern over
        /// <c>temperance.</c>). The known-keys check and the misspelling suggestions are derived from this list, so a new
        /// option is its line here and the policy accessor that reads it.
        /// </summary>
        public static readonly string[] FixedKeys =
        {
            ExtremeTemperature, Task, TestSeed, RequireSeed, TestAttributes, RawJson, CandidatesTemperature,
        };

        /// <summary>Key families, as regular expressions over the part after <c>temperance.</c> (see the methods above).</summary>
        public static readonly string[] KeyFamilies =
        {
            "task\\.[a-z_]+\\.(temperature|max_temperature)",
            "provider\\.[a-z_]+\\.[a-z_]+\\.(min|max|default)",
            "provider\\.[a-z_]+\\.unset_means_default",
            "model\\.[a-z0-9_]+\\.(match|rejects|except|provider|reasoning_default|reasoning_rejects|thinking_rejects|exclusive|recommended_temperature)",
            "deployment\\.[^\\s]+",
            "endpoint\\.[a-z0-9_]+\\.(match|provider)",
            "adapter\\.[a-z0-9_]+\\.(drops|drops_bag_keys)",
            "surface\\.[a-z0-9_]+\\.(type|provider|temperature|top_p|top_k|seed|candidates|model|response_format|sends)",
        };

        /// <summary>Whether a key is one Temperance reads (a fixed key or a member of a key family).</summary>
        public static bool IsKnown(string key) => KnownKey.IsMatch(key);

        private static readonly System.Text.RegularExpressions.Regex KnownKey = new System.Text.RegularExpressions.Regex(
            "^(" + string.Join("|", System.Linq.Enumerable.Select(FixedKeys, System.Text.RegularExpressions.Regex.Escape))
            + "|temperance\\.(" + string.Join("|", KeyFamilies) + "))$",
            System.Text.RegularExpressions.RegexOptions.CultureInvariant);

        public static readonly string[] TaskKinds =
        {
            "extraction", "classification", "code", "evaluation", "tool_use",
            "summarization", "translation", "conversation", "creative", "brainstorming",
        };

        /// <summary>
        /// The keys an options object lists. Some hosts and older tools do not implement <c>Keys</c> (it throws
        /// NotImplementedException); then no key is listed, which only means the keys that must be enumerated (model
        /// families, team surfaces, misspellings) are not found. Keys read by name still work.
        /// </summary>
        public static System.Collections.Generic.IEnumerable<string> ListedKeys(Microsoft.CodeAnalysis.Diagnostics.AnalyzerConfigOptions options)
        {
            try
            {
                return System.Linq.Enumerable.ToList(options.Keys);
            }
            catch (System.NotImplementedException)
            {
                return System.Array.Empty<string>();
            }
            catch (System.NotSupportedException)
            {
                return System.Array.Empty<string>();
            }
        }
    }
}
