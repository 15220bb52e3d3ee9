using System;
using System.Collections.Generic;
using System.Linq;
using Temperance.Model;

namespace Temperance.Policy
{
    /// <summary>A family of models from the rules table: which model ids belong to it and which settings it rejects.</summary>
    internal sealed class ModelFamily
    {
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
        public string Key { get; }

        /// <summary>
        /// A prefix matches at a word boundary: "o3" matches "o3", "o3-mini" and "o3.1", not "o30"; a trailing '*' in the
        /// table is allowed and means the same.
        /// </summary>
        public bool Matches(string modelId) => MatchesAny(modelId, Prefixes) && !MatchesAny(modelId, Exceptions);

        private static bool MatchesAny(string modelId, IReadOnlyList<string> prefixes)
        {
            for (var i = 0; i < prefixes.Count; i++)
            {
                if (MatchesPrefix(modelId, prefixes[i]))
                {
                    return true;
                }
            }

            return false;
        }

        private static bool MatchesPrefix(string modelId, string prefix)
        {
            var bare = prefix.Length > 0 && prefix[prefix.Length - 1] == '*' ? prefix.TrimEnd('*') : prefix;
            if (!modelId.StartsWith(bare, StringComparison.OrdinalIgnoreCase))
            {
                return false;
            }

            return modelId.Length == bare.Length || !char.IsLetterOrDigit(modelId[bare.Length]) || bare.EndsWith("-", StringComparison.Ordinal);
        }

        public bool RejectsSetting(Setting setting) => Rejects.Contains(setting);
    }
}
