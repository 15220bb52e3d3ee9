using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;

namespace Temperance.Inventory;

/// <summary>
/// Whether a project can be analysed at all. A project that is not restored, did not load, or whose LLM SDK does not
/// resolve compiles to a model without a single SDK type: the inventory would say "0 requests" and be wrong. Each check
/// gives a one-line reason that names the project, or null.
/// </summary>
public static class ProjectCheck
{
    /// <summary>The namespaces of the SDKs the analyzer knows; a using or a qualified name under one of them must resolve.</summary>
    public static readonly string[] SdkNamespaces =
    {
        "OpenAI", "Azure.AI.OpenAI", "Azure.AI.Inference", "Microsoft.Extensions.AI", "Microsoft.SemanticKernel", "Microsoft.Agents.AI",
        "OllamaSharp", "Anthropic", "LLama", "Microsoft.ML.OnnxRuntimeGenAI", "Betalgo.Ranul.OpenAI",
    };

    public static string Describe(Project project) =>
        project.FilePath is { } path ? $"project '{project.Name}' ({path})" : $"project '{project.Name}'";

    /// <summary>
    /// An SDK-style project whose restore output (project.assets.json) is missing: its package references resolve to nothing.
    /// The file is looked for above the intermediate assembly (obj/Debug/net10.0 → obj; artifacts/obj/X/debug → artifacts/obj/X).
    /// </summary>
    public static string? NotRestored(Project project)
    {
        if (project.FilePath is not { } path || !File.Exists(path))
        {
            return null;
        }

        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (IOException)
        {
            return null;
        }

        if (!text.Contains("Sdk", StringComparison.Ordinal) && !text.Contains("PackageReference", StringComparison.Ordinal))
        {
            return null; // a classic project: packages.config or nothing to restore
        }

        var folder = Path.GetDirectoryName(path)!;
        var places = new List<string> { Path.Combine(folder, "obj") };
        if (project.CompilationOutputInfo.AssemblyPath is { Length: > 0 } assembly && Path.GetDirectoryName(assembly) is { } start)
        {
            var dir = new DirectoryInfo(start);
            for (var up = 0; up < 4 && dir != null; up++, dir = dir.Parent)
            {
                places.Add(dir.FullName);
            }
        }

        if (places.Any(p => File.Exists(Path.Combine(p, "project.assets.json"))))
        {
            return null;
        }

        return $"{Describe(project)} is not restored (no {Path.GetRelativePath(folder, Path.Combine(places[0], "project.assets.json"))}); run 'dotnet restore' on it first";
    }

    /// <summary>
    /// Compile errors that hide the LLM SDK: a using directive or a qualified name under an SDK namespace that does not
    /// resolve (error CS0246/CS0234), so none of its requests can be found.
    /// </summary>
    public static string? SdkHidden(Project project, Compilation compilation, IEnumerable<string> teamNamespaces, CancellationToken cancellationToken)
    {
        var roots = SdkNamespaces.Concat(teamNamespaces).Distinct(StringComparer.Ordinal).ToList();
        var present = new Dictionary<string, bool>(StringComparer.Ordinal);
        foreach (var tree in compilation.SyntaxTrees)
        {
            var root = tree.GetRoot(cancellationToken);
            foreach (var name in Mentions(root))
            {
                var text = Flatten(name);
                var sdk = roots.FirstOrDefault(r => text == r || text.StartsWith(r + ".", StringComparison.Ordinal));
                if (sdk == null)
                {
                    continue;
                }

                if (!present.TryGetValue(sdk, out var exists))
                {
                    exists = present[sdk] = NamespaceExists(compilation, sdk);
                }

                if (exists)
                {
                    continue;
                }

                // The namespace is in no reference: confirm with the compiler's own error where the name is written.
                var model = compilation.GetSemanticModel(tree);
                if (model.GetSymbolInfo(name, cancellationToken).Symbol is INamespaceOrTypeSymbol)
                {
                    continue;
                }

                var error = model.GetDiagnostics(name.Span, cancellationToken).FirstOrDefault(d => d.Severity == DiagnosticSeverity.Error);
                var line = name.GetLocation().GetLineSpan();
                var where = $"{Path.GetFileName(line.Path)}:{line.StartLinePosition.Line + 1}";
                var why = error != null ? $"error {error.Id}: {error.GetMessage(System.Globalization.CultureInfo.InvariantCulture)}" : $"'{text}' does not resolve";
                return $"{Describe(project)} has compile errors that hide its LLM SDK ({where}: {why}); restore it or fix its package references";
            }
        }

        return null;
    }

    /// <summary>Names written as namespaces: using directives and outermost qualified names outside namespace declarations.</summary>
    private static IEnumerable<NameSyntax> Mentions(SyntaxNode root)
    {
        foreach (var node in root.DescendantNodes())
        {
            switch (node)
            {
                case UsingDirectiveSyntax { NamespaceOrType: NameSyntax name }:
                    yield return name;
                    break;
                case QualifiedNameSyntax qualified when qualified.Parent is not (QualifiedNameSyntax or UsingDirectiveSyntax or BaseNamespaceDeclarationSyntax or AliasQualifiedNameSyntax):
                    yield return qualified;
                    break;
            }
        }
    }

    private static string Flatten(NameSyntax name) => name switch
    {
        AliasQualifiedNameSyntax alias => alias.Name.Identifier.ValueText,
        QualifiedNameSyntax qualified => Flatten(qualified.Left) + "." + qualified.Right.Identifier.ValueText,
        SimpleNameSyntax simple => simple.Identifier.ValueText,
        _ => name.ToString(),
    };

    private static bool NamespaceExists(Compilation compilation, string dotted)
    {
        INamespaceSymbol? current = compilation.GlobalNamespace;
        foreach (var part in dotted.Split('.'))
        {
            current = current?.GetNamespaceMembers().FirstOrDefault(n => n.Name == part);
            if (current == null)
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>A workspace failure that is about a C# project file (others, such as an F# project, are skipped with a note).</summary>
    public static bool IsAboutCSharpProject(string message, out string? projectPath)
    {
        projectPath = null;
        var match = System.Text.RegularExpressions.Regex.Match(message, @"'([^']+\.[A-Za-z]*proj)'");
        if (!match.Success)
        {
            return true; // no path: it may be about anything, the whole input included
        }

        projectPath = match.Groups[1].Value;
        return projectPath.EndsWith(".csproj", StringComparison.OrdinalIgnoreCase);
    }
}
