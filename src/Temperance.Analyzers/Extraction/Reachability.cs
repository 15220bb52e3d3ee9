using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Where an options object goes: into a declared send (directly, through a carrier such as <c>KernelArguments</c> or a
    /// container request, or through the project's own helper that passes it on), out of sight (returned, stored in a
    /// field or property, handed to code we cannot read), or nowhere that reaches a model (a serialiser, a logger, an
    /// assertion, a mock's expectation, nothing at all).
    /// </summary>
    internal sealed partial class Reachability
    {
        private const int MaxHelperDepth = 3;

        private readonly SurfaceCatalog catalog;
        private readonly IReadOnlyList<IOperation> operations;
        private readonly int helperDepth;

        public Reachability(SurfaceCatalog catalog, IReadOnlyList<IOperation> operations, int helperDepth = 0)
        {
            this.catalog = catalog;
            this.operations = operations;
            this.helperDepth = helperDepth;
        }

        /// <summary>The result: how far the value got, the call that sends it (a declared send or a helper call), and why.</summary>
        public sealed class Result
        {
            public Reach Reach { get; set; }
            public IOperation? Send { get; set; }
            /// <summary>The declared send a helper passes the options to, when the send in this block is a helper call.</summary>
            public string? Through { get; set; }
            /// <summary>The declared send inside a helper of this file, when the helper was read through its operations.</summary>
            public IOperation? InnerSend { get; set; }
            public string? Escape { get; set; }
        }

        /// <summary>Follows the value created by <paramref name="creation"/> and everything held in <paramref name="holder"/>.</summary>
        public Result Of(IOperation? creation, ISymbol? holder, int position)
        {
            var result = new Result { Reach = Reach.NotSent };
            var followed = new HashSet<ISymbol>(SymbolEqualityComparer.Default);
            var pending = new Queue<IOperation>();
            if (creation != null)
            {
                pending.Enqueue(creation);
            }

            switch (holder)
            {
                case ILocalSymbol local:
                    Follow(local, followed, pending);
                    break;
                case IParameterSymbol parameter:
                    result.Reach = Reach.Escapes;
                    result.Escape = $"it comes from the parameter '{parameter.Name}'";
                    FollowReferences(parameter, position, pending);
                    break;
                case IFieldSymbol or IPropertySymbol:
                    result.Reach = Reach.Escapes;
                    result.Escape = $"it is kept in '{holder.Name}'";
                    FollowReferences(holder, position, pending);
                    break;
            }

            while (pending.Count > 0 && result.Reach != Reach.Sent)
            {
                Climb(pending.Dequeue(), result, followed, pending);
            }

            return result;
        }

        private void Follow(ILocalSymbol local, HashSet<ISymbol> followed, Queue<IOperation> pending)
        {
            if (!followed.Add(local))
            {
                return;
            }

            foreach (var operation in operations)
            {
                if (operation is ILocalReferenceOperation reference && SymbolEqualityComparer.Default.Equals(reference.Local, local))
                {
                    pending.Enqueue(reference);
                }
            }
        }

        private void FollowReferences(ISymbol member, int position, Queue<IOperation> pending)
        {
            foreach (var operation in operations)
            {
                var referenced = operation switch
                {
                    IParameterReferenceOperation p => p.Parameter,
                    IFieldReferenceOperation f => f.Field,
                    IPropertyReferenceOperation { Property.IsIndexer: false } p => p.Property,
                    _ => (ISymbol?)null,
                };
                if (referenced != null && SymbolEqualityComparer.Default.Equals(referenced, member) && operation.Syntax.SpanStart >= position)
                {
                    pending.Enqueue(operation);
                }
            }
        }

        private void Climb(IOperation value, Result result, HashSet<ISymbol> followed, Queue<IOperation> pending)
        {
            var current = value;
            for (var steps = 0; steps < 32; steps++)
            {
                var parent = current.Parent;
                switch (parent)
                {
                    case null:
                        return;
                    case IConversionOperation or IParenthesizedOperation or IAwaitOperation or ICoalesceOperation or IArrayInitializerOperation
                        or IArrayCreationOperation or ITupleOperation:
                        current = parent;
                        continue;
                    case IConditionalOperation conditional when !ReferenceEquals(conditional.Condition, current):
                        current = parent;
                        continue;
                    case IObjectOrCollectionInitializerOperation initializer when initializer.Parent != null:
                        current = initializer.Parent; // an element of a collection initializer: the collection carries it
                        continue;
                    case IArgumentOperation argument when argument.Parent is IInvocationOperation or IObjectCreationOperation:
                        if (OnArgument(argument.Parent, result))
                        {
                            return;
                        }

                        current = argument.Parent; // a carrier: KernelArguments, ChatClientAgentRunOptions, a request wrapper …
                        continue;
                    case IInvocationOperation invocation when ReferenceEquals(invocation.Instance, current):
                        // The carrier's own method: chat.SendAsync(…) on an OllamaSharp Chat holding the options.
                        if (catalog.IsSend(invocation.TargetMethod) && !Calls.IsExpectation(invocation))
                        {
                            Sent(result, invocation, null);
                        }

                        return;
                    case ISimpleAssignmentOperation assignment when ReferenceEquals(assignment.Value, current):
                        switch (assignment.Target)
                        {
                            case ILocalReferenceOperation local:
                                Follow(local.Local, followed, pending);
                                return;
                            case IMemberReferenceOperation { Instance: IInstanceReferenceOperation { ReferenceKind: InstanceReferenceKind.ImplicitReceiver } }
                                when assignment.Parent is IObjectOrCollectionInitializerOperation { Parent: { } created }:
                                current = created; // new ChatRequest { Options = options }: the created object carries it
                                continue;
                            case IMemberReferenceOperation { Instance: ILocalReferenceOperation carrier }:
                                Follow(carrier.Local, followed, pending); // chat.Options = options
                                return;
                            case IMemberReferenceOperation member:
                                Escape(result, $"it is stored in '{member.Member.Name}'");
                                return;
                            default:
                                return;
                        }
                    case IVariableInitializerOperation { Parent: IVariableDeclaratorOperation declarator }:
                        Follow(declarator.Symbol, followed, pending);
                        return;
                    case IReturnOperation:
                        Escape(result, "it is returned");
                        return;
                    case IFieldInitializerOperation or IPropertyInitializerOperation:
                        Escape(result, "it is stored in a field or property");
                        return;
                    default:
                        return;
                }
            }
        }

        /// <summary>The value is an argument of <paramref name="call"/>: true when that settles where it goes.</summary>
        private bool OnArgument(IOperation call, Result result)
        {
            var method = call switch
            {
                IInvocationOperation invocation => invocation.TargetMethod,
                IObjectCreationOperation creation => creation.Constructor,
                _ => null,
            };
            if (method == null)
            {
                return true;
            }

            if (catalog.IsSend(method))
            {
                if (!Calls.IsExpectation(call))
                {
                    Sent(result, call, null);
                }

                return true;
            }

            if (SurfaceCatalog.InNamespace(method, TestingSurfaces.SinkNamespaces) || SurfaceCatalog.InNamespace(method, TestingSurfaces.MockingNamespaces)
                || method.ContainingType?.SpecialType is SpecialType.System_Object or SpecialType.System_String)
            {
                return true; // serialised, logged, asserted or set up on a mock: goes no further
            }

            if (method.Locations.Any(l => l.IsInSource) && call is IInvocationOperation helperCall)
            {
                if (HelperSends(method) is { } through)
                {
                    Sent(result, helperCall, through.Name);
                    result.InnerSend = through.Send;
                    return true;
                }

                Escape(result, $"it is passed to '{method.Name}'");
                return false;
            }

            if (method.MethodKind != MethodKind.Constructor)
            {
                Escape(result, $"it is passed to '{method.ContainingType?.Name}.{method.Name}'");
            }

            return false;
        }

        private static void Sent(Result result, IOperation send, string? through)
        {
            result.Reach = Reach.Sent;
            result.Send = send;
            result.Through = through;
        }

        private static void Escape(Result result, string why)
        {
            if (result.Reach == Reach.NotSent)
            {
                result.Reach = Reach.Escapes;
                result.Escape = why;
            }
        }
    }
}
