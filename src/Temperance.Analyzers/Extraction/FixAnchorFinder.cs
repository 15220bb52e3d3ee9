using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Finds where a fix can add a setting nobody writes: a member of the options creation, or of a nested options object
    /// the fix creates (Ollama's <c>Options</c>, LLamaSharp's sampling pipeline), with the member's literal type and the
    /// id of an [Experimental] attribute a fix must keep compiling.
    /// </summary>
    internal static class FixAnchorFinder
    {
        /// <summary>The settings fixes add: the temperature a task asks for, and the seed a reproducible run needs.</summary>
        public static readonly Setting[] Added = { Setting.Temperature, Setting.Seed };

        public static void AddTargets(SurfaceCatalog catalog, RequestDraft request, IObjectCreationOperation creation, SurfaceDefinition surface)
        {
            foreach (var setting in Added)
            {
                if (!request.AddTargets.ContainsKey(setting) && TargetOf(catalog, creation, surface, setting) is { } target)
                {
                    request.AddTargets[setting] = target;
                }
            }
        }

        /// <summary>For a send that passes no options: the options type a fix passes and the members it sets.</summary>
        public static void AddOmitted(SurfaceCatalog catalog, RequestDraft request, IParameterSymbol? omitted, SurfaceDefinition surface, SyntaxNode call)
        {
            if (omitted?.Type is not INamedTypeSymbol optionsType)
            {
                return;
            }

            var concrete = optionsType.OriginalDefinition.SpecialType == SpecialType.System_Nullable_T ? (INamedTypeSymbol)optionsType.TypeArguments[0] : optionsType;
            if (concrete.TypeKind != TypeKind.Class || concrete.IsAbstract)
            {
                return;
            }

            request.OmittedParameter = omitted;
            request.OmittedOptionsType = concrete.WithNullableAnnotation(NullableAnnotation.NotAnnotated).ToDisplayString(SymbolDisplayFormat.FullyQualifiedFormat);
            foreach (var setting in Added)
            {
                if (MemberFor(catalog, concrete, surface, setting) is { } member)
                {
                    request.OmittedMembers[setting] = new MemberTarget(call, member.Name, member.Kind, null, null, member.Experimental);
                }
            }
        }

        /// <summary>True when the surface, or the options it nests, has a seed member or key.</summary>
        public static bool SeedAvailable(SurfaceCatalog catalog, SurfaceDefinition surface, ITypeSymbol? type)
        {
            if (surface.Carries(Setting.Seed))
            {
                return true;
            }

            foreach (var nested in surface.NestedMembers)
            {
                var nestedType = surface.NestedConcreteTypes.TryGetValue(nested, out var concrete) ? catalog.TypeOf(concrete)
                    : type == null ? null : TypeFacts.FindProperty(type, nested)?.Type;
                if (catalog.Find(nestedType) is { } nestedSurface && nestedSurface.Carries(Setting.Seed))
                {
                    return true;
                }
            }

            return false;
        }

        private static MemberTarget? TargetOf(SurfaceCatalog catalog, IObjectCreationOperation creation, SurfaceDefinition surface, Setting setting)
        {
            if (creation.Type == null)
            {
                return null;
            }

            if (MemberFor(catalog, creation.Type, surface, setting) is { } own)
            {
                return new MemberTarget(creation.Syntax, own.Name, own.Kind, null, null, own.Experimental);
            }

            foreach (var nestedName in surface.NestedMembers)
            {
                var nestedType = TypeFacts.FindProperty(creation.Type, nestedName)?.Type as INamedTypeSymbol;
                if (surface.NestedConcreteTypes.TryGetValue(nestedName, out var concrete) && catalog.TypeOf(concrete) is { } concreteType)
                {
                    nestedType = concreteType;
                }

                if (nestedType != null && catalog.Find(nestedType) is { } nestedSurface
                    && MemberFor(catalog, nestedType, nestedSurface, setting) is { } nested && nestedType.TypeKind == TypeKind.Class && !nestedType.IsAbstract)
                {
                    return new MemberTarget(creation.Syntax, nested.Name, nested.Kind, nestedName, nestedType.ToDisplayString(SymbolDisplayFormat.FullyQualifiedFormat), nested.Experimental);
                }
            }

            return null;
        }

        /// <summary>The member of a surface type that carries a setting, with its literal type and experimental id (cached per compilation).</summary>
        private static (string Name, NumericKind Kind, string? Experimental)? MemberFor(SurfaceCatalog catalog, ITypeSymbol type, SurfaceDefinition surface, Setting setting)
        {
            // Looked up first so the common hit allocates no closure.
            if (catalog.MemberCache.TryGetValue((type, setting), out var cached))
            {
                return cached;
            }

            return catalog.MemberCache.GetOrAdd((type, setting), FindMember(type, surface, setting));
        }

        private static (string Name, NumericKind Kind, string? Experimental)? FindMember(ITypeSymbol type, SurfaceDefinition surface, Setting setting)
        {
            foreach (var pair in surface.Members)
            {
                if (pair.Value == setting && TypeFacts.FindProperty(type, pair.Key) is { } property && property.SetMethod != null
                    && TypeFacts.NumericKindOf(property.Type) is { } kind)
                {
                    return (pair.Key, kind, ExperimentalId(property));
                }
            }

            return null;
        }

        /// <summary>The diagnostic id of [Experimental("ID")] on a member or its type.</summary>
        private static string? ExperimentalId(ISymbol symbol)
        {
            for (var current = symbol; current != null; current = current.ContainingType)
            {
                foreach (var attribute in current.GetAttributes())
                {
                    if (attribute.AttributeClass?.Name == "ExperimentalAttribute" && attribute.ConstructorArguments.Length > 0
                        && attribute.ConstructorArguments[0].Value is string id)
                    {
                        return id;
                    }
                }
            }

            return null;
        }
    }
}
