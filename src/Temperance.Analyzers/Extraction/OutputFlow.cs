using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;

namespace Temperance.Extraction
{
    /// <summary>
    /// Follows a model's output, through locals of the same block, to an exact assertion: xUnit Assert.Equal,
    /// NUnit Assert.That(…, Is.EqualTo(…)) and AreEqual, MSTest Assert.AreEqual, FluentAssertions/AwesomeAssertions
    /// Should().Be(…)/BeEquivalentTo(…), Shouldly ShouldBe, and snapshot verification. Contains, StartsWith, regex,
    /// NotEqual and length checks are not exact and are not followed.
    /// </summary>
    internal static class OutputFlow
    {
        private const int MaxPasses = 4;

        /// <summary>The exact assertion the outputs of <paramref name="sends"/> reach, or null.</summary>
        public static (string Description, Location Location)? FindExactAssertion(IOperation send, IReadOnlyList<IOperation> operations, ISet<IOperation> allSends)
        {
            var tainted = new HashSet<ISymbol>(SymbolEqualityComparer.Default);
            var otherOutputs = new HashSet<ISymbol>(SymbolEqualityComparer.Default);
            Spread(send, tainted);
            foreach (var other in allSends.Where(s => !ReferenceEquals(s, send)))
            {
                Spread(other, otherOutputs);
            }

            for (var pass = 0; pass < MaxPasses; pass++)
            {
                var before = tainted.Count + otherOutputs.Count;
                foreach (var reference in operations.OfType<ILocalReferenceOperation>())
                {
                    if (tainted.Contains(reference.Local))
                    {
                        Spread(reference, tainted);
                    }
                    else if (otherOutputs.Contains(reference.Local))
                    {
                        Spread(reference, otherOutputs);
                    }
                }

                if (tainted.Count + otherOutputs.Count == before)
                {
                    break;
                }
            }

            foreach (var invocation in operations.OfType<IInvocationOperation>())
            {
                if (ExactAssertion(invocation) is not { } assertion)
                {
                    continue;
                }

                var compared = assertion.Compared.ToList();
                var fromThis = compared.Count(c => Derives(c, send, tainted));
                var fromOthers = compared.Count(c => Derives(c, null, otherOutputs) || allSends.Any(s => !ReferenceEquals(s, send) && Contains(c, s)));
                // Two model outputs compared with each other (a cache test) say nothing about sampling.
                if (fromThis > 0 && fromThis + fromOthers < 2)
                {
                    return (assertion.Description, invocation.Syntax.GetLocation());
                }
            }

            return null;
        }

        /// <summary>Marks the locals an output value is stored in, through awaits, member reads and conversions.</summary>
        private static void Spread(IOperation output, HashSet<ISymbol> tainted)
        {
            var current = output;
            while (current.Parent is { } parent)
            {
                switch (parent)
                {
                    case IAwaitOperation:
                    case IConversionOperation:
                    case IParenthesizedOperation:
                    case IPropertyReferenceOperation { Instance: { } instance } when ReferenceEquals(instance, current):
                    case IArrayElementReferenceOperation { ArrayReference: { } array } when ReferenceEquals(array, current):
                    case IInvocationOperation { Instance: { } receiver } when ReferenceEquals(receiver, current):
                    case IArgumentOperation { Parent: IInvocationOperation call } when IsDeserialiserOrExtension(call):
                        current = parent is IArgumentOperation ? parent.Parent! : parent;
                        continue;
                    // chunk?.Message.Content
                    case IConditionalAccessOperation { Operation: { } accessed } when ReferenceEquals(accessed, current):
                        current = parent;
                        continue;
                    // await foreach (var chunk in client.ChatAsync(request))
                    case IForEachLoopOperation loop when ReferenceEquals(loop.Collection, current) || ReferenceEquals(ValueReader.Unwrap(loop.Collection), current):
                        foreach (var local in loop.Locals)
                        {
                            tainted.Add(local);
                        }

                        return;
                    // text += chunk.Message.Content
                    case ICompoundAssignmentOperation { Target: ILocalReferenceOperation accumulated } compound when ReferenceEquals(compound.Value, current):
                        tainted.Add(accumulated.Local);
                        return;
                    case IVariableInitializerOperation { Parent: IVariableDeclaratorOperation declarator }:
                        tainted.Add(declarator.Symbol);
                        return;
                    case ISimpleAssignmentOperation { Target: ILocalReferenceOperation local } assignment when ReferenceEquals(assignment.Value, current):
                        tainted.Add(local.Local);
                        return;
                    default:
                        return;
                }
            }
        }

        /// <summary>JsonSerializer.Deserialize(text), ToString(), and extension methods on the output (GetValue, Text()).</summary>
        private static bool IsDeserialiserOrExtension(IInvocationOperation call) =>
            call.TargetMethod.IsExtensionMethod || call.TargetMethod.Name.StartsWith("Deserialize", System.StringComparison.Ordinal)
            || call.TargetMethod.Name == "Parse";

        private static bool Derives(IOperation compared, IOperation? send, HashSet<ISymbol> tainted)
        {
            foreach (var operation in compared.DescendantsAndSelf())
            {
                if (send != null && ReferenceEquals(operation, send))
                {
                    return true;
                }

                if (operation is ILocalReferenceOperation local && tainted.Contains(local.Local))
                {
                    return true;
                }
            }

            return false;
        }

        private static bool Contains(IOperation compared, IOperation send) =>
            compared.DescendantsAndSelf().Any(o => ReferenceEquals(o, send));

        private sealed class Assertion
        {
            public Assertion(string description, IEnumerable<IOperation> compared)
            {
                Description = description;
                Compared = compared;
            }

            public string Description { get; }
            public IEnumerable<IOperation> Compared { get; }
        }

        private static Assertion? ExactAssertion(IInvocationOperation invocation)
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
