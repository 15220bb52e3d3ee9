using System.Collections.Immutable;
using System.Reflection;
using Microsoft.CodeAnalysis;

namespace Temperance.Tests.Infrastructure;

/// <summary>
/// What test snippets compile against: .NET 10 reference assemblies from Basic.Reference.Assemblies (nothing is
/// downloaded at test time) plus the real SDK assemblies this test project restored from NuGet.
/// </summary>
public static class TestReferences
{
    /// <summary>Assemblies of the SDKs and their non-framework dependencies, as restored next to the tests.</summary>
    private static readonly string[] SdkPrefixes =
    {
        "OpenAI", "Azure.AI.OpenAI", "Azure.AI.Inference", "Azure.Core", "System.ClientModel", "System.Memory.Data",
        "Microsoft.Extensions.AI", "Microsoft.SemanticKernel", "Microsoft.Agents.AI", "Anthropic", "OllamaSharp",
        "LLamaSharp", "Microsoft.ML.OnnxRuntimeGenAI", "Betalgo.Ranul.OpenAI", "ModelContextProtocol",
        "Microsoft.Extensions.DependencyInjection.Abstractions", "Microsoft.Extensions.Logging.Abstractions",
        "Microsoft.Extensions.VectorData.Abstractions", "Microsoft.Bcl.AsyncInterfaces", "Microsoft.Bcl.HashCode",
        // Configuration bound to options classes: the binder, options, and the generic host's builder.
        "Microsoft.Extensions.Configuration", "Microsoft.Extensions.Options", "Microsoft.Extensions.Primitives", "Microsoft.Extensions.Hosting",
        "Microsoft.Extensions.DependencyInjection", "Microsoft.Extensions.FileProviders.Abstractions", "Microsoft.Extensions.Diagnostics.Abstractions",
        "xunit.assert", "xunit.core", "xunit.abstractions",
        "nunit.framework", "nunit.framework.legacy", "MSTest.TestFramework", "Microsoft.VisualStudio.TestPlatform.TestFramework",
        "AwesomeAssertions", "FluentAssertions", "Shouldly", "Snapshooter", "Snapshooter.Xunit",
        "Moq", "Castle.Core", "NSubstitute", "FakeItEasy",
    };

    public static readonly ImmutableArray<MetadataReference> Sdks = LoadSdks();

    public static readonly ImmutableArray<MetadataReference> Framework =
        Basic.Reference.Assemblies.Net100.References.All.Cast<MetadataReference>().ToImmutableArray();

    public static ImmutableArray<MetadataReference> All => Framework.AddRange(Sdks);

    private static ImmutableArray<MetadataReference> LoadSdks()
    {
        var directory = AppContext.BaseDirectory;
        var references = ImmutableArray.CreateBuilder<MetadataReference>();
        foreach (var path in Directory.GetFiles(directory, "*.dll").OrderBy(p => p, StringComparer.Ordinal))
        {
            var name = Path.GetFileNameWithoutExtension(path);
            if (SdkPrefixes.Any(prefix => name.Equals(prefix, StringComparison.Ordinal) || name.StartsWith(prefix + ".", StringComparison.Ordinal)))
            {
                references.Add(MetadataReference.CreateFromFile(path));
            }
        }

        return references.ToImmutable();
    }

    /// <summary>The rules table exactly as the package ships it.</summary>
    public static string RulesTable => File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "rules", "temperance.globalconfig"));

    public static string RulesDirectory => Path.Combine(AppContext.BaseDirectory, "rules");

    /// <summary>The repository root, found from the test binaries (for end-to-end tests that pack the package).</summary>
    public static string RepositoryRoot
    {
        get
        {
            for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir != null; dir = dir.Parent)
            {
                if (File.Exists(Path.Combine(dir.FullName, "Analyzers.sln")))
                {
                    return dir.FullName;
                }
            }

            throw new InvalidOperationException("Analyzers.sln not found above " + AppContext.BaseDirectory);
        }
    }
}
