using System.Collections.Generic;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Gathers, during one operation block, the few operations that can create, change or send options. The filter
    /// is a symbol comparison; all other work waits until the block ends and something matched.
    /// </summary>
    internal sealed class BlockCollector
    {
        private readonly SurfaceCatalog catalog;
        private readonly object gate = new object();

        public BlockCollector(SurfaceCatalog catalog)
        {
            this.catalog = catalog;
        }

        public List<IOperation> Creations { get; } = new List<IOperation>();
        public List<ISimpleAssignmentOperation> Mutations { get; } = new List<ISimpleAssignmentOperation>();
        public List<IInvocationOperation> Invocations { get; } = new List<IInvocationOperation>();

        public bool IsEmpty => Creations.Count == 0 && Mutations.Count == 0 && Invocations.Count == 0;

        public void OnObjectCreation(IObjectCreationOperation creation)
        {
            if (catalog.Find(creation.Type) != null || (creation.Initializer != null && catalog.IsPayloadType(creation.Type)))
            {
                Add(Creations, creation);
            }
        }

        public void OnAnonymousObjectCreation(IAnonymousObjectCreationOperation creation)
        {
            if (!catalog.RawJsonEnabled)
            {
                return;
            }

            // A payload needs a "model" member; that check is a string compare on a handful of names.
            foreach (var initializer in creation.Initializers)
            {
                if (initializer is ISimpleAssignmentOperation { Target: IPropertyReferenceOperation { Property.Name: RawJsonSurface.ModelKey } })
                {
                    Add(Creations, creation);
                    return;
                }
            }
        }

        public void OnWith(IWithOperation with)
        {
            if (catalog.Find(with.Type) != null)
            {
                Add(Creations, with);
            }
        }

        public void OnAssignment(ISimpleAssignmentOperation assignment)
        {
            if (assignment.Target is not IPropertyReferenceOperation property)
            {
                return;
            }

            // Object-initializer members are read from their creation; only mutations of an existing instance land here.
            if (property.Instance is IInstanceReferenceOperation { ReferenceKind: InstanceReferenceKind.ImplicitReceiver })
            {
                return;
            }

            if (catalog.Find(property.Property.ContainingType) != null)
            {
                Add(Mutations, assignment);
                return;
            }

            // settings.ExtensionData["temperature"] = … or payload["temperature"] = …
            if (property.Property.IsIndexer && property.Instance != null
                && (catalog.IsPayloadType(property.Instance.Type)
                    || property.Instance is IPropertyReferenceOperation bag && catalog.Find(bag.Property.ContainingType) != null))
            {
                Add(Mutations, assignment);
            }
        }

        public void OnInvocation(IInvocationOperation invocation)
        {
            var method = invocation.TargetMethod;
            if (invocation.Instance != null && catalog.Find(invocation.Instance.Type) != null)
            {
                // SetSearchOption, SetGuidance, Clone …
                Add(Invocations, invocation);
                return;
            }

            if (IsSerialisation(method) || (method.Name == "Add" && invocation.Instance != null && catalog.IsPayloadType(invocation.Instance.Type)))
            {
                Add(Invocations, invocation);
                return;
            }

            foreach (var argument in invocation.Arguments)
            {
                if (argument.Parameter != null && catalog.Find(argument.Parameter.Type) != null)
                {
                    Add(Invocations, invocation);
                    return;
                }
            }

            if (catalog.SurfaceSentBy(method) != null)
            {
                Add(Invocations, invocation);
            }
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

        private void Add<T>(List<T> list, T item)
        {
            // Operation actions of one block may run concurrently.
            lock (gate)
            {
                list.Add(item);
            }
        }
    }
}
