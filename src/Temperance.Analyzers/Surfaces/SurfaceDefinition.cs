using System;
using System.Collections.Generic;
using System.Linq;
using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>
    /// Declares, for one SDK options type, which members carry which setting. Pure data: the extraction
    /// pass reads it, nothing here touches Roslyn.
    /// </summary>
    internal sealed class SurfaceDefinition
    {
        public SurfaceDefinition(string metadataName, string provider)
        {
            MetadataName = metadataName;
            Provider = provider;
        }

        /// <summary>Full metadata name, as <c>Compilation.GetTypeByMetadataName</c> takes it.</summary>
        public string MetadataName { get; }
        /// <summary>Provider key in the rules table.</summary>
        public string Provider { get; }
        public string ShortName => shortName ??= MetadataName.Substring(MetadataName.LastIndexOf('.') + 1);

        private string? shortName;

        /// <summary>Typed members: member name to setting.</summary>
        public Dictionary<string, Setting> Members { get; } = new Dictionary<string, Setting>(StringComparer.Ordinal);
        /// <summary>The member holding the model id, if the type has one.</summary>
        public string? ModelMember { get; set; }
        /// <summary>The member whose value says what shape of response is wanted.</summary>
        public string? ResponseFormatMember { get; set; }
        /// <summary>Members whose value is another surface (Ollama <c>Options</c>, LLamaSharp <c>SamplingPipeline</c>).</summary>
        public List<string> NestedMembers { get; } = new List<string>();
        /// <summary>A string-keyed dictionary member (<c>ExtensionData</c>, <c>AdditionalProperties</c>).</summary>
        public string? BagMember { get; set; }
        /// <summary>Keys of <see cref="BagMember"/> (or of a keyed method) that carry settings; case-insensitive.</summary>
        public Dictionary<string, Setting> Keys { get; } = new Dictionary<string, Setting>(StringComparer.OrdinalIgnoreCase);
        /// <summary>A method that sets a setting by string key: <c>SetSearchOption("temperature", 0.2)</c>.</summary>
        public string? KeyedMethod { get; set; }
        /// <summary>A method whose call fixes the response shape (<c>SetGuidance</c>).</summary>
        public string? ShapeMethod { get; set; }
        /// <summary>
        /// The calls that send this surface's requests to a model: a client type (or extension class) and method names,
        /// <c>.ctor</c> for a constructor. Options that reach none of them (directly, through a carrier object or the
        /// project's own helpers) never reach a model.
        /// </summary>
        public List<SendSite> SendSites { get; } = new List<SendSite>();

        /// <summary>
        /// Members that put the request in a mode (<see cref="Model.Modes"/>), by path: <c>ReasoningEffortLevel</c>, or
        /// <c>ReasoningOptions.ReasoningEffortLevel</c> for a member of an object the options create.
        /// </summary>
        public Dictionary<string, string> ModeMembers { get; } = new Dictionary<string, string>(StringComparer.Ordinal);

        /// <summary>True when a mode member lives in the object a member holds (<c>ReasoningOptions.…</c>).</summary>
        public bool HasModeUnder(string member)
        {
            foreach (var path in ModeMembers.Keys)
            {
                if (path.Length > member.Length && path[member.Length] == '.' && path.StartsWith(member, StringComparison.Ordinal))
                {
                    return true;
                }
            }

            return false;
        }

        public SurfaceDefinition Mode(string memberPath, string mode)
        {
            ModeMembers[memberPath] = mode;
            return this;
        }

        /// <summary>True when a member or key of this surface carries the setting.</summary>
        public bool Carries(Setting setting) => Members.ContainsValue(setting) || Keys.ContainsValue(setting);

        public SurfaceDefinition Map(string member, Setting setting)
        {
            Members[member] = setting;
            return this;
        }

        public SurfaceDefinition Key(string key, Setting setting)
        {
            Keys[key] = setting;
            return this;
        }

        /// <summary>Keys spelled as the settings' trade names (<c>temperature</c>, <c>top_p</c>, <c>frequency_penalty</c> …).</summary>
        public SurfaceDefinition TradeNameKeys(params Setting[] settings)
        {
            foreach (var setting in settings)
            {
                Keys[setting.KeyName()] = setting;
            }

            return this;
        }

        public SurfaceDefinition Sends(string clientType, params string[] methods)
        {
            SendSites.Add(new SendSite(clientType, methods));
            return this;
        }

        /// <summary>
        /// A member holding another surface; <paramref name="concreteType"/> names the type a fix creates when the member's
        /// own type is an interface (LLamaSharp's <c>ISamplingPipeline</c>).
        /// </summary>
        public SurfaceDefinition Nested(string member, string? concreteType = null)
        {
            NestedMembers.Add(member);
            if (concreteType != null)
            {
                NestedConcreteTypes[member] = concreteType;
            }

            return this;
        }

        public Dictionary<string, string> NestedConcreteTypes { get; } = new Dictionary<string, string>(StringComparer.Ordinal);

        /// <summary>The members most OpenAI-shaped SDKs share.</summary>
        public SurfaceDefinition OpenAIShape(string topPMember = "TopP") =>
            Map("Temperature", Setting.Temperature)
            .Map(topPMember, Setting.TopP)
            .Map("FrequencyPenalty", Setting.FrequencyPenalty)
            .Map("PresencePenalty", Setting.PresencePenalty);
    }

    /// <summary>A client type (metadata name) and the names of its methods that send a request.</summary>
    internal sealed class SendSite
    {
        public const string Constructor = ".ctor";

        public SendSite(string clientType, IReadOnlyList<string> methods)
        {
            ClientType = clientType;
            Methods = methods;
        }

        public string ClientType { get; }
        public IReadOnlyList<string> Methods { get; }
    }

    /// <summary>Provider keys of the rules table.</summary>
    internal static class Providers
    {
        public const string OpenAI = "openai";
        public const string AzureInference = "azure_inference";
        public const string Ollama = "ollama";
        public const string LLamaSharp = "llamasharp";
        public const string OnnxGenAI = "onnx_genai";
        public const string Anthropic = "anthropic";
        /// <summary>Provider-agnostic surfaces (M.E.AI ChatOptions, SK base settings, raw JSON): the widest range any provider accepts.</summary>
        public const string Generic = "generic";

        /// <summary>These and any other provider an SDK file declares.</summary>
        public static readonly string[] All = new[] { OpenAI, AzureInference, Ollama, LLamaSharp, OnnxGenAI, Anthropic, Generic }
            .Concat(SurfaceCatalog.Definitions.Select(d => d.Provider)).Distinct().ToArray();
    }
}
