using System.Collections.Generic;
using System.Collections.Immutable;
using System.Globalization;
using System.Linq;
using System.Threading;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Temperance.Files;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// What configuration says a property of the project's classes holds, in each environment. Made at compilation start,
    /// where it reads nothing; a class's bindings are scanned once per compilation when a request first reads a value
    /// through it, and the appsettings files are read once, when a bound class is met (most compilations never ask).
    /// </summary>
    internal sealed class ProjectConfiguration
    {
        private readonly Compilation compilation;
        private readonly ImmutableArray<AdditionalText> files;
        private readonly object gate = new object();
        private readonly System.Collections.Concurrent.ConcurrentDictionary<string, ConfigurationBindings> bindingsByClass =
            new System.Collections.Concurrent.ConcurrentDictionary<string, ConfigurationBindings>(System.StringComparer.Ordinal);
        private Loaded? loaded;

        private readonly string? projectDirectory;

        /// <param name="projectDirectory">MSBuildProjectDirectory when the build makes it visible (the package does): the app's
        /// configuration is the appsettings files there, never a copy deeper in the tree.</param>
        public ProjectConfiguration(Compilation compilation, ImmutableArray<AdditionalText> files, string? projectDirectory = null)
        {
            this.compilation = compilation;
            this.files = files;
            this.projectDirectory = projectDirectory;
        }

        /// <summary>The environments told apart, base first: "appsettings.json", then "appsettings.json + appsettings.Production.json" …</summary>
        public IReadOnlyList<string> Environments(CancellationToken cancellationToken) => Load(cancellationToken).Environments;

        /// <summary>
        /// The value a path holds in each of <see cref="Environments"/>: the environment's file, else appsettings.json, else the
        /// property's initializer. Null when no class along the path is bound to a section: then nothing is known.
        /// </summary>
        public IReadOnlyList<ConfiguredValue>? ValuesOf(MemberPath path, CancellationToken cancellationToken)
        {
            for (var i = 0; i < path.Properties.Count; i++)
            {
                var bindings = BindingsOf(path.Properties[i].ContainingType, cancellationToken);
                if (bindings.Section is { } section)
                {
                    var below = path.Properties.Skip(i).ToList();
                    if (bindings.WrittenByCode(below.Select(p => p.Name)) || below.Any(p => !HoldsWhatIsBound(p)))
                    {
                        return null; // code changes the value after binding: what the file says is not what is sent
                    }

                    var key = section + string.Concat(below.Select(p => ConfigurationSurface.KeySeparator + KeyOf(p)));
                    return Values(key, path, Load(cancellationToken).Layers);
                }
            }

            return null;
        }

        private static IReadOnlyList<ConfiguredValue> Values(string key, MemberPath path, AppSettingsLayers layers)
        {
            var fallback = Initializer(path.Last) is { } initial
                ? new ConfiguredValue(initial, $"the initializer of {path} ('{key}' is set in no configuration file)")
                : ConfiguredValue.Unknown;
            var values = new List<ConfiguredValue> { From(layers.Base, key, fallback) };
            foreach (var environment in layers.Environments)
            {
                values.Add(From(environment, key, values[0]));
            }

            return values;
        }

        /// <summary>A file that sets the key decides; one that does not leaves the layer below; one that cannot be read makes it Unknown.</summary>
        private static ConfiguredValue From(AppSettingsLayer? layer, string key, ConfiguredValue below)
        {
            if (layer == null)
            {
                return below;
            }

            if (!layer.Readable)
            {
                return ConfiguredValue.Unknown;
            }

            return layer.At(key) switch
            {
                null => below,
                { Kind: FileNodeKind.Scalar, Text: { } text } => new ConfiguredValue(text, $"configuration '{key}' in {layer.FileName}"),
                _ => ConfiguredValue.Unknown, // null or a nested object where a value was expected
            };
        }

        /// <summary>The key a property is bound from: its <c>[ConfigurationKeyName]</c>, else its name (matched ignoring case).</summary>
        private static string KeyOf(IPropertySymbol property)
        {
            foreach (var attribute in property.GetAttributes())
            {
                if (attribute.AttributeClass?.Name == ConfigurationSurface.KeyNameAttribute
                    && attribute.ConstructorArguments.Length == 1 && attribute.ConstructorArguments[0].Value is string name)
                {
                    return name;
                }
            }

            return property.Name;
        }

        /// <summary>
        /// A property that holds what the binder sets: an auto-property (or a record's positional one) that its own type does
        /// not assign anywhere but its initializer. A setter or getter with a body may clamp or compute; a Normalize() may rewrite it.
        /// </summary>
        private static bool HoldsWhatIsBound(IPropertySymbol property)
        {
            if (property.DeclaringSyntaxReferences.Length != 1)
            {
                return false;
            }

            switch (property.DeclaringSyntaxReferences[0].GetSyntax())
            {
                case ParameterSyntax:
                    return true;
                case PropertyDeclarationSyntax { AccessorList: { } accessors, ExpressionBody: null } declaration
                    when accessors.Accessors.All(a => a.Body == null && a.ExpressionBody == null):
                    return MemberValues.Of(property).All(value => value == declaration.Initializer?.Value);
                default:
                    return false;
            }
        }

        /// <summary>The literal a property is initialised with (<c>= 0.2f</c>, <c>= "gpt-4o-mini"</c>), read from syntax; else null.</summary>
        private static string? Initializer(IPropertySymbol property)
        {
            if (property.DeclaringSyntaxReferences.Length != 1
                || property.DeclaringSyntaxReferences[0].GetSyntax() is not PropertyDeclarationSyntax { Initializer.Value: { } value })
            {
                return null;
            }

            if (value is LiteralExpressionSyntax { Token.Value: string text })
            {
                return text;
            }

            if (value.IsKind(SyntaxKind.TrueLiteralExpression) || value.IsKind(SyntaxKind.FalseLiteralExpression))
            {
                return value.IsKind(SyntaxKind.TrueLiteralExpression) ? "true" : "false";
            }

            return ValueReader.TryReadLiteral(value, out var number) ? number.ToString("R", CultureInfo.InvariantCulture) : null;
        }

        /// <summary>Once per class and compilation (a race may scan twice, with the same answer); a cancelled scan caches nothing.</summary>
        private ConfigurationBindings BindingsOf(INamedTypeSymbol type, CancellationToken cancellationToken) =>
            bindingsByClass.TryGetValue(type.Name, out var known) ? known
            : bindingsByClass.GetOrAdd(type.Name, NameIsUnique(type, cancellationToken)
                ? ConfigurationBindings.Scan(compilation, type.Name, cancellationToken)
                : ConfigurationBindings.None);

        /// <summary>
        /// Binding calls name a class by its simple name (syntax, no semantic model): with two classes of that name in the
        /// project (Ferry.DeskOptions, Bakery.DeskOptions) a call cannot be told to bind one or the other, so neither is bound.
        /// </summary>
        private bool NameIsUnique(INamedTypeSymbol type, CancellationToken cancellationToken) =>
            compilation.GetSymbolsWithName(type.Name, SymbolFilter.Type, cancellationToken).Take(2).Count() == 1;

        private Loaded Load(CancellationToken cancellationToken)
        {
            var current = Volatile.Read(ref loaded);
            if (current != null)
            {
                return current;
            }

            // Once per compilation; a cancelled load leaves nothing behind, so the next caller reads again.
            lock (gate)
            {
                return loaded ??= new Loaded(AppSettingsLayers.Read(files, projectDirectory, cancellationToken));
            }
        }

        private sealed class Loaded
        {
            public Loaded(AppSettingsLayers layers)
            {
                Layers = layers;
                var baseName = layers.Base?.FileName;
                Environments = new[] { baseName ?? "no configuration file" }
                    .Concat(layers.Environments.Select(e => baseName == null ? e.FileName : baseName + " + " + e.FileName)).ToArray();
            }

            public AppSettingsLayers Layers { get; }
            public IReadOnlyList<string> Environments { get; }
        }
    }

    /// <summary>A configured value as text (null: Unknown), and where it came from, for messages.</summary>
    internal readonly struct ConfiguredValue
    {
        public static readonly ConfiguredValue Unknown = new ConfiguredValue(null, null);

        public ConfiguredValue(string? text, string? origin)
        {
            Text = text;
            Origin = origin;
        }

        public string? Text { get; }
        public string? Origin { get; }
    }
}
