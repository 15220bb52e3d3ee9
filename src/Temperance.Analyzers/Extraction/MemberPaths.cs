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
    /// Values read through properties of the project's own classes (<c>_options.Temperature</c>, <c>options.Value.Model</c>):
    /// the code cannot say what they hold, but configuration bound to those classes can (<see cref="ProjectConfiguration"/>).
    /// An instance the code builds itself (<c>var o = new T { Temperature = 0.1f }</c>) holds what the code wrote, not configuration.
    /// </summary>
    internal static class MemberPaths
    {
        /// <summary>The property path of a value operation, or null when it is not one (or the instance is built right here).</summary>
        public static MemberPath? Of(IOperation? value)
        {
            List<IPropertySymbol>? properties = null;
            var current = ValueReader.Unwrap(value);
            while (current is IPropertyReferenceOperation { Property: { IsStatic: false, IsIndexer: false } property } reference && IsProjectClass(property.ContainingType))
            {
                (properties ??= new List<IPropertySymbol>()).Add(property);
                current = ValueReader.Unwrap(reference.Instance);
            }

            if (properties == null || BuiltInCode(current, properties[properties.Count - 1].Name))
            {
                return null;
            }

            properties.Reverse();
            return new MemberPath(properties);
        }

        /// <summary>
        /// The same, from syntax, for a client created in another member (a constructor's <c>new ChatClient(_options.Model, key)</c>):
        /// the first name is a field, property or constructor parameter of <paramref name="scope"/>, each next one a member of
        /// the previous one's type. No semantic model is needed: member lookups on symbols only.
        /// </summary>
        public static MemberPath? OfSyntax(ExpressionSyntax expression, INamedTypeSymbol scope)
        {
            var names = new List<string>();
            while (true)
            {
                switch (expression)
                {
                    case MemberAccessExpressionSyntax access:
                        names.Add(access.Name.Identifier.ValueText);
                        expression = access.Expression;
                        continue;
                    case ParenthesizedExpressionSyntax parenthesized:
                        expression = parenthesized.Expression;
                        continue;
                    case PostfixUnaryExpressionSyntax suppressed: // options.Value!.Model
                        expression = suppressed.Operand;
                        continue;
                }

                break;
            }

            ITypeSymbol? type = expression switch
            {
                ThisExpressionSyntax => scope,
                IdentifierNameSyntax identifier => TypeOf(Member(scope, identifier.Identifier.ValueText))
                    ?? scope.InstanceConstructors.SelectMany(c => c.Parameters).FirstOrDefault(p => p.Name == identifier.Identifier.ValueText)?.Type,
                _ => null,
            };
            if (type == null || names.Count == 0)
            {
                return null;
            }

            names.Reverse();
            var tail = new List<IPropertySymbol>();
            foreach (var name in names)
            {
                var member = type == null ? null : Member(type, name);
                if (member is IPropertySymbol { IsStatic: false } property && IsProjectClass(property.ContainingType))
                {
                    tail.Add(property);
                }
                else
                {
                    tail.Clear();
                }

                type = TypeOf(member);
            }

            // A member that is not a project property empties the tail, so a path is left only when the last name is one.
            return tail.Count > 0 ? new MemberPath(tail) : null;
        }

        private static bool IsProjectClass(INamedTypeSymbol? type) =>
            type is { TypeKind: TypeKind.Class or TypeKind.Struct } && type.DeclaringSyntaxReferences.Length > 0;

        private static ISymbol? Member(ITypeSymbol type, string name)
        {
            for (var current = type; current != null; current = current.BaseType)
            {
                foreach (var member in current.GetMembers(name))
                {
                    if (member is IPropertySymbol or IFieldSymbol)
                    {
                        return member;
                    }
                }
            }

            foreach (var implemented in type.AllInterfaces)
            {
                foreach (var member in implemented.GetMembers(name))
                {
                    if (member is IPropertySymbol)
                    {
                        return member;
                    }
                }
            }

            return null;
        }

        private static ITypeSymbol? TypeOf(ISymbol? member) => member switch
        {
            IPropertySymbol property => property.Type,
            IFieldSymbol field => field.Type,
            _ => null,
        };

        /// <summary>
        /// An instance this code builds: a creation, or a local declared with one. A local created empty and then bound
        /// (<c>section.Bind(local)</c>) in the same member does hold configuration; one whose initializer writes the member does not.
        /// </summary>
        private static bool BuiltInCode(IOperation? instance, string member)
        {
            switch (instance)
            {
                case IObjectCreationOperation:
                    return true;
                case ILocalReferenceOperation { Local: var local } when local.DeclaringSyntaxReferences.Length == 1
                    && local.DeclaringSyntaxReferences[0].GetSyntax() is VariableDeclaratorSyntax { Initializer.Value: BaseObjectCreationExpressionSyntax creation } declarator:
                    var writesMember = creation.Initializer?.Expressions.OfType<AssignmentExpressionSyntax>()
                        .Any(a => a.Left is IdentifierNameSyntax { Identifier.ValueText: var name } && name == member) == true;
                    return writesMember || !BoundInItsMember(declarator, local.Name) || WrittenInItsMember(declarator, local.Name, member);
                // A field or property holding an instance it creates (= new DeskOptions()) holds code's values, not a section's.
                case IFieldReferenceOperation { Field: var field } when Initializer(field.DeclaringSyntaxReferences) is BaseObjectCreationExpressionSyntax:
                    return true;
                case IPropertyReferenceOperation { Property: var property } when property.DeclaringSyntaxReferences.Length == 1
                    && property.DeclaringSyntaxReferences[0].GetSyntax() is PropertyDeclarationSyntax { Initializer.Value: BaseObjectCreationExpressionSyntax }:
                    return true;
                default:
                    return false;
            }
        }

        private static ExpressionSyntax? Initializer(System.Collections.Immutable.ImmutableArray<SyntaxReference> references) =>
            references.Length == 1 && references[0].GetSyntax() is VariableDeclaratorSyntax { Initializer.Value: var value } ? value : null;

        /// <summary>The member is assigned on the local in its body (<c>bakery.Temperature = 0.2f</c> after the Bind): code decides it.</summary>
        private static bool WrittenInItsMember(SyntaxNode declarator, string local, string member) =>
            BindingCallReader.BodyOf(declarator).DescendantNodes().OfType<AssignmentExpressionSyntax>().Any(a =>
                a.Left is MemberAccessExpressionSyntax { Expression: IdentifierNameSyntax { Identifier.ValueText: var name }, Name.Identifier.ValueText: var assigned }
                && name == local && assigned == member);

        private static bool BoundInItsMember(SyntaxNode declarator, string local)
        {
            foreach (var call in BindingCallReader.BodyOf(declarator).DescendantNodes().OfType<InvocationExpressionSyntax>())
            {
                if (call.Expression is MemberAccessExpressionSyntax { Name.Identifier.ValueText: ConfigurationSurface.BindMethod }
                    && call.ArgumentList.Arguments.Any(a => a.Expression is IdentifierNameSyntax { Identifier.ValueText: var name } && name == local))
                {
                    return true;
                }
            }

            return false;
        }
    }
}
