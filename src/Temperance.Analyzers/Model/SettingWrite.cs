using Microsoft.CodeAnalysis;

namespace Temperance.Model
{
    /// <summary>
    /// One place in code that writes a setting: a member assignment, a bag key or a string-keyed call.
    /// A conditional value produces one write per branch, each flagged <see cref="FromConditional"/>.
    /// </summary>
    internal sealed class SettingWrite
    {
        public SettingWrite(Setting setting, ValueKind kind, double value, string member, Location location,
            SyntaxNode? valueSyntax, NumericKind literalKind, bool fromConditional, string? origin, bool fromKey = false, FileSpans? inFile = null,
            MemberPath? readFrom = null)
        {
            ReadFrom = readFrom;
            InFile = inFile;
            FromKey = fromKey;
            Setting = setting;
            Kind = kind;
            Value = value;
            Member = member;
            Location = location;
            ValueSyntax = valueSyntax;
            LiteralKind = literalKind;
            FromConditional = fromConditional;
            Origin = origin;
        }

        public Setting Setting { get; }
        public ValueKind Kind { get; }
        /// <summary>Meaningful only when <see cref="Kind"/> is <see cref="ValueKind.Known"/>.</summary>
        public double Value { get; }
        /// <summary>How the code spells it: <c>Temperature</c>, <c>"top_k"</c>, <c>NucleusSamplingFactor</c>.</summary>
        public string Member { get; }
        /// <summary>The whole assignment or call: where diagnostics about this value go.</summary>
        public Location Location { get; }
        /// <summary>The value expression a fix replaces; null when the value came from elsewhere (a constant).</summary>
        public SyntaxNode? ValueSyntax { get; }
        /// <summary>The C# type a replacement literal must have.</summary>
        public NumericKind LiteralKind { get; }
        public bool FromConditional { get; }
        /// <summary>Written under a string key (a bag entry, a payload key, a keyed method), not a typed member.</summary>
        public bool FromKey { get; }
        /// <summary>Where a known value came from when it is not a literal here ("constant 'Hot'").</summary>
        public string? Origin { get; }
        /// <summary>For a value written in a settings file: the spans a fix rewrites or deletes there (no syntax node exists).</summary>
        public FileSpans? InFile { get; }
        /// <summary>For an Unknown value read from a property of the project's own classes: that property, which configuration may bind.</summary>
        public MemberPath? ReadFrom { get; }

        /// <summary>
        /// This write with the value its <see cref="ReadFrom"/> property holds elsewhere (a configuration file): Known, said
        /// where it came from, and with no value syntax, so no fix replaces the property read with a literal.
        /// </summary>
        public SettingWrite Resolved(double value, string origin) =>
            new SettingWrite(Setting, ValueKind.Known, value, Member, Location, null, LiteralKind, FromConditional, origin, FromKey, null, ReadFrom);
    }

    /// <summary>Where a value sits in a settings file: the value's text, and what deleting its entry removes (empty: no removal).</summary>
    internal sealed class FileSpans
    {
        public FileSpans(Microsoft.CodeAnalysis.Text.TextSpan value, Microsoft.CodeAnalysis.Text.TextSpan removal)
        {
            Value = value;
            Removal = removal;
        }

        public Microsoft.CodeAnalysis.Text.TextSpan Value { get; }
        public Microsoft.CodeAnalysis.Text.TextSpan Removal { get; }
    }

    /// <summary>The numeric C# type of a member, so fixes write a literal that compiles.</summary>
    internal enum NumericKind
    {
        Double,
        Float,
        Decimal,
        Int,
        Long,
        UInt,
    }
}
