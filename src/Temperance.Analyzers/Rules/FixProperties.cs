using System.Collections.Generic;
using System.Collections.Immutable;
using System.Globalization;
using System.Linq;
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

        public static string Edit(int index) => Numbered("Temperance.Edit.", index);
        public static string Value(int index) => Numbered("Temperance.Value.", index);
        public static string NumericKind(int index) => Numbered("Temperance.NumericKind.", index);
        public static string Member(int index) => Numbered("Temperance.Member.", index);
        public static string Wrapper(int index) => Numbered("Temperance.Wrapper.", index);
        public static string TypeName(int index) => Numbered("Temperance.Type.", index);
        public static string Parameter(int index) => Numbered("Temperance.Parameter.", index);
        /// <summary>
        /// Where edit <c>i</c> applies, as "start:length" in the diagnostic's own file. Carried as a property rather than
        /// an additional location: the compiler checks every location of every diagnostic for generated code, which was
        /// most of Temperance's cost on a dense project.
        /// </summary>
        public static string Span(int index) => Numbered("Temperance.Span.", index);
        /// <summary>More assignments for the same edit, "Member|Kind|Value" joined by ';' (temperature and seed together).</summary>
        public static string Extra(int index) => Numbered("Temperance.Extra.", index);
        /// <summary>Experimental-API diagnostic the edited code raises (OPENAI001): the fix wraps the statement in a pragma.</summary>
        public static string Experimental(int index) => Numbered("Temperance.Experimental.", index);

        /// <summary>Property names of the first few edits are made once; every diagnostic carries several.</summary>
        private static readonly System.Collections.Concurrent.ConcurrentDictionary<(string Prefix, int Index), string> Names =
            new System.Collections.Concurrent.ConcurrentDictionary<(string, int), string>();

        private static string Numbered(string prefix, int index) =>
            Names.TryGetValue((prefix, index), out var name) ? name : Names.GetOrAdd((prefix, index), prefix + index.ToString(CultureInfo.InvariantCulture));

        /// <summary>"true" when all edits form one code action (SAMP002 sets temperature and seed together).</summary>
        public const string Combine = "Temperance.Combine";

        /// <summary>
        /// Equivalence key of every diagnostic's first (primary) fix, the same for all rules: <c>dotnet format</c> asks Fix All
        /// for the key of whichever Temperance diagnostic it meets first, so a per-rule key would fix nothing for the others.
        /// </summary>
        public const string PrimaryKey = "Temperance.Primary";

        /// <summary>Equivalence key of a further edit <paramref name="index"/> of a rule (SAMP004's second fix), for tests and Fix All.</summary>
        public static string Key(string diagnosticId, string edit, int index) => $"Temperance.{edit}.{diagnosticId}.{index}";

        /// <summary>How a number reads in a message: invariant culture, no float noise.</summary>
        public static string Show(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
    }

    /// <summary>Builds the numbered edits of one finding.</summary>
    internal sealed class FixPlan
    {
        /// <summary>Where each edit applies; only their spans leave the analyzer (see <see cref="FixProperties.Span"/>).</summary>
        private readonly List<Location> locations = new List<Location>();
        private readonly ImmutableDictionary<string, string?>.Builder properties = ImmutableDictionary.CreateBuilder<string, string?>();

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

        public FixPlan AddArgument(Location call, string parameter, string optionsType, string member, double value, NumericKind kind)
        {
            var index = Add(FixProperties.AddArgument, call, value, kind, member);
            properties[FixProperties.Parameter(index)] = parameter;
            properties[FixProperties.TypeName(index)] = optionsType;
            return this;
        }

        /// <summary>
        /// Writes settings nobody has written yet, wherever the request allows: into the options creation (or a new nested
        /// options object), else as an options argument of a call that passes none. The first setting decides the edit;
        /// the others join it when they belong to the same object. False when there is nowhere to write.
        /// </summary>
        public bool AddUnset(FixAnchors anchors, params (Setting Setting, double Value)[] settings)
        {
            var (first, value) = settings[0];
            if (anchors.Members.TryGetValue(first, out var target))
            {
                AddMember(target.Creation, target.Member, value, target.Kind, target.WrapperMember, target.WrapperType).Experimental(target.Experimental);
                foreach (var (other, otherValue) in settings.Skip(1))
                {
                    if (anchors.Members.TryGetValue(other, out var more) && more.Creation == target.Creation && more.WrapperMember == target.WrapperMember)
                    {
                        AlsoAssign(more.Member, more.Kind, otherValue, more.Experimental);
                    }
                }

                return true;
            }

            if (anchors.Call != null && anchors.OmittedParameter != null && anchors.OmittedOptionsType != null
                && anchors.OmittedMembers.TryGetValue(first, out var omitted))
            {
                AddArgument(anchors.Call, anchors.OmittedParameter, anchors.OmittedOptionsType, omitted.Member, value, omitted.Kind).Experimental(omitted.Experimental);
                foreach (var (other, otherValue) in settings.Skip(1))
                {
                    if (anchors.OmittedMembers.TryGetValue(other, out var more))
                    {
                        AlsoAssign(more.Member, more.Kind, otherValue, more.Experimental);
                    }
                }

                return true;
            }

            return false;
        }

        /// <summary>Adds another assignment to the last edit (an AddMember or AddArgument), and its experimental id if any.</summary>
        public FixPlan AlsoAssign(string member, NumericKind kind, double value, string? experimental)
        {
            var index = locations.Count - 1;
            var entry = $"{member}|{KindNames[(int)kind]}|{value.ToString("R", CultureInfo.InvariantCulture)}";
            properties.TryGetValue(FixProperties.Extra(index), out var existing);
            properties[FixProperties.Extra(index)] = string.IsNullOrEmpty(existing) ? entry : existing + ";" + entry;
            if (experimental != null)
            {
                properties[FixProperties.Experimental(index)] = experimental;
            }

            return this;
        }

        public FixPlan Experimental(string? id)
        {
            if (id != null && locations.Count > 0)
            {
                properties[FixProperties.Experimental(locations.Count - 1)] = id;
            }

            return this;
        }

        /// <summary>All edits are applied as one code action.</summary>
        public FixPlan Combined()
        {
            properties[FixProperties.Combine] = "true";
            return this;
        }

        public ImmutableDictionary<string, string?> Properties
        {
            get
            {
                properties[FixProperties.EditCount] = locations.Count.ToString(CultureInfo.InvariantCulture);
                return properties.ToImmutable();
            }
        }

        /// <summary>NumericKind names by value (Enum.ToString goes through reflection on every call).</summary>
        private static readonly string[] KindNames = ((NumericKind[])System.Enum.GetValues(typeof(NumericKind))).OrderBy(k => (int)k).Select(k => k.ToString()).ToArray();

        private int Add(string edit, Location location, double value, NumericKind kind, string member)
        {
            var index = locations.Count;
            locations.Add(location);
            properties[FixProperties.Span(index)] = $"{location.SourceSpan.Start.ToString(CultureInfo.InvariantCulture)}:{location.SourceSpan.Length.ToString(CultureInfo.InvariantCulture)}";
            properties[FixProperties.Edit(index)] = edit;
            properties[FixProperties.Value(index)] = value.ToString("R", CultureInfo.InvariantCulture);
            properties[FixProperties.NumericKind(index)] = KindNames[(int)kind];
            properties[FixProperties.Member(index)] = member;
            return index;
        }
    }
}
