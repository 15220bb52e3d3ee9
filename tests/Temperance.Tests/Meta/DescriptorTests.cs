using System.Text.RegularExpressions;
using Microsoft.CodeAnalysis;
using Temperance.Rules;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Meta;

/// <summary>Checks over every descriptor: doc page, help link, release tracking, messages, and a clean run on empty source.</summary>
public class DescriptorTests
{
    public static TheoryData<string> Ids
    {
        get
        {
            var data = new TheoryData<string>();
            foreach (var descriptor in Descriptors.All)
            {
                data.Add(descriptor.Id);
            }

            return data;
        }
    }

    private static DiagnosticDescriptor Get(string id) => Descriptors.All.Single(d => d.Id == id);

    [Fact]
    public void Ids_AreTheDesignCardsSet()
    {
        Assert.Equal(
            new[] { "SAMP001", "SAMP002", "SAMP003", "SAMP004", "SAMP005", "SAMP006", "SAMP007", "SAMP008", "SAMP009", "SAMP010", "SAMP100" },
            Descriptors.All.Select(d => d.Id).ToArray());
        Assert.Equal(Descriptors.All, new TemperanceAnalyzer().SupportedDiagnostics);
    }

    [Theory]
    [MemberData(nameof(Ids))]
    public void DocPage_ExistsWithEverySection(string id)
    {
        var path = Path.Combine(TestReferences.RulesDirectory, id + ".md");
        Assert.True(File.Exists(path), path);
        var text = File.ReadAllText(path);
        Assert.StartsWith($"# {id}: {Get(id).Title}", text, StringComparison.Ordinal);
        foreach (var section in new[] { "## Cause", "## Why it matters", "## How to fix", "## Examples", "## Configuration", "## Suppression" })
        {
            Assert.Contains(section, text, StringComparison.Ordinal);
        }

        Assert.Contains($"Default severity | {Get(id).DefaultSeverity}", text, StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(Ids))]
    public void HelpLink_PointsAtTheRulePage(string id)
    {
        Assert.Equal(Descriptors.HelpLinkBase + id + ".md", Get(id).HelpLinkUri);
        Assert.True(Uri.IsWellFormedUriString(Get(id).HelpLinkUri, UriKind.Absolute));
    }

    [Fact]
    public void HelpLinkBase_ComesFromTheRepositoryUrlProperty_AndIsAnHttpsAddressOfTheRulesFolder()
    {
        var props = File.ReadAllText(Path.Combine(TestReferences.RepositoryRoot, "Directory.Build.props"));
        var url = Regex.Match(props, @"<TemperanceRepositoryUrl[^>]*>([^<]+)</TemperanceRepositoryUrl>").Groups[1].Value.Trim();

        Assert.Equal(url.TrimEnd('/') + "/blob/main/rules/", Descriptors.HelpLinkBase);
        Assert.True(Uri.TryCreate(Descriptors.HelpLinkBase, UriKind.Absolute, out var uri), Descriptors.HelpLinkBase);
        Assert.Equal(Uri.UriSchemeHttps, uri!.Scheme);
        Assert.False(string.IsNullOrEmpty(uri.Host));
        Assert.EndsWith("/rules/", uri.AbsolutePath, StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(Ids))]
    public void ReleaseTracking_ListsTheRuleWithItsCategoryAndSeverity(string id)
    {
        var unshipped = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "releases", "AnalyzerReleases.Unshipped.md"));
        var shipped = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "releases", "AnalyzerReleases.Shipped.md"));
        var descriptor = Get(id);
        var row = new Regex($@"^{id}\s*\|\s*{descriptor.Category}\s*\|\s*{descriptor.DefaultSeverity}\s*\|", RegexOptions.Multiline);
        Assert.True(row.IsMatch(unshipped) || row.IsMatch(shipped), $"{id} missing from AnalyzerReleases files");
    }

    [Theory]
    [MemberData(nameof(Ids))]
    public void Texts_AreWritten(string id)
    {
        var descriptor = Get(id);
        Assert.False(string.IsNullOrWhiteSpace(descriptor.Title.ToString()));
        Assert.False(string.IsNullOrWhiteSpace(descriptor.Description.ToString()));
        Assert.False(descriptor.MessageFormat.ToString().EndsWith('.') && id != "SAMP100", "messages read as one sentence without a final period");
        Assert.True(descriptor.IsEnabledByDefault);
    }

    [Fact]
    public async Task EmptySource_RunsClean()
    {
        await Verify.AnalyzerAsync(string.Empty);
    }

    [Fact]
    public async Task ProjectWithoutSdks_RunsClean()
    {
        var test = new TemperanceTest("class Plain { int Add(int a, int b) => a + b; }");
        test.TestState.AdditionalReferences.Clear();
        test.TestState.AdditionalReferences.AddRange(TestReferences.Framework);
        await test.RunAsync();
    }

    [Fact]
    public async Task BrokenCode_DoesNotThrow()
    {
        // Half-typed code in the editor: the analyzer must not throw (AD0001 would fail this test).
        var test = new TemperanceTest("""
            using OpenAI.Chat;

            class Typing
            {
                ChatCompletionOptions A() => new ChatCompletionOptions { Temperature = , TopP = 3f };
                void B(ChatCompletionOptions o) { o.Temperature = ; }
            }
            """);
        test.CompilerDiagnostics = Microsoft.CodeAnalysis.Testing.CompilerDiagnostics.None;
        test.ExpectedDiagnostics.Add(Verify.Diagnostic("SAMP005").WithSpan(5, 78, 5, 87));
        await test.RunAsync();
    }

    [Fact]
    public void RulePages_MentionOnlyKeysThatExist()
    {
        var known = RulesTable.Entries.Select(e => e.Key).ToHashSet(StringComparer.Ordinal);
        var patterns = new[] { "temperance.task", "temperance.test_seed", "temperance.task.<kind>", "temperance.provider.<provider>", "temperance.model.<family>", "temperance.task.creative.temperature", "temperance.globalconfig", "temperance.provider.generic", "temperance.adapter.<name>", "temperance.model.harbour_reasoner", "temperance.test_attributes", "temperance.extreme_temprature" /* the misspelling SAMP100.md shows */, "temperance.surface.<name>", "temperance.raw_json", "temperance.deployment." /* any deployment name is a key */ };
        foreach (var page in Directory.GetFiles(TestReferences.RulesDirectory, "SAMP*.md"))
        {
            foreach (Match match in Regex.Matches(File.ReadAllText(page), @"temperance\.[a-z_<>.]+[a-z_>]"))
            {
                var key = match.Value;
                Assert.True(known.Contains(key) || patterns.Any(p => key.StartsWith(p, StringComparison.Ordinal)), $"{Path.GetFileName(page)} mentions unknown key {key}");
            }
        }
    }
}
