using Microsoft.CodeAnalysis;
using Temperance.Extraction;
using Temperance.Surfaces;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>
/// TypeLookup walks the merged namespaces instead of asking every referenced module; the compiler's own
/// GetTypeByMetadataName is the oracle it must agree with, for every name Temperance looks up.
/// </summary>
public class TypeLookupTests
{
    public static IEnumerable<object[]> NamesTemperanceLooksUp() =>
        SurfaceCatalog.Definitions.SelectMany(d => new[] { d.MetadataName }.Concat(d.SendSites.Select(s => s.ClientType)))
            .Concat(AdapterSurfaces.All.SelectMany(a => new[] { a.DeclaringType, a.ReceiverType }))
            .Concat(RawJsonSurface.PayloadTypes)
            .Concat(TestFrameworks.AttributeNames)
            .Concat(new[] { "System.CodeDom.Compiler.GeneratedCodeAttribute", ConfigurationSurface.ConfigurationType })
            .OfType<string>()
            .Distinct(StringComparer.Ordinal)
            .Select(name => new object[] { name });

    [Theory]
    [MemberData(nameof(NamesTemperanceLooksUp))]
    public void Find_AgreesWithTheCompiler_ForEveryNameTemperanceLooksUp(string metadataName)
    {
        var compilation = DirectRun.Compile(new[] { "class Empty { }" });
        var expected = compilation.GetTypeByMetadataName(metadataName);

        // every SDK the names come from is referenced by the tests; a few extension classes share a name across two of them
        Assert.NotEmpty(compilation.GetTypesByMetadataName(metadataName));
        Assert.Equal(expected, TypeLookup.Find(compilation, metadataName), SymbolEqualityComparer.Default);
    }

    [Theory]
    [InlineData("System.Collections.Generic.Dictionary`2")]
    [InlineData("System.Environment+SpecialFolder")]
    [InlineData("Contoso.Llm.GenerationSettings")]
    [InlineData("Contoso.Llm.Missing")]
    [InlineData("Nowhere.At.All")]
    [InlineData("System.Collections.Generic.Dictionary`x")]
    [InlineData("OpenAI.Chat.ChatCompletionOptions")]
    public void Find_AgreesWithTheCompiler_OnGenericNestedSourceMissingAndShadowedNames(string metadataName)
    {
        // The source declares a team type and its own OpenAI.Chat.ChatCompletionOptions next to the SDK's.
        var compilation = DirectRun.Compile(new[]
        {
            "namespace Contoso.Llm { public class GenerationSettings { public float Heat { get; set; } } }",
            "namespace OpenAI.Chat { public class ChatCompletionOptions { } }",
        });

        Assert.Equal(compilation.GetTypeByMetadataName(metadataName), TypeLookup.Find(compilation, metadataName), SymbolEqualityComparer.Default);
    }
}
