using System;
using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Reads one call as a binding of a class to a configuration section (the shapes ConfigurationSurface names), from syntax
    /// alone; holds the compilation only to look string constants up by name.
    /// </summary>
    internal sealed class BindingCallReader
    {
        private const int MaxLocalHops = 3;
        private readonly Compilation compilation;

        public BindingCallReader(Compilation compilation)
        {
            this.compilation = compilation;
        }

        /// <summary>The member body (or top-level program) a node is in: where its locals are declared and used.</summary>
        public static SyntaxNode BodyOf(SyntaxNode node) =>
            node.Ancestors().FirstOrDefault(a => a is BaseMethodDeclarationSyntax or BasePropertyDeclarationSyntax or LocalFunctionStatementSyntax or CompilationUnitSyntax)
            ?? node.SyntaxTree.GetRoot();

        public (string Class, string Section)? Binding(InvocationExpressionSyntax call)
        {
            var (name, generic, receiver) = Parts(call.Expression);
            var arguments = call.ArgumentList.Arguments;
            switch (name)
            {
                // services.Configure<T>(configuration.GetSection("S")), also with an options name first.
                // With an options name first (Configure<T>("night", section)) only that named instance is bound; code may read
                // it by name or read the default instance, which syntax cannot tell apart: the class counts as ambiguous.
                case ConfigurationSurface.ConfigureMethod when TypeArgument(generic) is { } configured:
                    return arguments.Count >= 2 && SectionPath(arguments[0].Expression) == null ? (configured, ConfigurationBindings.NamedInstance)
                        : arguments.Select(a => SectionPath(a.Expression)).FirstOrDefault(s => s != null) is { } configuredSection
                        ? (configured, configuredSection) : null;

                // section.Get<T>()
                case ConfigurationSurface.GetMethod when TypeArgument(generic) is { } got && receiver != null && SectionPath(receiver) is { } gotSection:
                    return (got, gotSection);

                // AddOptions<T>().BindConfiguration("S")
                case ConfigurationSurface.BindConfigurationMethod when OptionsBuilderType(receiver) is { } builderType
                    && arguments.Count >= 1 && ConstantKey(arguments[0].Expression) is { } key:
                    return (builderType, key);

                case ConfigurationSurface.BindMethod when arguments.Count >= 1:
                    // AddOptions<T>().Bind(configuration.GetSection("S"))
                    if (OptionsBuilderType(receiver) is { } boundType)
                    {
                        return SectionPath(arguments[0].Expression) is { } boundSection ? (boundType, boundSection) : null;
                    }

                    // configuration.GetSection("S").Bind(instance)
                    if (arguments.Count == 1 && receiver != null && SectionPath(receiver) is { } instanceSection)
                    {
                        return InstanceType(arguments[0].Expression) is { } instanceType ? (instanceType, instanceSection) : null;
                    }

                    // configuration.Bind("S", instance), under the receiver's section if it is one
                    if (arguments.Count == 2 && ConstantKey(arguments[0].Expression) is { } relative && InstanceType(arguments[1].Expression) is { } keyedType)
                    {
                        return (keyedType, Combine(receiver == null ? null : SectionPath(receiver), relative));
                    }

                    return null;
                default:
                    return null;
            }
        }

        /// <summary>
        /// Members a lambda for the class writes on its instance: <c>Xxx&lt;T&gt;(o =&gt; o.Sampling.Temperature = 1)</c> or
        /// <c>AddOptions&lt;T&gt;().Yyy(o =&gt; …)</c> adds "Sampling.Temperature". Any such call counts, whatever its name.
        /// </summary>
        public static void AddWrittenMembers(InvocationExpressionSyntax call, string className, HashSet<string> written)
        {
            string? type = null;
            foreach (var argument in call.ArgumentList.Arguments)
            {
                var parameter = argument.Expression switch
                {
                    SimpleLambdaExpressionSyntax simple => simple.Parameter.Identifier.ValueText,
                    ParenthesizedLambdaExpressionSyntax { ParameterList.Parameters.Count: 1 } lambda => lambda.ParameterList.Parameters[0].Identifier.ValueText,
                    _ => null,
                };
                if (parameter == null)
                {
                    continue;
                }

                if (type == null)
                {
                    var (_, generic, receiver) = Parts(call.Expression);
                    type = TypeArgument(generic) ?? OptionsBuilderType(receiver);
                    if (type != className)
                    {
                        return;
                    }
                }

                foreach (var assignment in argument.Expression.DescendantNodes().OfType<AssignmentExpressionSyntax>())
                {
                    if (WrittenPath(assignment.Left, parameter) is { } path)
                    {
                        written.Add(path);
                    }
                }
            }
        }

        /// <summary>"Sampling.Temperature" for <c>o.Sampling.Temperature</c> when <c>o</c> is the lambda's parameter.</summary>
        private static string? WrittenPath(ExpressionSyntax target, string parameter)
        {
            var names = new List<string>();
            while (target is MemberAccessExpressionSyntax access)
            {
                names.Insert(0, access.Name.Identifier.ValueText);
                target = access.Expression;
            }

            return names.Count > 0 && target is IdentifierNameSyntax { Identifier.ValueText: var root } && root == parameter ? string.Join(".", names) : null;
        }

        /// <summary>The key of a section expression: chained GetSection calls nest ("A:B"); a local is followed to its initializer.</summary>
        private string? SectionPath(ExpressionSyntax? section, int hops = 0)
        {
            var expression = Strip(section);
            if (expression is IdentifierNameSyntax local && hops < MaxLocalHops && LocalInitializer(local) is { } initializer)
            {
                return SectionPath(initializer, hops + 1);
            }

            if (expression is InvocationExpressionSyntax { Expression: MemberAccessExpressionSyntax access, ArgumentList.Arguments: { Count: 1 } arguments }
                && Array.IndexOf(ConfigurationSurface.SectionMethods, access.Name.Identifier.ValueText) >= 0
                && ConstantKey(arguments[0].Expression) is { } key)
            {
                return Combine(SectionPath(access.Expression, hops), key);
            }

            return null;
        }

        /// <summary>A constant key: a literal, <c>nameof(X)</c>, or a string constant of the project named as written (<c>HarbourLlmOptions.Section</c>).</summary>
        private string? ConstantKey(ExpressionSyntax expression)
        {
            switch (Strip(expression))
            {
                case LiteralExpressionSyntax { Token.Value: string text }:
                    return text;
                case InvocationExpressionSyntax { Expression: IdentifierNameSyntax { Identifier.ValueText: "nameof" }, ArgumentList.Arguments: { Count: 1 } named }:
                    return named[0].Expression is SimpleNameSyntax simple ? simple.Identifier.ValueText
                        : named[0].Expression is MemberAccessExpressionSyntax member ? member.Name.Identifier.ValueText : null;
                case MemberAccessExpressionSyntax { Name: SimpleNameSyntax constant } access:
                    return Constant(constant.Identifier.ValueText, LastName(access.Expression));
                case IdentifierNameSyntax bare:
                    return Constant(bare.Identifier.ValueText, null);
                default:
                    return null;
            }
        }

        private string? Constant(string name, string? owner)
        {
            if (name.Length == 0)
            {
                return null; // a name still being typed; the compiler's lookup takes none
            }

            string? value = null;
            foreach (var symbol in compilation.GetSymbolsWithName(name, SymbolFilter.Member))
            {
                if (symbol is IFieldSymbol { IsConst: true, ConstantValue: string text } field && (owner == null || field.ContainingType?.Name == owner))
                {
                    if (value != null && value != text)
                    {
                        return null; // two constants of that name: not known which
                    }

                    value = text;
                }
            }

            return value;
        }

        /// <summary>T of <c>AddOptions&lt;T&gt;()</c> somewhere down a call chain (<c>.AddOptions&lt;T&gt;().ValidateOnStart().Bind(…)</c>).</summary>
        private static string? OptionsBuilderType(ExpressionSyntax? receiver)
        {
            while (Strip(receiver) is InvocationExpressionSyntax call)
            {
                var (name, generic, inner) = Parts(call.Expression);
                if (name == ConfigurationSurface.AddOptionsMethod)
                {
                    return TypeArgument(generic);
                }

                receiver = inner;
            }

            return null;
        }

        /// <summary>
        /// The class of an instance handed to <c>Bind</c>: a creation, or a local, parameter, field or property whose declared
        /// type (or initializer) is visible, or the parameter of <c>Configure&lt;T&gt;(o =&gt; …)</c>.
        /// </summary>
        private static string? InstanceType(ExpressionSyntax instance)
        {
            var expression = Strip(instance);
            if (expression is ObjectCreationExpressionSyntax creation)
            {
                return TypeName(creation.Type);
            }

            var name = expression switch
            {
                IdentifierNameSyntax identifier => identifier.Identifier.ValueText,
                MemberAccessExpressionSyntax { Expression: ThisExpressionSyntax } access => access.Name.Identifier.ValueText,
                _ => null,
            };
            if (name == null || expression == null)
            {
                return null;
            }

            foreach (var ancestor in expression.Ancestors())
            {
                switch (ancestor)
                {
                    case SimpleLambdaExpressionSyntax simple when simple.Parameter.Identifier.ValueText == name:
                        return simple.Parameter.Type is { } simpleType ? TypeName(simpleType) : LambdaTarget(simple);
                    case ParenthesizedLambdaExpressionSyntax lambda when lambda.ParameterList.Parameters.FirstOrDefault(p => p.Identifier.ValueText == name) is { } parameter:
                        return parameter.Type is { } parameterType ? TypeName(parameterType) : LambdaTarget(lambda);
                    case BaseMethodDeclarationSyntax method when method.ParameterList.Parameters.FirstOrDefault(p => p.Identifier.ValueText == name) is { Type: { } declared }:
                        return TypeName(declared);
                    case TypeDeclarationSyntax type:
                        return MemberType(type, name);
                }

                if (ancestor is BaseMethodDeclarationSyntax or BasePropertyDeclarationSyntax or LocalFunctionStatementSyntax or CompilationUnitSyntax
                    && LocalDeclarator(ancestor, name, expression.SpanStart) is { } local)
                {
                    return local.Parent is VariableDeclarationSyntax { Type: { IsVar: false } localType } ? TypeName(localType)
                        : local.Initializer?.Value is ObjectCreationExpressionSyntax localCreation ? TypeName(localCreation.Type) : null;
                }
            }

            return null;
        }

        /// <summary>The T of the call a lambda is an argument of: <c>Configure&lt;T&gt;(o =&gt; …)</c> or <c>AddOptions&lt;T&gt;().Configure(o =&gt; …)</c>.</summary>
        private static string? LambdaTarget(LambdaExpressionSyntax lambda)
        {
            if (lambda.Parent is not ArgumentSyntax { Parent: ArgumentListSyntax { Parent: InvocationExpressionSyntax call } })
            {
                return null;
            }

            var (_, generic, receiver) = Parts(call.Expression);
            return TypeArgument(generic) ?? OptionsBuilderType(receiver);
        }

        private static string? MemberType(TypeDeclarationSyntax type, string name)
        {
            foreach (var member in type.Members)
            {
                switch (member)
                {
                    case FieldDeclarationSyntax field when field.Declaration.Variables.Any(v => v.Identifier.ValueText == name):
                        return TypeName(field.Declaration.Type);
                    case PropertyDeclarationSyntax property when property.Identifier.ValueText == name:
                        return TypeName(property.Type);
                }
            }

            return null;
        }

        /// <summary>What a local of the enclosing body is declared with, when the local is declared before its use.</summary>
        private static ExpressionSyntax? LocalInitializer(IdentifierNameSyntax local) =>
            LocalDeclarator(BodyOf(local), local.Identifier.ValueText, local.SpanStart)?.Initializer?.Value;

        private static VariableDeclaratorSyntax? LocalDeclarator(SyntaxNode body, string name, int before) =>
            body.DescendantNodes().OfType<VariableDeclaratorSyntax>()
                .FirstOrDefault(v => v.Identifier.ValueText == name && v.SpanStart < before && v.Parent is VariableDeclarationSyntax { Parent: LocalDeclarationStatementSyntax });

        private static (string? Name, GenericNameSyntax? Generic, ExpressionSyntax? Receiver) Parts(ExpressionSyntax invoked) => invoked switch
        {
            MemberAccessExpressionSyntax access => (access.Name.Identifier.ValueText, access.Name as GenericNameSyntax, access.Expression),
            GenericNameSyntax generic => (generic.Identifier.ValueText, generic, null),
            IdentifierNameSyntax identifier => (identifier.Identifier.ValueText, null, null),
            _ => (null, null, null),
        };

        private static string? TypeArgument(GenericNameSyntax? generic) =>
            generic is { TypeArgumentList.Arguments: { Count: 1 } arguments } ? TypeName(arguments[0]) : null;

        /// <summary>The simple name of a written type (<c>Harbour.HarbourLlmOptions</c>, <c>HarbourLlmOptions?</c> → HarbourLlmOptions).</summary>
        private static string? TypeName(TypeSyntax type) => type switch
        {
            NullableTypeSyntax nullable => TypeName(nullable.ElementType),
            QualifiedNameSyntax qualified => qualified.Right.Identifier.ValueText,
            AliasQualifiedNameSyntax alias => alias.Name.Identifier.ValueText,
            SimpleNameSyntax simple when !simple.IsVar => simple.Identifier.ValueText,
            _ => null,
        };

        private static string? LastName(ExpressionSyntax expression) => expression switch
        {
            SimpleNameSyntax simple => simple.Identifier.ValueText,
            MemberAccessExpressionSyntax access => access.Name.Identifier.ValueText,
            _ => null,
        };

        private static ExpressionSyntax? Strip(ExpressionSyntax? expression)
        {
            while (true)
            {
                switch (expression)
                {
                    case ParenthesizedExpressionSyntax parenthesized:
                        expression = parenthesized.Expression;
                        continue;
                    case PostfixUnaryExpressionSyntax suppressed when suppressed.IsKind(SyntaxKind.SuppressNullableWarningExpression):
                        expression = suppressed.Operand;
                        continue;
                    default:
                        return expression;
                }
            }
        }

        private static string Combine(string? parent, string key) =>
            string.IsNullOrEmpty(parent) ? key : parent + ConfigurationSurface.KeySeparator + key;
    }
}
