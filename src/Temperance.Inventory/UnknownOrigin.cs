using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Temperance.Model;

namespace Temperance.Inventory;

/// <summary>
/// Says where a value the analyzer cannot know comes from, so a reader knows where to look: "from parameter 'heat'",
/// "from configuration key 'Llm:Temperature'", "from '_options.Temperature'". Report wording only: nothing here is judged.
/// </summary>
internal static class UnknownOrigin
{
    private const int Longest = 60;

    public static string Describe(Request request, Setting setting, Func<SyntaxTree, SemanticModel> models)
    {
        var last = request.LastWrite(setting);
        if (last == null)
        {
            return request.UndeclaredSettings.Contains(setting) ? "a settings type the rules table does not describe"
                : request.BorrowedFrom != null ? $"options made by '{request.BorrowedFrom}'"
                : "options made elsewhere";
        }

        // A conditional: the branch that is not a number is the one to name.
        var write = last;
        if (last.FromConditional)
        {
            write = request.Writes.FirstOrDefault(w => w.Setting == setting && w.FromConditional && w.Location == last.Location && w.Kind != ValueKind.Known) ?? last;
        }

        var syntax = write.ValueSyntax as ExpressionSyntax ?? ValueAt(write.Location);
        if (syntax == null)
        {
            return request.UndeclaredSettings.Contains(setting) ? $"'{write.Member}', a member the rules table does not describe" : $"'{write.Member}'";
        }

        return "from " + Of(syntax, models(syntax.SyntaxTree));
    }

    /// <summary>The value side of the assignment or argument at a write's location (the left side of a coalesce).</summary>
    private static ExpressionSyntax? ValueAt(Location location)
    {
        if (location.SourceTree is not { } tree)
        {
            return null;
        }

        var node = tree.GetRoot().FindNode(location.SourceSpan, getInnermostNodeForTie: false);
        ExpressionSyntax? value = node switch
        {
            AssignmentExpressionSyntax assignment => assignment.Right,
            ArgumentSyntax argument => argument.Expression,
            ExpressionSyntax expression => expression,
            _ => null,
        };
        return Strip(value) is BinaryExpressionSyntax { RawKind: (int)SyntaxKind.CoalesceExpression } coalesce ? coalesce.Left : value;
    }

    private static ExpressionSyntax? Strip(ExpressionSyntax? expression)
    {
        while (true)
        {
            switch (expression)
            {
                case ParenthesizedExpressionSyntax parenthesized:
                    expression = parenthesized.Expression;
                    continue;
                case CastExpressionSyntax cast:
                    expression = cast.Expression;
                    continue;
                case CheckedExpressionSyntax @checked:
                    expression = @checked.Expression;
                    continue;
                case PostfixUnaryExpressionSyntax { RawKind: (int)SyntaxKind.SuppressNullableWarningExpression } suppressed:
                    expression = suppressed.Operand;
                    continue;
                case BinaryExpressionSyntax { RawKind: (int)SyntaxKind.AsExpression } @as:
                    expression = @as.Left;
                    continue;
                default:
                    return expression;
            }
        }
    }

    internal static string Of(ExpressionSyntax expression, SemanticModel model)
    {
        var value = Strip(expression) ?? expression;
        switch (value)
        {
            case InvocationExpressionSyntax invocation:
            {
                var name = MethodName(invocation);
                var arguments = invocation.ArgumentList.Arguments;
                if (name is "Parse" or "ToSingle" or "ToDouble" or "ToDecimal" or "ChangeType" && arguments.Count > 0)
                {
                    return Of(arguments[0].Expression, model);
                }

                if (name is "GetValue" or "GetSection" or "GetRequiredSection" && arguments.Count > 0 && Text(arguments[0].Expression, model) is { } key
                    && IsConfiguration(ReceiverType(invocation, model)))
                {
                    return $"configuration key '{key}'";
                }

                if (name == "GetEnvironmentVariable" && arguments.Count > 0 && Text(arguments[0].Expression, model) is { } variable)
                {
                    return $"environment variable '{variable}'";
                }

                break;
            }

            case ElementAccessExpressionSyntax { ArgumentList.Arguments.Count: 1 } element
                when Text(element.ArgumentList.Arguments[0].Expression, model) is { } key && IsConfiguration(model.GetTypeInfo(element.Expression).Type):
                return $"configuration key '{key}'";

            case MemberAccessExpressionSyntax { Name.Identifier.ValueText: "Value", Expression: InvocationExpressionSyntax section }
                when MethodName(section) is "GetSection" or "GetRequiredSection" && section.ArgumentList.Arguments.Count > 0
                    && Text(section.ArgumentList.Arguments[0].Expression, model) is { } key:
                return $"configuration key '{key}'";

            case IdentifierNameSyntax identifier:
                switch (model.GetSymbolInfo(identifier).Symbol)
                {
                    case IParameterSymbol parameter:
                        return $"parameter '{parameter.Name}'";
                    case ILocalSymbol local:
                        return $"local variable '{local.Name}'";
                    case IFieldSymbol field:
                        return $"field '{field.Name}'";
                    case IPropertySymbol property:
                        return $"property '{property.Name}'";
                }

                break;
        }

        return $"'{Short(value.ToString())}'";
    }

    private static string? MethodName(InvocationExpressionSyntax invocation) => invocation.Expression switch
    {
        MemberAccessExpressionSyntax member => member.Name.Identifier.ValueText,
        SimpleNameSyntax simple => simple.Identifier.ValueText,
        MemberBindingExpressionSyntax binding => binding.Name.Identifier.ValueText,
        _ => null,
    };

    private static ITypeSymbol? ReceiverType(InvocationExpressionSyntax invocation, SemanticModel model)
    {
        if (invocation.Expression is MemberAccessExpressionSyntax member)
        {
            return model.GetTypeInfo(member.Expression).Type;
        }

        // An extension method called without a receiver, or a method of the type itself: the method's first parameter.
        return (model.GetSymbolInfo(invocation).Symbol as IMethodSymbol)?.Parameters.FirstOrDefault()?.Type;
    }

    /// <summary>IConfiguration, IConfigurationSection, IConfigurationRoot, ConfigurationManager and their kin.</summary>
    private static bool IsConfiguration(ITypeSymbol? type)
    {
        if (type == null)
        {
            return false;
        }

        bool Named(ITypeSymbol t) => t.Name.Contains("Configuration", StringComparison.Ordinal);
        return Named(type) || type.AllInterfaces.Any(Named);
    }

    private static string? Text(ExpressionSyntax expression, SemanticModel model) =>
        model.GetConstantValue(expression) is { HasValue: true, Value: string text } ? text : null;

    private static string Short(string text)
    {
        var flat = string.Join(' ', text.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries));
        return flat.Length <= Longest ? flat : flat[..(Longest - 1)] + "…";
    }
}
