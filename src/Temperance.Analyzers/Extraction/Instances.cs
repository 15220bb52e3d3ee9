using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>One options object (or payload) in the block, and what holds it.</summary>
    internal sealed class Instance
    {
        public Instance(RequestDraft request, IOperation? creation, ISymbol? holder)
        {
            Request = request;
            Creation = creation;
            Holder = holder;
        }

        public RequestDraft Request { get; }
        public IOperation? Creation { get; }
        public ISymbol? Holder { get; }
        public bool IsPayload { get; set; }
        public bool PayloadHasModel { get; set; }
        public int PayloadSamplingKeys { get; set; }
        /// <summary>A key only a model request has (messages, prompt, max_tokens …), beside model and one sampling key.</summary>
        public bool PayloadHasRequestShape { get; set; }
        public bool PayloadSent { get; set; }
        /// <summary>For a request made by a send that passes no options: that send.</summary>
        public IOperation? ImplicitSend { get; set; }

        /// <summary>A hand-built payload is a request only with a model, once sent, and with two sampling keys or one beside a request-only key.</summary>
        public bool IsRequest => !IsPayload
            || (PayloadHasModel && PayloadSent && (PayloadSamplingKeys >= 2 || (PayloadSamplingKeys == 1 && PayloadHasRequestShape)));
    }

    /// <summary>The options instances of one block, in creation order, and which local, field or parameter holds each.</summary>
    internal sealed class Instances
    {
        private readonly List<Instance> all = new List<Instance>();

        public IReadOnlyList<Instance> All => all;

        public void Track(Instance instance) => all.Add(instance);

        /// <summary>The instance a member write belongs to; options from elsewhere (parameter, field, helper) get one of their own.</summary>
        public Instance For(IOperation? receiver, SurfaceDefinition surface, IOperation write, Model.CallContext context)
        {
            var holder = SymbolOf(receiver);
            if (Find(holder, write.Syntax.SpanStart) is { } existing)
            {
                return existing;
            }

            // Options from a parameter, a field or a helper: settings nobody writes here are Unknown, not Unset.
            var instance = new Instance(new RequestDraft(surface.Provider, surface.ShortName, write.Syntax.GetLocation(), context, originVisible: false), null, holder);
            Track(instance);
            return instance;
        }

        /// <summary>The latest instance held by <paramref name="holder"/> that was created before <paramref name="position"/>.</summary>
        public Instance? Find(ISymbol? holder, int position)
        {
            if (holder == null)
            {
                return null;
            }

            Instance? best = null;
            foreach (var instance in all)
            {
                if (SymbolEqualityComparer.Default.Equals(instance.Holder, holder)
                    && (instance.Creation == null || instance.Creation.Syntax.SpanStart <= position))
                {
                    best = instance;
                }
            }

            return best;
        }

        /// <summary>The instance an operand is: its creation itself, or what its local/field/parameter holds.</summary>
        public Instance? Of(IOperation operand, int position)
        {
            var unwrapped = ValueReader.Unwrap(operand);
            foreach (var instance in all)
            {
                if (instance.Creation != null && ReferenceEquals(instance.Creation, unwrapped))
                {
                    return instance;
                }
            }

            return Find(SymbolOf(unwrapped), position);
        }

        /// <summary>A copy (Clone, <c>with</c>) starts with the original's writes, model and shape.</summary>
        public static void Inherit(RequestDraft request, Instance? source)
        {
            if (source == null)
            {
                return;
            }

            request.AddRange(source.Request.Writes);
            request.ModelId = source.Request.ModelId;
            request.ResponseShape = source.Request.ResponseShape;
            request.ResponseShapeEvidence = source.Request.ResponseShapeEvidence;
        }

        /// <summary>The local, field or property an expression's value is stored in, if any.</summary>
        public static ISymbol? HolderOf(IOperation creation)
        {
            IOperation child = creation;
            var parent = creation.Parent;
            while (parent is IConversionOperation or IParenthesizedOperation)
            {
                child = parent;
                parent = parent.Parent;
            }

            return parent switch
            {
                IVariableInitializerOperation { Parent: IVariableDeclaratorOperation declarator } => declarator.Symbol,
                IFieldInitializerOperation field => field.InitializedFields.FirstOrDefault(),
                IPropertyInitializerOperation property => property.InitializedProperties.FirstOrDefault(),
                ISimpleAssignmentOperation assignment when ReferenceEquals(assignment.Value, child) => SymbolOf(assignment.Target),
                _ => null,
            };
        }

        public static IEnumerable<IOperation> Operands(IInvocationOperation invocation)
        {
            if (invocation.Instance != null)
            {
                yield return invocation.Instance;
            }

            foreach (var argument in invocation.Arguments)
            {
                yield return argument.Value;
            }
        }
        public static ISymbol? SymbolOf(IOperation? operation) => ValueReader.Unwrap(operation) switch
        {
            ILocalReferenceOperation local => local.Local,
            IFieldReferenceOperation field => field.Field,
            IPropertyReferenceOperation { Property.IsIndexer: false } property => property.Property,
            IParameterReferenceOperation parameter => parameter.Parameter,
            _ => null,
        };
    }
}
