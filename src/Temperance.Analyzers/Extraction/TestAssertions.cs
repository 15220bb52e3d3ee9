using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>In a test: whether the model's output reaches an exact assertion, here or in a caller of a helper that returns it.</summary>
    internal static class TestAssertions
    {
        public static void Link(BlockScope scope, IReadOnlyDictionary<RequestDraft, IOperation> sends)
        {
            if (!scope.Context.IsTest)
            {
                return;
            }

            var allSends = new HashSet<IOperation>(sends.Values);
            foreach (var pair in sends)
            {
                if (OutputFlow.FindExactAssertion(pair.Value, scope.Operations, allSends) is { } assertion)
                {
                    pair.Key.ExactAssertion = assertion.Description;
                    pair.Key.ExactAssertionLocation = assertion.Location;
                }
                else if (scope.Context.Member is IMethodSymbol helper && OutputFlow.ReachesReturn(pair.Value, scope.Operations)
                    && CallerAssertion(scope.Catalog, helper, pair.Value.SemanticModel) is { } callerAssertion)
                {
                    pair.Key.ExactAssertion = callerAssertion.Description;
                    pair.Key.ExactAssertionLocation = callerAssertion.Location;
                    pair.Key.ExactAssertionIn = callerAssertion.Caller;
                    // The caller may hand the helper a double as its client (a mock passed in as a parameter).
                    pair.Key.TestDouble ??= callerAssertion.Double;
                }
            }
        }

        /// <summary>
        /// A helper of a test class returns the model's output: the exact assertion a caller in the same file makes on the
        /// helper's result, if any, and the double the caller passes in.
        /// </summary>
        private static (string Description, Location Location, string Caller, string? Double)? CallerAssertion(SurfaceCatalog catalog, IMethodSymbol helper, SemanticModel? model)
        {
            if (model == null || helper.ContainingType == null)
            {
                return null;
            }

            foreach (var caller in helper.ContainingType.GetMembers().OfType<IMethodSymbol>())
            {
                if (SymbolEqualityComparer.Default.Equals(caller, helper) || caller.DeclaringSyntaxReferences.Length != 1
                    || caller.DeclaringSyntaxReferences[0].SyntaxTree != model.SyntaxTree
                    || model.GetOperation(caller.DeclaringSyntaxReferences[0].GetSyntax()) is not { } body)
                {
                    continue;
                }

                var operations = body.DescendantsAndSelf().ToList();
                foreach (var call in operations.OfType<IInvocationOperation>())
                {
                    if (SymbolEqualityComparer.Default.Equals(call.TargetMethod.OriginalDefinition, helper.OriginalDefinition)
                        && OutputFlow.FindExactAssertion(call, operations, new HashSet<IOperation> { call }) is { } found)
                    {
                        var doubles = new TestDoubles(catalog, operations, inTestCode: true);
                        var passedDouble = call.Arguments.Select(a => doubles.Describe(a.Value)).FirstOrDefault(d => d != null);
                        return (found.Description, found.Location, caller.Name, passedDouble);
                    }
                }
            }

            return null;
        }
    }
}
