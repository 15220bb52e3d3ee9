using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Turns what one operation block collected into requests. Value flow lives here and nowhere else:
    /// initializers, later mutations of the same local/field, nested option objects, bags, Clone/with, sends.
    /// </summary>
    internal sealed class RequestBuilder
    {
        private const int EvidenceLength = 60;

        private readonly SurfaceCatalog catalog;
        private readonly CallContext context;
        private readonly List<Instance> instances = new List<Instance>();

        private readonly IReadOnlyList<IOperation> blocks;

        private RequestBuilder(SurfaceCatalog catalog, CallContext context, IReadOnlyList<IOperation> blocks)
        {
            this.catalog = catalog;
            this.context = context;
            this.blocks = blocks;
        }

        public static IReadOnlyList<Request> Build(SurfaceCatalog catalog, CallContext context, BlockCollector collected, IReadOnlyList<IOperation> blocks)
        {
            var builder = new RequestBuilder(catalog, context, blocks);
            // A Clone() call starts a request like a creation does; every other call is read after the mutations.
            var clones = new List<IOperation>();
            var calls = new List<IInvocationOperation>();
            foreach (var invocation in collected.Invocations)
            {
                if (builder.IsClone(invocation))
                {
                    clones.Add(invocation);
                }
                else
                {
                    calls.Add(invocation);
                }
            }

            foreach (var creation in collected.Creations.Concat(clones).OrderBy(c => c.Syntax.SpanStart))
            {
                builder.AddCreation(creation);
            }

            foreach (var mutation in collected.Mutations.OrderBy(m => m.Syntax.SpanStart))
            {
                builder.AddMutation(mutation);
            }

            foreach (var invocation in calls.OrderBy(i => i.Syntax.SpanStart))
            {
                builder.AddInvocation(invocation);
            }

            var requests = builder.instances
                .Where(i => !i.IsPayload || (i.PayloadHasModel && i.PayloadSent && (i.PayloadSamplingKeys >= 2 || (i.PayloadSamplingKeys == 1 && i.PayloadHasRequestShape))))
                .ToList();
            if (requests.Count == 0)
            {
                return System.Array.Empty<Request>();
            }

            // Where each request's options go, and what receives them.
            var reachability = new Reachability(catalog, builder.Operations);
            var sends = new Dictionary<Request, IOperation>();
            foreach (var instance in requests)
            {
                if (builder.Resolve(instance, reachability) is { } send)
                {
                    sends[instance.Request] = send;
                }
            }

            // In a test: does the model's output reach an exact assertion?
            if (context.IsTest)
            {
                var allSends = new HashSet<IOperation>(sends.Values);
                foreach (var pair in sends)
                {
                    if (OutputFlow.FindExactAssertion(pair.Value, builder.Operations, allSends) is { } assertion)
                    {
                        pair.Key.ExactAssertion = assertion.Description;
                        pair.Key.ExactAssertionLocation = assertion.Location;
                    }
                    else if (context.Member is IMethodSymbol helper && OutputFlow.ReachesReturn(pair.Value, builder.Operations)
                        && builder.CallerAssertion(helper, pair.Value.SemanticModel) is { } callerAssertion)
                    {
                        pair.Key.ExactAssertion = callerAssertion.Description;
                        pair.Key.ExactAssertionLocation = callerAssertion.Location;
                        pair.Key.ExactAssertionIn = callerAssertion.Caller;
                        // The caller may hand the helper a double as its client (a mock passed in as a parameter).
                        pair.Key.TestDouble ??= callerAssertion.Double;
                    }
                }
            }

            // Task signals are read once per block and shared by its requests; names differ per holder.
            var annotation = TaskSignalReader.Annotation(context.Member);
            var prompts = TaskSignalReader.FromPrompts(builder.Operations).ToList();
            foreach (var instance in requests)
            {
                if (annotation != null)
                {
                    instance.Request.TaskSignals.Add(annotation);
                }

                instance.Request.TaskSignals.AddRange(TaskSignalReader.FromNames(context.Member, instance.Holder, context.NamesDescribeATest));
                instance.Request.TaskSignals.AddRange(prompts);
            }

            return requests.Select(i => i.Request).ToList();
        }

        /// <summary>
        /// A helper of a test class returns the model's output: the exact assertion a caller in the same file makes on the
        /// helper's result, if any.
        /// </summary>
        private (string Description, Location Location, string Caller, string? Double)? CallerAssertion(IMethodSymbol helper, SemanticModel? model)
        {
            if (model == null || helper.ContainingType == null)
            {
                return null;
            }

            foreach (var caller in helper.ContainingType.GetMembers().OfType<IMethodSymbol>())
            {
                if (SymbolEqualityComparer.Default.Equals(caller, helper) || caller.DeclaringSyntaxReferences.Length != 1
                    || caller.DeclaringSyntaxReferences[0].SyntaxTree != model.SyntaxTree
                    || model.GetOperation(caller.DeclaringSyntaxReferences[0].GetSyntax()) is not { } body)
                {
                    continue;
                }

                var operations = body.DescendantsAndSelf().ToList();
                foreach (var call in operations.OfType<IInvocationOperation>())
                {
                    if (SymbolEqualityComparer.Default.Equals(call.TargetMethod.OriginalDefinition, helper.OriginalDefinition)
                        && OutputFlow.FindExactAssertion(call, operations, new HashSet<IOperation> { call }) is { } found)
                    {
                        var doubles = new TestDoubles(catalog, operations, inTestCode: true);
                        var passedDouble = call.Arguments.Select(a => doubles.Describe(a.Value)).FirstOrDefault(d => d != null);
                        return (found.Description, found.Location, caller.Name, passedDouble);
                    }
                }
            }

            return null;
        }

        /// <summary>
        /// Fills in how far a request's options get (<see cref="Request.Reach"/>), the send, the client's model id, adapter
        /// and whether it is a test double. Returns the send, when there is one.
        /// </summary>
        private IOperation? Resolve(Instance instance, Reachability reachability)
        {
            var request = instance.Request;
            IOperation? send;
            IOperation? innerSend = null;
            if (instance.ImplicitSend != null)
            {
                send = instance.ImplicitSend;
                request.Reach = Reach.Sent;
            }
            else if (instance.IsPayload && !context.InTestCode)
            {
                request.Reach = Reach.Sent; // serialised or posted in this block (checked when it was collected)
                return null;
            }
            else
            {
                var result = reachability.Of(instance.Creation, instance.Holder, instance.Creation?.Syntax.SpanStart ?? 0);
                request.Reach = result.Reach;
                request.ReachNote = result.Reach == Reach.Sent ? (result.Through == null ? null : $"sent through '{Reachability.SendName(result.Send!)}' to '{result.Through}'") : result.Escape;
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
            request.ClientModelId = ClientModel(client, 0);
            if (ClientAdapter(client, 0) is { } adapter)
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

            request.TestDouble = new TestDoubles(catalog, Operations, context.InTestCode).Describe(client);
            if (request.TestDouble == null && innerSend != null)
            {
                // Sent through a helper of this file: the helper's own client decides.
                var helperBody = Reachability.Root(innerSend).DescendantsAndSelf().ToList();
                request.TestDouble = new TestDoubles(catalog, helperBody, context.InTestCode).Describe(ClientOf(innerSend));
            }

            return send;
        }

        /// <summary>The client a send goes through: the receiver, or for a constructor (an agent, a generator) its first argument.</summary>
        private static IOperation? ClientOf(IOperation send) => send switch
        {
            IInvocationOperation invocation => Receiver(invocation),
            IObjectCreationOperation { Arguments.Length: > 0 } creation => creation.Arguments[0].Value,
            _ => null,
        };

        private void AddCreation(IOperation creation)
        {
            switch (creation)
            {
                case IObjectCreationOperation objectCreation when catalog.Find(objectCreation.Type) is { } surface:
                    if (IsNestedInContainer(objectCreation))
                    {
                        return; // read as part of the container's request
                    }

                    var request = NewRequest(surface, creation, originVisible: true);
                    MarkUndeclared(request, objectCreation.Type, surface);
                    ReadInitializer(surface, objectCreation.Initializer, request);
                    AddTargets(request, objectCreation, surface);
                    request.SeedAvailable = SeedAvailable(surface, objectCreation.Type);
                    Track(new Instance(request, creation, HolderOf(creation)));
                    return;

                case IObjectCreationOperation payload:
                    AddPayload(payload, payload.Initializer);
                    return;

                case IAnonymousObjectCreationOperation anonymous:
                    AddAnonymousPayload(anonymous);
                    return;

                // var b = a.Clone(): b starts with a's writes. Inherited writes keep their locations, and the analyzer
                // reports a location once, so a value is never judged twice.
                case IInvocationOperation clone when catalog.Find(clone.Type) is { } cloneSurface:
                    var original = InstanceOf(clone.Instance!, clone.Syntax.SpanStart);
                    var copy = NewRequest(cloneSurface, creation, originVisible: original?.Request.OriginVisible ?? false);
                    Inherit(copy, original);
                    Track(new Instance(copy, creation, HolderOf(creation)));
                    return;

                case IWithOperation with when catalog.Find(with.Type) is { } recordSurface:
                    var source = FindInstance(SymbolOf(with.Operand), with.Syntax.SpanStart);
                    var derived = NewRequest(recordSurface, creation, originVisible: source?.Request.OriginVisible ?? false);
                    Inherit(derived, source);
                    ReadInitializer(recordSurface, with.Initializer, derived);
                    Track(new Instance(derived, creation, HolderOf(creation)));
                    return;
            }
        }

        /// <summary>
        /// A type derived from a declared surface (another provider's connector settings) with sampling members of its own
        /// that Surfaces does not declare: those settings are Unknown, never reported as unset.
        /// </summary>
        private void MarkUndeclared(Request request, ITypeSymbol? type, SurfaceDefinition surface)
        {
            for (var current = type as INamedTypeSymbol; current != null && catalog.TypeOf(surface.MetadataName) is { } declared
                && !SymbolEqualityComparer.Default.Equals(current.OriginalDefinition, declared); current = current.BaseType)
            {
                foreach (var member in current.GetMembers())
                {
                    if (member is IPropertySymbol { IsStatic: false } property && !surface.Members.ContainsKey(property.Name)
                        && SettingNames.OfMemberName(property.Name) is { } setting)
                    {
                        request.UndeclaredSettings.Add(setting);
                    }
                }
            }
        }

        private void AddMutation(ISimpleAssignmentOperation assignment)
        {
            var target = (IPropertyReferenceOperation)assignment.Target;
            var property = target.Property;
            if (property.IsIndexer)
            {
                // bag["key"] = value, where the bag is a surface member or a payload local.
                var key = target.Arguments.Length == 1 ? ValueReader.ConstantString(target.Arguments[0].Value) : null;
                if (key == null)
                {
                    return;
                }

                if (target.Instance is IPropertyReferenceOperation bag && catalog.Find(bag.Property.ContainingType) is { } bagSurface
                    && bag.Property.Name == bagSurface.BagMember)
                {
                    var owner = InstanceFor(bag.Instance, bagSurface, assignment);
                    ReadKey(bagSurface.Keys, key, assignment.Value, assignment.Syntax, owner);
                }
                else if (FindInstance(SymbolOf(target.Instance), assignment.Syntax.SpanStart) is { IsPayload: true } payload)
                {
                    ReadKey(RawJsonSurface.Keys, key, assignment.Value, assignment.Syntax, payload);
                }

                return;
            }

            if (catalog.Find(property.ContainingType) is { } surface)
            {
                var owner = InstanceFor(target.Instance, surface, assignment);
                ReadMember(surface, property, assignment.Value, assignment.Syntax, owner.Request);
            }
        }

        private void AddInvocation(IInvocationOperation invocation)
        {
            var method = invocation.TargetMethod;
            if (invocation.Instance != null && catalog.Find(invocation.Instance.Type) is { } surface)
            {
                if (method.Name == surface.KeyedMethod && invocation.Arguments.Length >= 2
                    && ValueReader.ConstantString(invocation.Arguments[0].Value) is { } key)
                {
                    var owner = InstanceFor(invocation.Instance, surface, invocation);
                    ReadKey(surface.Keys, key, invocation.Arguments[1].Value, invocation.Syntax, owner);
                    return;
                }

                if (method.Name == surface.ShapeMethod && invocation.Arguments.Length >= 1)
                {
                    var owner = InstanceFor(invocation.Instance, surface, invocation);
                    var kind = ValueReader.ConstantString(invocation.Arguments[0].Value);
                    owner.Request.ResponseShape = kind is "json_schema" or "json" ? ResponseShape.JsonSchema : ResponseShape.Grammar;
                    owner.Request.ResponseShapeEvidence = Evidence(invocation.Syntax);
                    return;
                }
            }

            // payload.Add("temperature", 0.2)
            if (method.Name == "Add" && invocation.Arguments.Length == 2 && invocation.Instance != null
                && FindInstance(SymbolOf(invocation.Instance), invocation.Syntax.SpanStart) is { IsPayload: true } payloadOwner
                && ValueReader.ConstantString(invocation.Arguments[0].Value) is { } payloadKey)
            {
                ReadKey(RawJsonSurface.Keys, payloadKey, invocation.Arguments[1].Value, invocation.Syntax, payloadOwner);
                return;
            }

            var serialises = BlockCollector.IsSerialisation(method);
            AddImplicitRequest(invocation);
            BorrowFromHelpers(invocation);
            // A hand-built payload counts once it is serialised or posted; where options go is Reachability's question.
            foreach (var operand in Operands(invocation))
            {
                if (InstanceOf(operand, invocation.Syntax.SpanStart) is { IsPayload: true } payload)
                {
                    payload.PayloadSent |= serialises;
                }
            }
        }

        /// <summary>
        /// A send that passes no options (<c>client.GetResponseAsync(prompt)</c>, <c>chat.CompleteChat(message)</c>):
        /// a request whose settings are all Unset, located at the call.
        /// </summary>
        private void AddImplicitRequest(IInvocationOperation invocation)
        {
            SurfaceDefinition? surface = null;
            IParameterSymbol? omitted = null;
            foreach (var argument in invocation.Arguments)
            {
                if (argument.Parameter != null && catalog.Find(argument.Parameter.Type) is { } parameterSurface)
                {
                    if (argument.ArgumentKind != ArgumentKind.DefaultValue && ValueReader.Unwrap(argument.Value)?.ConstantValue is not { HasValue: true, Value: null })
                    {
                        return; // options are passed: the request is that object
                    }

                    surface = parameterSurface;
                    omitted = argument.Parameter;
                }
            }

            // Only a declared send is a request; a factory or mapper with an omitted options parameter is not.
            surface ??= catalog.SurfaceSentBy(invocation.TargetMethod);
            if (surface == null || !catalog.IsSend(invocation.TargetMethod) || Reachability.IsExpectation(invocation))
            {
                return;
            }

            var request = new Request(surface.Provider, surface.ShortName, invocation.Syntax.GetLocation(), context, originVisible: true)
            {
                IsImplicit = true,
                OmittedParameter = omitted,
                SendingCall = invocation.TargetMethod,
                SendingCallLocation = invocation.Syntax.GetLocation(),
            };
            if (omitted?.Type is INamedTypeSymbol optionsType)
            {
                var concrete = optionsType.OriginalDefinition.SpecialType == SpecialType.System_Nullable_T ? (INamedTypeSymbol)optionsType.TypeArguments[0] : optionsType;
                if (concrete.TypeKind == TypeKind.Class && !concrete.IsAbstract)
                {
                    request.OmittedOptionsType = concrete.WithNullableAnnotation(NullableAnnotation.NotAnnotated).ToDisplayString(SymbolDisplayFormat.FullyQualifiedFormat);
                    foreach (var setting in new[] { Setting.Temperature, Setting.Seed })
                    {
                        if (MemberFor(concrete, surface, setting) is { } member)
                        {
                            request.OmittedMembers[setting] = new MemberTarget(invocation.Syntax, member.Name, member.Kind, null, null, member.Experimental);
                        }
                    }
                }
            }
            request.SeedAvailable = SeedAvailable(surface, null);
            Track(new Instance(request, invocation, null) { ImplicitSend = invocation });
        }

        /// <summary>
        /// <c>client.CompleteChat(messages, Options())</c> where <c>Options()</c> is a helper in this file that returns new
        /// options: the request sent here has the helper's writes and this call's task, test and client. Only the rules
        /// that depend on the call site judge it (the helper's own block judges the values).
        /// </summary>
        private void BorrowFromHelpers(IInvocationOperation send)
        {
            if (!catalog.IsSend(send.TargetMethod))
            {
                return;
            }

            foreach (var argument in send.Arguments)
            {
                if (argument.ArgumentKind == ArgumentKind.DefaultValue || argument.Parameter == null || catalog.Find(argument.Parameter.Type) == null
                    || ValueReader.Unwrap(argument.Value) is not IInvocationOperation { TargetMethod: { IsAbstract: false } helper } helperCall
                    || helper.DeclaringSyntaxReferences.Length != 1 || helperCall.SemanticModel is not { } model)
                {
                    continue;
                }

                var syntax = helper.DeclaringSyntaxReferences[0].GetSyntax();
                if (syntax.SyntaxTree != model.SyntaxTree || model.GetOperation(syntax) is not { } body)
                {
                    continue;
                }

                var returned = body.DescendantsAndSelf().OfType<IReturnOperation>().Select(r => ValueReader.Unwrap(r.ReturnedValue)).ToList();
                if (returned.Count != 1 || returned[0] is not IObjectCreationOperation creation || catalog.Find(creation.Type) is not { } surface)
                {
                    continue;
                }

                var request = new Request(surface.Provider, surface.ShortName, argument.Value.Syntax.GetLocation(), context, originVisible: true)
                {
                    BorrowedFrom = helper.Name,
                };
                MarkUndeclared(request, creation.Type, surface);
                ReadInitializer(surface, creation.Initializer, request);
                AddTargets(request, creation, surface);
                request.SeedAvailable = SeedAvailable(surface, creation.Type);
                Track(new Instance(request, helperCall, null));
            }
        }

        /// <summary>The client a call goes through: the instance, or the <c>this</c> argument of an extension method.</summary>
        private static IOperation? Receiver(IInvocationOperation invocation) =>
            invocation.Instance ?? (invocation.TargetMethod.IsExtensionMethod && invocation.Arguments.Length > 0 ? invocation.Arguments[0].Value : null);

        private static readonly HashSet<string> ModelParameterNames = new HashSet<string>(System.StringComparer.Ordinal)
        {
            "model", "modelId", "deploymentName", "defaultModel", "defaultModelId",
        };

        /// <summary>
        /// The constant model id of a client: a <c>model</c>-like argument of its creation or of <c>GetChatClient</c>,
        /// following locals of this block and adapter chains such as <c>.AsIChatClient()</c>.
        /// </summary>
        private string? ClientModel(IOperation? client, int depth)
        {
            if (client == null || depth > 4)
            {
                return null;
            }

            client = ValueReader.Unwrap(client);
            IEnumerable<IArgumentOperation> arguments;
            IOperation? inner = null;
            switch (client)
            {
                case IObjectCreationOperation creation:
                    arguments = creation.Arguments;
                    break;
                case IInvocationOperation call:
                    arguments = call.Arguments;
                    inner = Receiver(call);
                    break;
                case ILocalReferenceOperation local:
                    return ClientModel(LocalInitializer(local.Local), depth + 1);
                case IFieldReferenceOperation field:
                    return ModelFromSyntax(field.Field);
                case IPropertyReferenceOperation property:
                    return ModelFromSyntax(property.Property);
                default:
                    return null;
            }

            foreach (var argument in arguments)
            {
                if (argument.Parameter != null && ModelParameterNames.Contains(argument.Parameter.Name)
                    && ValueReader.ConstantString(argument.Value) is { Length: > 0 } model)
                {
                    return model;
                }
            }

            return ClientModel(inner, depth + 1);
        }

        /// <summary>The adapter behind an IChatClient, following locals of this block and casts (<c>(IChatClient)service</c>).</summary>
        private AdapterDefinition? ClientAdapter(IOperation? client, int depth)
        {
            if (client == null || depth > 6)
            {
                return null;
            }

            var operation = client;
            while (operation is IConversionOperation conversion)
            {
                operation = conversion.Operand;
            }

            if (operation is ILocalReferenceOperation local)
            {
                return ClientAdapter(LocalInitializer(local.Local), depth + 1);
            }

            // Middleware keeps the adapter underneath: adapter.AsBuilder().UseFunctionInvocation().Build(), new ChatClientBuilder(adapter).
            return catalog.AdapterCreatedBy(operation) ?? operation switch
            {
                IInvocationOperation call => ClientAdapter(Receiver(call), depth + 1),
                IObjectCreationOperation { Type.Name: "ChatClientBuilder", Arguments.Length: > 0 } builder => ClientAdapter(builder.Arguments[0].Value, depth + 1),
                _ => null,
            };
        }

        private IOperation? LocalInitializer(ILocalSymbol local)
        {
            if (localInitializers == null)
            {
                localInitializers = new Dictionary<ILocalSymbol, IOperation?>(SymbolEqualityComparer.Default);
                foreach (var declarator in Operations.OfType<IVariableDeclaratorOperation>())
                {
                    localInitializers[declarator.Symbol] = declarator.Initializer?.Value;
                }
            }

            return localInitializers.TryGetValue(local, out var initializer) ? initializer : null;
        }

        /// <summary>Every operation of the block, walked once and shared by all readers (locals, prompts, test assertions).</summary>
        private IReadOnlyList<IOperation> Operations => operations ??= blocks.SelectMany(b => b.DescendantsAndSelf()).ToList();

        private IReadOnlyList<IOperation>? operations;
        private Dictionary<ILocalSymbol, IOperation?>? localInitializers;

        /// <summary>
        /// A client held in a field or property initialised elsewhere in the type (its initializer, a constructor, a setup
        /// method): read the model from syntax (no semantic model for other members in the analyzer). A named argument wins; else the first string literal of GetChatClient(…) or
        /// of the creation that is not an address.
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
            foreach (var argument in initializer.DescendantNodesAndSelf().OfType<Microsoft.CodeAnalysis.CSharp.Syntax.ArgumentSyntax>())
            {
                if (argument.Expression is not Microsoft.CodeAnalysis.CSharp.Syntax.LiteralExpressionSyntax { Token.Value: string text } || text.Length == 0)
                {
                    continue;
                }

                if (argument.NameColon != null)
                {
                    if (ModelParameterNames.Contains(argument.NameColon.Name.Identifier.ValueText))
                    {
                        return text;
                    }

                    continue;
                }

                var call = argument.Parent?.Parent;
                var isGetClient = call is Microsoft.CodeAnalysis.CSharp.Syntax.InvocationExpressionSyntax { Expression: Microsoft.CodeAnalysis.CSharp.Syntax.MemberAccessExpressionSyntax access }
                    && access.Name.Identifier.ValueText.StartsWith("Get", System.StringComparison.Ordinal)
                    && access.Name.Identifier.ValueText.EndsWith("Client", System.StringComparison.Ordinal);
                if (isGetClient)
                {
                    return text;
                }

                if (fallback == null && call is Microsoft.CodeAnalysis.CSharp.Syntax.BaseObjectCreationExpressionSyntax && !text.Contains("://") && !text.Contains(" "))
                {
                    fallback = text;
                }
            }

            return fallback;
        }

        /// <summary>
        /// Where an unset temperature can be added: this creation when its type has a temperature member; for a container
        /// (Ollama ChatRequest, LLamaSharp InferenceParams) a new nested options object.
        /// </summary>
        private void AddTargets(Request request, IObjectCreationOperation creation, SurfaceDefinition surface)
        {
            foreach (var setting in new[] { Setting.Temperature, Setting.Seed })
            {
                if (!request.AddTargets.ContainsKey(setting) && TargetOf(creation, surface, setting) is { } target)
                {
                    request.AddTargets[setting] = target;
                }
            }
        }

        /// <summary>True when the surface, or the options it nests, has a seed member or key.</summary>
        private bool SeedAvailable(SurfaceDefinition surface, ITypeSymbol? type)
        {
            if (surface.Members.ContainsValue(Setting.Seed) || surface.Keys.ContainsValue(Setting.Seed))
            {
                return true;
            }

            foreach (var nested in surface.NestedMembers)
            {
                var nestedType = surface.NestedConcreteTypes.TryGetValue(nested, out var concrete) ? catalog.TypeOf(concrete)
                    : type == null ? null : FindProperty(type, nested)?.Type;
                if (catalog.Find(nestedType) is { } nestedSurface && (nestedSurface.Members.ContainsValue(Setting.Seed) || nestedSurface.Keys.ContainsValue(Setting.Seed)))
                {
                    return true;
                }
            }

            return false;
        }

        private MemberTarget? TargetOf(IObjectCreationOperation creation, SurfaceDefinition surface, Setting setting)
        {
            if (creation.Type == null)
            {
                return null;
            }

            if (MemberFor(creation.Type, surface, setting) is { } own)
            {
                return new MemberTarget(creation.Syntax, own.Name, own.Kind, null, null, own.Experimental);
            }

            foreach (var nestedName in surface.NestedMembers)
            {
                var nestedType = FindProperty(creation.Type, nestedName)?.Type as INamedTypeSymbol;
                if (surface.NestedConcreteTypes.TryGetValue(nestedName, out var concrete) && catalog.TypeOf(concrete) is { } concreteType)
                {
                    nestedType = concreteType;
                }

                if (nestedType != null && catalog.Find(nestedType) is { } nestedSurface
                    && MemberFor(nestedType, nestedSurface, setting) is { } nested && nestedType.TypeKind == TypeKind.Class && !nestedType.IsAbstract)
                {
                    return new MemberTarget(creation.Syntax, nested.Name, nested.Kind, nestedName, nestedType.ToDisplayString(SymbolDisplayFormat.FullyQualifiedFormat), nested.Experimental);
                }
            }

            return null;
        }

        /// <summary>The member of a surface type that carries a setting, with its literal type and experimental id (cached per compilation).</summary>
        private (string Name, NumericKind Kind, string? Experimental)? MemberFor(ITypeSymbol type, SurfaceDefinition surface, Setting setting)
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
                if (pair.Value == setting && FindProperty(type, pair.Key) is { } property && property.SetMethod != null
                    && ValueReader.KindOfType(property.Type) is { } kind)
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

        private static IPropertySymbol? FindProperty(ITypeSymbol type, string name)
        {
            for (var current = type; current != null; current = current.BaseType)
            {
                foreach (var member in current.GetMembers(name))
                {
                    if (member is IPropertySymbol property && !property.IsStatic)
                    {
                        return property;
                    }
                }
            }

            return null;
        }

        private bool IsClone(IInvocationOperation invocation) =>
            invocation.TargetMethod.Name == "Clone" && invocation.Instance != null && invocation.Arguments.Length == 0
            && catalog.Find(invocation.Instance.Type) != null && catalog.Find(invocation.Type) != null;

        private static IEnumerable<IOperation> Operands(IInvocationOperation invocation)
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

        // ---- payloads -------------------------------------------------------------------------------------------

        private void AddPayload(IObjectCreationOperation creation, IObjectOrCollectionInitializerOperation? initializer)
        {
            var request = new Request(Providers.Generic, "JSON payload", creation.Syntax.GetLocation(), context, originVisible: true);
            var instance = new Instance(request, creation, HolderOf(creation)) { IsPayload = true };
            if (initializer != null)
            {
                ReadKeyedInitializer(RawJsonSurface.Keys, initializer, instance);
            }

            instance.PayloadSent |= IsSerialisedInPlace(creation);
            Track(instance);
        }

        private void AddAnonymousPayload(IAnonymousObjectCreationOperation creation)
        {
            var request = new Request(Providers.Generic, "JSON payload", creation.Syntax.GetLocation(), context, originVisible: true);
            var instance = new Instance(request, creation, HolderOf(creation)) { IsPayload = true };
            ReadAnonymous(creation, instance);
            instance.PayloadSent |= IsSerialisedInPlace(creation);
            Track(instance);
        }

        private static void ReadAnonymous(IAnonymousObjectCreationOperation creation, Instance instance)
        {
            foreach (var element in creation.Initializers)
            {
                if (element is not ISimpleAssignmentOperation { Target: IPropertyReferenceOperation property } assignment)
                {
                    continue;
                }

                // Ollama's native API nests sampling under "options".
                if (property.Property.Name == "options" && ValueReader.Unwrap(assignment.Value) is IAnonymousObjectCreationOperation nested)
                {
                    instance.PayloadHasRequestShape = true;
                    ReadAnonymous(nested, instance);
                    continue;
                }

                ReadKey(RawJsonSurface.Keys, property.Property.Name, assignment.Value, assignment.Syntax, instance);
            }
        }

        /// <summary>A payload written straight into a send or serialise call: <c>PostAsJsonAsync(url, new { … })</c>.</summary>
        private static bool IsSerialisedInPlace(IOperation creation)
        {
            var parent = creation.Parent;
            while (parent is IConversionOperation or IArgumentOperation or IParenthesizedOperation)
            {
                if (parent is IArgumentOperation { Parent: IInvocationOperation call } && BlockCollector.IsSerialisation(call.TargetMethod))
                {
                    return true;
                }

                parent = parent.Parent;
            }

            return false;
        }

        // ---- members, keys and shapes ---------------------------------------------------------------------------

        private void ReadInitializer(SurfaceDefinition surface, IObjectOrCollectionInitializerOperation? initializer, Request request)
        {
            if (initializer == null)
            {
                return;
            }

            foreach (var element in initializer.Initializers)
            {
                switch (element)
                {
                    case ISimpleAssignmentOperation { Target: IPropertyReferenceOperation property } assignment:
                        ReadMember(surface, property.Property, assignment.Value, assignment.Syntax, request);
                        break;
                    // Get-only collections: AdditionalProperties = { ["N"] = 2 }
                    case IMemberInitializerOperation { InitializedMember: IPropertyReferenceOperation bag } memberInitializer
                        when bag.Property.Name == surface.BagMember:
                        ReadBag(surface, memberInitializer.Initializer, request);
                        break;
                }
            }
        }

        private void ReadMember(SurfaceDefinition surface, IPropertySymbol property, IOperation value, SyntaxNode syntax, Request request)
        {
            var name = property.Name;
            if (surface.Members.TryGetValue(name, out var setting) && catalog.Find(property.ContainingType) != null)
            {
                request.AddRange(ValueReader.Read(setting, name, value, property.Type, syntax.GetLocation()));
            }
            else if (request.UndeclaredSettings.Count > 0 && SettingNames.OfMemberName(name) is { } undeclared && request.UndeclaredSettings.Contains(undeclared))
            {
                // Written, but on a member whose provider, range and default are not declared: known to be set, value not judged.
                request.Add(new SettingWrite(undeclared, ValueKind.Unknown, 0, name, syntax.GetLocation(), null, NumericKind.Double, false, null));
            }
            else if (name == surface.ModelMember)
            {
                request.ModelId = ValueReader.ConstantString(value) ?? request.ModelId;
            }
            else if (name == surface.ResponseFormatMember)
            {
                SetShape(request, value);
            }
            else if (surface.NestedMembers.Contains(name))
            {
                if (ValueReader.Unwrap(value) is IObjectCreationOperation child && catalog.Find(child.Type) is { } childSurface)
                {
                    ReadInitializer(childSurface, child.Initializer, request);
                    AddTargets(request, child, childSurface);
                }
            }
            else if (name == surface.BagMember && ValueReader.Unwrap(value) is IObjectCreationOperation { Initializer: { } bagInitializer })
            {
                ReadBag(surface, bagInitializer, request);
            }
        }

        private void ReadBag(SurfaceDefinition surface, IObjectOrCollectionInitializerOperation initializer, Request request) =>
            ReadKeyedInitializer(surface.Keys, initializer, new Instance(request, null, null));

        /// <summary>A string-keyed initializer, in either form: <c>["temperature"] = 0.2</c> or <c>{ "temperature", 0.2 }</c>.</summary>
        private static void ReadKeyedInitializer(IReadOnlyDictionary<string, Setting> keys, IObjectOrCollectionInitializerOperation initializer, Instance instance)
        {
            foreach (var element in initializer.Initializers)
            {
                switch (element)
                {
                    case ISimpleAssignmentOperation { Target: IPropertyReferenceOperation { Property.IsIndexer: true, Arguments.Length: 1 } indexer } assignment
                        when ValueReader.ConstantString(indexer.Arguments[0].Value) is { } key:
                        ReadKey(keys, key, assignment.Value, assignment.Syntax, instance);
                        break;
                    case IInvocationOperation { TargetMethod.Name: "Add", Arguments.Length: 2 } add
                        when ValueReader.ConstantString(add.Arguments[0].Value) is { } addKey:
                        ReadKey(keys, addKey, add.Arguments[1].Value, add.Syntax, instance);
                        break;
                }
            }
        }

        private static void ReadKey(IReadOnlyDictionary<string, Setting> keys, string key, IOperation value, SyntaxNode syntax, Instance instance)
        {
            if (instance.IsPayload && key == RawJsonSurface.ModelKey)
            {
                instance.PayloadHasModel = true;
                instance.Request.ModelId = ValueReader.ConstantString(value);
                return;
            }

            if (instance.IsPayload && key is "response_format" or "format")
            {
                instance.PayloadHasRequestShape = true;
                instance.Request.ResponseShape = ResponseShape.JsonObject;
                instance.Request.ResponseShapeEvidence = Evidence(syntax);
                return;
            }

            if (instance.IsPayload && RawJsonSurface.RequestKeys.Contains(key))
            {
                instance.PayloadHasRequestShape = true;
            }

            if (keys.TryGetValue(key, out var setting))
            {
                instance.PayloadSamplingKeys++;
                instance.Request.AddRange(ValueReader.Read(setting, $"\"{key}\"", value, null, syntax.GetLocation()));
            }
        }

        private static void SetShape(Request request, IOperation value)
        {
            var shape = ShapeOf(value);
            if (shape != ResponseShape.Unspecified)
            {
                request.ResponseShape = shape;
                request.ResponseShapeEvidence = Evidence(value.Syntax);
            }
        }

        /// <summary>Reads a response-format value by the factory or type it names; anything else stays Unspecified.</summary>
        private static ResponseShape ShapeOf(IOperation value)
        {
            foreach (var operation in value.DescendantsAndSelf())
            {
                switch (operation)
                {
                    case IInvocationOperation call:
                        var name = call.TargetMethod.Name;
                        if (name.Contains("JsonSchema"))
                        {
                            return ResponseShape.JsonSchema;
                        }

                        if (name == "CreateJsonObjectFormat")
                        {
                            return ResponseShape.JsonObject;
                        }

                        if (name == "CreateJsonFormat")
                        {
                            return call.Arguments.Any(a => a.ArgumentKind == ArgumentKind.Explicit) ? ResponseShape.JsonSchema : ResponseShape.JsonObject;
                        }

                        if (name == "CreateTextFormat")
                        {
                            return ResponseShape.Text;
                        }

                        break;
                    case IPropertyReferenceOperation { Property.IsStatic: true } property:
                        switch (property.Property.Name)
                        {
                            case "Json":
                            case "JsonObject":
                                return ResponseShape.JsonObject;
                            case "JsonSchema":
                                return ResponseShape.JsonSchema;
                            case "Text":
                                return ResponseShape.Text;
                        }

                        break;
                    case IObjectCreationOperation creation:
                        switch (creation.Type?.Name)
                        {
                            case "Grammar":
                                return ResponseShape.Grammar;
                            case "JsonOutputFormat":
                            case "ChatResponseFormatJson":
                                return ResponseShape.JsonSchema;
                        }

                        break;
                    case ILiteralOperation { ConstantValue: { HasValue: true, Value: string text } }:
                        if (text is "json" or "json_object")
                        {
                            return ResponseShape.JsonObject;
                        }

                        if (text == "text")
                        {
                            return ResponseShape.Text;
                        }

                        break;
                }
            }

            return ResponseShape.Unspecified;
        }

        private static string Evidence(SyntaxNode syntax)
        {
            var text = syntax.ToString().Replace("\r", " ").Replace("\n", " ");
            return text.Length <= EvidenceLength ? text : text.Substring(0, EvidenceLength) + "…";
        }

        // ---- instances and holders ------------------------------------------------------------------------------

        private Request NewRequest(SurfaceDefinition surface, IOperation creation, bool originVisible) =>
            new Request(surface.Provider, surface.ShortName, creation.Syntax.GetLocation(), context, originVisible);

        private void Track(Instance instance) => instances.Add(instance);

        /// <summary>The instance a member write belongs to; options from elsewhere (parameter, field, helper) get one of their own.</summary>
        private Instance InstanceFor(IOperation? receiver, SurfaceDefinition surface, IOperation write)
        {
            var holder = SymbolOf(receiver);
            var existing = FindInstance(holder, write.Syntax.SpanStart);
            if (existing != null)
            {
                return existing;
            }

            // Options from a parameter, a field or a helper: settings nobody writes here are Unknown, not Unset.
            var request = new Request(surface.Provider, surface.ShortName, write.Syntax.GetLocation(), context, originVisible: false);
            var instance = new Instance(request, null, holder);
            Track(instance);
            return instance;
        }

        private static void Inherit(Request request, Instance? source)
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

        /// <summary>The latest instance held by <paramref name="holder"/> that was created before <paramref name="position"/>.</summary>
        private Instance? FindInstance(ISymbol? holder, int position)
        {
            if (holder == null)
            {
                return null;
            }

            Instance? best = null;
            foreach (var instance in instances)
            {
                if (SymbolEqualityComparer.Default.Equals(instance.Holder, holder)
                    && (instance.Creation == null || instance.Creation.Syntax.SpanStart <= position))
                {
                    best = instance;
                }
            }

            return best;
        }

        private Instance? InstanceOf(IOperation operand, int position)
        {
            var unwrapped = ValueReader.Unwrap(operand);
            foreach (var instance in instances)
            {
                if (instance.Creation != null && ReferenceEquals(instance.Creation, unwrapped))
                {
                    return instance;
                }
            }

            return FindInstance(SymbolOf(unwrapped), position);
        }

        private bool IsNestedInContainer(IObjectCreationOperation creation)
        {
            var parent = creation.Parent;
            while (parent is IConversionOperation)
            {
                parent = parent.Parent;
            }

            return parent is ISimpleAssignmentOperation { Target: IPropertyReferenceOperation member, Parent: IObjectOrCollectionInitializerOperation }
                && catalog.Find(member.Property.ContainingType) is { } container
                && container.NestedMembers.Contains(member.Property.Name);
        }

        /// <summary>The local, field or property an expression's value is stored in, if any.</summary>
        private static ISymbol? HolderOf(IOperation creation)
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

        private static ISymbol? SymbolOf(IOperation? operation) => ValueReader.Unwrap(operation) switch
        {
            ILocalReferenceOperation local => local.Local,
            IFieldReferenceOperation field => field.Field,
            IPropertyReferenceOperation { Property.IsIndexer: false } property => property.Property,
            IParameterReferenceOperation parameter => parameter.Parameter,
            _ => null,
        };

        /// <summary>One options object (or payload) in the block, and what holds it.</summary>
        private sealed class Instance
        {
            public Instance(Request request, IOperation? creation, ISymbol? holder)
            {
                Request = request;
                Creation = creation;
                Holder = holder;
            }

            public Request Request { get; }
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
        }
    }
}
