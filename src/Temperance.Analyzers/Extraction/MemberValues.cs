using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>The expressions a field or property is given in its own type: initializer, expression body and assignments.</summary>
    internal static class MemberValues
    {
        public static IEnumerable<ExpressionSyntax> Of(ISymbol member)
        {
            foreach (var reference in member.DeclaringSyntaxReferences)
            {
                switch (reference.GetSyntax())
                {
                    case VariableDeclaratorSyntax { Initializer: { } initializer }:
                        yield return initializer.Value;
                        break;
                    case PropertyDeclarationSyntax property:
                        if (property.Initializer != null)
                        {
                            yield return property.Initializer.Value;
                        }

                        if (property.ExpressionBody != null)
                        {
                            yield return property.ExpressionBody.Expression;
                        }

                        break;
                }
            }

            if (member.ContainingType == null)
            {
                yield break;
            }

            foreach (var typeReference in member.ContainingType.DeclaringSyntaxReferences)
            {
                foreach (var assignment in typeReference.GetSyntax().DescendantNodes().OfType<AssignmentExpressionSyntax>())
                {
                    var target = assignment.Left switch
                    {
                        IdentifierNameSyntax identifier => identifier.Identifier.ValueText,
                        MemberAccessExpressionSyntax { Expression: ThisExpressionSyntax } access => access.Name.Identifier.ValueText,
                        _ => null,
                    };
                    if (target == member.Name)
                    {
                        yield return assignment.Right;
                    }
                }
            }
        }
    }
}
