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
        public List<IOperation> Creations { get; } = new List<IOperation>();
        public List<ISimpleAssignmentOperation> Mutations { get; } = new List<ISimpleAssignmentOperation>();
        public List<IInvocationOperation> Invocations { get; } = new List<IInvocationOperation>();

        /// <summary>
        /// For the tools that run outside the compiler's driver (inventory, tests, benchmark phases): walks the operations
        /// of a block and keeps those that could belong to a request; null when none could. The analyzer gets the same
        /// operations from the driver's own walk instead.
        /// </summary>
        public static BlockCollector? Collect(SurfaceCatalog catalog, IReadOnlyList<IOperation> blocks)
        {
            BlockCollector? collector = null;
            foreach (var block in blocks)
            {
                foreach (var operation in block.DescendantsAndSelf())
                {
                    if (IsCandidate(catalog, operation))
                    {
                        (collector ??= new BlockCollector()).OfferCandidate(operation);
                    }
                }
            }

            return collector;
        }

        /// <summary>Keeps an operation that passed <see cref="IsCandidate"/>.</summary>
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
        public static bool IsCandidate(SurfaceCatalog catalog, IOperation operation) => operation.Kind switch
        {
            // The kind is a field read; most operations of a block leave here without a type test.
            OperationKind.ObjectCreation => operation is IObjectCreationOperation creation && (catalog.Find(creation.Type) != null
                || (creation.Initializer != null && catalog.IsPayloadType(creation.Type) && HasRequestKey(creation.Initializer))),
            OperationKind.AnonymousObjectCreation => catalog.RawJsonEnabled && operation is IAnonymousObjectCreationOperation anonymous && HasModelMember(anonymous),
            OperationKind.With => catalog.Find(operation.Type) != null,
            OperationKind.SimpleAssignment => operation is ISimpleAssignmentOperation assignment && IsMutation(catalog, assignment),
            OperationKind.Invocation => operation is IInvocationOperation invocation && IsRelevantCall(catalog, invocation),
            _ => false,
        };

        /// <summary>
        /// A dictionary or JsonObject is a payload only if its initializer names a key a request carries ("model", a
        /// sampling key, "messages" …): a lookup table such as <c>{ ["label"] = … }</c> never reaches the builder.
        /// </summary>
        private static bool HasRequestKey(IObjectOrCollectionInitializerOperation initializer)
        {
            foreach (var element in initializer.Initializers)
            {
                var key = element switch
                {
                    ISimpleAssignmentOperation { Target: IPropertyReferenceOperation { Property.IsIndexer: true, Arguments.Length: 1 } indexer } =>
                        ValueReader.ConstantString(indexer.Arguments[0].Value),
                    IInvocationOperation { TargetMethod.Name: "Add", Arguments.Length: 2 } add => ValueReader.ConstantString(add.Arguments[0].Value),
                    _ => null,
                };
                if (key != null && (key == RawJsonSurface.ModelKey || RawJsonSurface.Keys.ContainsKey(key) || RawJsonSurface.RequestKeys.Contains(key)))
                {
                    return true;
                }
            }

            return false;
        }

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

            if (PayloadReader.IsSerialisation(method) || (method.Name == "Add" && invocation.Instance != null && catalog.IsPayloadType(invocation.Instance.Type)))
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
    }
}
