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
    /// Links a request to where it is sent: how far its options get (<see cref="Reachability"/>), the send, and what the
    /// client behind the send is: its constant model id, the IChatClient adapter it goes through, or a test double.
    /// </summary>
    internal sealed class ClientLinker
    {
        /// <summary>How many links of a client chain (local → initializer → receiver → builder argument) are followed.</summary>
        private const int MaxChainLength = 6;

        private readonly BlockScope scope;
        private readonly Reachability reachability;

        public ClientLinker(BlockScope scope)
        {
            this.scope = scope;
            reachability = new Reachability(scope.Catalog, scope.Operations);
        }

        /// <summary>
        /// Fills in how far a request's options get (<see cref="Request.Reach"/>), the send, the client's model id, adapter
        /// and whether it is a test double. Returns the send, when there is one.
        /// </summary>
        public IOperation? Resolve(Instance instance)
        {
            var request = instance.Request;
            IOperation? send;
            IOperation? innerSend = null;
            if (instance.ImplicitSend != null)
            {
                send = instance.ImplicitSend;
                request.Reach = Reach.Sent;
            }
            else if (instance.IsPayload && !scope.Context.InTestCode)
            {
                request.Reach = Reach.Sent; // serialised or posted in this block (checked when it was collected)
                return null;
            }
            else
            {
                var result = reachability.Of(instance.Creation, instance.Holder, instance.Creation?.Syntax.SpanStart ?? 0);
                request.Reach = result.Reach;
                request.ReachNote = result.Reach == Reach.Sent
                    ? (result.Through == null ? null : $"sent through '{Calls.SendName(result.Send!)}' to '{result.Through}'")
                    : result.Escape;
                send = result.Send;
                innerSend = result.InnerSend;
                if (send == null)
                {
                    return null;
                }
            }

            request.SendingCall = send switch
            {
                IInvocationOperation invocation => invocation.TargetMethod,
                IObjectCreationOperation creation => creation.Constructor,
                _ => null,
            };
            request.SendingCallLocation = send.Syntax.GetLocation();
            var client = ClientOf(send);
            request.ClientModelId = ClientModel(client);
            request.ClientModelIdFrom = request.ClientModelId == null ? ClientModelPath(client) : null;
            request.Endpoint = ClientEndpoint(client);
            if ((scope.Catalog.AdapterOfSend(request.SendingCall) ?? ClientAdapter(client)) is { } adapter)
            {
                request.Adapter = adapter.Name;
                request.AdapterDisplay = adapter.Display;
            }

            // GetResponseAsync<Invoice>(…): a typed structured-output send (only a send: a serialiser's Write<T> is not one).
            if (request.SendingCall is { IsGenericMethod: true, TypeArguments.Length: 1 } generic && innerSend == null
                && request.ResponseShape is ResponseShape.Unspecified or ResponseShape.Text)
            {
                request.ResponseShape = ResponseShape.Structured;
                request.ResponseShapeEvidence = $"{generic.Name}<{generic.TypeArguments[0].Name}>";
            }

            request.TestDouble = new TestDoubles(scope.Catalog, scope.Operations, scope.Context.InTestCode).Describe(client);
            if (request.TestDouble == null && innerSend != null)
            {
                // Sent through a helper of this file: the helper's own client decides.
                var helperBody = Calls.Root(innerSend).DescendantsAndSelf().ToList();
                request.TestDouble = new TestDoubles(scope.Catalog, helperBody, scope.Context.InTestCode).Describe(ClientOf(innerSend));
            }

            return send;
        }

        /// <summary>The client a send goes through: the receiver, or for a constructor (an agent, a generator) its first argument.</summary>
        public static IOperation? ClientOf(IOperation send) => send switch
        {
            IInvocationOperation invocation => Receiver(invocation),
            IObjectCreationOperation { Arguments.Length: > 0 } creation => creation.Arguments[0].Value,
            _ => null,
        };

        /// <summary>The client a call goes through: the instance, or the <c>this</c> argument of an extension method.</summary>
        public static IOperation? Receiver(IInvocationOperation invocation) =>
            invocation.Instance ?? (invocation.TargetMethod.IsExtensionMethod && invocation.Arguments.Length > 0 ? invocation.Arguments[0].Value : null);

        /// <summary>
        /// Every link of a client's chain, nearest first: the expression, what a local of this block was declared with, the
        /// receiver of a call (<c>.AsIChatClient()</c>, <c>.AsBuilder().Build()</c>) and the client a middleware builder wraps.
        /// Conversions, casts included (<c>(IChatClient)service</c>), are looked through.
        /// </summary>
        private IEnumerable<IOperation> Chain(IOperation? client)
        {
            for (var length = 0; client != null && length <= MaxChainLength; length++)
            {
                while (client is IConversionOperation or IParenthesizedOperation)
                {
                    client = client is IConversionOperation conversion ? conversion.Operand : ((IParenthesizedOperation)client).Operand;
                }

                if (client is ILocalReferenceOperation local)
                {
                    client = scope.LocalInitializer(local.Local);
                    continue;
                }

                yield return client!;
                client = client switch
                {
                    IInvocationOperation call => Receiver(call),
                    IObjectCreationOperation creation when creation.Type is INamedTypeSymbol type
                        && ClientShapes.MiddlewareBuilders.TryGetValue(SurfaceCatalog.FullName(type.OriginalDefinition), out var argument)
                        && creation.Arguments.Length > argument => creation.Arguments[argument].Value,
                    _ => null,
                };
            }
        }

        /// <summary>
        /// The constant model id of a client: a model-id argument of its creation or of a client factory along its chain, or
        /// for a client kept in a field or property, what the type assigns it.
        /// </summary>
        private string? ClientModel(IOperation? client)
        {
            foreach (var link in Chain(client))
            {
                switch (link)
                {
                    case IObjectCreationOperation creation when ModelArgument(creation.Arguments) is { } created:
                        return created;
                    case IInvocationOperation call when ModelArgument(call.Arguments) is { } fromFactory:
                        return fromFactory;
                    case IFieldReferenceOperation field:
                        return ModelFromSyntax(field.Field);
                    case IPropertyReferenceOperation property:
                        return ModelFromSyntax(property.Property);
                }
            }

            return null;
        }

        /// <summary>
        /// When the client's model id is not constant: the property of the project's classes it is read from along the same
        /// chain (<c>new ChatClient(_options.Model, key)</c>), which configuration may bind.
        /// </summary>
        private MemberPath? ClientModelPath(IOperation? client)
        {
            foreach (var link in Chain(client))
            {
                switch (link)
                {
                    case IObjectCreationOperation creation when ModelArgumentPath(creation.Arguments) is { } created:
                        return created;
                    case IInvocationOperation call when ModelArgumentPath(call.Arguments) is { } fromFactory:
                        return fromFactory;
                    case IFieldReferenceOperation field:
                        return ModelPathFromSyntax(field.Field);
                    case IPropertyReferenceOperation property:
                        return ModelPathFromSyntax(property.Property);
                }
            }

            return null;
        }

        private static MemberPath? ModelArgumentPath(IEnumerable<IArgumentOperation> arguments)
        {
            foreach (var argument in arguments)
            {
                if (argument.Parameter != null && ClientShapes.ModelParameterNames.Contains(argument.Parameter.Name))
                {
                    return MemberPaths.Of(argument.Value);
                }
            }

            return null;
        }

        /// <summary>
        /// A client kept in a field or property and created elsewhere in its type, read from syntax as <see cref="ModelFromSyntax(ISymbol)"/>
        /// reads a literal: a named model argument wins, else the first argument of a client factory, else of the first creation.
        /// </summary>
        private static MemberPath? ModelPathFromSyntax(ISymbol member)
        {
            if (member.ContainingType is not { } scope)
            {
                return null;
            }

            MemberPath? fallback = null;
            foreach (var value in MemberValues.Of(member))
            {
                foreach (var argument in value.DescendantNodesAndSelf().OfType<ArgumentSyntax>())
                {
                    var call = argument.Parent?.Parent;
                    if (argument.NameColon != null)
                    {
                        if (ClientShapes.ModelParameterNames.Contains(argument.NameColon.Name.Identifier.ValueText))
                        {
                            return MemberPaths.OfSyntax(argument.Expression, scope);
                        }

                        continue;
                    }

                    if (argument.Parent is not ArgumentListSyntax list || list.Arguments[0] != argument)
                    {
                        continue;
                    }

                    if (call is InvocationExpressionSyntax { Expression: MemberAccessExpressionSyntax access } && IsClientFactory(access.Name.Identifier.ValueText))
                    {
                        return MemberPaths.OfSyntax(argument.Expression, scope);
                    }

                    if (fallback == null && call is BaseObjectCreationExpressionSyntax)
                    {
                        fallback = MemberPaths.OfSyntax(argument.Expression, scope);
                    }
                }
            }

            return fallback;
        }

        /// <summary>The constant address the client is pointed at: an endpoint argument, or an Endpoint member of an options argument.</summary>
        private string? ClientEndpoint(IOperation? client)
        {
            foreach (var link in Chain(client))
            {
                if (link is not IObjectCreationOperation creation)
                {
                    continue;
                }

                foreach (var argument in creation.Arguments)
                {
                    if (argument.Parameter != null && ClientShapes.EndpointParameterNames.Contains(argument.Parameter.Name) && Address(argument.Value) is { } direct)
                    {
                        return direct;
                    }

                    var value = ValueReader.Unwrap(argument.Value);
                    if (value is ILocalReferenceOperation local)
                    {
                        value = ValueReader.Unwrap(scope.LocalInitializer(local.Local));
                    }

                    if (value is IObjectCreationOperation { Initializer: { } options })
                    {
                        foreach (var element in options.Initializers)
                        {
                            if (element is ISimpleAssignmentOperation { Target: IPropertyReferenceOperation member } assignment
                                && ClientShapes.EndpointMembers.Contains(member.Property.Name) && Address(assignment.Value) is { } address)
                            {
                                return address;
                            }
                        }
                    }
                }
            }

            return null;
        }

        /// <summary><c>new Uri("…")</c> or a constant string.</summary>
        private static string? Address(IOperation value) => ValueReader.Unwrap(value) switch
        {
            IObjectCreationOperation { Arguments.Length: >= 1 } uri when uri.Type?.Name == nameof(System.Uri) => ValueReader.ConstantString(uri.Arguments[0].Value),
            var other => ValueReader.ConstantString(other),
        };

        private static string? ModelArgument(IEnumerable<IArgumentOperation> arguments)
        {
            foreach (var argument in arguments)
            {
                if (argument.Parameter != null && ClientShapes.ModelParameterNames.Contains(argument.Parameter.Name)
                    && ValueReader.ConstantString(argument.Value) is { Length: > 0 } model)
                {
                    return model;
                }
            }

            return null;
        }

        /// <summary>The adapter behind an IChatClient: the first link of its chain that creates one.</summary>
        private AdapterDefinition? ClientAdapter(IOperation? client)
        {
            foreach (var link in Chain(client))
            {
                if (scope.Catalog.AdapterCreatedBy(link) is { } adapter)
                {
                    return adapter;
                }
            }

            return null;
        }

        /// <summary>
        /// A client held in a field or property initialised elsewhere in the type (its initializer, a constructor, a setup
        /// method), read from syntax: the analyzer has no semantic model for other members. A named model argument wins; else
        /// the first string of a client factory, else the first string of a creation that is not an address.
        /// </summary>
        private static string? ModelFromSyntax(ISymbol member)
        {
            foreach (var value in MemberValues.Of(member))
            {
                if (ModelFromSyntax(value) is { } model)
                {
                    return model;
                }
            }

            return null;
        }

        private static string? ModelFromSyntax(SyntaxNode initializer)
        {
            string? fallback = null;
            foreach (var argument in initializer.DescendantNodesAndSelf().OfType<ArgumentSyntax>())
            {
                if (argument.Expression is not LiteralExpressionSyntax { Token.Value: string text } || text.Length == 0)
                {
                    continue;
                }

                if (argument.NameColon != null)
                {
                    if (ClientShapes.ModelParameterNames.Contains(argument.NameColon.Name.Identifier.ValueText))
                    {
                        return text;
                    }

                    continue;
                }

                var call = argument.Parent?.Parent;
                if (call is InvocationExpressionSyntax { Expression: MemberAccessExpressionSyntax access } && IsClientFactory(access.Name.Identifier.ValueText))
                {
                    return text;
                }

                if (fallback == null && call is BaseObjectCreationExpressionSyntax && !text.Contains("://") && !text.Contains(" "))
                {
                    fallback = text;
                }
            }

            return fallback;
        }

        private static bool IsClientFactory(string name) =>
            name.StartsWith(ClientShapes.ClientFactoryPrefix, System.StringComparison.Ordinal) && name.EndsWith(ClientShapes.ClientFactorySuffix, System.StringComparison.Ordinal);
    }
}
