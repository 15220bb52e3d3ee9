using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;

namespace Temperance.Extraction
{
    /// <summary>Test-method attributes of xUnit, NUnit and MSTest, resolved by symbol once per compilation.</summary>
    internal sealed class TestFrameworks
    {
        private static readonly string[] AttributeNames =
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

        private TestFrameworks(HashSet<INamedTypeSymbol> attributes)
        {
            this.attributes = attributes;
        }

        public static TestFrameworks Resolve(Compilation compilation)
        {
            var found = new HashSet<INamedTypeSymbol>(SymbolEqualityComparer.Default);
            foreach (var name in AttributeNames)
            {
                if (compilation.GetTypeByMetadataName(name) is { } type)
                {
                    found.Add(type);
                }
            }

            return new TestFrameworks(found);
        }

        /// <summary>True for a method carrying a test attribute (or one derived from it, such as Theory from Fact).</summary>
        public bool IsTest(ISymbol? member)
        {
            if (attributes.Count == 0 || member is not IMethodSymbol method)
            {
                return false;
            }

            return method.GetAttributes().Any(a => Derives(a.AttributeClass));
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
