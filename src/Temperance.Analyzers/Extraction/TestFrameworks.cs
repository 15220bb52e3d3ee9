using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>Test-method attributes of xUnit, NUnit and MSTest, resolved by symbol once per compilation.</summary>
    internal sealed class TestFrameworks
    {
        internal static readonly string[] AttributeNames =
        {
            "Xunit.FactAttribute",
            "Xunit.TheoryAttribute",
            "NUnit.Framework.TestAttribute",
            "NUnit.Framework.TestCaseAttribute",
            "NUnit.Framework.TestCaseSourceAttribute",
            "Microsoft.VisualStudio.TestTools.UnitTesting.TestMethodAttribute",
            "Microsoft.VisualStudio.TestTools.UnitTesting.DataTestMethodAttribute",
        };

        private readonly HashSet<INamedTypeSymbol> attributes;
        private readonly System.Collections.Concurrent.ConcurrentDictionary<(INamedTypeSymbol, string), HashSet<string>> calledFromTests =
            new System.Collections.Concurrent.ConcurrentDictionary<(INamedTypeSymbol, string), HashSet<string>>(SymbolKeyComparer<INamedTypeSymbol, string>.Instance);

        private readonly bool testProject;
        private readonly System.Collections.Concurrent.ConcurrentDictionary<(INamedTypeSymbol, string), bool> testClasses =
            new System.Collections.Concurrent.ConcurrentDictionary<(INamedTypeSymbol, string), bool>(SymbolKeyComparer<INamedTypeSymbol, string>.Instance);

        private TestFrameworks(HashSet<INamedTypeSymbol> attributes, bool testProject)
        {
            this.attributes = attributes;
            this.testProject = testProject;
        }

        /// <summary>
        /// A test project: MSBuild's <c>IsTestProject</c> (set by Microsoft.NET.Test.Sdk, made visible by the package), or an
        /// assembly named like one (<c>*.Tests</c>, <c>*.Test</c>, <c>*.Specs</c>) that references a test framework.
        /// </summary>
        private static bool IsTestProject(Compilation compilation, Microsoft.CodeAnalysis.Diagnostics.AnalyzerConfigOptions? global, bool hasFramework)
        {
            if (global != null && global.TryGetValue("build_property.IsTestProject", out var value) && !string.IsNullOrWhiteSpace(value))
            {
                return string.Equals(value.Trim(), "true", System.StringComparison.OrdinalIgnoreCase);
            }

            var name = compilation.AssemblyName ?? string.Empty;
            return hasFramework && (name.EndsWith(".Tests", System.StringComparison.Ordinal) || name.EndsWith(".Test", System.StringComparison.Ordinal)
                || name.EndsWith(".UnitTests", System.StringComparison.Ordinal) || name.EndsWith(".IntegrationTests", System.StringComparison.Ordinal)
                || name.EndsWith(".Specs", System.StringComparison.Ordinal));
        }

        /// <summary>True in a test project: settings files there are test data, never sent by the product.</summary>
        public bool InTestProject => testProject;

        public static TestFrameworks Resolve(Compilation compilation, Microsoft.CodeAnalysis.Diagnostics.AnalyzerConfigOptions? global = null)
        {
            var found = new HashSet<INamedTypeSymbol>(SymbolEqualityComparer.Default);
            foreach (var name in AttributeNames)
            {
                if (TypeLookup.Find(compilation, name) is { } type)
                {
                    found.Add(type);
                }
            }

            return new TestFrameworks(found, IsTestProject(compilation, global, found.Count > 0));
        }

        /// <summary>Where a block's requests are built: whether it is a test (or a test's helper), and whether it is test code at all.</summary>
        public Model.CallContext ContextOf(ISymbol owner, IReadOnlyCollection<string> extraAttributes)
        {
            var isTest = IsTestContext(owner, extraAttributes);
            return new Model.CallContext(owner, owner.ContainingType, isTest, testProject, IsTestClass(owner.ContainingType, extraAttributes));
        }

        /// <summary>A class (or one containing it) that declares test methods: its fields, fixtures and helpers are test code.</summary>
        private bool IsTestClass(INamedTypeSymbol? type, IReadOnlyCollection<string> extraAttributes)
        {
            if (attributes.Count == 0 && extraAttributes.Count == 0)
            {
                return false;
            }

            for (var current = type; current != null; current = current.ContainingType)
            {
                var key = (current, extraAttributes.Count == 0 ? string.Empty : string.Join(",", extraAttributes));
                if (testClasses.GetOrAdd(key, k => k.Item1.GetMembers().Any(m => IsTest(m, extraAttributes))))
                {
                    return true;
                }
            }

            return false;
        }

        /// <summary>True for a method carrying a test attribute (or one derived from it, such as Theory from Fact).</summary>
        public bool IsTest(ISymbol? member) => IsTest(member, System.Array.Empty<string>());

        /// <summary>
        /// A test method (framework attributes, or the team's own from <c>temperance.test_attributes</c>), or a helper of
        /// a test class that a test in the same class calls by name.
        /// </summary>
        public bool IsTestContext(ISymbol? member, IReadOnlyCollection<string> extraAttributes)
        {
            if (IsTest(member, extraAttributes))
            {
                return true;
            }

            // No test framework referenced and no team test attribute: nothing can be a test, so no helper of one either.
            if ((attributes.Count == 0 && extraAttributes.Count == 0)
                || member is not IMethodSymbol { MethodKind: MethodKind.Ordinary } helper || helper.ContainingType == null)
            {
                return false;
            }

            return NamesCalledFromTests(helper.ContainingType, extraAttributes).Contains(helper.Name);
        }

        /// <summary>The identifiers the test methods of a type mention, read from syntax once per type (per compilation).</summary>
        private HashSet<string> NamesCalledFromTests(INamedTypeSymbol type, IReadOnlyCollection<string> extraAttributes) =>
            calledFromTests.GetOrAdd((type, extraAttributes.Count == 0 ? string.Empty : string.Join(",", extraAttributes)), _ =>
            {
                var names = new HashSet<string>(System.StringComparer.Ordinal);
                foreach (var candidate in type.GetMembers().OfType<IMethodSymbol>())
                {
                    if (!IsTest(candidate, extraAttributes))
                    {
                        continue;
                    }

                    foreach (var reference in candidate.DeclaringSyntaxReferences)
                    {
                        foreach (var name in reference.GetSyntax().DescendantNodes().OfType<Microsoft.CodeAnalysis.CSharp.Syntax.IdentifierNameSyntax>())
                        {
                            names.Add(name.Identifier.ValueText);
                        }
                    }
                }

                return names;
            });

        private bool IsTest(ISymbol? member, IReadOnlyCollection<string> extraAttributes)
        {
            if (member is not IMethodSymbol method || (attributes.Count == 0 && extraAttributes.Count == 0))
            {
                return false;
            }

            return method.GetAttributes().Any(a => Derives(a.AttributeClass) || IsExtra(a.AttributeClass, extraAttributes));
        }

        private static bool IsExtra(INamedTypeSymbol? type, IReadOnlyCollection<string> names)
        {
            if (type == null || names.Count == 0)
            {
                return false;
            }

            var full = type.ToDisplayString();
            var shortName = type.Name.EndsWith("Attribute", System.StringComparison.Ordinal) ? type.Name.Substring(0, type.Name.Length - "Attribute".Length) : type.Name;
            return names.Any(n => n == full || n == type.Name || n == shortName);
        }

        private bool Derives(INamedTypeSymbol? type)
        {
            for (var current = type; current != null; current = current.BaseType)
            {
                if (attributes.Contains(current))
                {
                    return true;
                }
            }

            return false;
        }
    }
}
