using System.Collections.Generic;
using System.Collections.Immutable;
using System.Globalization;
using Microsoft.CodeAnalysis;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>
    /// The shared vocabulary between rules and the one code-fix provider. A finding carries one or more numbered edits;
    /// edit <c>i</c> applies to additional location <c>i</c>. The provider knows three generic edits and nothing about rules.
    /// </summary>
    internal static class FixProperties
    {
        public const string EditCount = "Temperance.Edits";

        /// <summary>Replace the value expression at the location with a literal.</summary>
        public const string SetValue = "SetValue";
        /// <summary>Add <c>Member = literal</c> to the object creation at the location (creating the initializer, or a wrapper object).</summary>
        public const string AddMember = "AddMember";
        /// <summary>Remove the member assignment, bag entry, payload member or statement at the location.</summary>
        public const string RemoveMember = "RemoveMember";

        /// <summary>Add a named options argument <c>param: new Type { Member = literal }</c> to the call at the location.</summary>
        public const string AddArgument = "AddArgument";

        public static string Edit(int index) => $"Temperance.Edit.{index}";
        public static string Value(int index) => $"Temperance.Value.{index}";
        public static string NumericKind(int index) => $"Temperance.NumericKind.{index}";
        public static string Member(int index) => $"Temperance.Member.{index}";
        public static string Wrapper(int index) => $"Temperance.Wrapper.{index}";
        public static string TypeName(int index) => $"Temperance.Type.{index}";
        public static string Parameter(int index) => $"Temperance.Parameter.{index}";

        /// <summary>Equivalence key of edit <paramref name="index"/> of a rule, reused by tests and Fix All.</summary>
        public static string Key(string diagnosticId, string edit, int index) => $"Temperance.{edit}.{diagnosticId}.{index}";

        /// <summary>How a number reads in a message: invariant culture, no float noise.</summary>
        public static string Show(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
    }

    /// <summary>Builds the numbered edits of one finding.</summary>
    internal sealed class FixPlan
    {
        private readonly List<Location> locations = new List<Location>();
        private readonly ImmutableDictionary<string, string?>.Builder properties = ImmutableDictionary.CreateBuilder<string, string?>();

        public static FixPlan None => new FixPlan();

        public FixPlan SetValue(SettingWrite write, double value)
        {
            if (write.ValueSyntax != null)
            {
                Add(FixProperties.SetValue, write.ValueSyntax.GetLocation(), value, write.LiteralKind, write.Member);
            }

            return this;
        }

        public FixPlan Remove(SettingWrite write)
        {
            Add(FixProperties.RemoveMember, write.Location, 0, write.LiteralKind, write.Member);
            return this;
        }

        public FixPlan AddMember(SyntaxNode creation, string member, double value, NumericKind kind, string? wrapperMember, string? wrapperType)
        {
            var index = Add(FixProperties.AddMember, creation.GetLocation(), value, kind, member);
            properties[FixProperties.Wrapper(index)] = wrapperMember;
            properties[FixProperties.TypeName(index)] = wrapperType;
            return this;
        }

        public FixPlan AddArgument(SyntaxNode call, string parameter, string optionsType, string member, double value, NumericKind kind)
        {
            var index = Add(FixProperties.AddArgument, call.GetLocation(), value, kind, member);
            properties[FixProperties.Parameter(index)] = parameter;
            properties[FixProperties.TypeName(index)] = optionsType;
            return this;
        }

        public ImmutableArray<Location> Locations => locations.ToImmutableArray();

        public ImmutableDictionary<string, string?> Properties
        {
            get
            {
                properties[FixProperties.EditCount] = locations.Count.ToString(CultureInfo.InvariantCulture);
                return properties.ToImmutable();
            }
        }

        private int Add(string edit, Location location, double value, NumericKind kind, string member)
        {
            var index = locations.Count;
            locations.Add(location);
            properties[FixProperties.Edit(index)] = edit;
            properties[FixProperties.Value(index)] = value.ToString("R", CultureInfo.InvariantCulture);
            properties[FixProperties.NumericKind(index)] = kind.ToString();
            properties[FixProperties.Member(index)] = member;
            return index;
        }
    }
}
