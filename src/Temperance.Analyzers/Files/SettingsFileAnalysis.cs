using System;
using System.IO;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Text;
using Temperance.Policy;
using Temperance.Rules;
using Temperance.Surfaces;

namespace Temperance.Files
{
    /// <summary>
    /// One additional file: decide what kind of settings file it is (by name first, then by its keys), read its requests and
    /// judge them with the same rules and the policy of the file's own path. A file that cannot be parsed but mentions a
    /// sampling key gets one SAMP100 naming the file and the parser's message, never a silent skip.
    /// </summary>
    internal static class SettingsFileAnalysis
    {
        public static void Analyze(AdditionalFileAnalysisContext context, bool inTestProject, SettingsFileContext shared)
        {
            try
            {
                AnalyzeFile(context, inTestProject, shared);
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                // A parser's surprise is the file's problem, not the build's: said once, naming the file, never a crash.
                ReportUnreadable(context, context.AdditionalFile.GetText(context.CancellationToken) ?? SourceText.From(string.Empty),
                    new FileParseError(e.Message, 1, 1));
            }
        }

        private static void AnalyzeFile(AdditionalFileAnalysisContext context, bool inTestProject, SettingsFileContext shared)
        {
            var path = context.AdditionalFile.Path;
            var kind = KindOf(path);
            if (kind == FileKind.None)
            {
                return;
            }

            var text = context.AdditionalFile.GetText(context.CancellationToken);
            if (text == null)
            {
                return;
            }

            var content = text.ToString();
            if (!FileSurfaces.MayHoldSettings(content))
            {
                return; // nearly free for the many files without a sampling key
            }

            if (kind == FileKind.AppSettings)
            {
                // Configuration is judged where C# copies it into a request; here only that the file can be read at all.
                if (!inTestProject)
                {
                    ReportUnreadable(context, text, JsonFileReader.Validate(content));
                }

                return;
            }

            var surface = SurfaceOf(kind);
            var sibling = surface?.SiblingPrompt is { } siblingName ? shared.Find(path, siblingName, context.CancellationToken) : null;
            var requests = FileRequestReader.Read(path, text, surface, sibling, inTestProject, out var error);
            // A YAML file that does not parse is ours to report only when it reads like a template or an agent definition: a
            // Helm chart with Go templating and a "seed:" key is nobody's prompt.
            // A test project's files are its test data, broken ones included.
            if (!inTestProject && (kind != FileKind.Yaml || FileSurfaces.LooksLikeYamlSettings(content)) && ReportUnreadable(context, text, error) || error != null || requests.Count == 0)
            {
                return;
            }

            var policy = shared.PolicyFor(context.Options.AnalyzerConfigOptionsProvider.GetOptions(context.AdditionalFile),
                context.Options.AnalyzerConfigOptionsProvider.GlobalOptions);
            TemperanceAnalyzer.Judge(requests, policy, context.ReportDiagnostic);
        }

        internal enum FileKind
        {
            None,
            PromptDirectory,
            Yaml,
            FrontMatter,
            AppSettings,
        }

        /// <summary>What a file is by its name alone (the inventory asks the same question).</summary>
        internal static FileKind KindOf(string path)
        {
            var name = Path.GetFileName(path);
            if (name.Equals("config.json", StringComparison.OrdinalIgnoreCase))
            {
                return FileKind.PromptDirectory;
            }

            if (name.StartsWith("appsettings", StringComparison.OrdinalIgnoreCase) && name.EndsWith(".json", StringComparison.OrdinalIgnoreCase))
            {
                return FileKind.AppSettings;
            }

            if (name.EndsWith(".yaml", StringComparison.OrdinalIgnoreCase) || name.EndsWith(".yml", StringComparison.OrdinalIgnoreCase))
            {
                return FileKind.Yaml;
            }

            return FrontMatterExtensions.Any(e => name.EndsWith(e, StringComparison.OrdinalIgnoreCase)) ? FileKind.FrontMatter : FileKind.None;
        }

        /// <summary>The surface a kind of file always has; null for YAML (a template or an agent definition, told apart by its keys).</summary>
        internal static FileSurface? SurfaceOf(FileKind kind) => kind switch
        {
            FileKind.PromptDirectory => FileSurfaces.PromptDirectory,
            FileKind.FrontMatter => FileSurfaces.FrontMatterPrompt,
            _ => null,
        };

        /// <summary>Prompt files with a front matter of model parameters: Prompty, the .prompt format and Markdown prompt files.</summary>
        internal static readonly string[] FrontMatterExtensions = { ".prompty", ".prompt", ".prompt.md" };

        /// <summary>The file as messages name it: its folder and name (<c>Poem/config.json</c>), enough to find it in a project.</summary>
        private static string ShortName(string path)
        {
            var folder = Path.GetFileName(Path.GetDirectoryName(path) ?? string.Empty);
            return string.IsNullOrEmpty(folder) ? Path.GetFileName(path) : folder + "/" + Path.GetFileName(path);
        }

        private static bool ReportUnreadable(AdditionalFileAnalysisContext context, SourceText text, FileParseError? error)
        {
            if (error == null)
            {
                return false;
            }

            var line = Math.Max(0, Math.Min(error.Line - 1, text.Lines.Count - 1));
            var position = new LinePosition(line, Math.Max(0, Math.Min(error.Column - 1, text.Lines[line].Span.Length)));
            var start = text.Lines.GetPosition(position);
            var span = new TextSpan(start, 0);
            var location = Location.Create(context.AdditionalFile.Path, span, new LinePositionSpan(position, position));
            // SAMP100 with the file in place of a key: the file's content is the value that could not be used.
            var syntax = FileRequestReader.SyntaxOf(context.AdditionalFile.Path) == SettingsFileSyntax.Json ? "JSON" : "YAML";
            context.ReportDiagnostic(Diagnostic.Create(Descriptors.InvalidConfiguration, location, ShortName(context.AdditionalFile.Path), error.Message,
                $"{syntax} that parses (the parser stopped at line {error.Line}, column {error.Column}); its sampling settings are not checked"));
            return true;
        }
    }

    /// <summary>
    /// What settings files share within one compilation: the prompt files that sit beside them (skprompt.txt), by folder,
    /// indexed once so a project with hundreds of prompt directories does not scan every additional file for every
    /// config.json; and their policies, one per distinct set of keys.
    /// </summary>
    internal sealed class SettingsFileContext
    {
        private readonly System.Collections.Immutable.ImmutableArray<AdditionalText> files;
        private System.Collections.Generic.Dictionary<string, AdditionalText>? byFolderAndName;

        public SettingsFileContext(System.Collections.Immutable.ImmutableArray<AdditionalText> files)
        {
            this.files = files;
        }

        public string? Find(string path, string name, System.Threading.CancellationToken cancellationToken)
        {
            var index = System.Threading.LazyInitializer.EnsureInitialized(ref byFolderAndName, Index)!;
            return index.TryGetValue(Key(Path.GetDirectoryName(path), name), out var sibling) ? sibling.GetText(cancellationToken)?.ToString() : null;
        }

        private System.Collections.Generic.Dictionary<string, AdditionalText> Index()
        {
            var index = new System.Collections.Generic.Dictionary<string, AdditionalText>(StringComparer.Ordinal);
            foreach (var file in files)
            {
                index[Key(Path.GetDirectoryName(file.Path), Path.GetFileName(file.Path))] = file;
            }

            return index;
        }

        private static string Key(string? folder, string name) => (folder ?? string.Empty) + "|" + name.ToLowerInvariant();

        /// <summary>
        /// One policy per distinct set of <c>temperance.*</c> keys a file's .editorconfig sections give it: most files share
        /// one, and a policy reads the rules table's families once instead of once per file (measured: 76 µs → 8 µs a file).
        /// </summary>
        public Policy.TemperancePolicy PolicyFor(Microsoft.CodeAnalysis.Diagnostics.AnalyzerConfigOptions fileOptions,
            Microsoft.CodeAnalysis.Diagnostics.AnalyzerConfigOptions globalOptions)
        {
            var signature = new System.Text.StringBuilder();
            foreach (var key in System.Linq.Enumerable.OrderBy(fileOptions.Keys, k => k, StringComparer.Ordinal))
            {
                if (key.StartsWith(Policy.OptionKeys.Prefix, StringComparison.Ordinal) && fileOptions.TryGetValue(key, out var value))
                {
                    signature.Append(key).Append('=').Append(value).Append('\n');
                }
            }

            return policies.GetOrAdd(signature.ToString(), _ => new Policy.TemperancePolicy(fileOptions, globalOptions));
        }

        private readonly System.Collections.Concurrent.ConcurrentDictionary<string, Policy.TemperancePolicy> policies =
            new System.Collections.Concurrent.ConcurrentDictionary<string, Policy.TemperancePolicy>(StringComparer.Ordinal);
    }
}
