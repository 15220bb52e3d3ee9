using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Surfaces;

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

            // Arguments the model chose for a tool call, kept in a captured local: model output as much as the reply's text.
            foreach (var local in ToolArgumentLocals(operations))
            {
                tainted.Add(local);
            }

            Propagate(operations, tainted, otherOutputs);

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

        /// <summary>
        /// Whether a send's output is returned from its method (a test's helper that asks the model and returns the text),
        /// so the callers' assertions decide.
        /// </summary>
        public static bool ReachesReturn(IOperation send, IReadOnlyList<IOperation> operations)
        {
            var tainted = new HashSet<ISymbol>(SymbolEqualityComparer.Default);
            Spread(send, tainted);
            Propagate(operations, tainted, new HashSet<ISymbol>(SymbolEqualityComparer.Default));
            return operations.OfType<IReturnOperation>().Any(r => r.ReturnedValue != null && Derives(r.ReturnedValue, send, tainted));
        }

        /// <summary>Spreads outputs through the locals they are stored in until nothing changes (a few passes).</summary>
        private static void Propagate(IReadOnlyList<IOperation> operations, HashSet<ISymbol> tainted, HashSet<ISymbol> otherOutputs)
        {
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
        }

        /// <summary>Marks the locals an output value is stored in, through awaits, member reads and conversions.</summary>
        private static void Spread(IOperation output, HashSet<ISymbol> tainted)
        {
            var current = output;
            while (current.Parent is { } parent)
            {
                switch (parent)
                {
                    // response.Messages[0].Role, response.Usage …: filled in by the provider, not sampled.
                    case IPropertyReferenceOperation { Instance: { } read } metadata when ReferenceEquals(read, current)
                        && TestingSurfaces.ResponseMetadataMembers.Contains(metadata.Property.Name):
                        return;
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
                    // builder.Append(update.Text): the builder accumulates the output
                    case IArgumentOperation { Parent: IInvocationOperation { Instance: ILocalReferenceOperation accumulator, TargetMethod.Name: "Append" or "AppendLine" } }:
                        tainted.Add(accumulator.Local);
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
                if (((send != null && ReferenceEquals(operation, send)) || (operation is ILocalReferenceOperation local && tainted.Contains(local.Local)))
                    && !ReadsMetadata(operation, compared))
                {
                    return true;
                }
            }

            return false;
        }

        /// <summary>Whether the value compared is a metadata member of the output (its role, usage, id …), not its content.</summary>
        private static bool ReadsMetadata(IOperation output, IOperation compared)
        {
            for (var current = output; current != null && !ReferenceEquals(current, compared.Parent); current = current.Parent)
            {
                if (current is IPropertyReferenceOperation property && TestingSurfaces.ResponseMetadataMembers.Contains(property.Property.Name))
                {
                    return true;
                }
            }

            return false;
        }

        /// <summary>
        /// Locals assigned, inside a delegate handed to a tool factory (<c>AIFunctionFactory.Create</c>), from that delegate's
        /// parameters: the model chose those values.
        /// </summary>
        private static IEnumerable<ILocalSymbol> ToolArgumentLocals(IReadOnlyList<IOperation> operations)
        {
            foreach (var lambda in operations.OfType<IAnonymousFunctionOperation>())
            {
                if (!IsToolDelegate(lambda))
                {
                    continue;
                }

                foreach (var assignment in lambda.Body.DescendantsAndSelf().OfType<ISimpleAssignmentOperation>())
                {
                    if (assignment.Target is ILocalReferenceOperation captured
                        && !SymbolEqualityComparer.Default.Equals(captured.Local.ContainingSymbol, lambda.Symbol)
                        && assignment.Value.DescendantsAndSelf().OfType<IParameterReferenceOperation>()
                            .Any(p => SymbolEqualityComparer.Default.Equals(p.Parameter.ContainingSymbol, lambda.Symbol)))
                    {
                        yield return captured.Local;
                    }
                }
            }
        }

        private static bool IsToolDelegate(IAnonymousFunctionOperation lambda)
        {
            var current = lambda.Parent;
            while (current is IDelegateCreationOperation or IConversionOperation)
            {
                current = current.Parent;
            }

            if (current is not IArgumentOperation { Parent: IInvocationOperation factory })
            {
                return false;
            }

            var type = factory.TargetMethod.ContainingType;
            return type != null && TestingSurfaces.ToolFactories.Any(t => t.Method == factory.TargetMethod.Name && t.Type == Surfaces.SurfaceCatalog.FullName(type));
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

        /// <summary>A property or field read (<c>verdict.IsSafe</c>), not a computed check such as <c>text.Contains("x")</c>.</summary>
        private static bool IsMemberRead(IOperation value) =>
            ValueReader.Unwrap(value) is IPropertyReferenceOperation or IFieldReferenceOperation;

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
