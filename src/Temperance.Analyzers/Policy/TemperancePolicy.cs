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

        public TemperancePolicy(AnalyzerConfigOptions treeOptions, AnalyzerConfigOptions globalOptions)
        {
            this.treeOptions = treeOptions;
            this.globalOptions = globalOptions;
            TaskKind = ReadTaskKind();
        }

        /// <summary>The task every call in this file has, from <c>temperance.task</c>; null when not set or invalid.</summary>
        public string? TaskKind { get; }

        /// <summary>Problems found so far; each is reported once per tree by the analyzer.</summary>
        public IReadOnlyList<ConfigProblem> Problems
        {
            get
            {
                lock (gate)
                {
                    return problems.ToArray();
                }
            }
        }

        public Limit? ExtremeTemperature => Number(OptionKeys.ExtremeTemperature);

        public Limit? Min(string provider, Setting setting) => Number(OptionKeys.ProviderLimit(provider, setting, "min"));

        public Limit? Max(string provider, Setting setting) => Number(OptionKeys.ProviderLimit(provider, setting, "max"));

        public Limit? Default(string provider, Setting setting) => Number(OptionKeys.ProviderLimit(provider, setting, "default"));

        /// <summary>The temperature fixes write for a task (<c>temperance.task.&lt;kind&gt;.temperature</c>).</summary>
        public Limit? TaskTemperatureOf(string kind) => Number(OptionKeys.TaskTemperature(kind));

        /// <summary>The ceiling SAMP001 applies to a task; null for kinds without one (creative, brainstorming).</summary>
        public Limit? TaskCeiling(string kind) => Number(OptionKeys.TaskCeiling(kind));

        /// <summary>The temperature SAMP008's second fix raises to, so several candidates can differ.</summary>
        public Limit? CandidatesTemperature => Number(OptionKeys.CandidatesTemperature);

        /// <summary>
        /// Whether an unset temperature really means the provider's documented default. False where something outside the
        /// call may fill it in (an Ollama Modelfile, an IChatClient pipeline's ConfigureOptions), so SAMP001 stays silent.
        /// </summary>
        public bool UnsetMeansDefault(string provider) => Flag(OptionKeys.UnsetMeansDefault(provider)) ?? false;

        /// <summary>The seed fixes write (<c>temperance.test_seed</c>).</summary>
        public Limit? TestSeed => Number(OptionKeys.TestSeed);

        /// <summary>Where SAMP003 asks for a seed: tests (default), always, or never.</summary>
        public string RequireSeed
        {
            get
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

            foreach (var family in Families())
            {
                if (family.Matches(modelId))
                {
                    return family;
                }
            }

            return null;
        }

        private IReadOnlyList<ModelFamily>? families;

        private IReadOnlyList<ModelFamily> Families()
        {
            lock (gate)
            {
                if (families != null)
                {
                    return families;
                }
            }

            var found = new List<ModelFamily>();
            var names = treeOptions.Keys.Concat(globalOptions.Keys)
                .Where(k => k.StartsWith(OptionKeys.ModelPrefix, StringComparison.Ordinal) && k.EndsWith(".match", StringComparison.Ordinal))
                .Select(k => k.Substring(OptionKeys.ModelPrefix.Length, k.Length - OptionKeys.ModelPrefix.Length - ".match".Length))
                .Distinct(StringComparer.Ordinal)
                .OrderBy(n => n, StringComparer.Ordinal);
            foreach (var name in names)
            {
                TryGetRaw(OptionKeys.ModelMatch(name), out var match);
                TryGetRaw(OptionKeys.ModelRejects(name), out var rejects);
                var settings = new List<Setting>();
                foreach (var item in Split(rejects))
                {
                    var setting = SettingNames.Parse(item);
                    if (setting == null)
                    {
                        AddProblem(new ConfigProblem(OptionKeys.ModelRejects(name), rejects, "a comma-separated list of settings such as temperature, top_p"));
                        continue;
                    }

                    settings.Add(setting.Value);
                }

                TryGetRaw(OptionKeys.ModelExcept(name), out var except);
                found.Add(new ModelFamily(name, Split(match).ToArray(), settings, OptionKeys.ModelMatch(name), Split(except).ToArray()));
            }

            lock (gate)
            {
                families ??= found;
                return families;
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

        /// <summary>A min above its max: both keys are named so the team sees which pair is wrong.</summary>
        public void ReportInvertedRange(Limit min, Limit max) =>
            AddProblem(new ConfigProblem(min.Key, min.Value.ToString(CultureInfo.InvariantCulture),
                $"a value no greater than '{max.Key}' ({max.Value.ToString(CultureInfo.InvariantCulture)})"));

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

            problems.Add(new ConfigProblem(OptionKeys.Task, raw, "one of " + string.Join(", ", OptionKeys.TaskKinds)));
            return null;
        }
    }
}
