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
                if (ExactAssertions.Of(invocation) is not { } assertion)
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
    }
}
