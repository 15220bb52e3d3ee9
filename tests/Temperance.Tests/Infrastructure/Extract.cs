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
        foreach (var node in tree.GetRoot().DescendantNodes())
        {
            // The same blocks the analyzer sees: method/accessor bodies and field/property initializers.
            if (node is not (Microsoft.CodeAnalysis.CSharp.Syntax.BaseMethodDeclarationSyntax
                or Microsoft.CodeAnalysis.CSharp.Syntax.AccessorDeclarationSyntax
                or Microsoft.CodeAnalysis.CSharp.Syntax.EqualsValueClauseSyntax { Parent: Microsoft.CodeAnalysis.CSharp.Syntax.VariableDeclaratorSyntax { Parent.Parent: Microsoft.CodeAnalysis.CSharp.Syntax.FieldDeclarationSyntax } or Microsoft.CodeAnalysis.CSharp.Syntax.PropertyDeclarationSyntax }
                or Microsoft.CodeAnalysis.CSharp.Syntax.ArrowExpressionClauseSyntax { Parent: Microsoft.CodeAnalysis.CSharp.Syntax.PropertyDeclarationSyntax }))
            {
                continue;
            }

            var operation = model.GetOperation(node);
            if (operation == null)
            {
                continue;
            }

            var owner = node is Microsoft.CodeAnalysis.CSharp.Syntax.EqualsValueClauseSyntax or Microsoft.CodeAnalysis.CSharp.Syntax.ArrowExpressionClauseSyntax
                ? model.GetDeclaredSymbol(node.Parent is Microsoft.CodeAnalysis.CSharp.Syntax.VariableDeclaratorSyntax v ? v : node.Parent!)
                : model.GetDeclaredSymbol(node);
            var collector = BlockCollector.Collect(catalog, new[] { operation });
            if (collector != null)
            {
                requests.AddRange(RequestBuilder.Build(catalog, new CallContext(owner, owner?.ContainingType, tests.IsTest(owner)), collector, new[] { operation }));
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
        var kind = request.KindOf(setting, out var value);
        return (kind, value);
    }
}
