using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.CSharp.Testing;
using Microsoft.CodeAnalysis.Testing;
using Temperance.CodeFixes;

namespace Temperance.Tests.Infrastructure;

/// <summary>Analyzer + fixer test against the real SDKs, with the shipped rules table as the global config.</summary>
public sealed class TemperanceTest : CSharpCodeFixTest<TemperanceAnalyzer, TemperanceCodeFixProvider, DefaultVerifier>
{
    /// <summary>Experimental-API diagnostics of the SDKs (errors by default); snippets are about sampling, not those.</summary>
    private static readonly string[] SdkExperimentalIds = { "OPENAI001", "SCME0001", "SCME0002", "SKEXP0001", "SKEXP0010", "MEAI001", "AOAI001" };

    public TemperanceTest(string source, string? editorConfig = null, string? fixedSource = null, bool suppressSdkExperimental = true)
    {
        ReferenceAssemblies = new ReferenceAssemblies("net10.0");
        TestState.AdditionalReferences.AddRange(TestReferences.All);
        TestState.Sources.Add(source);
        TestState.AnalyzerConfigFiles.Add(("/.globalconfig", TestReferences.RulesTable));
        if (editorConfig != null)
        {
            TestState.AnalyzerConfigFiles.Add(("/.editorconfig", "root = true\n\n[*.cs]\n" + editorConfig));
        }

        if (fixedSource != null)
        {
            FixedState.Sources.Add(fixedSource);
        }

        // Through a global config rather than compilation options, so per-file severities from .editorconfig still apply.
        if (suppressSdkExperimental)
        {
            TestState.AnalyzerConfigFiles.Add(("/.sdk-experimental.globalconfig",
                "is_global = true\n" + string.Concat(SdkExperimentalIds.Select(id => $"dotnet_diagnostic.{id}.severity = none\n"))));
        }
    }
}

/// <summary>Short entry points, in the style of the Microsoft.CodeAnalysis.Testing verifiers.</summary>
public static class Verify
{
    public static DiagnosticResult Diagnostic(string id) => new DiagnosticResult(id, Temperance.Rules.Descriptors.All.Single(d => d.Id == id).DefaultSeverity);

    public static Task AnalyzerAsync(string source, params DiagnosticResult[] expected) => AnalyzerAsync(source, null, expected);

    public static Task AnalyzerAsync(string source, string? editorConfig, params DiagnosticResult[] expected)
    {
        var test = new TemperanceTest(source, editorConfig);
        test.ExpectedDiagnostics.AddRange(expected);
        return test.RunAsync();
    }

    /// <summary>
    /// Several files of one project (a fake or a handler declared in another file than the test using it), with optional
    /// global options such as <c>build_property.IsTestProject = true</c>.
    /// </summary>
    public static Task ProjectAsync(string[] sources, string? globalOptions, params DiagnosticResult[] expected)
    {
        var test = new TemperanceTest(sources[0]);
        foreach (var more in sources.Skip(1))
        {
            test.TestState.Sources.Add(more);
        }

        if (globalOptions != null)
        {
            test.TestState.AnalyzerConfigFiles.Add(("/.project.globalconfig", "is_global = true\n" + globalOptions));
        }

        test.ExpectedDiagnostics.AddRange(expected);
        return test.RunAsync();
    }

    /// <summary>
    /// Settings files passed as additional files (markup such as <c>{|SAMP004:…|}</c> marks the expected span in them), beside
    /// C# sources; <paramref name="editorConfig"/> is a whole .editorconfig (sections by path).
    /// </summary>
    public static Task FilesAsync((string Path, string Content)[] files, string? editorConfig, params DiagnosticResult[] expected) =>
        FilesAsync(files, new[] { "class Placeholder { }" }, editorConfig, expected);

    public static Task FilesAsync((string Path, string Content)[] files, string[] sources, string? editorConfig, params DiagnosticResult[] expected)
    {
        var test = Files(files, sources, editorConfig);
        test.ExpectedDiagnostics.AddRange(expected);
        return test.RunAsync();
    }

    private static TemperanceTest Files((string Path, string Content)[] files, string[] sources, string? editorConfig)
    {
        var test = new TemperanceTest(sources[0]);
        foreach (var more in sources.Skip(1))
        {
            test.TestState.Sources.Add(more);
        }

        foreach (var file in files)
        {
            test.TestState.AdditionalFiles.Add(file);
        }

        if (editorConfig != null)
        {
            test.TestState.AnalyzerConfigFiles.Add(("/.editorconfig", editorConfig));
        }

        return test;
    }

    public static Task FixAsync(string source, string fixedSource, string? editorConfig = null)
    {
        var test = new TemperanceTest(source, editorConfig, fixedSource);
        return test.RunAsync();
    }
}
