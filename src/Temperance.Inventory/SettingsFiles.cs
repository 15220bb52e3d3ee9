using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Text;
using Temperance.Files;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Inventory;

/// <summary>
/// The settings files of a project for the inventory: the project's own additional files (the package adds them in a
/// build), plus, for a project that does not reference the package, the files the package would add, found in the
/// project's folder with the package's default globs.
/// </summary>
internal static class SettingsFiles
{
    private static readonly string[] Patterns = { "*.yaml", "*.yml", "*.prompty", "*.prompt", "*.prompt.md", "config.json", "skprompt.txt", "appsettings*.json" };

    public static ImmutableArray<AdditionalText> Of(Project project)
    {
        var files = new Dictionary<string, AdditionalText>(StringComparer.Ordinal);
        foreach (var document in project.AdditionalDocuments)
        {
            if (document.FilePath != null)
            {
                files[Path.GetFullPath(document.FilePath)] = new FileText(document.FilePath);
            }
        }

        if (Path.GetDirectoryName(project.FilePath) is { } folder && Directory.Exists(folder))
        {
            foreach (var pattern in Patterns)
            {
                foreach (var path in Directory.EnumerateFiles(folder, pattern, SearchOption.AllDirectories))
                {
                    if (!IsBuildOutput(folder, path) && (Path.GetFileName(path) != "config.json" || File.Exists(Path.Combine(Path.GetDirectoryName(path)!, "skprompt.txt"))))
                    {
                        files.TryAdd(Path.GetFullPath(path), new FileText(path));
                    }
                }
            }
        }

        return files.Values.ToImmutableArray();
    }

    /// <summary>Every request the analyzer's file front end reads in these files, with the file it came from.</summary>
    public static IEnumerable<(AdditionalText File, Request Request)> Requests(ImmutableArray<AdditionalText> files, bool inTestProject, CancellationToken cancellationToken)
    {
        var siblings = new SettingsFileContext(files);
        foreach (var file in files)
        {
            // The analyzer's own classification; appsettings files are read where C# binds them, not as requests.
            var kind = SettingsFileAnalysis.KindOf(file.Path);
            var surface = SettingsFileAnalysis.SurfaceOf(kind);
            if (kind is SettingsFileAnalysis.FileKind.None or SettingsFileAnalysis.FileKind.AppSettings
                || file.GetText(cancellationToken) is not { } text || !FileSurfaces.MayHoldSettings(text.ToString()))
            {
                continue;
            }

            var sibling = surface?.SiblingPrompt is { } siblingName ? siblings.Find(file.Path, siblingName, cancellationToken) : null;
            foreach (var extracted in FileRequestReader.Read(file.Path, text, surface, sibling, inTestProject, out _))
            {
                yield return (file, extracted.Request);
            }
        }
    }

    /// <summary>A request read from a settings file (its location is in the file, not in a syntax tree).</summary>
    public static bool IsFileRequest(Request request) => request.Location.Kind == LocationKind.ExternalFile;

    /// <summary>A value that configuration decided (an appsettings file named in its origin).</summary>
    public static bool FromConfiguration(SettingWrite write) => write.Origin?.Contains("appsettings", StringComparison.OrdinalIgnoreCase) == true;

    private static bool IsBuildOutput(string folder, string path)
    {
        var relative = Path.GetRelativePath(folder, path).Replace('\\', '/');
        return relative.StartsWith("bin/", StringComparison.Ordinal) || relative.StartsWith("obj/", StringComparison.Ordinal)
            || relative.Contains("/bin/", StringComparison.Ordinal) || relative.Contains("/obj/", StringComparison.Ordinal)
            || relative.Split('/').Any(part => part.StartsWith('.') && part.Length > 1) || relative.Contains("node_modules", StringComparison.Ordinal);
    }

    /// <summary>A file on disk as the analyzer reads additional files.</summary>
    private sealed class FileText : AdditionalText
    {
        private readonly Lazy<SourceText?> text;

        public FileText(string path)
        {
            Path = path;
            text = new Lazy<SourceText?>(() =>
            {
                try
                {
                    using var stream = File.OpenRead(path);
                    return SourceText.From(stream);
                }
                catch (IOException)
                {
                    return null;
                }
                catch (UnauthorizedAccessException)
                {
                    return null;
                }
            });
        }

        public override string Path { get; }

        public override SourceText? GetText(CancellationToken cancellationToken = default) => text.Value;
    }
}
