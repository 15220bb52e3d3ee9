using System;
using System.Collections.Generic;
using System.Collections.Immutable;
using System.Globalization;
using System.Linq;
using System.Text;
using Microsoft.CodeAnalysis.Text;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>The four generic edits the code-fix provider knows. It knows nothing about rules.</summary>
    internal enum FixEditKind
    {
        /// <summary>Replace the value expression at the span with a literal.</summary>
        SetValue,
        /// <summary>Add <c>Member = literal</c> to the object creation at the span (creating the initializer, or a wrapper object).</summary>
        AddMember,
        /// <summary>Remove the member assignment, bag entry, payload member or statement at the span.</summary>
        RemoveMember,
        /// <summary>Add a named options argument <c>param: new Type { Member = literal }</c> to the call at the span.</summary>
        AddArgument,
    }

    /// <summary>One more <c>Member = value</c> an AddMember or AddArgument edit writes (temperature and seed together).</summary>
    internal readonly struct FixAssignment : IEquatable<FixAssignment>
    {
        public FixAssignment(string member, NumericKind kind, double value)
        {
            Member = member;
            Kind = kind;
            Value = value;
        }

        public string Member { get; }
        /// <summary>The C# type the literal must have.</summary>
        public NumericKind Kind { get; }
        public double Value { get; }

        public bool Equals(FixAssignment other) => Member == other.Member && Kind == other.Kind && Value.Equals(other.Value);
        public override bool Equals(object? obj) => obj is FixAssignment other && Equals(other);
        public override int GetHashCode() => ((Member?.GetHashCode() ?? 0) * 31 + (int)Kind) * 31 + Value.GetHashCode();
        public override string ToString() => $"{Member}|{Kind}|{Value.ToString("R", CultureInfo.InvariantCulture)}";
    }

    /// <summary>
    /// One edit of a fix, applied at <see cref="Span"/> in the diagnostic's own file. Made through the factory per kind, so
    /// an edit carries only what its kind uses; <see cref="FixProperties.Encode"/> and <see cref="FixProperties.TryDecode"/>
    /// carry it through diagnostic Properties.
    /// </summary>
    internal sealed class FixEdit : IEquatable<FixEdit>
    {
        private FixEdit(FixEditKind kind, TextSpan span, string member, double value, NumericKind numericKind, string? wrapperMember = null,
            string? wrapperType = null, string? parameter = null, string? optionsType = null, ImmutableArray<FixAssignment> extras = default,
            string? experimental = null)
        {
            Kind = kind;
            Span = span;
            Member = member;
            Value = value;
            NumericKind = numericKind;
            WrapperMember = wrapperMember;
            WrapperType = wrapperType;
            Parameter = parameter;
            OptionsType = optionsType;
            Extras = extras.IsDefault ? ImmutableArray<FixAssignment>.Empty : extras;
            Experimental = experimental;
        }

        /// <summary>Replace the value expression at <paramref name="value"/>'s span with <paramref name="newValue"/>.</summary>
        public static FixEdit SetValue(TextSpan value, string member, double newValue, NumericKind kind) =>
            new FixEdit(FixEditKind.SetValue, value, member, newValue, kind);

        /// <summary>Remove the write of <paramref name="member"/> at <paramref name="write"/>.</summary>
        public static FixEdit RemoveMember(TextSpan write, string member, NumericKind kind) =>
            new FixEdit(FixEditKind.RemoveMember, write, member, 0, kind);

        /// <summary>
        /// Add <c>member = value</c> to the creation at <paramref name="creation"/>; with a wrapper, add
        /// <c>wrapperMember = new wrapperType { member = value }</c> instead.
        /// </summary>
        public static FixEdit AddMember(TextSpan creation, string member, double value, NumericKind kind, string? wrapperMember, string? wrapperType) =>
            new FixEdit(FixEditKind.AddMember, creation, member, value, kind, wrapperMember: wrapperMember, wrapperType: wrapperType);

        /// <summary>Add <c>parameter: new optionsType { member = value }</c> to the call at <paramref name="call"/>.</summary>
        public static FixEdit AddArgument(TextSpan call, string parameter, string optionsType, string member, double value, NumericKind kind) =>
            new FixEdit(FixEditKind.AddArgument, call, member, value, kind, parameter: parameter, optionsType: optionsType);

        public FixEditKind Kind { get; }
        /// <summary>
        /// Where the edit applies, in the diagnostic's own file. Carried as a property rather than an additional location:
        /// the compiler checks every location of every diagnostic for generated code, which was most of Temperance's cost
        /// on a dense project.
        /// </summary>
        public TextSpan Span { get; }
        /// <summary>How the code spells the setting (<c>Temperature</c>); what SetValue and RemoveMember name in their titles.</summary>
        public string Member { get; }
        /// <summary>The new value (0 for RemoveMember).</summary>
        public double Value { get; }
        /// <summary>The C# type the literal must have.</summary>
        public NumericKind NumericKind { get; }
        /// <summary>AddMember only: the member that gets a new options object holding the assignments (null: assign directly).</summary>
        public string? WrapperMember { get; }
        /// <summary>AddMember only: the type of that new options object.</summary>
        public string? WrapperType { get; }
        /// <summary>AddArgument only: the name of the options parameter.</summary>
        public string? Parameter { get; }
        /// <summary>AddArgument only: the type of the options object passed.</summary>
        public string? OptionsType { get; }
        /// <summary>More assignments the same AddMember/AddArgument makes, after the main one.</summary>
        public ImmutableArray<FixAssignment> Extras { get; }
        /// <summary>
        /// Experimental-API diagnostic the edited code raises (OPENAI001): the fix wraps the statement in
        /// <c>#pragma warning disable</c>/<c>restore</c> so it still compiles.
        /// </summary>
        public string? Experimental { get; }

        /// <summary>The main assignment, then the extras.</summary>
        public IEnumerable<FixAssignment> Assignments => new[] { new FixAssignment(Member, NumericKind, Value) }.Concat(Extras);

        /// <summary>The same edit with one more assignment after the others.</summary>
        public FixEdit WithExtra(FixAssignment extra) =>
            new FixEdit(Kind, Span, Member, Value, NumericKind, WrapperMember, WrapperType, Parameter, OptionsType, Extras.Add(extra), Experimental);

        /// <summary>The same edit raising <paramref name="id"/>; null leaves it as it is.</summary>
        public FixEdit WithExperimental(string? id) => id == null ? this
            : new FixEdit(Kind, Span, Member, Value, NumericKind, WrapperMember, WrapperType, Parameter, OptionsType, Extras, id);

        public bool Equals(FixEdit? other) =>
            other != null && Kind == other.Kind && Span == other.Span && Member == other.Member && Value.Equals(other.Value)
            && NumericKind == other.NumericKind && WrapperMember == other.WrapperMember && WrapperType == other.WrapperType
            && Parameter == other.Parameter && OptionsType == other.OptionsType && Experimental == other.Experimental
            && Extras.SequenceEqual(other.Extras);

        public override bool Equals(object? obj) => Equals(obj as FixEdit);

        public override int GetHashCode() => (((int)Kind * 31 + Span.GetHashCode()) * 31 + Member.GetHashCode()) * 31 + Value.GetHashCode();

        public override string ToString()
        {
            var text = new StringBuilder().Append(Kind).Append(' ').Append(Span).Append(' ').Append(new FixAssignment(Member, NumericKind, Value));
            foreach (var extra in Extras)
            {
                text.Append(", ").Append(extra);
            }

            void Add(string name, string? value)
            {
                if (value != null)
                {
                    text.Append(' ').Append(name).Append('=').Append(value);
                }
            }

            Add("wrapper", WrapperMember);
            Add("wrapperType", WrapperType);
            Add("parameter", Parameter);
            Add("optionsType", OptionsType);
            Add("experimental", Experimental);
            return text.ToString();
        }
    }

    /// <summary>The edits of one finding; edit 0 is the primary fix.</summary>
    internal sealed class FixEdits : IEquatable<FixEdits>
    {
        public static readonly FixEdits None = new FixEdits(ImmutableArray<FixEdit>.Empty, combined: false);

        public FixEdits(ImmutableArray<FixEdit> edits, bool combined)
        {
            Edits = edits.IsDefault ? ImmutableArray<FixEdit>.Empty : edits;
            Combined = combined;
        }

        public ImmutableArray<FixEdit> Edits { get; }
        /// <summary>True when all edits form one code action (SAMP002 sets temperature and seed together); else one action per edit.</summary>
        public bool Combined { get; }

        public bool Equals(FixEdits? other) => other != null && Combined == other.Combined && Edits.SequenceEqual(other.Edits);
        public override bool Equals(object? obj) => Equals(obj as FixEdits);
        public override int GetHashCode() => Edits.Length * 2 + (Combined ? 1 : 0);
        public override string ToString() => (Combined ? "combined: " : string.Empty) + string.Join("; ", Edits);
    }

    /// <summary>
    /// How a <see cref="FixEdits"/> travels in diagnostic Properties from a rule to the one code-fix provider, both ways:
    /// <see cref="Encode"/> and <see cref="TryDecode"/>. Edit <c>i</c> is a set of keys numbered <c>i</c>; the key strings
    /// and equivalence keys below are what shipped, so keep them.
    /// </summary>
    internal static class FixProperties
    {
        /// <summary>How many edits; present on every Temperance diagnostic, "0" when there is no fix.</summary>
        public const string EditCount = "Temperance.Edits";
        /// <summary>"true" when all edits form one code action.</summary>
        public const string Combine = "Temperance.Combine";

        /// <summary>Wire names of <see cref="FixEditKind"/>, the value of <see cref="Edit"/>; also part of <see cref="Key(string, string, int)"/>.</summary>
        public const string SetValue = "SetValue";
        public const string AddMember = "AddMember";
        public const string RemoveMember = "RemoveMember";
        public const string AddArgument = "AddArgument";

        /// <summary>Prefixes of the numbered keys (the edit's index follows).</summary>
        public const string EditPrefix = "Temperance.Edit.";
        public const string ValuePrefix = "Temperance.Value.";
        public const string NumericKindPrefix = "Temperance.NumericKind.";
        public const string MemberPrefix = "Temperance.Member.";
        public const string WrapperPrefix = "Temperance.Wrapper.";
        /// <summary>The wrapper type of an AddMember, the options type of an AddArgument.</summary>
        public const string TypePrefix = "Temperance.Type.";
        public const string ParameterPrefix = "Temperance.Parameter.";
        /// <summary>"start:length" in the diagnostic's own file.</summary>
        public const string SpanPrefix = "Temperance.Span.";
        /// <summary>The extra assignments, "Member|NumericKind|Value" joined by ';'.</summary>
        public const string ExtraPrefix = "Temperance.Extra.";
        public const string ExperimentalPrefix = "Temperance.Experimental.";

        public static string Edit(int index) => Numbered(EditPrefix, index);
        public static string Value(int index) => Numbered(ValuePrefix, index);
        public static string NumericKind(int index) => Numbered(NumericKindPrefix, index);
        public static string Member(int index) => Numbered(MemberPrefix, index);
        public static string Wrapper(int index) => Numbered(WrapperPrefix, index);
        public static string TypeName(int index) => Numbered(TypePrefix, index);
        public static string Parameter(int index) => Numbered(ParameterPrefix, index);
        public static string Span(int index) => Numbered(SpanPrefix, index);
        public static string Extra(int index) => Numbered(ExtraPrefix, index);
        public static string Experimental(int index) => Numbered(ExperimentalPrefix, index);

        /// <summary>
        /// Equivalence key of every diagnostic's first (primary) fix, the same for all rules: <c>dotnet format</c> asks Fix All
        /// for the key of whichever Temperance diagnostic it meets first, so a per-rule key would fix nothing for the others.
        /// </summary>
        public const string PrimaryKey = "Temperance.Primary";

        /// <summary>Equivalence key of a further edit <paramref name="index"/> of a rule (SAMP004's second fix), for tests and Fix All.</summary>
        public static string Key(string diagnosticId, string edit, int index) => $"Temperance.{edit}.{diagnosticId}.{index}";

        /// <inheritdoc cref="Key(string, string, int)"/>
        public static string Key(string diagnosticId, FixEditKind edit, int index) => Key(diagnosticId, Name(edit), index);

        /// <summary>The wire name of an edit kind.</summary>
        public static string Name(FixEditKind kind) => kind switch
        {
            FixEditKind.SetValue => SetValue,
            FixEditKind.AddMember => AddMember,
            FixEditKind.RemoveMember => RemoveMember,
            FixEditKind.AddArgument => AddArgument,
            _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, null),
        };

        /// <summary>How a number reads in a message: invariant culture, no float noise. (Here because rules call it by this name.)</summary>
        public static string Show(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);

        /// <summary>The Properties of a diagnostic carrying <paramref name="fix"/>.</summary>
        public static ImmutableDictionary<string, string?> Encode(FixEdits fix)
        {
            var properties = ImmutableDictionary.CreateBuilder<string, string?>();
            for (var index = 0; index < fix.Edits.Length; index++)
            {
                var edit = fix.Edits[index];
                properties[Span(index)] = $"{Text(edit.Span.Start)}:{Text(edit.Span.Length)}";
                properties[Edit(index)] = Name(edit.Kind);
                properties[Value(index)] = Text(edit.Value);
                properties[NumericKind(index)] = KindNames[(int)edit.NumericKind];
                properties[Member(index)] = edit.Member;
                switch (edit.Kind)
                {
                    case FixEditKind.AddMember:
                        properties[Wrapper(index)] = edit.WrapperMember;
                        properties[TypeName(index)] = edit.WrapperType;
                        break;
                    case FixEditKind.AddArgument:
                        properties[Parameter(index)] = edit.Parameter;
                        properties[TypeName(index)] = edit.OptionsType;
                        break;
                }

                if (edit.Extras.Length > 0)
                {
                    properties[Extra(index)] = string.Join(";", edit.Extras.Select(e => $"{e.Member}|{KindNames[(int)e.Kind]}|{Text(e.Value)}"));
                }

                if (edit.Experimental != null)
                {
                    properties[Experimental(index)] = edit.Experimental;
                }
            }

            if (fix.Combined)
            {
                properties[Combine] = "true";
            }

            properties[EditCount] = Text(fix.Edits.Length);
            return properties.ToImmutable();
        }

        /// <summary>
        /// Reads back what <see cref="Encode"/> wrote. False, never an exception, when anything is missing or malformed (no
        /// count, an unknown edit kind or numeric kind, a span or number that does not parse, an AddArgument without its
        /// parameter or type): a fix read only in part could apply half of a combined edit.
        /// </summary>
        public static bool TryDecode(ImmutableDictionary<string, string?> properties, out FixEdits fix)
        {
            fix = FixEdits.None;
            if (!properties.TryGetValue(EditCount, out var countText) || !TryParse(countText, out int count) || count < 0)
            {
                return false;
            }

            var edits = ImmutableArray.CreateBuilder<FixEdit>();
            for (var index = 0; index < count; index++)
            {
                if (!TryDecode(properties, index, out var edit))
                {
                    return false;
                }

                edits.Add(edit);
            }

            fix = new FixEdits(edits.ToImmutable(), properties.TryGetValue(Combine, out var combine) && combine == "true");
            return true;
        }

        private static bool TryDecode(ImmutableDictionary<string, string?> properties, int index, out FixEdit edit)
        {
            edit = null!;
            if (!properties.TryGetValue(Edit(index), out var kindText) || ParseEditKind(kindText) is not { } kind
                || !properties.TryGetValue(Span(index), out var spanText) || !TryParseSpan(spanText, out var span)
                || !properties.TryGetValue(Value(index), out var valueText) || !TryParse(valueText, out double value)
                || !properties.TryGetValue(NumericKind(index), out var numericText) || !TryParseKind(numericText, out var numericKind)
                || !properties.TryGetValue(Member(index), out var member) || member == null)
            {
                return false;
            }

            properties.TryGetValue(TypeName(index), out var typeName);
            switch (kind)
            {
                case FixEditKind.SetValue:
                    edit = FixEdit.SetValue(span, member, value, numericKind);
                    break;
                case FixEditKind.RemoveMember:
                    edit = FixEdit.RemoveMember(span, member, numericKind);
                    break;
                case FixEditKind.AddMember:
                    properties.TryGetValue(Wrapper(index), out var wrapper);
                    edit = FixEdit.AddMember(span, member, value, numericKind, wrapper, typeName);
                    break;
                default:
                    if (!properties.TryGetValue(Parameter(index), out var parameter) || parameter == null || typeName == null)
                    {
                        return false;
                    }

                    edit = FixEdit.AddArgument(span, parameter, typeName, member, value, numericKind);
                    break;
            }

            if (properties.TryGetValue(Extra(index), out var extraText) && !string.IsNullOrEmpty(extraText))
            {
                foreach (var entry in extraText!.Split(';'))
                {
                    var parts = entry.Split('|');
                    if (parts.Length != 3 || !TryParseKind(parts[1], out var extraKind) || !TryParse(parts[2], out double extraValue))
                    {
                        return false;
                    }

                    edit = edit.WithExtra(new FixAssignment(parts[0], extraKind, extraValue));
                }
            }

            properties.TryGetValue(Experimental(index), out var experimental);
            edit = edit.WithExperimental(experimental);
            return true;
        }

        private static FixEditKind? ParseEditKind(string? text) => text switch
        {
            SetValue => FixEditKind.SetValue,
            AddMember => FixEditKind.AddMember,
            RemoveMember => FixEditKind.RemoveMember,
            AddArgument => FixEditKind.AddArgument,
            _ => null,
        };

        private static bool TryParseSpan(string? text, out TextSpan span)
        {
            span = default;
            var colon = text?.IndexOf(':') ?? -1;
            if (colon < 0 || !TryParse(text!.Substring(0, colon), out int start) || !TryParse(text.Substring(colon + 1), out int length)
                || start < 0 || length < 0 || length > int.MaxValue - start)
            {
                return false;
            }

            span = new TextSpan(start, length);
            return true;
        }

        private static bool TryParseKind(string? text, out Model.NumericKind kind)
        {
            var index = text == null ? -1 : Array.IndexOf(KindNames, text);
            kind = (Model.NumericKind)Math.Max(index, 0);
            return index >= 0;
        }

        private static bool TryParse(string? text, out int value) => int.TryParse(text, NumberStyles.Integer, CultureInfo.InvariantCulture, out value);

        private static bool TryParse(string? text, out double value) => double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out value);

        private static string Text(int value) => value.ToString(CultureInfo.InvariantCulture);

        /// <summary>Round-trip form: 0.1 reads back as exactly 0.1.</summary>
        private static string Text(double value) => value.ToString("R", CultureInfo.InvariantCulture);

        /// <summary>NumericKind names by value (Enum.ToString goes through reflection on every call).</summary>
        private static readonly string[] KindNames =
            ((Model.NumericKind[])Enum.GetValues(typeof(Model.NumericKind))).OrderBy(k => (int)k).Select(k => k.ToString()).ToArray();

        /// <summary>Property names of the first few edits are made once; every diagnostic carries several.</summary>
        private static readonly System.Collections.Concurrent.ConcurrentDictionary<(string Prefix, int Index), string> Names =
            new System.Collections.Concurrent.ConcurrentDictionary<(string, int), string>();

        private static string Numbered(string prefix, int index) =>
            Names.TryGetValue((prefix, index), out var name) ? name : Names.GetOrAdd((prefix, index), prefix + index.ToString(CultureInfo.InvariantCulture));
    }
}
