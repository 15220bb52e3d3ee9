using System.Collections.Immutable;
using System.Composition;
using System.Globalization;
using System.Linq;
using System.Threading;
using System.Threading.Tasks;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CodeActions;
using Microsoft.CodeAnalysis.CodeFixes;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Temperance.Model;
using Temperance.Rules;

namespace Temperance.CodeFixes
{
    /// <summary>
    /// The one fixer. Rules describe the edit in diagnostic Properties (see <see cref="FixProperties"/>); this provider
    /// only applies generic edits, so a new rule with a known edit needs no new fixer.
    /// </summary>
    [ExportCodeFixProvider(LanguageNames.CSharp, Name = nameof(TemperanceCodeFixProvider)), Shared]
    public sealed class TemperanceCodeFixProvider : CodeFixProvider
    {
        public override ImmutableArray<string> FixableDiagnosticIds { get; } =
            ImmutableArray.Create(Descriptors.ValueOutOfRange.Id, Descriptors.ExtremeTemperature.Id);

        public override FixAllProvider GetFixAllProvider() => WellKnownFixAllProviders.BatchFixer;

        public override Task RegisterCodeFixesAsync(CodeFixContext context)
        {
            foreach (var diagnostic in context.Diagnostics)
            {
                if (!diagnostic.Properties.TryGetValue(FixProperties.Edit, out var edit) || edit != FixProperties.SetValue
                    || diagnostic.AdditionalLocations.Count == 0
                    || !TryGetLiteral(diagnostic, out var literal))
                {
                    continue;
                }

                diagnostic.Properties.TryGetValue(FixProperties.Member, out var member);
                var title = $"Set {member} to {literal}";
                context.RegisterCodeFix(
                    CodeAction.Create(title, ct => SetValueAsync(context.Document, diagnostic, literal, ct), FixProperties.SetValueKey(diagnostic.Id)),
                    diagnostic);
            }

            return Task.CompletedTask;
        }

        private static async Task<Document> SetValueAsync(Document document, Diagnostic diagnostic, string literal, CancellationToken cancellationToken)
        {
            var root = await document.GetSyntaxRootAsync(cancellationToken).ConfigureAwait(false);
            if (root == null)
            {
                return document;
            }

            var span = diagnostic.AdditionalLocations[0].SourceSpan;
            if (root.FindNode(span, getInnermostNodeForTie: true) is not ExpressionSyntax value)
            {
                return document;
            }

            // Walk up to the node that spans exactly the value (FindNode may return an inner token's node).
            while (value.Parent is ExpressionSyntax parent && parent.Span == span)
            {
                value = parent;
            }

            // Keep the comments and spacing around the old value.
            var replacement = SyntaxFactory.ParseExpression(literal).WithTriviaFrom(value);
            return document.WithSyntaxRoot(root.ReplaceNode(value, replacement));
        }

        /// <summary>A C# literal of the member's own type, so the fixed code compiles: 0.7f, 0.7, 0.7m, 1, 1L, 1u.</summary>
        internal static bool TryGetLiteral(Diagnostic diagnostic, out string literal)
        {
            literal = string.Empty;
            if (!diagnostic.Properties.TryGetValue(FixProperties.Value, out var text)
                || !double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value)
                || !diagnostic.Properties.TryGetValue(FixProperties.NumericKind, out var kindText)
                || !System.Enum.TryParse<NumericKind>(kindText, out var kind))
            {
                return false;
            }

            var fractional = value.ToString("0.0###", CultureInfo.InvariantCulture);
            var whole = System.Math.Round(value).ToString("0", CultureInfo.InvariantCulture);
            var negative = value < 0;
            literal = kind switch
            {
                NumericKind.Float => fractional + "f",
                NumericKind.Decimal => fractional + "m",
                NumericKind.Int => whole,
                NumericKind.Long => whole + "L",
                NumericKind.UInt when !negative => whole + "u",
                NumericKind.UInt => string.Empty,
                _ => fractional,
            };
            return literal.Length > 0;
        }
    }
}
