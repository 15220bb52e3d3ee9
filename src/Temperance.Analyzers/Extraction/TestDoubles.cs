using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Decides whether the client a request is sent to is a test double, and names it. Follows the client back through
    /// locals, fields and properties set anywhere in their type (constructors, fixtures, initializers), the project's own
    /// helper methods, adapters and builders (<c>AsIChatClient()</c>, <c>new ChatClientBuilder(inner)</c>) and the
    /// arguments it was built from (an <c>HttpClient</c> over a handler, a pipeline transport). Doubles are: mocking
    /// libraries' proxies and in-process test servers anywhere; in test code also classes declared in the project that
    /// act as the client or its transport (a decorator that wraps a real client is not one); in product code a client
    /// class of the project that holds no model client (a chat interface over some other service).
    /// </summary>
    internal sealed class TestDoubles
    {
        private const int MaxDepth = 8;

        private readonly SurfaceCatalog catalog;
        private readonly IReadOnlyList<IOperation> operations;
        private readonly SemanticModel? model;
        private readonly bool inTestCode;
        private readonly HashSet<ISymbol> visited = new HashSet<ISymbol>(SymbolEqualityComparer.Default);
        private readonly StandInTypes standIns;

        public TestDoubles(SurfaceCatalog catalog, IReadOnlyList<IOperation> operations, bool inTestCode)
        {
            this.catalog = catalog;
            this.operations = operations;
            this.inTestCode = inTestCode;
            standIns = new StandInTypes(catalog, inTestCode);
            model = operations.Count > 0 ? operations[0].SemanticModel : null;
        }

        /// <summary>What the client is, when it is a double ("FakeChatClient, declared in this project"); null when it may be real.</summary>
        public string? Describe(IOperation? client) => Resolve(client, 0);

        private string? Resolve(IOperation? operation, int depth)
        {
            if (operation == null || depth > MaxDepth)
            {
                return null;
            }

            while (operation is IConversionOperation or IParenthesizedOperation or IAwaitOperation)
            {
                operation = operation switch
                {
                    IConversionOperation conversion => conversion.Operand,
                    IParenthesizedOperation parenthesized => parenthesized.Operand,
                    IAwaitOperation awaited => awaited.Operation,
                    _ => operation,
                };
            }

            if (standIns.OfType(operation.Type) is { } byType)
            {
                return byType;
            }

            switch (operation)
            {
                case IObjectCreationOperation creation:
                    return standIns.OfType(creation.Type) ?? standIns.CannedDelegatingHandler(creation) ?? Arguments(creation.Arguments, depth) ?? Initializer(creation.Initializer, depth);

                case IInvocationOperation invocation:
                    var method = invocation.TargetMethod;
                    if (SurfaceCatalog.InNamespace(method, TestingSurfaces.MockingNamespaces))
                    {
                        return $"a {method.ContainingNamespace.ToDisplayString()} double ({method.ContainingType.Name}.{method.Name})";
                    }

                    if (StandInTypes.IsTestServer(method.ContainingType))
                    {
                        return $"a client of the in-process test server ({method.ContainingType.Name})";
                    }

                    if (method.Locations.Any(l => l.IsInSource) && !method.IsAbstract && Helper(method, depth) is { } fromHelper)
                    {
                        return fromHelper;
                    }

                    return Resolve(invocation.Instance, depth + 1) ?? Arguments(invocation.Arguments, depth);

                case IPropertyReferenceOperation { Property.IsIndexer: false } property:
                    if (SurfaceCatalog.InNamespace(property.Instance?.Type, TestingSurfaces.MockingNamespaces))
                    {
                        return $"a {property.Instance!.Type!.ContainingNamespace.ToDisplayString()} mock ({property.Instance.Type.Name}.{property.Property.Name})";
                    }

                    return Member(property.Property, depth) ?? Resolve(property.Instance, depth + 1);

                case IFieldReferenceOperation field:
                    return Member(field.Field, depth);

                case ILocalReferenceOperation local:
                    return Local(local, depth);

                case IConditionalAccessOperation access:
                    return Resolve(access.Operation, depth + 1);

                default:
                    return null;
            }
        }

        private string? Arguments(IEnumerable<IArgumentOperation> arguments, int depth)
        {
            foreach (var argument in arguments)
            {
                if (argument.ArgumentKind != ArgumentKind.DefaultValue && Resolve(argument.Value, depth + 1) is { } found)
                {
                    return found;
                }
            }

            return null;
        }

        private string? Initializer(IObjectOrCollectionInitializerOperation? initializer, int depth)
        {
            if (initializer == null)
            {
                return null;
            }

            foreach (var element in initializer.Initializers)
            {
                var value = element is ISimpleAssignmentOperation assignment ? assignment.Value : element;
                if (Resolve(value, depth + 1) is { } found)
                {
                    return found;
                }
            }

            return null;
        }

        /// <summary>
        /// A local: its initializer, later assignments, and what builder calls on it were given. Read in the body it belongs
        /// to, which is another member's when the reference came from a field's assignment in a setup method.
        /// </summary>
        private string? Local(ILocalReferenceOperation reference, int depth)
        {
            var local = reference.Local;
            if (!visited.Add(local))
            {
                return null;
            }

            var top = Calls.Root(reference);
            var body = operations.Count > 0 && ReferenceEquals(Calls.Root(operations[0]), top) ? operations : top.DescendantsAndSelf().ToList();
            foreach (var operation in body)
            {
                var found = operation switch
                {
                    IVariableDeclaratorOperation declarator when SymbolEqualityComparer.Default.Equals(declarator.Symbol, local) =>
                        Resolve(declarator.Initializer?.Value, depth + 1),
                    ISimpleAssignmentOperation { Target: ILocalReferenceOperation target } assignment when SymbolEqualityComparer.Default.Equals(target.Local, local) =>
                        Resolve(assignment.Value, depth + 1),
                    IInvocationOperation call when IsCalledOn(call, local) => Arguments(call.Arguments.Where(a => !ReferenceEquals(a.Value, ReceiverOf(call))), depth),
                    _ => null,
                };
                if (found != null)
                {
                    return found;
                }
            }

            return null;
        }

        private static IOperation? ReceiverOf(IInvocationOperation call) =>
            call.Instance ?? (call.TargetMethod.IsExtensionMethod && call.Arguments.Length > 0 ? call.Arguments[0].Value : null);

        /// <summary><c>builder.AddX(…)</c> or <c>builder.Services.AddSingleton(…)</c> where builder is the local.</summary>
        private static bool IsCalledOn(IInvocationOperation call, ILocalSymbol local)
        {
            var receiver = ReceiverOf(call);
            while (receiver is IConversionOperation or IPropertyReferenceOperation { Instance: not null })
            {
                receiver = receiver is IConversionOperation conversion ? conversion.Operand : ((IPropertyReferenceOperation)receiver).Instance;
            }

            return receiver is ILocalReferenceOperation reference && SymbolEqualityComparer.Default.Equals(reference.Local, local);
        }

        /// <summary>A field or property: every value its type gives it (initializer, expression body, constructor and fixture assignments).</summary>
        private string? Member(ISymbol member, int depth)
        {
            if (!visited.Add(member) || member.ContainingType == null)
            {
                return null;
            }

            foreach (var value in MemberValues.Of(member))
            {
                var found = model != null && value.SyntaxTree == model.SyntaxTree && model.GetOperation(value) is { } operation
                    ? Resolve(operation, depth + 1)
                    : BySyntax(value);
                if (found != null)
                {
                    return found;
                }
            }

            return null;
        }

        /// <summary>A helper of the project that returns the client: what it returns.</summary>
        private string? Helper(IMethodSymbol method, int depth)
        {
            if (!visited.Add(method) || method.DeclaringSyntaxReferences.Length == 0)
            {
                return null;
            }

            var syntax = method.DeclaringSyntaxReferences[0].GetSyntax();
            if (model != null && syntax.SyntaxTree == model.SyntaxTree && model.GetOperation(syntax) is { } body)
            {
                foreach (var returned in body.DescendantsAndSelf().OfType<IReturnOperation>())
                {
                    if (Resolve(returned.ReturnedValue, depth + 1) is { } found)
                    {
                        return found;
                    }
                }

                return null;
            }

            return BySyntax(syntax);
        }

        /// <summary>
        /// Code in another file, read without a semantic model: a mocking call, or <c>new X(…)</c> of a class of the project
        /// that is a double by <see cref="OfType"/>.
        /// </summary>
        private string? BySyntax(SyntaxNode syntax)
        {
            var compilation = model?.Compilation;
            foreach (var node in syntax.DescendantNodesAndSelf())
            {
                switch (node)
                {
                    case ObjectCreationExpressionSyntax creation:
                        var name = creation.Type switch
                        {
                            GenericNameSyntax generic => generic.Identifier.ValueText,
                            QualifiedNameSyntax qualified => qualified.Right.Identifier.ValueText,
                            IdentifierNameSyntax identifier => identifier.Identifier.ValueText,
                            _ => null,
                        };
                        if (name == TestingSurfaces.MockType)
                        {
                            return $"a mocking library's double ({TestingSurfaces.MockType})";
                        }

                        if (name != null && compilation != null)
                        {
                            foreach (var type in compilation.GetSymbolsWithName(name, SymbolFilter.Type).OfType<INamedTypeSymbol>())
                            {
                                if (standIns.OfType(type) is { } found)
                                {
                                    return found;
                                }
                            }
                        }

                        break;
                    case InvocationExpressionSyntax { Expression: MemberAccessExpressionSyntax { Expression: IdentifierNameSyntax owner } access }
                        when TestingSurfaces.MockFactories.Contains((owner.Identifier.ValueText, access.Name.Identifier.ValueText)):
                        return $"a mocking library's double ({owner.Identifier.ValueText}.{access.Name.Identifier.ValueText})";
                }
            }

            return null;
        }
    }
}
