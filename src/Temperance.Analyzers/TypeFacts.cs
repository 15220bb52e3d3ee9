using Microsoft.CodeAnalysis;
using Temperance.Model;

namespace Temperance
{
    /// <summary>Questions about types that extraction, fixes and configuration all ask, answered in one place.</summary>
    internal static class TypeFacts
    {
        /// <summary>An instance property by name, on the type or its nearest base that declares one.</summary>
        public static IPropertySymbol? FindProperty(ITypeSymbol type, string name)
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

        /// <summary>The literal kind a value of this type is written as (nullable looked through); null for anything not numeric.</summary>
        public static NumericKind? NumericKindOf(ITypeSymbol? type)
        {
            if (type is INamedTypeSymbol { OriginalDefinition.SpecialType: SpecialType.System_Nullable_T } nullable)
            {
                type = nullable.TypeArguments[0];
            }

            return type?.SpecialType switch
            {
                SpecialType.System_Double => NumericKind.Double,
                SpecialType.System_Single => NumericKind.Float,
                SpecialType.System_Decimal => NumericKind.Decimal,
                SpecialType.System_Int32 => NumericKind.Int,
                SpecialType.System_Int64 => NumericKind.Long,
                SpecialType.System_UInt32 => NumericKind.UInt,
                _ => (NumericKind?)null,
            };
        }

        /// <summary>Numeric or nullable numeric, as a sampling member must be.</summary>
        public static bool IsNumber(ITypeSymbol? type) => NumericKindOf(type) != null;
    }
}
