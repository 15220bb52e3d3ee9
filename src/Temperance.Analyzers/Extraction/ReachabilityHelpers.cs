using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>The project's own methods that pass options on to a send (read in this file by operations, elsewhere by syntax).</summary>
    internal sealed partial class Reachability
    {
        /// <summary>
        /// Whether a method of the project passes its options parameter on to a declared send: read through its operations
        /// when it is in the same file, else by its syntax (a call named like a send that mentions the parameter).
        /// Returns the send's name, or null.
        /// </summary>
        private (string Name, IOperation? Send)? HelperSends(IMethodSymbol helper)
        {
            if (helperDepth >= MaxHelperDepth || helper.IsAbstract || helper.DeclaringSyntaxReferences.Length == 0)
            {
                return null;
            }

            var parameters = helper.Parameters.Where(p => catalog.Find(p.Type) != null).ToList();
            if (parameters.Count == 0)
            {
                return null;
            }

            var syntax = helper.DeclaringSyntaxReferences[0].GetSyntax();
            var model = operations.Count > 0 ? operations[0].SemanticModel : null;
            if (model != null && syntax.SyntaxTree == model.SyntaxTree && model.GetOperation(syntax) is { } body)
            {
                var inner = new Reachability(catalog, body.DescendantsAndSelf().ToList(), helperDepth + 1);
                foreach (var parameter in parameters)
                {
                    var reached = inner.Of(null, parameter, 0);
                    if (reached.Reach == Reach.Sent && reached.Send != null)
                    {
                        return (reached.Through ?? Calls.SendName(reached.Send), reached.InnerSend ?? reached.Send);
                    }
                }

                return null;
            }

            // Another file: no semantic model here, so read the syntax.
            foreach (var call in syntax.DescendantNodes().OfType<InvocationExpressionSyntax>())
            {
                var name = call.Expression switch
                {
                    MemberAccessExpressionSyntax access => access.Name.Identifier.ValueText,
                    IdentifierNameSyntax identifier => identifier.Identifier.ValueText,
                    _ => null,
                };
                if (name != null && catalog.SendMethodNames.Contains(name)
                    && call.ArgumentList.DescendantNodes().OfType<IdentifierNameSyntax>().Any(i => parameters.Any(p => p.Name == i.Identifier.ValueText)))
                {
                    return (name, null);
                }
            }

            return null;
        }
    }
}
