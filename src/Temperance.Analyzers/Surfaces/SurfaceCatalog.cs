using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;

namespace Temperance.Surfaces
{
    /// <summary>Every built-in surface, and their symbols resolved once per compilation.</summary>
    internal sealed class SurfaceCatalog
    {
        public static readonly IReadOnlyList<SurfaceDefinition> Definitions =
            OpenAISurfaces.All()
            .Concat(MicrosoftExtensionsAISurfaces.All())
            .Concat(SemanticKernelSurfaces.All())
            .Concat(OllamaSurfaces.All())
            .Concat(LocalRuntimeSurfaces.All())
            .Concat(OtherHostedSurfaces.All())
            .Concat(McpSurfaces.All())
            .ToArray();

        private readonly Dictionary<INamedTypeSymbol, SurfaceDefinition> byType;
        private readonly Dictionary<INamedTypeSymbol, (SurfaceDefinition Surface, HashSet<string> Methods)> sendMethods;
        private readonly HashSet<string> sendMethodNames;
        private readonly List<(AdapterDefinition Adapter, INamedTypeSymbol Declaring, INamedTypeSymbol? Receiver)> adapters =
            new List<(AdapterDefinition, INamedTypeSymbol, INamedTypeSymbol?)>();

        private SurfaceCatalog(Dictionary<INamedTypeSymbol, SurfaceDefinition> byType, Dictionary<INamedTypeSymbol, (SurfaceDefinition, HashSet<string>)> sendMethods,
            INamedTypeSymbol? jsonObject, INamedTypeSymbol? dictionary)
        {
            this.byType = byType;
            this.sendMethods = sendMethods;
            sendMethodNames = new HashSet<string>(sendMethods.Values.SelectMany(s => s.Item2), System.StringComparer.Ordinal);
            JsonObjectType = jsonObject;
            DictionaryType = dictionary;
        }

        public bool HasSdkSurfaces => byType.Count > 0;

        /// <summary>Per compilation: which member of a surface type carries a setting (attribute decoding is not free).</summary>
        public System.Collections.Concurrent.ConcurrentDictionary<(ITypeSymbol Type, Model.Setting Setting), (string Name, Model.NumericKind Kind, string? Experimental)?> MemberCache { get; } =
            new System.Collections.Concurrent.ConcurrentDictionary<(ITypeSymbol, Model.Setting), (string, Model.NumericKind, string?)?>(SymbolKeyComparer<ITypeSymbol, Model.Setting>.Instance);

        /// <summary>Whether hand-built JSON payloads are looked for in this compilation.</summary>
        public bool RawJsonEnabled { get; private set; }
        public INamedTypeSymbol? JsonObjectType { get; }
        public INamedTypeSymbol? DictionaryType { get; }

        public static SurfaceCatalog Resolve(Compilation compilation) => Resolve(compilation, System.Array.Empty<SurfaceDefinition>(), RawJsonMode.Auto);

        /// <summary>
        /// The built-in surfaces plus a team's own (declared in configuration), resolved to symbols. Hand-built JSON payloads
        /// are looked for when an LLM SDK or a declared surface is present (auto), always, or never.
        /// </summary>
        public static SurfaceCatalog Resolve(Compilation compilation, IReadOnlyList<SurfaceDefinition> teamSurfaces, RawJsonMode rawJson)
        {
            var all = Definitions.Concat(teamSurfaces).ToList();
            var byType = new Dictionary<INamedTypeSymbol, SurfaceDefinition>(SymbolEqualityComparer.Default);
            foreach (var definition in all)
            {
                if (TypeLookup.Find(compilation, definition.MetadataName) is { } type)
                {
                    byType[type] = definition;
                }
            }

            var sendMethods = new Dictionary<INamedTypeSymbol, (SurfaceDefinition, HashSet<string>)>(SymbolEqualityComparer.Default);
            var sendsByType = new Dictionary<string, HashSet<string>>(System.StringComparer.Ordinal);
            foreach (var definition in all)
            {
                foreach (var site in definition.SendSites)
                {
                    if (!sendsByType.TryGetValue(site.ClientType, out var names))
                    {
                        sendsByType[site.ClientType] = names = new HashSet<string>(System.StringComparer.Ordinal);
                    }

                    names.UnionWith(site.Methods);
                    if (TypeLookup.Find(compilation, site.ClientType) is { } client && !sendMethods.ContainsKey(client))
                    {
                        sendMethods[client] = (definition, new HashSet<string>(site.Methods, System.StringComparer.Ordinal));
                    }
                }
            }

            var rawJsonOn = rawJson == RawJsonMode.Always || (rawJson == RawJsonMode.Auto && byType.Count > 0);
            var catalog = new SurfaceCatalog(
                byType,
                sendMethods,
                rawJsonOn ? TypeLookup.Find(compilation, RawJsonSurface.PayloadTypes[0]) : null,
                rawJsonOn ? TypeLookup.Find(compilation, RawJsonSurface.PayloadTypes[1]) : null)
            {
                RawJsonEnabled = rawJsonOn,
                sendsByTypeName = sendsByType,
                allSendNames = new HashSet<string>(sendsByType.Values.SelectMany(n => n), System.StringComparer.Ordinal),
            };
            foreach (var adapter in AdapterSurfaces.All)
            {
                if (TypeLookup.Find(compilation, adapter.DeclaringType) is { } declaring)
                {
                    var receiver = adapter.ReceiverType == null ? null : TypeLookup.Find(compilation, adapter.ReceiverType);
                    if (adapter.ReceiverType == null || receiver != null)
                    {
                        catalog.adapters.Add((adapter, declaring, receiver));
                    }
                }
            }

            return catalog;
        }

        /// <summary>The adapter an operation creates: an adapter method call, or <c>new</c> of an adapter type.</summary>
        public AdapterDefinition? AdapterCreatedBy(IOperation operation)
        {
            foreach (var (adapter, declaring, receiver) in adapters)
            {
                switch (operation)
                {
                    case IInvocationOperation call when adapter.Method != null && call.TargetMethod.Name == adapter.Method
                        && SymbolEqualityComparer.Default.Equals(call.TargetMethod.ContainingType, declaring):
                        var self = call.TargetMethod.Parameters.Length > 0 ? call.TargetMethod.Parameters[0].Type : null;
                        if (receiver == null || SymbolEqualityComparer.Default.Equals(self, receiver))
                        {
                            return adapter;
                        }

                        break;
                    case IObjectCreationOperation creation when adapter.Method == null
                        && SymbolEqualityComparer.Default.Equals(creation.Type, declaring):
                        return adapter;
                }
            }

            return null;
        }

        /// <summary>The adapter a send converts its options through itself (<see cref="AdapterDefinition.Sends"/>), when it is one.</summary>
        public AdapterDefinition? AdapterOfSend(IMethodSymbol? method)
        {
            if (method?.ContainingType == null)
            {
                return null;
            }

            foreach (var (adapter, declaring, _) in adapters)
            {
                if (System.Array.IndexOf(adapter.Sends, method.Name) >= 0
                    && SymbolEqualityComparer.Default.Equals(method.ContainingType.OriginalDefinition, declaring)
                    && method.Parameters.Any(p => Find(p.Type)?.MetadataName == adapter.ConvertedOptions))
                {
                    return adapter;
                }
            }

            return null;
        }

        /// <summary>A resolved surface type by metadata name.</summary>
        public INamedTypeSymbol? TypeOf(string metadataName)
        {
            foreach (var pair in byType)
            {
                if (pair.Value.MetadataName == metadataName)
                {
                    return pair.Key;
                }
            }

            return null;
        }

        /// <summary>The surface of a type or of its nearest base type that is one (user subclasses, Azure SK settings).</summary>
        /// <remarks>
        /// The filter asks this for most types of ordinary code. Special types (string, int, object, ValueType, Enum …) are
        /// never surfaces and end the walk without a lookup, so <c>string</c> costs nothing and <c>List&lt;string&gt;</c> one.
        /// </remarks>
        public SurfaceDefinition? Find(ITypeSymbol? type)
        {
            for (var current = type as INamedTypeSymbol; current != null && current.SpecialType == SpecialType.None; current = current.BaseType)
            {
                if (byType.TryGetValue(current.OriginalDefinition, out var definition))
                {
                    return definition;
                }
            }

            return null;
        }

        /// <summary>
        /// Send methods that have an overload without any options parameter (OpenAI's <c>CompleteChat(params ChatMessage[])</c>):
        /// the surface whose defaults then apply. Protocol overloads taking raw BinaryContent are not typed requests.
        /// </summary>
        public SurfaceDefinition? SurfaceSentBy(IMethodSymbol method)
        {
            // The name first: the filter asks this for every call of ordinary code, and ContainingType is not a field read.
            if (!sendMethodNames.Contains(method.Name) || method.ContainingType == null || !sendMethods.TryGetValue(method.ContainingType.OriginalDefinition, out var sent)
                || !sent.Methods.Contains(method.Name))
            {
                return null;
            }

            if (method.Parameters.Length > 0 && method.Parameters[0].Type.Name == ClientShapes.ProtocolContentType)
            {
                return null;
            }

            return sent.Surface;
        }

        private Dictionary<string, HashSet<string>> sendsByTypeName = new Dictionary<string, HashSet<string>>();
        private HashSet<string> allSendNames = new HashSet<string>();

        /// <summary>Every method name some declared send has (for reading helpers in other files by syntax).</summary>
        public IReadOnlyCollection<string> SendMethodNames => allSendNames;

        /// <summary>
        /// Whether a call (or a constructor) sends a request to a model: a declared send method of a declared client type,
        /// of a type deriving from it, or of a class implementing a declared client interface. Matched by the type's full
        /// name, because some extension classes share a name across assemblies.
        /// </summary>
        public bool IsSend(IMethodSymbol method)
        {
            if (method.ContainingType == null)
            {
                return false;
            }

            var name = method.MethodKind == MethodKind.Constructor ? SendSite.Constructor : method.Name;
            // Any other method of a declared client type that takes options sends them too (a team's Gateway.Complete).
            var takesOptions = method.Parameters.Any(p => Find(p.Type) != null);
            if (!takesOptions && !allSendNames.Contains(name))
            {
                return false;
            }

            for (var type = method.ContainingType; type != null && type.SpecialType == SpecialType.None; type = type.BaseType)
            {
                if (Declares(type, name, takesOptions))
                {
                    return true;
                }
            }

            foreach (var implemented in method.ContainingType.AllInterfaces)
            {
                if (Declares(implemented, name, takesOptions))
                {
                    return true;
                }
            }

            return false;
        }

        /// <summary>A type that declares sends (a client interface or class, an extension class of sends).</summary>
        public bool IsClientType(INamedTypeSymbol type) => sendsByTypeName.ContainsKey(FullName(type.OriginalDefinition));

        private bool Declares(INamedTypeSymbol type, string method, bool takesOptions) =>
            sendsByTypeName.TryGetValue(FullName(type.OriginalDefinition), out var methods) && (takesOptions || methods.Contains(method));

        /// <summary><c>Namespace.Outer+Inner`1</c>-style metadata name, as the surfaces declare types.</summary>
        public static string FullName(INamedTypeSymbol type)
        {
            var name = type.MetadataName;
            for (var outer = type.ContainingType; outer != null; outer = outer.ContainingType)
            {
                name = outer.MetadataName + "+" + name;
            }

            var ns = type.ContainingNamespace;
            return ns == null || ns.IsGlobalNamespace ? name : ns.ToDisplayString() + "." + name;
        }

        /// <summary>True when the symbol's namespace is one of <paramref name="namespaces"/> or inside one.</summary>
        public static bool InNamespace(ISymbol? symbol, string[] namespaces)
        {
            var ns = symbol?.ContainingNamespace?.ToDisplayString();
            if (string.IsNullOrEmpty(ns))
            {
                return false;
            }

            foreach (var candidate in namespaces)
            {
                if (ns!.StartsWith(candidate, System.StringComparison.Ordinal) && (ns.Length == candidate.Length || ns[candidate.Length] == '.'))
                {
                    return true;
                }
            }

            return false;
        }

        /// <summary>A string-keyed dictionary or JsonObject that could be a hand-built payload.</summary>
        public bool IsPayloadType(ITypeSymbol? type)
        {
            if (type is not INamedTypeSymbol named)
            {
                return false;
            }

            if (JsonObjectType != null && SymbolEqualityComparer.Default.Equals(named, JsonObjectType))
            {
                return true;
            }

            return DictionaryType != null
                && SymbolEqualityComparer.Default.Equals(named.OriginalDefinition, DictionaryType)
                && named.TypeArguments[0].SpecialType == SpecialType.System_String;
        }
    }
}
