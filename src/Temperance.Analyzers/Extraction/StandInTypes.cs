using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Whether a type stands in for a model client by itself: a mocking library's type, an in-process test server, or in
    /// test code a class of the project that acts as the client or its transport (and is not a decorator of a real one);
    /// in product code, a client class of the project that holds no model client.
    /// </summary>
    internal sealed class StandInTypes
    {
        private readonly SurfaceCatalog catalog;
        private readonly bool inTestCode;

        public StandInTypes(SurfaceCatalog catalog, bool inTestCode)
        {
            this.catalog = catalog;
            this.inTestCode = inTestCode;
        }

        /// <summary>A type that is a double by itself: a mocking library's type, or in test code a class of the project.</summary>
        public string? OfType(ITypeSymbol? type)
        {
            if (type is not INamedTypeSymbol named || named.SpecialType != SpecialType.None)
            {
                return null;
            }

            if (SurfaceCatalog.InNamespace(named, TestingSurfaces.MockingNamespaces))
            {
                return $"a {named.ContainingNamespace.ToDisplayString()} double ({named.Name})";
            }

            if (IsTestServer(named))
            {
                return $"the in-process test server ({named.Name})";
            }

            if (named.TypeKind != TypeKind.Class || !named.Locations.Any(l => l.IsInSource))
            {
                return null;
            }

            if (!inTestCode)
            {
                // Product code has real clients of its own; one that holds no model client (no SDK client, no IChatClient,
                // no HttpClient) wraps some other service and reaches no model.
                return ActsAsClient(named) && !IsDecorator(named) && !HoldsAModelClient(named)
                    ? $"'{named.Name}', a client of this project that holds no model client"
                    : null;
            }

            if (DerivesFromAny(named, TestingSurfaces.TransportBaseTypes))
            {
                // A DelegatingHandler may pass requests on to a real handler: decided where it is created.
                return DerivesFromDelegatingHandler(named) ? null : $"'{named.Name}', a transport declared in this project that answers instead of a model";
            }

            // Only a class that stands in for a client is a double: a fixture, a logger factory or the test class itself is not.
            return ActsAsClient(named) && !IsDecorator(named) ? $"'{named.Name}', declared in this project" : null;
        }

        /// <summary>Derives from or implements a type that declares sends (IChatClient, ChatClient, IChatCompletionService …).</summary>
        private bool ActsAsClient(INamedTypeSymbol type)
        {
            for (var current = type.BaseType; current != null && current.SpecialType == SpecialType.None; current = current.BaseType)
            {
                if (catalog.IsClientType(current))
                {
                    return true;
                }
            }

            return type.AllInterfaces.Any(catalog.IsClientType);
        }

        /// <summary>
        /// A field, property or constructor parameter whose type is a client (IChatClient, an SDK client) or an HttpClient
        /// (a hand-written client over HTTP may well call a model): then the class may reach a model.
        /// </summary>
        private bool HoldsAModelClient(INamedTypeSymbol type)
        {
            bool IsModelClient(ITypeSymbol? candidate) =>
                candidate is INamedTypeSymbol named && named.SpecialType == SpecialType.None
                && (SurfaceCatalog.FullName(named) == TestingSurfaces.HttpClientType || catalog.IsClientType(named) || ActsAsClient(named));

            foreach (var member in type.GetMembers())
            {
                var memberType = member switch
                {
                    IFieldSymbol field => field.Type,
                    IPropertySymbol property => property.Type,
                    _ => null,
                };
                if (IsModelClient(memberType))
                {
                    return true;
                }
            }

            return type.InstanceConstructors.Any(c => c.Parameters.Any(p => IsModelClient(p.Type)));
        }

        private static bool DerivesFromDelegatingHandler(INamedTypeSymbol type)
        {
            for (var current = type.BaseType; current != null; current = current.BaseType)
            {
                if (SurfaceCatalog.FullName(current) == TestingSurfaces.DelegatingHandlerType)
                {
                    return true;
                }
            }

            return false;
        }

        /// <summary>
        /// <c>new RecordingHandlerStub()</c>: a DelegatingHandler of the project created without an inner handler cannot
        /// pass anything on, so it answers itself (the usual shape of a handler stub).
        /// </summary>
        public string? CannedDelegatingHandler(IObjectCreationOperation creation)
        {
            if (!inTestCode || creation.Type is not INamedTypeSymbol type || !type.Locations.Any(l => l.IsInSource) || !DerivesFromDelegatingHandler(type))
            {
                return null;
            }

            var inner = creation.Arguments.Any(a => a.ArgumentKind == ArgumentKind.Explicit)
                || (creation.Initializer?.Initializers.Any(i => i is ISimpleAssignmentOperation { Target: IPropertyReferenceOperation { Property.Name: TestingSurfaces.InnerHandlerMember } }) ?? false);
            return inner ? null : $"'{type.Name}', a handler declared in this project that answers instead of a model";
        }

        /// <summary>A class that wraps another instance of what it is (a DelegatingChatClient, a DelegatingHandler): decided by what it wraps.</summary>
        private static bool IsDecorator(INamedTypeSymbol type)
        {
            for (var current = type.BaseType; current != null; current = current.BaseType)
            {
                if (TestingSurfaces.DecoratorBaseTypes.Contains(SurfaceCatalog.FullName(current.OriginalDefinition)) && !current.Locations.Any(l => l.IsInSource))
                {
                    return true;
                }
            }

            foreach (var constructor in type.InstanceConstructors)
            {
                foreach (var parameter in constructor.Parameters)
                {
                    if (parameter.Type is INamedTypeSymbol wrapped && wrapped.TypeKind == TypeKind.Interface
                        && type.AllInterfaces.Contains(wrapped, SymbolEqualityComparer.Default))
                    {
                        return true;
                    }
                }
            }

            return false;
        }

        private static bool DerivesFromAny(INamedTypeSymbol type, string[] fullNames)
        {
            for (var current = type.BaseType; current != null; current = current.BaseType)
            {
                if (fullNames.Contains(SurfaceCatalog.FullName(current.OriginalDefinition)))
                {
                    return true;
                }
            }

            return false;
        }

        public static bool IsTestServer(INamedTypeSymbol? type)
        {
            for (var current = type; current != null; current = current.BaseType)
            {
                if (TestingSurfaces.TestServerTypes.Contains(SurfaceCatalog.FullName(current.OriginalDefinition)))
                {
                    return true;
                }
            }

            return false;
        }
    }
}
