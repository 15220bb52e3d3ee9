using System;
using System.Collections.Generic;
using System.Globalization;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Text;
using Temperance.Extraction;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Files
{
    /// <summary>
    /// The second front end: turns each settings block of a settings file into a <see cref="Request"/> of the same model C#
    /// requests have, so the same policy and rules judge it. What the file kinds look like is declared in
    /// <see cref="FileSurfaces"/>; this reads any of them the same way.
    /// </summary>
    internal static class FileRequestReader
    {
        private static readonly CallContext FileContext = new CallContext(null, null, isTest: false);
        private static readonly CallContext TestDataContext = new CallContext(null, null, isTest: false, inTestCode: true);

        /// <summary>
        /// The requests in one file, or the parse error that stopped the reading. <paramref name="siblingPrompt"/> is the text
        /// of the prompt file beside it (a prompt directory's skprompt.txt), when the build passed it.
        /// </summary>
        public static IReadOnlyList<ExtractedRequest> Read(string path, SourceText text, FileSurface? surface, string? siblingPrompt, bool inTestProject, out FileParseError? error)
        {
            error = null;
            var root = Parse(text, surface?.Syntax ?? SyntaxOf(path), out error, out var body);
            if (root == null || root.Kind != FileNodeKind.Mapping)
            {
                return Array.Empty<ExtractedRequest>();
            }

            surface ??= FileSurfaces.Yaml.FirstOrDefault(s => Recognises(s, root));
            if (surface == null || !Recognises(surface, root))
            {
                return Array.Empty<ExtractedRequest>();
            }

            var file = new FileFacts(path, text, surface, root, body, siblingPrompt);
            var requests = new List<ExtractedRequest>();
            foreach (var (blockKey, block, blockName) in Blocks(root, surface))
            {
                requests.Add(new ExtractedRequest(BuildRequest(file, blockKey, block, blockName, inTestProject), FixAnchors.None));
            }

            return requests;
        }

        /// <summary>The syntax a file is read with, from its name (used when no surface is known up front).</summary>
        public static SettingsFileSyntax SyntaxOf(string path) =>
            path.EndsWith(".json", StringComparison.OrdinalIgnoreCase) ? SettingsFileSyntax.Json
            : path.EndsWith(".yaml", StringComparison.OrdinalIgnoreCase) || path.EndsWith(".yml", StringComparison.OrdinalIgnoreCase) ? SettingsFileSyntax.Yaml
            : SettingsFileSyntax.FrontMatter;

        public static FileNode? Parse(SourceText text, SettingsFileSyntax syntax, out FileParseError? error, out string? body)
        {
            body = null;
            error = null;
            switch (syntax)
            {
                case SettingsFileSyntax.Json:
                    return JsonFileReader.Read(text, out error);
                case SettingsFileSyntax.Yaml:
                    return YamlFileReader.Read(text, new TextSpan(0, text.Length), out error);
                default:
                    if (YamlFileReader.FrontMatter(text) is not { } yaml)
                    {
                        return null;
                    }

                    var close = text.Lines.GetLineFromPosition(yaml.End);
                    body = text.ToString(TextSpan.FromBounds(Math.Min(text.Length, close.EndIncludingLineBreak), text.Length));
                    return YamlFileReader.Read(text, yaml, out error);
            }
        }

        private static bool Recognises(FileSurface surface, FileNode root) =>
            surface.RecognisedBy.Any(path => root.At(path) is { Kind: FileNodeKind.Mapping })
            && (surface.AlsoNeedsOneOf.Length == 0 || surface.AlsoNeedsOneOf.Any(path => root.At(path) != null));

        private static IEnumerable<(FileEntry Key, FileNode Block, string? Name)> Blocks(FileNode root, FileSurface surface)
        {
            foreach (var path in surface.Blocks)
            {
                var parent = path.Length == 1 ? root : root.At(path.Take(path.Length - 1).ToArray());
                if (parent == null)
                {
                    continue;
                }

                if (path[path.Length - 1] == "*")
                {
                    foreach (var entry in parent.Entries.Where(e => e.Value.Kind == FileNodeKind.Mapping))
                    {
                        yield return (entry, entry.Value, entry.Key);
                    }
                }
                else if (parent.Entry(path[path.Length - 1]) is { Value.Kind: FileNodeKind.Mapping } entry)
                {
                    yield return (entry, entry.Value, null);
                }
            }
        }

        private static Request BuildRequest(FileFacts file, FileEntry blockKey, FileNode block, string? service, bool inTestProject)
        {
            var writes = new List<SettingWrite>();
            var modes = new Dictionary<string, ModeValue>();
            var shape = ResponseShape.Unspecified;
            string? shapeEvidence = null;
            foreach (var entry in block.Entries)
            {
                if (FileSurfaces.Keys.TryGetValue(entry.Key, out var setting))
                {
                    if (entry.Value.Kind == FileNodeKind.Scalar && entry.Value.Text == null)
                    {
                        continue; // null: not set
                    }

                    var known = entry.Value.Kind == FileNodeKind.Scalar && double.TryParse(entry.Value.Text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value)
                        && !double.IsNaN(value) && !double.IsInfinity(value); // NaN and infinities bind to nothing a provider takes: Unknown
                    writes.Add(new SettingWrite(setting, known ? ValueKind.Known : ValueKind.Unknown, known ? double.Parse(entry.Value.Text!, NumberStyles.Float, CultureInfo.InvariantCulture) : 0,
                        entry.Key, file.Location(entry.Span), null, setting is Setting.Seed or Setting.TopK or Setting.Candidates ? NumericKind.Int : NumericKind.Double, fromConditional: false,
                        origin: known ? null : $"'{entry.Value.Text ?? "…"}', computed when the file is loaded", fromKey: true,
                        inFile: new FileSpans(entry.Value.Span, entry.Removal)));
                }
                else if (FileSurfaces.ModeKeys.TryGetValue(entry.Key, out var mode))
                {
                    var node = mode.Member == null ? entry.Value : entry.Value.At(mode.Member);
                    var constant = node is { Kind: FileNodeKind.Scalar, Text: { } t } && !IsComputed(t) ? t.ToLowerInvariant() : null;
                    modes[mode.Mode] = new ModeValue(mode.Mode, constant, $"'{entry.Key}{(mode.Member == null ? string.Empty : "." + mode.Member)}: {node?.Text}' in {file.FileName}");
                }
                else if (Array.IndexOf(FileSurfaces.FormatKeys, entry.Key) >= 0)
                {
                    var format = entry.Value.Kind == FileNodeKind.Scalar ? entry.Value.Text : entry.Value.TextOf("type");
                    shape = format switch
                    {
                        "json_schema" => ResponseShape.JsonSchema,
                        "json_object" => ResponseShape.JsonObject,
                        "text" => ResponseShape.Text,
                        _ => shape,
                    };
                    shapeEvidence = $"'{entry.Key}: {format}' in {file.FileName}";
                }
            }

            if (shape == ResponseShape.Unspecified && file.Surface.SchemaPaths.FirstOrDefault(p => file.Root.At(p) != null) is { } schema)
            {
                shape = ResponseShape.JsonSchema;
                shapeEvidence = $"'{string.Join(".", schema)}' in {file.FileName}";
            }

            var model = block.Entries.Where(e => Array.IndexOf(file.Surface.BlockModelKeys, e.Key) >= 0).Select(e => e.Value.Text).FirstOrDefault(t => t != null)
                ?? file.Surface.ModelPaths.Select(p => file.Root.At(p)).FirstOrDefault(n => n is { Kind: FileNodeKind.Scalar, Text: not null })?.Text;
            var provider = service != null && FileSurfaces.ServiceProviders.TryGetValue(service, out var byService) ? byService
                : file.Surface.ProviderPath != null && file.Root.At(file.Surface.ProviderPath)?.Text is { } named
                && file.Surface.ProviderValues.TryGetValue(named, out var mapped) ? mapped : Providers.Generic;

            return new Request
            {
                Provider = provider,
                // The kind of file, and the service for a block of several: where the file is, the location says.
                Surface = service == null ? file.Surface.Name : $"{file.Surface.Name} (service '{service}')",
                Location = file.Location(blockKey.KeySpan),
                Context = inTestProject ? TestDataContext : FileContext,
                // A YAML merge key (<<: *base) brings settings this reader does not follow: what the block does not write is
                // then Unknown, not the provider's default.
                OriginVisible = block.Entry("<<") == null,
                Writes = writes,
                ModelId = ModelIdOf(model),
                ResponseShape = shape,
                ResponseShapeEvidence = shapeEvidence,
                Modes = modes,
                // A prompt-template loader sends what the file says; a test project's files are its test data.
                Reach = inTestProject ? Reach.Escapes : Reach.Sent,
                ReachNote = inTestProject ? "a settings file in a test project" : null,
                TaskSignals = file.TaskSignals(),
                SeedAvailable = true,
            };
        }

        /// <summary>A model id as written, without a provider prefix (<c>googleai/gemini-2.5-flash</c>); null when computed.</summary>
        private static string? ModelIdOf(string? written)
        {
            if (string.IsNullOrWhiteSpace(written) || IsComputed(written!))
            {
                return null;
            }

            var slash = written!.LastIndexOf('/');
            return slash >= 0 ? written.Substring(slash + 1) : written.Trim();
        }

        /// <summary>Text the loader fills in at run time: <c>=Env.X</c>, <c>{{$var}}</c>, <c>${env:X}</c>.</summary>
        private static bool IsComputed(string text) =>
            text.StartsWith("=", StringComparison.Ordinal) || text.Contains("{{") || text.Contains("${");

        /// <summary>What one file says about itself, read once for all its blocks.</summary>
        private sealed class FileFacts
        {
            private IReadOnlyList<TaskSignal>? signals;

            public FileFacts(string path, SourceText text, FileSurface surface, FileNode root, string? body, string? siblingPrompt)
            {
                Path = path;
                Text = text;
                Surface = surface;
                Root = root;
                Body = body;
                SiblingPrompt = siblingPrompt;
                FileName = surface.FileName != null ? $"{DirectoryName(path)}/{surface.FileName}" : System.IO.Path.GetFileName(path);
            }

            public string Path { get; }
            public SourceText Text { get; }
            public FileSurface Surface { get; }
            public FileNode Root { get; }
            public string? Body { get; }
            public string? SiblingPrompt { get; }
            /// <summary>How messages name the file: "Poem/config.json", "agent.yaml".</summary>
            public string FileName { get; }

            public Location Location(TextSpan span) => Microsoft.CodeAnalysis.Location.Create(Path, span, Text.Lines.GetLinePositionSpan(span));

            public IReadOnlyList<TaskSignal> TaskSignals()
            {
                if (signals != null)
                {
                    return signals;
                }

                var found = new List<TaskSignal>();
                // The function's name: its name key, else (a prompt directory) the directory's name.
                var name = Surface.NamePaths.Select(p => Root.At(p)?.Text).FirstOrDefault(t => t != null)
                    ?? (Surface.FileName != null ? DirectoryName(Path) : null);
                if (name != null && TaskSignalReader.KindOfName(name) is { } kind)
                {
                    found.Add(new TaskSignal(kind, TaskSignalSource.Name, $"the function name '{name}' in {FileName}"));
                }

                var texts = Surface.PromptPaths.Select(p => Root.At(p)?.Text).Where(t => t != null).Select(t => t!).ToList();
                if (Body != null)
                {
                    texts.Add(Body);
                }

                if (SiblingPrompt != null)
                {
                    texts.Add(SiblingPrompt);
                }

                found.AddRange(TaskSignalReader.FromTexts(texts));
                return signals = found;
            }

            private static string DirectoryName(string path)
            {
                var directory = System.IO.Path.GetDirectoryName(path) ?? string.Empty;
                return System.IO.Path.GetFileName(directory.TrimEnd('/', '\\'));
            }
        }
    }
}
