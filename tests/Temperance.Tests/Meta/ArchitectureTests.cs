using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.Text;
using Temperance.Model;
using Temperance.Rules;
using Temperance.Surfaces;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Meta;

/// <summary>
/// The shape DEVELOPERS.md promises: SDK knowledge only in Surfaces/, one definition per rule, one precedence table.
/// </summary>
public class ArchitectureTests
{
    private static string Source(string folder) => Path.Combine(TestReferences.RepositoryRoot, "src", "Temperance.Analyzers", folder);

    /// <summary>
    /// Every name Surfaces declares about an SDK or a test double: types (and their namespaces' first segment), send
    /// methods, non-setting members, adapters, response-format spellings, client shapes, payload serialisers. Member names
    /// that are also the setting's trade name (Temperature, TopP, Seed …) are words of messages too, so they are not listed.
    /// String literals may hold none of these names; identifiers may not name an SDK's types or namespaces (member names
    /// such as Model or Create are ordinary identifiers too).
    /// </summary>
    private static (HashSet<string> Types, HashSet<string> All) DeclaredSdkNames()
    {
        var names = new HashSet<string>(StringComparer.Ordinal);
        var types = new HashSet<string>(StringComparer.Ordinal);
        void Type(string metadataName)
        {
            var simple = metadataName.Substring(metadataName.LastIndexOf('.') + 1).Split('`')[0].Split('+').Last();
            names.Add(simple);
            var root = metadataName.Split('.')[0];
            if (root != "System")
            {
                types.Add(simple); // an LLM SDK's or test library's type: not even an identifier may name it
            }

            if (root is not ("System" or "Microsoft"))
            {
                names.Add(root);
                types.Add(root);
            }
        }

        foreach (var surface in SurfaceCatalog.Definitions)
        {
            Type(surface.MetadataName);
            foreach (var site in surface.SendSites)
            {
                Type(site.ClientType);
                names.UnionWith(site.Methods.Where(m => m != SendSite.Constructor));
            }

            foreach (var member in new[] { surface.ModelMember, surface.ResponseFormatMember, surface.BagMember, surface.KeyedMethod, surface.ShapeMethod }
                .Concat(surface.NestedMembers).Concat(surface.NestedConcreteTypes.Values))
            {
                if (member != null)
                {
                    names.Add(member.Contains('.') ? member.Substring(member.LastIndexOf('.') + 1) : member);
                }
            }
        }

        foreach (var adapter in AdapterSurfaces.All)
        {
            Type(adapter.DeclaringType);
            if (adapter.Method != null)
            {
                names.Add(adapter.Method);
            }
        }

        names.UnionWith(ResponseFormats.Factories.Keys);
        names.UnionWith(ResponseFormats.CreatedTypes.Keys);
        names.Add(ResponseFormats.JsonOrSchemaFactory);
        names.UnionWith(ClientShapes.MiddlewareBuilders.Keys.Select(k => k.Substring(k.LastIndexOf('.') + 1)));
        names.Add(ClientShapes.ProtocolContentType);
        names.UnionWith(RawJsonSurface.ValueWrappers.Select(w => w.Type));
        names.UnionWith(RawJsonSurface.SerialiserTypes);
        names.UnionWith(TestingSurfaces.DecoratorBaseTypes.Select(t => t.Substring(t.LastIndexOf('.') + 1)));
        names.UnionWith(TestingSurfaces.MockFactories.Select(f => f.Owner).Where(o => o.Length > 1));
        names.UnionWith(TestingSurfaces.MockingNamespaces.Select(n => n.Split('.')[0]));
        names.Add(TestingSurfaces.InnerHandlerMember);
        Type(ConfigurationSurface.ConfigurationType);
        names.UnionWith(ConfigurationSurface.SectionMethods);
        names.UnionWith(new[]
        {
            ConfigurationSurface.ConfigureMethod, ConfigurationSurface.AddOptionsMethod, ConfigurationSurface.BindMethod,
            ConfigurationSurface.BindConfigurationMethod, ConfigurationSurface.GetMethod, ConfigurationSurface.KeyNameAttribute,
        });
        foreach (var type in TestingSurfaces.TransportBaseTypes.Concat(TestingSurfaces.TestServerTypes)
            .Append(TestingSurfaces.HttpClientType).Append(TestingSurfaces.DelegatingHandlerType))
        {
            Type(type);
        }

        return (types, names);
    }

    [Fact]
    public void NoSdkTypeOrMemberName_AppearsInExtractionOrRules()
    {
        var (types, declared) = DeclaredSdkNames();
        Assert.Contains("ChatCompletionOptions", types); // the lists are real
        Assert.Contains("CompleteChat", declared);
        var offences = new List<string>();
        foreach (var folder in new[] { "Extraction", "Rules" })
        {
            foreach (var file in Directory.GetFiles(Source(folder), "*.cs"))
            {
                var root = CSharpSyntaxTree.ParseText(File.ReadAllText(file)).GetRoot();
                foreach (var token in root.DescendantTokens())
                {
                    var words = token.Kind() switch
                    {
                        SyntaxKind.IdentifierToken => types.Contains(token.ValueText) ? new[] { token.ValueText } : Array.Empty<string>(),
                        SyntaxKind.StringLiteralToken or SyntaxKind.InterpolatedStringTextToken =>
                            System.Text.RegularExpressions.Regex.Matches(token.ValueText, "[A-Za-z_][A-Za-z0-9_]*").Select(m => m.Value).ToArray(),
                        _ => Array.Empty<string>(),
                    };
                    foreach (var word in words.Where(declared.Contains))
                    {
                        var line = token.GetLocation().GetLineSpan().StartLinePosition.Line + 1;
                        offences.Add($"{folder}/{Path.GetFileName(file)}:{line}: '{word}'");
                    }
                }
            }
        }

        Assert.True(offences.Count == 0, "SDK knowledge belongs in Surfaces/:\n" + string.Join("\n", offences));
    }

    [Fact]
    public void EveryRuleDescriptor_HasExactlyOneDefinition()
    {
        var defined = RuleCatalog.All.Select(r => r.Descriptor.Id).ToList();
        Assert.Equal(defined.Distinct().Count(), defined.Count);
        Assert.Equal(Descriptors.All.Select(d => d.Id).Where(id => id != Descriptors.InvalidConfiguration.Id).OrderBy(i => i), defined.OrderBy(i => i));
        Assert.Equal(new TemperanceAnalyzer().SupportedDiagnostics.Select(d => d.Id), Descriptors.All.Select(d => d.Id));
    }

    [Fact]
    public void FixerServes_ExactlyTheFixableRules()
    {
        Assert.Equal(RuleCatalog.FixableIds.OrderBy(i => i), new Temperance.CodeFixes.TemperanceCodeFixProvider().FixableDiagnosticIds.OrderBy(i => i));
    }

    [Fact]
    public void PrecedenceTable_NamesOnlyRules_AndHasNoCycle()
    {
        var ruleDescriptors = RuleCatalog.All.Select(r => r.Descriptor).ToHashSet();
        foreach (var entry in Precedence.Table)
        {
            Assert.Contains(entry.Winner, ruleDescriptors);
            Assert.Contains(entry.Loser, ruleDescriptors);
            Assert.False(string.IsNullOrWhiteSpace(entry.Why));
        }

        // No rule may outrank itself through a chain of entries.
        foreach (var start in ruleDescriptors)
        {
            var reached = new HashSet<DiagnosticDescriptor>();
            var pending = new Queue<DiagnosticDescriptor>();
            pending.Enqueue(start);
            while (pending.Count > 0)
            {
                var current = pending.Dequeue();
                foreach (var entry in Precedence.Table.Where(e => e.Winner == current))
                {
                    Assert.NotEqual(start, entry.Loser);
                    if (reached.Add(entry.Loser))
                    {
                        pending.Enqueue(entry.Loser);
                    }
                }
            }
        }
    }

    [Fact]
    public void Precedence_SharedWriteEntry_SuppressesOnlyFindingsAboutTheSameWrite()
    {
        var tree = CSharpSyntaxTree.ParseText("class C { double t = 3.5; double p = 0.5; }");
        var span = (int start) => Location.Create(tree, new TextSpan(start, 1));
        var temperature = new SettingWrite(Setting.Temperature, ValueKind.Known, 3.5, "Temperature", span(10), null, NumericKind.Double, false, null);
        var topP = new SettingWrite(Setting.TopP, ValueKind.Known, 0.5, "TopP", span(25), null, NumericKind.Double, false, null);
        var outOfRange = new Finding(Descriptors.ValueOutOfRange, temperature.Location, new FixPlan()).About(temperature);
        var extremeSame = new Finding(Descriptors.ExtremeTemperature, temperature.Location, new FixPlan()).About(temperature);
        var extremeOther = new Finding(Descriptors.ExtremeTemperature, topP.Location, new FixPlan()).About(topP);

        var kept = Precedence.Apply(new[] { outOfRange, extremeSame, extremeOther }).ToList();

        Assert.Equal(new[] { outOfRange, extremeOther }, kept);
    }

    [Fact]
    public void Precedence_SameRequestEntry_SuppressesTheLoserWhateverItIsAbout()
    {
        var tree = CSharpSyntaxTree.ParseText("class C { }");
        var at = Location.Create(tree, new TextSpan(0, 1));
        var random = new Finding(Descriptors.RandomSamplingInExactTest, at, new FixPlan());
        var seed = new Finding(Descriptors.MissingSeed, at, new FixPlan());

        Assert.Equal(new[] { random }, Precedence.Apply(new[] { seed, random }).ToList());
        Assert.Equal(new[] { seed }, Precedence.Apply(new[] { seed }).ToList());
    }
}
