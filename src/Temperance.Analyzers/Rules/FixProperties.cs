using System.Collections.Immutable;
using System.Globalization;
using Microsoft.CodeAnalysis;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>
    /// The shared vocabulary between rules and the one code-fix provider. A finding with a fix names an edit and its
    /// argument; the provider applies it to the first additional location (the value expression).
    /// </summary>
    internal static class FixProperties
    {
        public const string Edit = "Temperance.Edit";
        public const string Value = "Temperance.Value";
        public const string NumericKind = "Temperance.NumericKind";
        public const string Member = "Temperance.Member";

        /// <summary>Replace the value expression with a literal.</summary>
        public const string SetValue = "SetValue";

        /// <summary>Equivalence key of the set-value fix, reused by tests and Fix All.</summary>
        public static string SetValueKey(string diagnosticId) => "Temperance.SetValue." + diagnosticId;

        public static (ImmutableArray<Location>, ImmutableDictionary<string, string?>) SetValueEdit(SettingWrite write, double value)
        {
            if (write.ValueSyntax == null)
            {
                return (ImmutableArray<Location>.Empty, ImmutableDictionary<string, string?>.Empty);
            }

            var properties = ImmutableDictionary<string, string?>.Empty
                .Add(Edit, SetValue)
                .Add(Value, value.ToString("R", CultureInfo.InvariantCulture))
                .Add(NumericKind, write.LiteralKind.ToString())
                .Add(Member, write.Member);
            return (ImmutableArray.Create(write.ValueSyntax.GetLocation()), properties);
        }

        /// <summary>How a number reads in a message: invariant culture, no float noise.</summary>
        public static string Show(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
    }
}
