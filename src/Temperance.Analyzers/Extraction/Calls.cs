using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>Small facts about a call: whether it only describes one (a mock expectation), its body's root, its name for messages.</summary>
    internal static class Calls
    {
        /// <summary>
        /// A send written inside a lambda that becomes an expression tree (a mock's Setup/Verify, FakeItEasy's CallTo) is a
        /// description of a call, never run.
        /// </summary>
        public static bool IsExpectation(IOperation send)
        {
            for (var current = send.Parent; current != null; current = current.Parent)
            {
                // The lambda's delegate creation, or the conversion around it, has the Expression<T> type.
                if (current is IAnonymousFunctionOperation { Parent: { } converted }
                    && (IsExpressionTree(converted.Type) || IsExpressionTree(converted.Parent?.Type)))
                {
                    return true;
                }
            }

            return false;
        }

        private static bool IsExpressionTree(ITypeSymbol? type) =>
            type is INamedTypeSymbol { Name: "Expression" } expression && expression.ContainingNamespace?.ToDisplayString() == "System.Linq.Expressions";

        /// <summary>The outermost operation of the body an operation belongs to.</summary>
        public static IOperation Root(IOperation operation)
        {
            while (operation.Parent != null)
            {
                operation = operation.Parent;
            }

            return operation;
        }

        public static string SendName(IOperation send) => send switch
        {
            IInvocationOperation invocation => invocation.TargetMethod.Name,
            IObjectCreationOperation creation => "new " + creation.Type?.Name,
            _ => "a send",
        };
    }
}
