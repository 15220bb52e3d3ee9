using System;
using System.Collections.Generic;
using System.Globalization;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;

namespace Temperance.Extraction
{
    /// <summary>
    /// Turns the value expression of a setting into Known / Unknown writes. This is the only place that decides
    /// what counts as a compile-time value; everything not provably constant is Unknown and never judged.
    /// </summary>
    internal static class ValueReader
    {
        /// <summary>One write per possible value: a conditional gives one per branch.</summary>
        public static IEnumerable<SettingWrite> Read(Setting setting, string member, IOperation value, ITypeSymbol? targetType, Location location, bool fromKey = false)
        {
            var kind = NumericKindOf(targetType, value, setting);
            var branches = new List<(IOperation? op, bool conditional)>();
            CollectBranches(value, false, branches);
            foreach (var (op, conditional) in branches)
            {
                if (op == null)
                {
                    yield return new SettingWrite(setting, ValueKind.Unknown, 0, member, location, null, kind, conditional, null, fromKey);
                    continue;
                }

                if (TryGetNumber(op, out var number, out var origin))
                {
                    yield return new SettingWrite(setting, ValueKind.Known, number, member, location, op.Syntax, kind, conditional, origin, fromKey);
                }
                else
                {
                    // A property of the project's own classes (options bound from configuration) may still become Known: ConfiguredVariants.
                    yield return new SettingWrite(setting, ValueKind.Unknown, 0, member, location, op.Syntax, kind, conditional, null, fromKey, readFrom: MemberPaths.Of(op));
                }
            }
        }

        /// <summary>A constant string (model ids, dictionary keys), looking through conversions.</summary>
        public static string? ConstantString(IOperation? operation)
        {
            operation = Unwrap(operation);
            if (operation?.ConstantValue is { HasValue: true, Value: string text })
            {
                return text;
            }

            // A model id wrapped by an implicit conversion from string (an SDK's string enum).
            if (operation is IConversionOperation { Operand: var operand } && operand.ConstantValue is { HasValue: true, Value: string inner })
            {
                return inner;
            }

            return null;
        }

        /// <summary>
        /// A constant name, lower case: a constant string (<c>"low"</c>), or a static member or enum value of a mode type
        /// (<c>ChatReasoningEffortLevel.None</c> → "none"); null for anything computed.
        /// </summary>
        public static string? ConstantName(IOperation? operation)
        {
            if (ConstantString(operation) is { } text)
            {
                return text.Trim().ToLowerInvariant();
            }

            for (var current = operation; current != null; current = (current as IConversionOperation)?.Operand ?? (current as IParenthesizedOperation)?.Operand)
            {
                switch (current)
                {
                    // ChatReasoningEffortLevel.Low: a static member of its own type (an extensible enum), or an enum value. Any
                    // other static (Settings.Effort, a static readonly read from the environment) is not a constant name.
                    case IPropertyReferenceOperation { Property: { IsStatic: true } property } when SymbolEqualityComparer.Default.Equals(property.Type, property.ContainingType):
                        return property.Name.ToLowerInvariant();
                    case IFieldReferenceOperation { Field: { IsStatic: true } field }
                        when field.ContainingType?.TypeKind == TypeKind.Enum || SymbolEqualityComparer.Default.Equals(field.Type, field.ContainingType):
                        return field.Name.ToLowerInvariant();
                }
            }

            return null;
        }

        public static IOperation? Unwrap(IOperation? operation)
        {
            while (true)
            {
                switch (operation)
                {
                    case IConversionOperation conversion when conversion.Operand.ConstantValue.HasValue || TypeFacts.IsNumber(conversion.Type) || conversion.IsImplicit:
                        operation = conversion.Operand;
                        continue;
                    case IParenthesizedOperation parenthesized:
                        operation = parenthesized.Operand;
                        continue;
                    default:
                        return operation;
                }
            }
        }

        private static void CollectBranches(IOperation operation, bool conditional, List<(IOperation?, bool)> branches)
        {
            var unwrapped = Unwrap(operation) ?? operation;
            switch (unwrapped)
            {
                case IConditionalOperation { WhenFalse: { } whenFalse } ternary when !ternary.ConstantValue.HasValue:
                    CollectBranches(ternary.WhenTrue, true, branches);
                    CollectBranches(whenFalse, true, branches);
                    return;
                case ICoalesceOperation coalesce:
                    // The left side is not constant (else there would be nothing to coalesce); the fallback is a real branch.
                    branches.Add((null, true));
                    CollectBranches(coalesce.WhenNull, true, branches);
                    return;
                default:
                    branches.Add((operation, conditional));
                    return;
            }
        }

        private static bool TryGetNumber(IOperation operation, out double number, out string? origin)
        {
            origin = null;
            number = 0;
            // The outermost constant wins (an explicit (int)2.7 is 2); a nullable conversion carries none, so look inside it.
            for (var current = operation; current != null; current = (current as IConversionOperation)?.Operand ?? (current as IParenthesizedOperation)?.Operand)
            {
                if (!current.ConstantValue.HasValue)
                {
                    continue;
                }

                if (!TryConvert(current.ConstantValue.Value, out number))
                {
                    return false;
                }

                var inner = Unwrap(current);
                if (inner is IFieldReferenceOperation { Field: { IsConst: true } constant })
                {
                    origin = $"constant '{constant.Name}'";
                }
                else if (inner is ILocalReferenceOperation { Local: { IsConst: true } local })
                {
                    origin = $"constant '{local.Name}'";
                }

                return true;
            }

            var unwrapped = Unwrap(operation);
            switch (unwrapped)
            {
                case IFieldReferenceOperation { Field: { IsReadOnly: true, IsStatic: true } field } when TryReadStaticReadonly(field, out number):
                    origin = $"static readonly '{field.Name}'";
                    return true;
                // BinaryData.FromObjectAsJson(40), JsonValue.Create(0.2): the payload value is the argument.
                case IInvocationOperation { Arguments.Length: >= 1, TargetMethod.IsStatic: true } call when IsValueWrapper(call.TargetMethod):
                    return TryGetNumber(call.Arguments[0].Value, out number, out origin);
                default:
                    return false;
            }
        }

        private static bool IsValueWrapper(IMethodSymbol method)
        {
            foreach (var (type, name) in Surfaces.RawJsonSurface.ValueWrappers)
            {
                if (method.Name == name && method.ContainingType?.Name == type)
                {
                    return true;
                }
            }

            return false;
        }

        /// <summary>
        /// A static readonly field whose declaration initializes it with a numeric literal. Read from syntax, so no
        /// semantic model is needed; anything but a plain (possibly negated or cast) literal is Unknown.
        /// </summary>
        private static bool TryReadStaticReadonly(IFieldSymbol field, out double number)
        {
            number = 0;
            if (field.DeclaringSyntaxReferences.Length != 1)
            {
                return false;
            }

            if (field.DeclaringSyntaxReferences[0].GetSyntax() is not VariableDeclaratorSyntax { Initializer.Value: { } initializer })
            {
                return false;
            }

            return TryReadLiteral(initializer, out number);
        }

        /// <summary>A numeric literal, possibly negated, cast or parenthesised (<c>0.2f</c>, <c>-(1)</c>); anything else is not read.</summary>
        public static bool TryReadLiteral(ExpressionSyntax expression, out double number)
        {
            number = 0;
            switch (expression)
            {
                case LiteralExpressionSyntax literal when literal.IsKind(SyntaxKind.NumericLiteralExpression):
                    return TryConvert(literal.Token.Value, out number);
                case PrefixUnaryExpressionSyntax { OperatorToken.RawKind: (int)SyntaxKind.MinusToken } negated when TryReadLiteral(negated.Operand, out var positive):
                    number = -positive;
                    return true;
                case CastExpressionSyntax cast:
                    return TryReadLiteral(cast.Expression, out number);
                case ParenthesizedExpressionSyntax parenthesized:
                    return TryReadLiteral(parenthesized.Expression, out number);
                default:
                    return false;
            }
        }

        private static bool TryConvert(object? value, out double number)
        {
            switch (value)
            {
                case double d: number = d; return true;
                // Through the shortest round-trip text, so 0.7f reads as 0.7 rather than 0.699999988.
                case float f when !float.IsNaN(f) && !float.IsInfinity(f):
                    number = double.Parse(f.ToString("R", CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
                    return true;
                case decimal m: number = (double)m; return true;
                case int i: number = i; return true;
                case long l: number = l; return true;
                case uint u: number = u; return true;
                case ulong ul: number = ul; return true;
                case short s: number = s; return true;
                case byte b: number = b; return true;
                // ONNX do_sample: false is greedy search.
                case bool flag: number = flag ? 1 : 0; return true;
                default: number = 0; return false;
            }
        }

        /// <summary>The literal type a fix must write: the member's type, or the value's own type for object-typed bags.</summary>
        private static NumericKind NumericKindOf(ITypeSymbol? targetType, IOperation value, Setting setting)
        {
            if (TypeFacts.NumericKindOf(targetType) is { } fromTarget)
            {
                return fromTarget;
            }

            var operand = value;
            while (operand is IConversionOperation conversion)
            {
                operand = conversion.Operand;
            }

            return TypeFacts.NumericKindOf(operand.Type) switch
            {
                NumericKind.Float => NumericKind.Float,
                NumericKind.Decimal => NumericKind.Decimal,
                // Counts stay integers in a JSON bag ("n": 1, not 1.0); other integers become doubles so fractions stay valid.
                NumericKind.Int or NumericKind.Long when setting is Setting.Candidates or Setting.TopK or Setting.Seed => TypeFacts.NumericKindOf(operand.Type)!.Value,
                _ => NumericKind.Double,
            };
        }
    }
}
