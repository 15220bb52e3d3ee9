using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Extraction;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Tests.Infrastructure;

/// <summary>
/// Runs the real extraction pass (collector + builder) over every member body of a snippet, so tests can assert on
/// the request model itself: provider, model id, response shape, candidate count, context.
/// </summary>
public static class Extract
{
    internal static IReadOnlyList<Request> Requests(string source)
    {
        var tree = CSharpSyntaxTree.ParseText(source, new CSharpParseOptions(LanguageVersion.Latest));
        var compilation = CSharpCompilation.Create(
            "Snippet", new[] { tree }, TestReferences.All,
            new CSharpCompilationOptions(OutputKind.DynamicallyLinkedLibrary, nullableContextOptions: NullableContextOptions.Enable)
                .WithSpecificDiagnosticOptions(new[] { "OPENAI001", "SCME0001", "SKEXP0001", "SKEXP0010", "MEAI001" }
                    .Select(id => new KeyValuePair<string, ReportDiagnostic>(id, ReportDiagnostic.Suppress))));
        var errors = compilation.GetDiagnostics().Where(d => d.Severity == DiagnosticSeverity.Error).ToList();
        Assert.True(errors.Count == 0, "snippet does not compile: " + string.Join("\n", errors));

        var model = compilation.GetSemanticModel(tree);
        var catalog = SurfaceCatalog.Resolve(compilation);
        var tests = TestFrameworks.Resolve(compilation);
        var requests = new List<Request>();
        foreach (var (operation, owner) in MemberBlocks.Of(tree, model))
        {
            var collector = BlockCollector.Collect(catalog, new[] { operation });
            if (collector != null)
            {
                requests.AddRange(RequestBuilder.Build(catalog, new CallContext(owner, owner?.ContainingType, tests.IsTest(owner)), collector, new[] { operation }).Select(r => r.Request));
            }
        }

        return requests;
    }

    internal static Request Single(string source)
    {
        var requests = Requests(source);
        Assert.True(requests.Count == 1, $"expected one request, found {requests.Count}");
        return requests[0];
    }

    internal static (ValueKind Kind, double Value) Setting(this Request request, Setting setting)
    {
        var value = request.Value(setting);
        return (value.Kind, value.Value);
    }
}
