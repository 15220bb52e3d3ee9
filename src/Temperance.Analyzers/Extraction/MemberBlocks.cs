using System.Collections.Generic;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;

namespace Temperance.Extraction
{
    /// <summary>
    /// The member blocks of a tree as the analyzer sees them (method and accessor bodies, field and property
    /// initializers, expression-bodied properties), with their owning symbol. For the tools that run the extraction
    /// outside the compiler's driver: the inventory tool, the tests and the benchmark.
    /// </summary>
    internal static class MemberBlocks
    {
        public static IEnumerable<(IOperation Block, ISymbol? Owner)> Of(SyntaxTree tree, SemanticModel model, System.Threading.CancellationToken cancellationToken = default)
        {
            foreach (var node in tree.GetRoot(cancellationToken).DescendantNodes())
            {
                ISymbol? owner;
                switch (node)
                {
                    case BaseMethodDeclarationSyntax method when method.Body != null || method.ExpressionBody != null:
                        owner = model.GetDeclaredSymbol(method, cancellationToken);
                        break;
                    case AccessorDeclarationSyntax accessor when accessor.Body != null || accessor.ExpressionBody != null:
                        owner = model.GetDeclaredSymbol(accessor, cancellationToken);
                        break;
                    case EqualsValueClauseSyntax { Parent: VariableDeclaratorSyntax { Parent.Parent: FieldDeclarationSyntax } declarator }:
                        owner = model.GetDeclaredSymbol(declarator, cancellationToken);
                        break;
                    case EqualsValueClauseSyntax { Parent: PropertyDeclarationSyntax property }:
                        owner = model.GetDeclaredSymbol(property, cancellationToken);
                        break;
                    case ArrowExpressionClauseSyntax { Parent: PropertyDeclarationSyntax arrowProperty }:
                        owner = model.GetDeclaredSymbol(arrowProperty, cancellationToken);
                        break;
                    default:
                        continue;
                }

                if (model.GetOperation(node, cancellationToken) is { } block)
                {
                    yield return (block, owner);
                }
            }
        }
    }
}
