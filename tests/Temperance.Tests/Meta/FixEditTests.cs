using System.Collections.Immutable;
using Microsoft.CodeAnalysis.Text;
using Temperance.Model;
using Temperance.Rules;

namespace Temperance.Tests.Meta;

/// <summary>The fix edits a rule encodes in diagnostic Properties read back the same in the code-fix provider.</summary>
public class FixEditTests
{
    private static readonly FixEdit SetTemperature = FixEdit.SetValue(new TextSpan(120, 4), "Temperature", 0.1, NumericKind.Float);
    private static readonly FixEdit RemoveTopP = FixEdit.RemoveMember(new TextSpan(0, 17), "TopP", NumericKind.Double);
    private static readonly FixEdit AddWrapped = FixEdit.AddMember(new TextSpan(40, 30), "Temperature", 1e-7, NumericKind.Decimal, "ExecutionSettings", "Some.Settings")
        .WithExtra(new FixAssignment("Seed", NumericKind.Long, 42))
        .WithExperimental("OPENAI001");
    private static readonly FixEdit AddDirect = FixEdit.AddMember(new TextSpan(7, 0), "Temperature", 0, NumericKind.Double, null, null);
    private static readonly FixEdit AddOptions = FixEdit.AddArgument(new TextSpan(300, 25), "options", "global::Vendor.ChatOptions", "CandidateCount", 2, NumericKind.Int)
        .WithExtra(new FixAssignment("Temperature", NumericKind.Float, 0.7))
        .WithExtra(new FixAssignment("Seed", NumericKind.UInt, 7))
        .WithExperimental("VENDOR001");

    public static TheoryData<string> Cases => new() { "set", "remove", "add-wrapped", "add-direct", "argument", "all", "all-combined", "none" };

    private static FixEdits Case(string name) => name switch
    {
        "set" => Fix(false, SetTemperature),
        "remove" => Fix(false, RemoveTopP),
        "add-wrapped" => Fix(false, AddWrapped),
        "add-direct" => Fix(false, AddDirect),
        "argument" => Fix(false, AddOptions),
        "all" => Fix(false, SetTemperature, RemoveTopP, AddWrapped, AddDirect, AddOptions),
        "all-combined" => Fix(true, SetTemperature, RemoveTopP, AddWrapped, AddDirect, AddOptions),
        _ => FixEdits.None,
    };

    private static FixEdits Fix(bool combined, params FixEdit[] edits) => new(edits.ToImmutableArray(), combined);

    [Theory]
    [MemberData(nameof(Cases))]
    public void EncodeThenDecode_GivesTheSameEdits(string name)
    {
        var fix = Case(name);

        Assert.True(FixProperties.TryDecode(FixProperties.Encode(fix), out var decoded));

        Assert.Equal(fix, decoded);
        Assert.Equal<FixEdit>(fix.Edits, decoded.Edits);
        Assert.Equal(fix.Combined, decoded.Combined);
    }

    [Fact]
    public void RoundTrip_KeepsEveryField()
    {
        Assert.True(FixProperties.TryDecode(FixProperties.Encode(Fix(true, AddOptions, AddWrapped)), out var decoded));

        var argument = decoded.Edits[0];
        Assert.Equal(FixEditKind.AddArgument, argument.Kind);
        Assert.Equal(new TextSpan(300, 25), argument.Span);
        Assert.Equal(2, argument.Value);
        Assert.Equal(NumericKind.Int, argument.NumericKind);
        Assert.Equal("CandidateCount", argument.Member);
        Assert.Equal("options", argument.Parameter);
        Assert.Equal("global::Vendor.ChatOptions", argument.OptionsType);
        Assert.Null(argument.WrapperMember);
        Assert.Null(argument.WrapperType);
        Assert.Equal(new[] { new FixAssignment("Temperature", NumericKind.Float, 0.7), new FixAssignment("Seed", NumericKind.UInt, 7) }, argument.Extras);
        Assert.Equal("VENDOR001", argument.Experimental);

        var wrapped = decoded.Edits[1];
        Assert.Equal(1e-7, wrapped.Value);
        Assert.Equal(NumericKind.Decimal, wrapped.NumericKind);
        Assert.Equal("ExecutionSettings", wrapped.WrapperMember);
        Assert.Equal("Some.Settings", wrapped.WrapperType);
        Assert.Null(wrapped.OptionsType);
        Assert.True(decoded.Combined);
    }

    [Fact]
    public void Encode_WritesTheShippedKeys()
    {
        var properties = FixProperties.Encode(Fix(true, SetTemperature, AddOptions));

        Assert.Equal("2", properties["Temperance.Edits"]);
        Assert.Equal("true", properties["Temperance.Combine"]);
        Assert.Equal("SetValue", properties["Temperance.Edit.0"]);
        Assert.Equal("120:4", properties["Temperance.Span.0"]);
        Assert.Equal("0.1", properties["Temperance.Value.0"]);
        Assert.Equal("Float", properties["Temperance.NumericKind.0"]);
        Assert.Equal("Temperature", properties["Temperance.Member.0"]);
        Assert.Equal("AddArgument", properties["Temperance.Edit.1"]);
        Assert.Equal("options", properties["Temperance.Parameter.1"]);
        Assert.Equal("global::Vendor.ChatOptions", properties["Temperance.Type.1"]);
        Assert.Equal("Temperature|Float|0.7;Seed|UInt|7", properties["Temperance.Extra.1"]);
        Assert.Equal("VENDOR001", properties["Temperance.Experimental.1"]);
        Assert.Equal("Temperance.RemoveMember.SAMP004.1", FixProperties.Key("SAMP004", FixEditKind.RemoveMember, 1));
        Assert.Equal(FixProperties.Key("SAMP004", FixProperties.RemoveMember, 1), FixProperties.Key("SAMP004", FixEditKind.RemoveMember, 1));
    }

    [Fact]
    public void NoEdits_StillCarryACountOfZero()
    {
        var properties = FixProperties.Encode(FixEdits.None);

        Assert.Equal("0", properties[FixProperties.EditCount]);
        Assert.True(FixProperties.TryDecode(properties, out var decoded));
        Assert.Empty(decoded.Edits);
    }

    public static TheoryData<string> RequiredKeys => new()
    {
        FixProperties.EditCount, FixProperties.Edit(1), FixProperties.Span(1), FixProperties.Value(1),
        FixProperties.NumericKind(1), FixProperties.Member(1), FixProperties.Parameter(1), FixProperties.TypeName(1),
    };

    [Theory]
    [MemberData(nameof(RequiredKeys))]
    public void Decode_WithoutARequiredKey_IsFalse(string key)
    {
        var properties = FixProperties.Encode(Fix(false, SetTemperature, AddOptions)).Remove(key);

        Assert.False(FixProperties.TryDecode(properties, out var decoded));
        Assert.Empty(decoded.Edits);
    }

    public static TheoryData<string, string?> Garbage => new()
    {
        { FixProperties.EditCount, "two" },
        { FixProperties.EditCount, "-1" },
        { FixProperties.EditCount, "3" },
        { FixProperties.EditCount, "2147483647" },
        { FixProperties.EditCount, null },
        { FixProperties.Span(0), "start:4" },
        { FixProperties.Span(0), "120" },
        { FixProperties.Span(0), "120:4:1" },
        { FixProperties.Span(0), "-1:4" },
        { FixProperties.Span(0), "2147483647:1" },
        { FixProperties.Span(0), "" },
        { FixProperties.Edit(0), "Rename" },
        { FixProperties.Edit(0), "setvalue" },
        { FixProperties.Value(0), "warm" },
        { FixProperties.NumericKind(0), "Single" },
        { FixProperties.NumericKind(0), "1" },
        { FixProperties.Member(0), null },
        { FixProperties.Extra(1), "Seed|Long" },
        { FixProperties.Extra(1), "Seed|Long|many" },
        { FixProperties.Extra(1), "Seed|Huge|7" },
        { FixProperties.Parameter(1), null },
    };

    [Theory]
    [MemberData(nameof(Garbage))]
    public void Decode_Garbage_IsFalseNotAnException(string key, string? value)
    {
        var properties = FixProperties.Encode(Fix(false, SetTemperature, AddOptions)).SetItem(key, value);

        Assert.False(FixProperties.TryDecode(properties, out var decoded));
        Assert.Empty(decoded.Edits);
    }

    [Fact]
    public void Decode_OfAnUnrelatedDiagnostic_IsFalse()
    {
        Assert.False(FixProperties.TryDecode(ImmutableDictionary<string, string?>.Empty, out _));
    }
}
