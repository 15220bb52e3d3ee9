using System;
using System.Collections.Generic;
using System.Linq;
using Temperance.Model;

namespace Temperance.Policy
{
    /// <summary>
    /// A family of models from the rules table (<c>temperance.model.&lt;family&gt;.*</c>): which model ids belong to it, and
    /// what it does with sampling settings: rejects always, rejects in a mode (reasoning effort other than none, extended
    /// thinking), rejects in combination, and the temperature its publisher advises not to go below.
    /// </summary>
    internal sealed class ModelFamily
    {
        private static readonly Setting[] NoSettings = new Setting[0];

        public ModelFamily(string name, IReadOnlyList<string> prefixes, IReadOnlyList<Setting> rejects, string key, IReadOnlyList<string>? exceptions = null)
        {
            Name = name;
            Prefixes = prefixes;
            Rejects = rejects;
            Key = key;
            Exceptions = exceptions ?? Array.Empty<string>();
        }

        /// <summary>Prefixes inside the family that do not belong to it (a chat variant of a reasoning line).</summary>
        public IReadOnlyList<string> Exceptions { get; }

        public string Name { get; }
        public IReadOnlyList<string> Prefixes { get; }
        public IReadOnlyList<Setting> Rejects { get; }
        /// <summary>The key that matched the family (for messages: where the knowledge comes from).</summary>
        public string Key { get; }

        /// <summary>The provider whose ranges apply to a request that does not name one (a raw payload, ChatOptions).</summary>
        public string? Provider { get; set; }
        /// <summary>The reasoning effort the model uses when the request sets none (gpt-5.1: none; earlier: medium).</summary>
        public string? ReasoningDefault { get; set; }
        /// <summary>Settings rejected at any reasoning effort other than <c>none</c>.</summary>
        public IReadOnlyList<Setting> ReasoningRejects { get; set; } = NoSettings;
        /// <summary>Settings rejected with extended thinking on (other than at the provider default).</summary>
        public IReadOnlyList<Setting> ThinkingRejects { get; set; } = NoSettings;
        /// <summary>Settings of which at most one may be set (Anthropic: temperature or top_p, not both).</summary>
        public IReadOnlyList<Setting> Exclusive { get; set; } = NoSettings;
        /// <summary>The publisher advises keeping the temperature at this value; lower values are SAMP010.</summary>
        public Limit? RecommendedTemperature { get; set; }

        /// <summary>
        /// The length of the longest prefix that matches, or -1: the most specific family wins. A prefix matches at a word
        /// boundary: "o3" matches "o3", "o3-mini" and "o3.1", not "o30"; a prefix ending in '-' or '.' matches anything
        /// after it; a trailing '*' in the table is allowed and means the same.
        /// </summary>
        public int MatchLength(string modelId)
        {
            if (LongestMatch(modelId, Exceptions) >= 0)
            {
                return -1;
            }

            return LongestMatch(modelId, Prefixes);
        }

        private static int LongestMatch(string modelId, IReadOnlyList<string> prefixes)
        {
            var longest = -1;
            for (var i = 0; i < prefixes.Count; i++)
            {
                var bare = prefixes[i].TrimEnd('*');
                if (bare.Length > longest && MatchesPrefix(modelId, bare))
                {
                    longest = bare.Length;
                }
            }

            return longest;
        }

        private static bool MatchesPrefix(string modelId, string bare)
        {
            if (bare.Length == 0 || !modelId.StartsWith(bare, StringComparison.OrdinalIgnoreCase))
            {
                return false;
            }

            return modelId.Length == bare.Length || !char.IsLetterOrDigit(modelId[bare.Length]) || !char.IsLetterOrDigit(bare[bare.Length - 1]);
        }

        public bool RejectsSetting(Setting setting) => Rejects.Contains(setting);
    }
}
