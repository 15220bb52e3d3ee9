using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CodeActions;
using Microsoft.CodeAnalysis.CodeFixes;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Text;
using Temperance.CodeFixes;

namespace Temperance.Tests.Infrastructure;

/// <summary>
/// Applies a fix to a settings file the way an IDE does: the analyzer runs on a workspace project that has the file as an
/// additional document, and the fixer gets a <see cref="CodeFixContext"/> for that document. Needed because the testing
/// library (Microsoft.CodeAnalysis.Testing 1.1.4) only fixes diagnostics whose location is in a C# document: its
/// FixEachAnalyzerDiagnosticAsync keeps diagnostics with <c>Solution.GetDocument(location.SourceTree) is object</c>.
/// </summary>
public static class FileFixRunner
{
    /// <summary>The file after applying action <paramref name="actionIndex"/> of the first <paramref name="id"/> diagnostic in it.</summary>
    public static async Task<string> ApplyAsync(string path, string content, string id, int actionIndex = 0)
    {
        var (actions, file) = await FixesAsync(path, content, id);
        if (actionIndex >= actions.Count)
        {
            throw new InvalidOperationException($"{actions.Count} fixes offered: {string.Join(", ", actions.Select(a => a.Title))}");
        }

        var operations = await actions[actionIndex].GetOperationsAsync(CancellationToken.None);
        var changed = operations.OfType<ApplyChangesOperation>().Single().ChangedSolution;
        return (await changed.GetAdditionalDocument(file)!.GetTextAsync()).ToString();
    }

    /// <summary>The titles of the fixes offered for the first <paramref name="id"/> diagnostic in the file.</summary>
    public static async Task<IReadOnlyList<string>> TitlesAsync(string path, string content, string id) =>
        (await FixesAsync(path, content, id)).Actions.Select(a => a.Title).ToList();

    private static async Task<(List<CodeAction> Actions, DocumentId File)> FixesAsync(string path, string content, string id)
    {
        using var workspace = new AdhocWorkspace();
        var project = workspace.AddProject(ProjectInfo.Create(ProjectId.CreateNewId(), VersionStamp.Default, "Consumer", "Consumer", LanguageNames.CSharp,
            metadataReferences: TestReferences.Framework));
        project = project.AddDocument("Placeholder.cs", "class Placeholder { }", filePath: "/Placeholder.cs").Project;
        project = project.AddAnalyzerConfigDocument("/.globalconfig", SourceText.From(TestReferences.RulesTable), filePath: "/.globalconfig").Project;
        var file = project.AddAdditionalDocument(Path.GetFileName(path), SourceText.From(content), filePath: path);
        project = file.Project;

        var compilation = (await project.GetCompilationAsync())!;
        var analyzers = compilation.WithAnalyzers(ImmutableArray.Create<DiagnosticAnalyzer>(new TemperanceAnalyzer()), project.AnalyzerOptions);
        var diagnostics = await analyzers.GetAnalyzerDiagnosticsAsync();
        var diagnostic = diagnostics.FirstOrDefault(d => d.Id == id && d.Location.GetLineSpan().Path == path)
            ?? throw new InvalidOperationException($"no {id} in {path}; found: {string.Join(", ", diagnostics.Select(d => d.ToString()))}");

        var actions = new List<CodeAction>();
        var document = project.GetAdditionalDocument(file.Id)!;
        var context = new CodeFixContext(document, diagnostic, (action, _) => actions.Add(action), CancellationToken.None);
        await new TemperanceCodeFixProvider().RegisterCodeFixesAsync(context);
        return (actions, file.Id);
    }
}
