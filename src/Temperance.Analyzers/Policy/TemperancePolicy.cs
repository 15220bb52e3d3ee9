using System;
using System.Collections.Generic;
using System.Globalization;
using System.Linq;
using Microsoft.CodeAnalysis.Diagnostics;
using Temperance.Model;

namespace Temperance.Policy
{
    /// <summary>A bound of the rules table together with the key it came from, so messages can name it.</summary>
    internal readonly struct Limit
    {
        public Limit(double value, string key)
        {
            Value = value;
            Key = key;
        }

        public double Value { get; }
        public string Key { get; }
    }

    /// <summary>A configuration entry that could not be used: reported as SAMP100, and the rule needing it stays silent.</summary>
    internal sealed class ConfigProblem
    {
        public ConfigProblem(string key, string value, string expected)
        {
            Key = key;
            Value = value;
            Expected = expected;
        }

        public string Key { get; }
        public string Value { get; }
        public string Expected { get; }
    }

    /// <summary>
    /// Typed view of the rules table and the team's .editorconfig for one syntax tree. Values are read through
    /// Roslyn's analyzer-config options only (no file I/O); the tree's options win, the global config is the fallback.
    /// </summary>
    internal sealed class TemperancePolicy
    {
        private readonly AnalyzerConfigOptions treeOptions;
        private readonly AnalyzerConfigOptions globalOptions;
        private readonly System.Collections.Concurrent.ConcurrentDictionary<string, Limit?> numbers = new System.Collections.Concurrent.ConcurrentDictionary<string, Limit?>(StringComparer.Ordinal);
        private readonly List<ConfigProblem> problems = new List<ConfigProblem>();
        private readonly object gate = new object();
        private int problemCount;

        public TemperancePolicy(AnalyzerConfigOptions treeOptions, AnalyzerConfigOptions globalOptions)
        {
            this.treeOptions = treeOptions;
            this.globalOptions = globalOptions;
            TaskKind = ReadTaskKind();
        }

        /// <summary>The task every call in this file has, from <c>temperance.task</c>; null when not set or invalid.</summary>
        public string? TaskKind { get; }

        /// <summary><c>temperance.task</c> is set to something Temperance cannot use: the task rule is skipped for the file, never guessed.</summary>
        public bool TaskKindInvalid { get; private set; }

        /// <summary>
        /// <c>temperance.test_seed</c> is set but is not a number: fixes write no seed at all rather than a substitute.
        /// </summary>
        public bool TestSeedInvalid => TestSeed == null && TryGetRaw(OptionKeys.TestSeed, out var raw) && raw.Length > 0;

        /// <summary>Problems found so far; each is reported once per tree by the analyzer.</summary>
        public IReadOnlyList<ConfigProblem> Problems
        {
            get
            {
                if (System.Threading.Volatile.Read(ref problemCount) == 0)
                {
                    return Array.Empty<ConfigProblem>(); // the usual case, asked once per block: no lock
                }

                lock (gate)
                {
                    return problems.ToArray();
                }
            }
        }

        public Limit? ExtremeTemperature => Number(OptionKeys.ExtremeTemperature);

        public Limit? Min(string provider, Setting setting) => Lookup(provider, setting, "min");

        public Limit? Max(string provider, Setting setting) => Lookup(provider, setting, "max");

        public Limit? Default(string provider, Setting setting) => Lookup(provider, setting, "default");

        /// <summary>
        /// The accepted range of a setting for a provider; an open end is null. Null when the table gives no bound, or when
        /// its bounds are inverted: that is a configuration error (reported here as SAMP100, both keys named), not a reason
        /// to warn on code.
        /// </summary>
        public (Limit? Min, Limit? Max)? Range(string provider, Setting setting)
        {
            var min = Min(provider, setting);
            var max = Max(provider, setting);
            if (min == null && max == null)
            {
                return null;
            }

            if (min != null && max != null && min.Value.Value > max.Value.Value)
            {
                AddProblem(new ConfigProblem(min.Value.Key, min.Value.Value.ToString(CultureInfo.InvariantCulture),
                    $"a value no greater than '{max.Value.Key}' ({max.Value.Value.ToString(CultureInfo.InvariantCulture)})"));
                return null;
            }

            return (min, max);
        }

        /// <summary>The temperature fixes write for a task (<c>temperance.task.&lt;kind&gt;.temperature</c>).</summary>
        public Limit? TaskTemperatureOf(string kind) => Lookup(kind, Setting.Temperature, TaskTemperatureBound);

        /// <summary>The ceiling SAMP001 applies to a task; null for kinds without one (creative, brainstorming).</summary>
        public Limit? TaskCeiling(string kind) => Lookup(kind, Setting.Temperature, TaskCeilingBound);

        private const string TaskTemperatureBound = "task temperature";
        private const string TaskCeilingBound = "task ceiling";

        /// <summary>
        /// A provider bound or task value, cached by its parts: every rule asks for a few of them per request, and building
        /// the key string each time cost more than the rule itself.
        /// </summary>
        private Limit? Lookup(string subject, Setting setting, string bound)
        {
            var id = (subject, setting, bound);
            if (limits.TryGetValue(id, out var cached))
            {
                return cached;
            }

            var key = bound switch
            {
                TaskTemperatureBound => OptionKeys.TaskTemperature(subject),
                TaskCeilingBound => OptionKeys.TaskCeiling(subject),
                _ => OptionKeys.ProviderLimit(subject, setting, bound),
            };
            var limit = Number(key);
            limits.TryAdd(id, limit);
            return limit;
        }

        private readonly System.Collections.Concurrent.ConcurrentDictionary<(string Subject, Setting Setting, string Bound), Limit?> limits =
            new System.Collections.Concurrent.ConcurrentDictionary<(string, Setting, string), Limit?>();

        /// <summary>The temperature SAMP008's second fix raises to, so several candidates can differ.</summary>
        public Limit? CandidatesTemperature => Number(OptionKeys.CandidatesTemperature);

        /// <summary>
        /// Whether an unset temperature really means the provider's documented default. False where something outside the
        /// call may fill it in (an Ollama Modelfile, an IChatClient pipeline's ConfigureOptions), so SAMP001 stays silent.
        /// </summary>
        public bool UnsetMeansDefault(string provider)
        {
            if (!unsetMeansDefault.TryGetValue(provider, out var value))
            {
                value = Flag(OptionKeys.UnsetMeansDefault(provider)) ?? false;
                unsetMeansDefault.TryAdd(provider, value);
            }

            return value;
        }

        private readonly System.Collections.Concurrent.ConcurrentDictionary<string, bool> unsetMeansDefault =
            new System.Collections.Concurrent.ConcurrentDictionary<string, bool>(StringComparer.Ordinal);

        /// <summary>The seed fixes write (<c>temperance.test_seed</c>).</summary>
        public Limit? TestSeed => Number(OptionKeys.TestSeed);

        /// <summary>Where SAMP003 asks for a seed: tests (default), always, or never.</summary>
        public string RequireSeed => requireSeed ??= ReadRequireSeed();

        private string? requireSeed;

        private string ReadRequireSeed()
        {
            if (!TryGetRaw(OptionKeys.RequireSeed, out var raw) || raw.Length == 0)
            {
                return "tests";
            }

            var value = raw.ToLowerInvariant();
            if (value is "tests" or "always" or "never")
            {
                return value;
            }

            AddProblem(new ConfigProblem(OptionKeys.RequireSeed, raw, "tests, always or never"));
            return "never";
        }

        /// <summary>Extra test attributes from <c>temperance.test_attributes</c> (simple or full names).</summary>
        public IReadOnlyCollection<string> TestAttributes =>
            testAttributes ??= TryGetRaw(OptionKeys.TestAttributes, out var raw) ? Split(raw).ToArray() : Array.Empty<string>();

        private IReadOnlyCollection<string>? testAttributes;

        /// <summary>The settings an IChatClient adapter drops (<c>temperance.adapter.&lt;name&gt;.drops</c>), and whether it ignores bag keys.</summary>
        public (IReadOnlyList<Setting> Drops, bool DropsBagKeys, string Key) AdapterDrops(string adapter)
        {
            var key = OptionKeys.AdapterDrops(adapter);
            var drops = new List<Setting>();
            if (TryGetRaw(key, out var raw))
            {
                foreach (var item in Split(raw))
                {
                    if (SettingNames.Parse(item) is { } setting)
                    {
                        drops.Add(setting);
                    }
                    else
                    {
                        AddProblem(new ConfigProblem(key, raw, "a comma-separated list of settings such as temperature, top_k"));
                    }
                }
            }

            return (drops, Flag(OptionKeys.AdapterDropsBagKeys(adapter)) ?? false, key);
        }

        /// <summary>The model family whose patterns match a model id, with the settings it rejects.</summary>
        public ModelFamily? FamilyOf(string? modelId)
        {
            if (modelId == null)
            {
                return null;
            }

            // Several rules ask per request, and a file holds few distinct model ids.
            if (familyByModel.TryGetValue(modelId, out var known))
            {
                return known;
            }

            // The most specific family wins: "gpt-5." (effort-aware) over "gpt-5" over "gpt-".
            ModelFamily? found = null;
            var best = -1;
            foreach (var family in Families())
            {
                var length = family.MatchLength(modelId);
                if (length > best)
                {
                    best = length;
                    found = family;
                }
            }

            familyByModel.TryAdd(modelId, found);
            return found;
        }

        private readonly System.Collections.Concurrent.ConcurrentDictionary<string, ModelFamily?> familyByModel =
            new System.Collections.Concurrent.ConcurrentDictionary<string, ModelFamily?>(StringComparer.Ordinal);

        private IReadOnlyList<ModelFamily>? families;

        private IReadOnlyList<ModelFamily> Families()
        {
            if (System.Threading.Volatile.Read(ref families) is { } known)
            {
                return known;
            }

            var found = new List<ModelFamily>();
            // A plain loop over the keys: this runs once per file, and the LINQ chain it replaces showed in profiles.
            var names = new SortedSet<string>(StringComparer.Ordinal);
            AddNames(treeOptions, OptionKeys.ModelPrefix, ".match", names);
            AddNames(globalOptions, OptionKeys.ModelPrefix, ".match", names);
            foreach (var name in names)
            {
                TryGetRaw(OptionKeys.ModelMatch(name), out var match);
                TryGetRaw(OptionKeys.ModelExcept(name), out var except);
                var family = new ModelFamily(name, Split(match).ToArray(), SettingList(OptionKeys.ModelRejects(name)), OptionKeys.ModelMatch(name), Split(except).ToArray())
                {
                    ReasoningRejects = SettingList(OptionKeys.ModelReasoningRejects(name)),
                    ThinkingRejects = SettingList(OptionKeys.ModelThinkingRejects(name)),
                    Exclusive = SettingList(OptionKeys.ModelExclusive(name)),
                    RecommendedTemperature = Number(OptionKeys.ModelRecommendedTemperature(name)),
                };
                if (TryGetRaw(OptionKeys.ModelReasoningDefault(name), out var effort) && effort.Length > 0)
                {
                    family.ReasoningDefault = effort.ToLowerInvariant();
                }

                if (TryGetRaw(OptionKeys.ModelProvider(name), out var provider) && provider.Length > 0)
                {
                    // Any provider the rules table has a temperature default for (a family may name one no SDK surface uses).
                    if (Default(provider, Setting.Temperature) != null)
                    {
                        family.Provider = provider;
                    }
                    else
                    {
                        AddProblem(new ConfigProblem(OptionKeys.ModelProvider(name), provider, "a provider with rows in the rules table (temperance.provider.<name>.temperature.default)"));
                    }
                }

                found.Add(family);
            }

            lock (gate)
            {
                families ??= found;
                return families;
            }
        }

        /// <summary>A comma-separated list of settings; a name that is not one is SAMP100 and left out.</summary>
        private IReadOnlyList<Setting> SettingList(string key)
        {
            TryGetRaw(key, out var raw);
            var settings = new List<Setting>();
            foreach (var item in Split(raw))
            {
                if (SettingNames.Parse(item) is { } setting)
                {
                    settings.Add(setting);
                }
                else
                {
                    AddProblem(new ConfigProblem(key, raw, "a comma-separated list of settings such as temperature, top_p"));
                }
            }

            return settings;
        }

        /// <summary>
        /// The model a request goes to: its constant id, or what a deployment or alias name maps to
        /// (<c>temperance.deployment.&lt;name&gt;</c>), with where the mapping came from; null when unknown.
        /// </summary>
        public (string Id, string? MappedBy)? ResolveModel(string? modelId)
        {
            if (string.IsNullOrEmpty(modelId))
            {
                return null;
            }

            var key = OptionKeys.Deployment(modelId!);
            return TryGetRaw(key, out var mapped) && mapped.Length > 0 ? (mapped, key) : (modelId!, (string?)null);
        }

        /// <summary>
        /// The provider of the server an endpoint points at (<c>temperance.endpoint.&lt;name&gt;.match</c> hosts, compared with
        /// the address's host and host:port), and the key that says so; null for an address no entry names.
        /// </summary>
        public (string Provider, string Key)? ProviderAt(string? endpoint)
        {
            if (endpoint == null)
            {
                return null;
            }

            // A file holds few distinct addresses; the entries are read once per address.
            if (providerByEndpoint.TryGetValue(endpoint, out var known))
            {
                return known;
            }

            var found = FindProviderAt(endpoint);
            providerByEndpoint.TryAdd(endpoint, found);
            return found;
        }

        private readonly System.Collections.Concurrent.ConcurrentDictionary<string, (string Provider, string Key)?> providerByEndpoint =
            new System.Collections.Concurrent.ConcurrentDictionary<string, (string Provider, string Key)?>(StringComparer.Ordinal);

        private (string Provider, string Key)? FindProviderAt(string endpoint)
        {
            System.Uri uri;
            try
            {
                if (!System.Uri.TryCreate(endpoint, System.UriKind.Absolute, out uri!))
                {
                    return null;
                }
            }
            catch (Exception e) when (e is UriFormatException or ArgumentException)
            {
                return null; // a malformed host (IDN) on .NET Framework hosts: an unknown address
            }

            var host = uri.Host.ToLowerInvariant();
            var hostPort = host + ":" + uri.Port.ToString(CultureInfo.InvariantCulture);
            var names = new SortedSet<string>(StringComparer.Ordinal);
            AddNames(treeOptions, OptionKeys.EndpointPrefix, ".match", names);
            AddNames(globalOptions, OptionKeys.EndpointPrefix, ".match", names);
            foreach (var name in names)
            {
                TryGetRaw(OptionKeys.EndpointMatch(name), out var match);
                if (Split(match).Any(m => string.Equals(m, hostPort, StringComparison.OrdinalIgnoreCase) || string.Equals(m, host, StringComparison.OrdinalIgnoreCase))
                    && TryGetRaw(OptionKeys.EndpointProvider(name), out var provider) && provider.Length > 0)
                {
                    if (Default(provider, Setting.Temperature) != null)
                    {
                        return (provider, OptionKeys.EndpointMatch(name));
                    }

                    AddProblem(new ConfigProblem(OptionKeys.EndpointProvider(name), provider, "a provider with rows in the rules table (temperance.provider.<name>.temperature.default)"));
                }
            }

            return null;
        }

        /// <summary>The names of keyed entries (<c>prefix + name + suffix</c>) an options object lists: model families, endpoints.</summary>
        private static void AddNames(AnalyzerConfigOptions options, string prefix, string suffix, SortedSet<string> names)
        {
            foreach (var key in OptionKeys.ListedKeys(options))
            {
                if (key.Length > prefix.Length + suffix.Length && key.StartsWith(prefix, StringComparison.Ordinal) && key.EndsWith(suffix, StringComparison.Ordinal))
                {
                    names.Add(key.Substring(prefix.Length, key.Length - prefix.Length - suffix.Length));
                }
            }
        }

        private static IEnumerable<string> Split(string list) =>
            list.Split(new[] { ',' }, StringSplitOptions.RemoveEmptyEntries).Select(p => p.Trim()).Where(p => p.Length > 0);

        private void AddProblem(ConfigProblem problem)
        {
            lock (gate)
            {
                if (!problems.Exists(p => p.Key == problem.Key))
                {
                    problems.Add(problem);
                    System.Threading.Volatile.Write(ref problemCount, problems.Count);
                }
            }
        }

        private bool? Flag(string key)
        {
            if (!TryGetRaw(key, out var raw) || raw.Length == 0)
            {
                return null;
            }

            if (bool.TryParse(raw, out var value))
            {
                return value;
            }

            AddProblem(new ConfigProblem(key, raw, "true or false"));
            return null;
        }

        public bool TryGetRaw(string key, out string value)
        {
            if (treeOptions.TryGetValue(key, out var local) && local != null)
            {
                value = local.Trim();
                return true;
            }

            if (globalOptions.TryGetValue(key, out var global) && global != null)
            {
                value = global.Trim();
                return true;
            }

            value = string.Empty;
            return false;
        }

        private Limit? Number(string key)
        {
            if (numbers.TryGetValue(key, out var cached))
            {
                return cached;
            }

            Limit? result = null;
            ConfigProblem? problem = null;
            if (TryGetRaw(key, out var raw) && raw.Length > 0)
            {
                if (double.TryParse(raw, NumberStyles.Float, CultureInfo.InvariantCulture, out var parsed)
                    && !double.IsNaN(parsed) && !double.IsInfinity(parsed))
                {
                    result = new Limit(parsed, key);
                }
                else
                {
                    problem = new ConfigProblem(key, raw, "a number such as 1.5 (invariant culture, '.' as decimal separator)");
                }
            }

            if (numbers.TryAdd(key, result) && problem != null)
            {
                AddProblem(problem);
            }

            return result;
        }

        private string? ReadTaskKind()
        {
            if (!TryGetRaw(OptionKeys.Task, out var raw) || raw.Length == 0)
            {
                return null;
            }

            var kind = raw.ToLowerInvariant();
            if (OptionKeys.TaskKinds.Contains(kind))
            {
                return kind;
            }

            problems.Add(new ConfigProblem(OptionKeys.Task, raw, "one of " + string.Join(", ", OptionKeys.TaskKinds) + ConfigSource.Suggestion(kind, OptionKeys.TaskKinds)));
            problemCount = problems.Count;
            TaskKindInvalid = true;
            return null;
        }
    }
}
