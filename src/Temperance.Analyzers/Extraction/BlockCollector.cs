using System.Collections.Generic;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Gathers the few operations of one block that can create, change or send options. The filter is a symbol
    /// comparison (<see cref="IsCandidate"/>); all other work waits until a block has matched.
    /// </summary>
    internal sealed class BlockCollector
    {
        private readonly SurfaceCatalog catalog;

        public BlockCollector(SurfaceCatalog catalog)
        {
            this.catalog = catalog;
        }

        public List<IOperation> Creations { get; } = new List<IOperation>();
        public List<ISimpleAssignmentOperation> Mutations { get; } = new List<ISimpleAssignmentOperation>();
        public List<IInvocationOperation> Invocations { get; } = new List<IInvocationOperation>();

        public bool IsEmpty => Creations.Count == 0 && Mutations.Count == 0 && Invocations.Count == 0;

        /// <summary>Keeps an operation if it could belong to a request.</summary>
        public void Offer(IOperation operation)
        {
            if (!IsCandidate(catalog, operation))
            {
                return;
            }

            OfferCandidate(operation);
        }

        /// <summary>Keeps an operation that already passed <see cref="IsCandidate"/>.</summary>
        public void OfferCandidate(IOperation operation)
        {
            switch (operation)
            {
                case ISimpleAssignmentOperation assignment: Mutations.Add(assignment); break;
                case IInvocationOperation invocation: Invocations.Add(invocation); break;
                default: Creations.Add(operation); break;
            }
        }

        /// <summary>
        /// Whether an operation could belong to a request. The analyzer runs this on every operation of the kinds it
        /// registers, so it allocates nothing and stays a handful of symbol comparisons.
        /// </summary>
        public static bool IsCandidate(SurfaceCatalog catalog, IOperation operation) => operation switch
        {
            IObjectCreationOperation creation => catalog.Find(creation.Type) != null || (creation.Initializer != null && catalog.IsPayloadType(creation.Type)),
            IAnonymousObjectCreationOperation anonymous => catalog.RawJsonEnabled && HasModelMember(anonymous),
            IWithOperation with => catalog.Find(with.Type) != null,
            ISimpleAssignmentOperation assignment => IsMutation(catalog, assignment),
            IInvocationOperation invocation => IsRelevantCall(catalog, invocation),
            _ => false,
        };

        /// <summary>A payload needs a "model" member; that check is a string compare on a handful of names.</summary>
        private static bool HasModelMember(IAnonymousObjectCreationOperation creation)
        {
            foreach (var initializer in creation.Initializers)
            {
                if (initializer is ISimpleAssignmentOperation { Target: IPropertyReferenceOperation { Property.Name: RawJsonSurface.ModelKey } })
                {
                    return true;
                }
            }

            return false;
        }

        private static bool IsMutation(SurfaceCatalog catalog, ISimpleAssignmentOperation assignment)
        {
            if (assignment.Target is not IPropertyReferenceOperation property)
            {
                return false;
            }

            // Object-initializer members are read from their creation; only mutations of an existing instance count here.
            if (property.Instance is IInstanceReferenceOperation { ReferenceKind: InstanceReferenceKind.ImplicitReceiver })
            {
                return false;
            }

            if (catalog.Find(property.Property.ContainingType) != null)
            {
                return true;
            }

            // settings.ExtensionData["temperature"] = … or payload["temperature"] = …
            return property.Property.IsIndexer && property.Instance != null
                && (catalog.IsPayloadType(property.Instance.Type)
                    || property.Instance is IPropertyReferenceOperation bag && catalog.Find(bag.Property.ContainingType) != null);
        }

        private static bool IsRelevantCall(SurfaceCatalog catalog, IInvocationOperation invocation)
        {
            var method = invocation.TargetMethod;
            if (invocation.Instance != null && catalog.Find(invocation.Instance.Type) != null)
            {
                return true; // SetSearchOption, SetGuidance, Clone …
            }

            if (IsSerialisation(method) || (method.Name == "Add" && invocation.Instance != null && catalog.IsPayloadType(invocation.Instance.Type)))
            {
                return true;
            }

            foreach (var argument in invocation.Arguments)
            {
                if (argument.Parameter != null && catalog.Find(argument.Parameter.Type) != null)
                {
                    return true;
                }
            }

            return catalog.SurfaceSentBy(method) != null;
        }

        /// <summary>Methods that send or serialise a hand-built JSON payload.</summary>
        public static bool IsSerialisation(IMethodSymbol method)
        {
            var typeName = method.ContainingType?.Name;
            if (typeName is not ("HttpClientJsonExtensions" or "JsonSerializer" or "JsonContent" or "JsonConvert" or "JsonNode" or "JsonObject"))
            {
                return false;
            }

            var ns = method.ContainingType!.ContainingNamespace?.ToDisplayString() ?? string.Empty;
            return ns.StartsWith("System.Net.Http.Json", System.StringComparison.Ordinal)
                || ns.StartsWith("System.Text.Json", System.StringComparison.Ordinal)
                || ns.StartsWith("Newtonsoft.Json", System.StringComparison.Ordinal);
        }
    }
}
