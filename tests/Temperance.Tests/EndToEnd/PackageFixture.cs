using System.IO.Compression;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.EndToEnd;

/// <summary>
/// Packs Temperance.Analyzers once, with a version no other run uses, into a throwaway local feed. Consumers restore
/// it into their own isolated package folder, so no earlier copy of the package can be picked up.
/// </summary>
public sealed class PackageFixture : IDisposable
{
    public PackageFixture()
    {
        Root = Path.Combine(Path.GetTempPath(), "temperance-e2e-" + Guid.NewGuid().ToString("N")[..12]);
        Feed = Path.Combine(Root, "feed");
        Directory.CreateDirectory(Feed);
        Version = "0.0.0-e2e." + DateTime.UtcNow.ToString("yyyyMMddHHmmss") + "." + Environment.ProcessId;

        var pack = DotNet.Run(TestReferences.RepositoryRoot,
            $"pack src/Temperance.Package/Temperance.Package.csproj -c Release -o \"{Feed}\" -p:TemperanceVersion={Version} -nodeReuse:false");
        if (pack.ExitCode != 0)
        {
            throw new InvalidOperationException("pack failed:\n" + pack);
        }

        PackagePath = Path.Combine(Feed, $"Temperance.Analyzers.{Version}.nupkg");
        if (!File.Exists(PackagePath))
        {
            throw new InvalidOperationException("package not produced:\n" + pack);
        }
    }

    public string Root { get; }
    public string Feed { get; }
    public string Version { get; }
    public string PackagePath { get; }

    /// <summary>The package folder the test project itself restored into: a local, offline source for the real SDKs.</summary>
    public static string RestoredPackages =>
        Environment.GetEnvironmentVariable("NUGET_PACKAGES") is { Length: > 0 } custom
            ? custom
            : Path.Combine(Environment.GetFolderPath(Environment.SpecialFolder.UserProfile), ".nuget", "packages");

    public IReadOnlyList<string> PackageEntries()
    {
        using var zip = ZipFile.OpenRead(PackagePath);
        return zip.Entries.Select(e => e.FullName).ToList();
    }

    /// <summary>A consumer project in its own folder, with its own package folder and a nuget.config that works offline.</summary>
    public Consumer CreateConsumer(string name, string extraPackages = "", string extraProperties = "")
    {
        var directory = Path.Combine(Root, name);
        Directory.CreateDirectory(directory);
        File.WriteAllText(Path.Combine(directory, "nuget.config"), $"""
            <?xml version="1.0" encoding="utf-8"?>
            <configuration>
              <packageSources>
                <clear />
                <add key="temperance-under-test" value="{Feed}" />
                <add key="already-restored" value="{RestoredPackages}" />
              </packageSources>
            </configuration>
            """);
        File.WriteAllText(Path.Combine(directory, "Consumer.csproj"), $"""
            <Project Sdk="Microsoft.NET.Sdk">
              <PropertyGroup>
                <TargetFramework>net10.0</TargetFramework>
                <Nullable>enable</Nullable>
                <ImplicitUsings>enable</ImplicitUsings>
                <NoWarn>$(NoWarn);OPENAI001</NoWarn>
                <UseSharedCompilation>false</UseSharedCompilation>
                {extraProperties}
              </PropertyGroup>
              <ItemGroup>
                <PackageReference Include="Temperance.Analyzers" Version="{Version}" PrivateAssets="all" />
                <PackageReference Include="OpenAI" Version="2.15.0" />
                <PackageReference Include="Microsoft.Extensions.AI.Abstractions" Version="10.11.0" />
                {extraPackages}
              </ItemGroup>
            </Project>
            """);
        return new Consumer(directory, Path.Combine(Root, name + "-packages"));
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Root, recursive: true);
        }
        catch (IOException)
        {
            // A build server may still hold a file; the temp folder is cleaned by the OS.
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}

public sealed class Consumer
{
    public Consumer(string directory, string packages)
    {
        Directory = directory;
        Packages = packages;
    }

    public string Directory { get; }
    public string Packages { get; }

    public void Write(string relativePath, string content) => File.WriteAllText(Path.Combine(Directory, relativePath), content);

    public string Read(string relativePath) => File.ReadAllText(Path.Combine(Directory, relativePath));

    public DotNet.Result Run(string arguments) =>
        DotNet.Run(Directory, arguments, new Dictionary<string, string> { ["NUGET_PACKAGES"] = Packages });

    public DotNet.Result Build() => Run("build --no-incremental -nodeReuse:false -p:UseSharedCompilation=false");
}
