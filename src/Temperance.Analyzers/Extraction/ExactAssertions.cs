using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// The assertions that compare a value exactly, per test framework and assertion library (xUnit, MSTest, NUnit,
    /// Shouldly, FluentAssertions/AwesomeAssertions, snapshot libraries), and which of their arguments are compared.
    /// </summary>
    internal static class ExactAssertions
    {
        internal sealed class Assertion
        {
            public Assertion(string description, IEnumerable<IOperation> compared)
            {
                Description = description;
                Compared = compared;
            }

            public string Description { get; }
            public IEnumerable<IOperation> Compared { get; }
        }

        /// <summary>A property or field read (<c>verdict.IsSafe</c>), not a computed check such as <c>text.Contains("x")</c>.</summary>
        private static bool IsMemberRead(IOperation value) =>
            ValueReader.Unwrap(value) is IPropertyReferenceOperation or IFieldReferenceOperation;

        public static Assertion? Of(IInvocationOperation invocation)
        {
            var method = invocation.TargetMethod;
            var type = method.ContainingType;
            if (type == null)
            {
                return null;
            }

            var ns = type.ContainingNamespace?.ToDisplayString() ?? string.Empty;
            var arguments = invocation.Arguments.Where(a => a.ArgumentKind == ArgumentKind.Explicit || a.ArgumentKind == ArgumentKind.ParamArray).Select(a => a.Value).ToList();
            switch (ns)
            {
                case "Xunit" when type.Name == "Assert" && method.Name is "Equal" or "StrictEqual" or "Equivalent":
                    return new Assertion($"Assert.{method.Name}", arguments.Take(2));
                case "Microsoft.VisualStudio.TestTools.UnitTesting" when type.Name == "Assert" && method.Name == "AreEqual":
                    return new Assertion("Assert.AreEqual", arguments.Take(2));
                case "NUnit.Framework" or "NUnit.Framework.Legacy" when type.Name is "Assert" or "ClassicAssert" && method.Name == "AreEqual":
                    return new Assertion($"{type.Name}.AreEqual", arguments.Take(2));
                case "NUnit.Framework" when type.Name == "Assert" && method.Name == "That" && arguments.Count >= 2
                    && ValueReader.Unwrap(arguments[1]) is IInvocationOperation { TargetMethod: { Name: "EqualTo" or "EquivalentTo", ContainingType.Name: "Is" } } constraint:
                    return new Assertion($"Assert.That(…, Is.{constraint.TargetMethod.Name}(…))", new[] { arguments[0] }.Concat(constraint.Arguments.Select(a => a.Value)));
                case "Shouldly" when method.Name == "ShouldBe":
                    return new Assertion("ShouldBe", arguments.Take(2));
                case "Snapshooter.Xunit" or "Snapshooter.NUnit" or "Snapshooter.MSTest" or "Snapshooter" when method.Name is "Match" or "MatchSnapshot":
                    return new Assertion($"snapshot {method.Name}", arguments.Take(1));
                case "VerifyXunit" or "VerifyNUnit" or "VerifyMSTest" or "VerifyTests" when method.Name.StartsWith("Verify", System.StringComparison.Ordinal):
                    return new Assertion($"snapshot {method.Name}", arguments.Take(1));
            }

            // A boolean the model produced (verdict.IsSafe), asserted true or false: as exact as Assert.Equal.
            var boolean = (ns, type.Name, method.Name) switch
            {
                ("Xunit", "Assert", "True" or "False") => $"Assert.{method.Name}",
                ("Microsoft.VisualStudio.TestTools.UnitTesting", "Assert", "IsTrue" or "IsFalse") => $"Assert.{method.Name}",
                ("NUnit.Framework" or "NUnit.Framework.Legacy", "Assert" or "ClassicAssert", "IsTrue" or "IsFalse" or "True" or "False") => $"{type.Name}.{method.Name}",
                ("Shouldly", _, "ShouldBeTrue" or "ShouldBeFalse") => method.Name,
                _ => null,
            };
            if (boolean != null && arguments.Count > 0 && IsMemberRead(arguments[0]))
            {
                return new Assertion(boolean, arguments.Take(1));
            }

            if (method.Name is "BeTrue" or "BeFalse"
                && invocation.Instance is IInvocationOperation { TargetMethod.Name: "Should" } boolShould
                && boolShould.TargetMethod.ContainingNamespace?.ToDisplayString() is "FluentAssertions" or "AwesomeAssertions"
                && (boolShould.Arguments.Length > 0 ? boolShould.Arguments[0].Value : boolShould.Instance) is { } subject && IsMemberRead(subject))
            {
                return new Assertion($"Should().{method.Name}", new[] { subject });
            }

            // FluentAssertions / AwesomeAssertions: actual.Should().Be(expected)
            if (method.Name is "Be" or "BeEquivalentTo" or "Equal"
                && invocation.Instance is IInvocationOperation { TargetMethod.Name: "Should" } should
                && should.TargetMethod.ContainingNamespace?.ToDisplayString() is "FluentAssertions" or "AwesomeAssertions")
            {
                var actual = should.Arguments.Length > 0 ? should.Arguments[0].Value : should.Instance;
                return actual == null ? null : new Assertion($"Should().{method.Name}", new[] { actual }.Concat(arguments.Take(1)));
            }

            return null;
        }
    }
}
