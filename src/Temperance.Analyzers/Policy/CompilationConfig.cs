using System;
using System.Collections.Generic;
using System.Linq;
using System.Text.RegularExpressions;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Diagnostics;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Policy
{
    /// <summary>
    /// Configuration that holds for the whole compilation, read once at compilation start: the team's own options types
    /// (<c>temperance.surface.&lt;name&gt;.*</c>) and a check that every <c>temperance.*</c> key is one Temperance knows.
    /// Read from the global options and the options of the first source file (the root .editorconfig's [*.cs] section).
    /// </summary>
    internal sealed class CompilationConfig
    {
        private const string SurfacePrefix = "temperance.surface.";

        private static readonly string[] SurfaceSettingKeys = { "temperature", "top_p", "top_k", "seed", "candidates" };

        public List<SurfaceDefinition> Surfaces { get; } = new List<SurfaceDefinition>();
        public List<ConfigProblem> Problems { get; } = new List<ConfigProblem>();
        public RawJsonMode RawJson { get; private set; } = RawJsonMode.Auto;

        public static CompilationConfig Read(Compilation compilation, AnalyzerConfigOptionsProvider provider)
        {
            var sources = new List<AnalyzerConfigOptions> { provider.GlobalOptions };
            var firstTree = compilation.SyntaxTrees.FirstOrDefault();
            if (firstTree != null)
            {
                sources.Add(provider.GetOptions(firstTree));
            }

            var values = new Dictionary<string, string>(StringComparer.Ordinal);
            foreach (var source in sources)
            {
                foreach (var key in OptionKeys.ListedKeys(source))
                {
                    if (key.StartsWith(OptionKeys.Prefix, StringComparison.Ordinal) && source.TryGetValue(key, out var value))
                    {
                        values[key] = value.Trim();
                    }
                }
            }

            var config = new CompilationConfig();
            var known = values.Keys.Where(k => OptionKeys.IsKnown(k)).Concat(OptionKeys.FixedKeys).Distinct(StringComparer.Ordinal).ToList();
            foreach (var pair in values.OrderBy(p => p.Key, StringComparer.Ordinal))
            {
                if (!OptionKeys.IsKnown(pair.Key))
                {
                    config.Problems.Add(new ConfigProblem(pair.Key, pair.Value,
                        "a key Temperance knows" + ConfigSource.Suggestion(pair.Key, known) + " (a misspelt key is ignored until fixed; see the README's Configuration section)"));
                }
            }

            if (values.TryGetValue(OptionKeys.RawJson, out var rawJson))
            {
                switch (rawJson.ToLowerInvariant())
                {
                    case "auto": config.RawJson = RawJsonMode.Auto; break;
                    case "always": config.RawJson = RawJsonMode.Always; break;
                    case "never": config.RawJson = RawJsonMode.Never; break;
                    default:
                        config.Problems.Add(new ConfigProblem(OptionKeys.RawJson, rawJson, "auto, always or never" + ConfigSource.Suggestion(rawJson, new[] { "auto", "always", "never" })));
                        break;
                }
            }

            foreach (var name in values.Keys.Where(k => k.StartsWith(SurfacePrefix, StringComparison.Ordinal) && k.EndsWith(".type", StringComparison.Ordinal))
                .Select(k => k.Substring(SurfacePrefix.Length, k.Length - SurfacePrefix.Length - ".type".Length)))
            {
                config.ReadSurface(name, values, compilation);
            }

            return config;
        }

        private void ReadSurface(string name, Dictionary<string, string> values, Compilation compilation)
        {
            string Key(string part) => $"{SurfacePrefix}{name}.{part}";
            var typeKey = Key("type");
            if (TypeLookup.Find(compilation, values[typeKey]) is not { } type)
            {
                Problems.Add(new ConfigProblem(typeKey, values[typeKey], "the full metadata name of a type in this compilation or its references (e.g. Contoso.Llm.GenerationSettings)"));
                return;
            }

            var provider = values.TryGetValue(Key("provider"), out var providerName) ? providerName : Providers.Generic;
            if (!Providers.All.Contains(provider))
            {
                Problems.Add(new ConfigProblem(Key("provider"), provider, "one of " + string.Join(", ", Providers.All)));
                return;
            }

            var surface = new SurfaceDefinition(values[typeKey], provider);
            foreach (var settingKey in SurfaceSettingKeys)
            {
                if (!values.TryGetValue(Key(settingKey), out var member))
                {
                    continue;
                }

                if (TypeFacts.FindProperty(type, member) is { SetMethod: not null } property && TypeFacts.IsNumber(property.Type))
                {
                    surface.Map(member, SettingNames.Parse(settingKey == "candidates" ? "candidates" : settingKey)!.Value);
                }
                else
                {
                    Problems.Add(new ConfigProblem(Key(settingKey), member, $"the name of a settable numeric property of {type.ToDisplayString()}"));
                }
            }

            if (values.TryGetValue(Key("model"), out var model))
            {
                if (TypeFacts.FindProperty(type, model) is { Type.SpecialType: SpecialType.System_String })
                {
                    surface.ModelMember = model;
                }
                else
                {
                    Problems.Add(new ConfigProblem(Key("model"), model, $"the name of a string property of {type.ToDisplayString()}"));
                }
            }

            if (values.TryGetValue(Key("response_format"), out var format))
            {
                if (TypeFacts.FindProperty(type, format) != null)
                {
                    surface.ResponseFormatMember = format;
                }
                else
                {
                    Problems.Add(new ConfigProblem(Key("response_format"), format, $"the name of a property of {type.ToDisplayString()}"));
                }
            }

            if (values.TryGetValue(Key("sends"), out var sends))
            {
                ReadSends(surface, Key("sends"), sends, compilation);
            }

            Surfaces.Add(surface);
        }

        /// <summary><c>Contoso.Llm.Gateway.CompleteAsync, Contoso.Llm.Gateway.Complete</c>: calls without options are requests too.</summary>
        private void ReadSends(SurfaceDefinition surface, string key, string list, Compilation compilation)
        {
            foreach (var entry in list.Split(new[] { ',' }, StringSplitOptions.RemoveEmptyEntries).Select(e => e.Trim()))
            {
                var dot = entry.LastIndexOf('.');
                var client = dot > 0 ? TypeLookup.Find(compilation, entry.Substring(0, dot)) : null;
                var method = dot > 0 ? entry.Substring(dot + 1) : string.Empty;
                if (client == null || !client.GetMembers(method).OfType<IMethodSymbol>().Any())
                {
                    Problems.Add(new ConfigProblem(key, list, "comma-separated methods as Full.Type.Name.Method of types in this compilation"));
                    return;
                }

                if (surface.SendSites.Count > 0 && surface.SendSites[0].ClientType != client.ToDisplayString())
                {
                    Problems.Add(new ConfigProblem(key, list, "methods of a single client type"));
                    return;
                }

                surface.Sends(entry.Substring(0, dot), method);
            }
        }
    }
}
