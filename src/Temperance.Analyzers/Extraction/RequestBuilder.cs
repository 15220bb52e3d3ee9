using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Turns what one operation block collected into requests: creations (and copies) start instances, mutations add
    /// writes to them, calls add keyed writes, implicit requests and helper-built options. Then each request is linked to
    /// its send (<see cref="ClientLinker"/>), to a test's exact assertion (<see cref="TestAssertions"/>) and to task signals.
    /// </summary>
    internal sealed class RequestBuilder
    {
        private readonly BlockScope scope;
        private readonly SettingReader reader;
        private readonly Instances instances = new Instances();

        private RequestBuilder(BlockScope scope)
        {
            this.scope = scope;
            reader = new SettingReader(scope.Catalog);
        }

        private SurfaceCatalog Catalog => scope.Catalog;

        /// <param name="configuration">What configuration binds to the project's classes; null reads code alone (values read through them stay Unknown).</param>
        public static IReadOnlyList<ExtractedRequest> Build(SurfaceCatalog catalog, CallContext context, BlockCollector collected, IReadOnlyList<IOperation> blocks,
            ProjectConfiguration? configuration = null, System.Threading.CancellationToken cancellationToken = default)
        {
            var scope = new BlockScope(catalog, context, blocks);
            var builder = new RequestBuilder(scope);
            // A copy (Clone()) starts a request like a creation does; every other call is read after the mutations.
            var copies = collected.Invocations.Where(builder.IsCopy).ToList();
            foreach (var creation in collected.Creations.Concat(copies).OrderBy(c => c.Syntax.SpanStart))
            {
                builder.AddCreation(creation);
            }

            foreach (var mutation in collected.Mutations.OrderBy(m => m.Syntax.SpanStart))
            {
                builder.AddMutation(mutation);
            }

            foreach (var invocation in collected.Invocations.Except(copies).OrderBy(i => i.Syntax.SpanStart))
            {
                builder.AddInvocation(invocation);
            }

            var requests = builder.instances.All.Where(i => i.IsRequest).ToList();
            if (requests.Count == 0)
            {
                return System.Array.Empty<ExtractedRequest>();
            }

            var linker = new ClientLinker(scope);
            var sends = new Dictionary<RequestDraft, IOperation>();
            foreach (var instance in requests)
            {
                if (linker.Resolve(instance) is { } send)
                {
                    sends[instance.Request] = send;
                }
            }

            TestAssertions.Link(scope, sends);

            // Task signals are read once per block and shared by its requests; names differ per holder.
            var annotation = TaskSignalReader.Annotation(context.Member);
            var prompts = TaskSignalReader.FromPrompts(scope.Operations).ToList();
            foreach (var instance in requests)
            {
                if (annotation != null)
                {
                    instance.Request.TaskSignals.Add(annotation);
                }

                instance.Request.TaskSignals.AddRange(TaskSignalReader.FromNames(context.Member, instance.Holder, context.NamesDescribeATest));
                instance.Request.TaskSignals.AddRange(prompts);
            }

            // A request reading configuration-bound properties becomes one copy per environment that changes its values.
            var frozen = new List<ExtractedRequest>(requests.Count);
            foreach (var instance in requests)
            {
                ConfiguredVariants.Freeze(instance.Request, configuration, cancellationToken, frozen);
            }

            return frozen;
        }

        private RequestDraft NewRequest(SurfaceDefinition surface, IOperation at, bool originVisible) =>
            new RequestDraft(surface.Provider, surface.ShortName, at.Syntax.GetLocation(), scope.Context, originVisible);

        private void AddCreation(IOperation creation)
        {
            switch (creation)
            {
                case IObjectCreationOperation objectCreation when Catalog.Find(objectCreation.Type) is { } surface:
                    if (reader.IsNestedInContainer(objectCreation))
                    {
                        return; // read as part of the container's request
                    }

                    instances.Track(new Instance(reader.ReadCreation(surface, objectCreation, NewRequest(surface, objectCreation, originVisible: true)), creation, Instances.HolderOf(creation)));
                    return;

                case IObjectCreationOperation payload:
                    instances.Track(PayloadReader.FromDictionary(payload, scope.Context));
                    return;

                case IAnonymousObjectCreationOperation anonymous:
                    instances.Track(PayloadReader.FromAnonymous(anonymous, scope.Context));
                    return;

                // var b = a.Clone(): b starts with a's writes. Inherited writes keep their locations, and the analyzer
                // reports a location once, so a value is never judged twice.
                case IInvocationOperation copy when Catalog.Find(copy.Type) is { } copySurface:
                    var original = instances.Of(copy.Instance!, copy.Syntax.SpanStart);
                    var copied = NewRequest(copySurface, creation, originVisible: original?.Request.OriginVisible ?? false);
                    Instances.Inherit(copied, original);
                    instances.Track(new Instance(copied, creation, Instances.HolderOf(creation)));
                    return;

                case IWithOperation with when Catalog.Find(with.Type) is { } recordSurface:
                    var source = instances.Find(Instances.SymbolOf(with.Operand), with.Syntax.SpanStart);
                    var derived = NewRequest(recordSurface, creation, originVisible: source?.Request.OriginVisible ?? false);
                    Instances.Inherit(derived, source);
                    reader.ReadInitializer(recordSurface, with.Initializer, derived);
                    instances.Track(new Instance(derived, creation, Instances.HolderOf(creation)));
                    return;
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

                if (target.Instance is IPropertyReferenceOperation bag && Catalog.Find(bag.Property.ContainingType) is { } bagSurface
                    && bag.Property.Name == bagSurface.BagMember)
                {
                    SettingReader.ReadKey(bagSurface.Keys, key, assignment.Value, assignment.Syntax, instances.For(bag.Instance, bagSurface, assignment, scope.Context));
                }
                else if (instances.Find(Instances.SymbolOf(target.Instance), assignment.Syntax.SpanStart) is { IsPayload: true } payload)
                {
                    SettingReader.ReadKey(RawJsonSurface.Keys, key, assignment.Value, assignment.Syntax, payload);
                }

                return;
            }

            if (Catalog.Find(property.ContainingType) is { } surface)
            {
                var owner = instances.For(target.Instance, surface, assignment, scope.Context);
                reader.ReadMember(surface, property, assignment.Value, assignment.Syntax, owner.Request);
            }
        }

        private void AddInvocation(IInvocationOperation invocation)
        {
            var method = invocation.TargetMethod;
            if (invocation.Instance != null && Catalog.Find(invocation.Instance.Type) is { } surface)
            {
                if (method.Name == surface.KeyedMethod && invocation.Arguments.Length >= 2
                    && ValueReader.ConstantString(invocation.Arguments[0].Value) is { } key)
                {
                    SettingReader.ReadKey(surface.Keys, key, invocation.Arguments[1].Value, invocation.Syntax, instances.For(invocation.Instance, surface, invocation, scope.Context));
                    return;
                }

                if (method.Name == surface.ShapeMethod && invocation.Arguments.Length >= 1)
                {
                    var owner = instances.For(invocation.Instance, surface, invocation, scope.Context);
                    owner.Request.ResponseShape = ResponseFormats.OfShapeMethodKind(ValueReader.ConstantString(invocation.Arguments[0].Value));
                    owner.Request.ResponseShapeEvidence = ResponseShapeReader.Evidence(invocation.Syntax);
                    return;
                }
            }

            // payload.Add("temperature", 0.2)
            if (invocation.Instance != null && SettingReader.KeyedEntry(invocation) is { } entry
                && instances.Find(Instances.SymbolOf(invocation.Instance), invocation.Syntax.SpanStart) is { IsPayload: true } payloadOwner)
            {
                SettingReader.ReadKey(RawJsonSurface.Keys, entry.Key, entry.Value, invocation.Syntax, payloadOwner);
                return;
            }

            AddImplicitRequest(invocation);
            BorrowFromHelpers(invocation);
            // A hand-built payload counts once it is serialised or posted; where options go is Reachability's question.
            if (PayloadReader.IsSerialisation(method))
            {
                foreach (var operand in Instances.Operands(invocation))
                {
                    if (instances.Of(operand, invocation.Syntax.SpanStart) is { IsPayload: true } payload)
                    {
                        payload.PayloadSent = true;
                    }
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
                if (argument.Parameter != null && Catalog.Find(argument.Parameter.Type) is { } parameterSurface)
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
            surface ??= Catalog.SurfaceSentBy(invocation.TargetMethod);
            if (surface == null || !Catalog.IsSend(invocation.TargetMethod) || Calls.IsExpectation(invocation))
            {
                return;
            }

            var request = NewRequest(surface, invocation, originVisible: true);
            request.IsImplicit = true;
            request.SendingCall = invocation.TargetMethod;
            request.SendingCallLocation = invocation.Syntax.GetLocation();
            request.SeedAvailable = FixAnchorFinder.SeedAvailable(Catalog, surface, null);
            FixAnchorFinder.AddOmitted(Catalog, request, omitted, surface, invocation.Syntax);
            instances.Track(new Instance(request, invocation, null) { ImplicitSend = invocation });
        }

        /// <summary>
        /// <c>client.CompleteChat(messages, Options())</c> where <c>Options()</c> is a helper in this file that returns new
        /// options: the request sent here has the helper's writes and this call's task, test and client. Only the rules
        /// that depend on the call site judge it (the helper's own block judges the values).
        /// </summary>
        private void BorrowFromHelpers(IInvocationOperation send)
        {
            if (!Catalog.IsSend(send.TargetMethod))
            {
                return;
            }

            foreach (var argument in send.Arguments)
            {
                if (argument.ArgumentKind == ArgumentKind.DefaultValue || argument.Parameter == null || Catalog.Find(argument.Parameter.Type) == null
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
                if (returned.Count != 1 || returned[0] is not IObjectCreationOperation creation || Catalog.Find(creation.Type) is not { } surface)
                {
                    continue;
                }

                var request = reader.ReadCreation(surface, creation, NewRequest(surface, argument.Value, originVisible: true));
                request.BorrowedFrom = helper.Name;
                instances.Track(new Instance(request, helperCall, null));
            }
        }

        /// <summary>An options copy: the declared copy method, called on options and returning options.</summary>
        private bool IsCopy(IInvocationOperation invocation) =>
            invocation.TargetMethod.Name == ClientShapes.CopyMethod && invocation.Instance != null && invocation.Arguments.Length == 0
            && Catalog.Find(invocation.Instance.Type) != null && Catalog.Find(invocation.Type) != null;
    }
}
