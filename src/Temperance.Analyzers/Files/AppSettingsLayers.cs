using System;
using System.Collections.Generic;
using System.Collections.Immutable;
using System.IO;
using System.Linq;
using System.Threading;
using Microsoft.CodeAnalysis;
using Temperance.Surfaces;

namespace Temperance.Files
{
    /// <summary>
    /// The build's appsettings files as the host layers them: appsettings.json, then one appsettings.{Environment}.json at a
    /// time over it. Each file is flattened to ':'-joined keys, ignoring case, as the JSON configuration provider does. Only the
    /// files beside the shallowest appsettings.json count: the host reads them from its content root, the project directory,
    /// and copies elsewhere (test data, templates) are not this application's configuration.
    /// </summary>
    internal sealed class AppSettingsLayers
    {
        private static readonly AppSettingsLayer[] NoLayers = new AppSettingsLayer[0];

        private AppSettingsLayers(AppSettingsLayer? baseLayer, IReadOnlyList<AppSettingsLayer> environments)
        {
            Base = baseLayer;
            Environments = environments;
        }

        /// <summary>appsettings.json; null when the build passed none.</summary>
        public AppSettingsLayer? Base { get; }

        /// <summary>Each appsettings.{Environment}.json beside it, by file name.</summary>
        public IReadOnlyList<AppSettingsLayer> Environments { get; }

        public static AppSettingsLayers Read(ImmutableArray<AdditionalText> files, string? projectDirectory, CancellationToken cancellationToken)
        {
            var candidates = files.Where(f => EnvironmentOf(Path.GetFileName(f.Path)) != null).ToList();
            if (candidates.Count == 0)
            {
                return new AppSettingsLayers(null, NoLayers);
            }

            // The project's folder when the build says which it is; else the top-most folder holding an appsettings.json.
            var bases = candidates.Where(f => EnvironmentOf(Path.GetFileName(f.Path)) == string.Empty).ToList();
            var root = !string.IsNullOrEmpty(projectDirectory) ? projectDirectory!.TrimEnd('/', '\\')
                : bases.Count > 0
                ? Path.GetDirectoryName(bases.OrderBy(f => f.Path.Length).ThenBy(f => f.Path, StringComparer.Ordinal).First().Path)
                : Path.GetDirectoryName(candidates.OrderBy(f => f.Path.Length).ThenBy(f => f.Path, StringComparer.Ordinal).First().Path);
            AppSettingsLayer? baseLayer = null;
            var environments = new List<AppSettingsLayer>();
            foreach (var file in candidates.Where(f => string.Equals(Path.GetDirectoryName(f.Path), root, StringComparison.Ordinal))
                .OrderBy(f => Path.GetFileName(f.Path), StringComparer.OrdinalIgnoreCase))
            {
                var layer = AppSettingsLayer.Read(file, cancellationToken);
                if (EnvironmentOf(layer.FileName) == string.Empty)
                {
                    baseLayer ??= layer;
                }
                else
                {
                    environments.Add(layer);
                }
            }

            return new AppSettingsLayers(baseLayer, environments);
        }

        /// <summary>"" for appsettings.json, "Production" for appsettings.Production.json, null for any other name.</summary>
        private static string? EnvironmentOf(string name)
        {
            var stem = ConfigurationSurface.FileStem;
            var extension = ConfigurationSurface.FileExtension;
            if (!name.StartsWith(stem, StringComparison.OrdinalIgnoreCase) || !name.EndsWith(extension, StringComparison.OrdinalIgnoreCase))
            {
                return null;
            }

            if (name.Length == stem.Length + extension.Length)
            {
                return string.Empty;
            }

            // appsettings.{Environment}.json: one name between the dots.
            var middle = name.Substring(stem.Length, name.Length - stem.Length - extension.Length);
            return middle.Length > 1 && middle[0] == '.' && middle.IndexOf('.', 1) < 0 ? middle.Substring(1) : null;
        }
    }

    /// <summary>One appsettings file: its name, whether it could be read, and its scalar values by flattened key (ignoring case).</summary>
    internal sealed class AppSettingsLayer
    {
        private readonly Dictionary<string, FileNode> values;

        private AppSettingsLayer(string fileName, bool readable, Dictionary<string, FileNode> values)
        {
            FileName = fileName;
            Readable = readable;
            this.values = values;
        }

        public string FileName { get; }

        /// <summary>
        /// False when the file does not parse: its values are not known at all (never "absent"), so nothing it might set is
        /// judged. SettingsFileAnalysis reports the file itself (SAMP100).
        /// </summary>
        public bool Readable { get; }

        /// <summary>The node at a flattened key ("HarbourLlm:Temperature"), when the file sets it.</summary>
        public FileNode? At(string key) => values.TryGetValue(key, out var node) ? node : null;

        public static AppSettingsLayer Read(AdditionalText file, CancellationToken cancellationToken)
        {
            var name = Path.GetFileName(file.Path);
            var values = new Dictionary<string, FileNode>(StringComparer.OrdinalIgnoreCase);
            var text = file.GetText(cancellationToken);
            if (text == null)
            {
                return new AppSettingsLayer(name, false, values);
            }

            FileNode? root;
            FileParseError? error;
            try
            {
                root = JsonFileReader.Read(text, out error);
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                return new AppSettingsLayer(name, false, values); // the reader reports JSON errors itself; anything else must not stop the build either
            }

            if (error != null)
            {
                return new AppSettingsLayer(name, false, values);
            }

            if (root != null)
            {
                Flatten(root, null, values);
            }

            return new AppSettingsLayer(name, true, values);
        }

        /// <summary>Mappings join their keys with ':', sequences add the index; a later duplicate wins, as it would at run time.</summary>
        private static void Flatten(FileNode node, string? prefix, Dictionary<string, FileNode> values)
        {
            switch (node.Kind)
            {
                case FileNodeKind.Mapping:
                    foreach (var entry in node.Entries)
                    {
                        Flatten(entry.Value, Join(prefix, entry.Key), values);
                    }

                    break;
                case FileNodeKind.Sequence:
                    for (var i = 0; i < node.Items.Count; i++)
                    {
                        Flatten(node.Items[i], Join(prefix, i.ToString(System.Globalization.CultureInfo.InvariantCulture)), values);
                    }

                    break;
                default:
                    if (prefix != null)
                    {
                        values[prefix] = node;
                    }

                    break;
            }
        }

        private static string Join(string? prefix, string key) => prefix == null ? key : prefix + ConfigurationSurface.KeySeparator + key;
    }
}
