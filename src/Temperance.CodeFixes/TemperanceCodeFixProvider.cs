using System.Collections.Generic;
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
using Microsoft.CodeAnalysis.Formatting;
using Microsoft.CodeAnalysis.Simplification;
using Temperance.Model;
using Temperance.Rules;

namespace Temperance.CodeFixes
{
    /// <summary>
    /// The one fixer. Rules describe their fix as <see cref="FixEdits"/> carried in diagnostic Properties (FixEdit.cs
    /// encodes and decodes them); this provider applies four generic edits (<see cref="FixEditKind"/>), and wraps the
    /// statement in a pragma when an edit uses an experimental member, so a new rule with a known edit needs no new fixer.
    /// </summary>
    [ExportCodeFixProvider(LanguageNames.CSharp, Name = nameof(TemperanceCodeFixProvider),
        DocumentKinds = new[] { nameof(TextDocumentKind.Document), nameof(TextDocumentKind.AdditionalDocument) }), Shared]
    public sealed class TemperanceCodeFixProvider : CodeFixProvider
    {
        /// <summary>Derived from the rule catalog: every rule whose findings carry an edit.</summary>
        public override ImmutableArray<string> FixableDiagnosticIds { get; } = RuleCatalog.FixableIds.ToImmutableArray();

        public override FixAllProvider GetFixAllProvider() => WellKnownFixAllProviders.BatchFixer;

        public override Task RegisterCodeFixesAsync(CodeFixContext context)
        {
            if (context.TextDocument is not Document)
            {
                return SettingsFileFixes.RegisterAsync(context);
            }

            foreach (var diagnostic in context.Diagnostics)
            {
                if (!FixProperties.TryDecode(diagnostic.Properties, out var fix))
                {
                    continue;
                }

                var edits = new List<Edit>();
                for (var index = 0; index < fix.Edits.Length; index++)
                {
                    if (Edit.TryCreate(fix.Edits[index], index, out var edit) && (edit.Kind != FixEditKind.RemoveMember || context.Document.TryGetSyntaxRoot(out var root) is false
                        || Removable(root!.FindNode(edit.Span, getInnermostNodeForTie: true)) != null))
                    {
                        edits.Add(edit);
                    }
                }

                if (edits.Count == 0)
                {
                    continue;
                }

                if (fix.Combined)
                {
                    var title = string.Join(" and ", edits.Select(e => e.Title));
                    context.RegisterCodeFix(
                        CodeAction.Create(title, ct => ApplyAsync(context.Document, edits, ct), FixProperties.PrimaryKey),
                        diagnostic);
                    continue;
                }

                for (var i = 0; i < edits.Count; i++)
                {
                    var edit = edits[i];
                    var key = i == 0 ? FixProperties.PrimaryKey : FixProperties.Key(diagnostic.Id, edit.Kind, edit.Index);
                    context.RegisterCodeFix(CodeAction.Create(edit.Title, ct => ApplyAsync(context.Document, new[] { edit }, ct), key), diagnostic);
                }
            }

            return Task.CompletedTask;
        }

        /// <summary>
        /// Applies the edits in order. Targets are marked with annotations first, so an edit inside another edit's target
        /// (a value inside the creation that also gets a member) is still found after the first change.
        /// </summary>
        private static async Task<Document> ApplyAsync(Document document, IReadOnlyList<Edit> edits, CancellationToken cancellationToken)
        {
            var root = await document.GetSyntaxRootAsync(cancellationToken).ConfigureAwait(false);
            if (root == null)
            {
                return document;
            }

            var marks = new Dictionary<SyntaxNode, SyntaxAnnotation>();
            var targets = new List<(Edit Edit, SyntaxAnnotation Mark)>();
            foreach (var edit in edits)
            {
                if (Target(root, edit) is not { } target)
                {
                    continue;
                }

                if (!marks.TryGetValue(target, out var mark))
                {
                    mark = new SyntaxAnnotation("Temperance.Target");
                    marks[target] = mark;
                }

                targets.Add((edit, mark));
            }

            root = root.ReplaceNodes(marks.Keys, (original, rewritten) => rewritten.WithAdditionalAnnotations(marks[original]));
            var experimental = new List<(string Id, SyntaxAnnotation Mark)>();
            foreach (var (edit, mark) in targets)
            {
                var node = root.GetAnnotatedNodes(mark).FirstOrDefault();
                if (node == null)
                {
                    continue;
                }

                root = ApplyOne(root, node, edit);
                if (edit.Experimental != null)
                {
                    experimental.Add((edit.Experimental, mark));
                }
            }

            foreach (var (id, mark) in experimental)
            {
                if (root.GetAnnotatedNodes(mark).FirstOrDefault() is { } node)
                {
                    root = SuppressExperimental(root, node, id);
                }
            }

            return document.WithSyntaxRoot(root);
        }

        private static SyntaxNode? Target(SyntaxNode root, Edit edit)
        {
            var node = root.FindNode(edit.Span, getInnermostNodeForTie: true);
            switch (edit.Kind)
            {
                case FixEditKind.SetValue:
                    // The outermost expression with exactly the span (an argument or parenthesis around it is not the value).
                    while (node.Parent is ExpressionSyntax && node.Parent.Span == edit.Span)
                    {
                        node = node.Parent;
                    }

                    return node as ExpressionSyntax;
                case FixEditKind.AddMember:
                    return FindCreation(node);
                case FixEditKind.AddArgument:
                    return node.DescendantNodesAndSelf().OfType<InvocationExpressionSyntax>().FirstOrDefault();
                case FixEditKind.RemoveMember:
                    return Removable(node);
                default:
                    return null;
            }
        }

        private static SyntaxNode ApplyOne(SyntaxNode root, SyntaxNode node, Edit edit) => edit.Kind switch
        {
            FixEditKind.SetValue => root.ReplaceNode(node, SyntaxFactory.ParseExpression(edit.Literal).WithTriviaFrom(node).WithAdditionalAnnotations(node.GetAnnotations("Temperance.Target"))),
            FixEditKind.AddMember when node is BaseObjectCreationExpressionSyntax creation => root.ReplaceNode(creation, AddMember(creation, edit)),
            FixEditKind.AddArgument when node is InvocationExpressionSyntax call => root.ReplaceNode(call, AddArgument(call, edit)),
            FixEditKind.RemoveMember => Remove(root, node),
            _ => root,
        };

        /// <summary>
        /// The edit used an [Experimental] member (OpenAI's Seed raises OPENAI001, an error by default): wrap the narrowest
        /// statement or member in a pragma, with the reason, so the fixed code still compiles.
        /// </summary>
        private static SyntaxNode SuppressExperimental(SyntaxNode root, SyntaxNode node, string id)
        {
            SyntaxNode? scope = node.AncestorsAndSelf().FirstOrDefault(n => n is StatementSyntax && n is not BlockSyntax)
                ?? node.AncestorsAndSelf().FirstOrDefault(n => n is MemberDeclarationSyntax);
            if (scope == null)
            {
                return root;
            }

            var leading = scope.GetLeadingTrivia();
            var indentation = leading.Count > 0 && leading[leading.Count - 1].IsKind(SyntaxKind.WhitespaceTrivia) ? leading[leading.Count - 1] : default;
            var before = indentation == default ? leading : SyntaxFactory.TriviaList(leading.Take(leading.Count - 1));
            var newline = SyntaxFactory.ElasticCarriageReturnLineFeed;
            var disable = SyntaxFactory.ParseLeadingTrivia($"#pragma warning disable {id} // {id}: the SDK marks this member experimental; set for reproducible runs\n");
            var restore = SyntaxFactory.ParseLeadingTrivia($"#pragma warning restore {id}\n");

            var newLeading = before;
            if (indentation != default)
            {
                newLeading = newLeading.Add(indentation);
            }

            newLeading = newLeading.AddRange(disable);
            if (indentation != default)
            {
                newLeading = newLeading.Add(indentation);
            }

            var trailing = scope.GetTrailingTrivia();
            if (!trailing.Any(t => t.IsKind(SyntaxKind.EndOfLineTrivia)))
            {
                trailing = trailing.Add(newline);
            }

            var newTrailing = trailing;
            if (indentation != default)
            {
                newTrailing = newTrailing.Add(indentation);
            }

            newTrailing = newTrailing.AddRange(restore);
            return root.ReplaceNode(scope, scope.WithLeadingTrivia(newLeading).WithTrailingTrivia(newTrailing));
        }

        /// <summary>
        /// What removing a setting removes: an initializer element, an anonymous-object member, or the whole statement of a
        /// mutation or keyed call. Null when nothing can go (an expression-bodied member is the call itself).
        /// </summary>
        private static SyntaxNode? Removable(SyntaxNode node)
        {
            for (var current = node; current != null; current = current.Parent)
            {
                switch (current)
                {
                    case AnonymousObjectMemberDeclaratorSyntax member:
                        return member;
                    case ExpressionSyntax element when current.Parent is InitializerExpressionSyntax:
                        return element;
                    case ExpressionStatementSyntax statement:
                        return statement;
                    case ArrowExpressionClauseSyntax:
                    case StatementSyntax:
                    case MemberDeclarationSyntax:
                        return null;
                }
            }

            return null;
        }

        /// <summary>Removes a list element or a statement and leaves the surrounding layout and comments as they were.</summary>
        private static SyntaxNode Remove(SyntaxNode root, SyntaxNode removable)
        {
            switch (removable.Parent)
            {
                case InitializerExpressionSyntax initializer:
                    return root.ReplaceNode(initializer, initializer.WithExpressions(WithoutElement(initializer.Expressions, (ExpressionSyntax)removable)));
                case AnonymousObjectCreationExpressionSyntax anonymous:
                    return root.ReplaceNode(anonymous, anonymous.WithInitializers(WithoutElement(anonymous.Initializers, (AnonymousObjectMemberDeclaratorSyntax)removable)));
            }

            // A statement: comments on the lines above it stay, its own line goes.
            var leading = removable.GetLeadingTrivia();
            var lastLineEnd = -1;
            for (var i = 0; i < leading.Count; i++)
            {
                if (leading[i].IsKind(SyntaxKind.EndOfLineTrivia))
                {
                    lastLineEnd = i;
                }
            }

            var kept = leading.Take(lastLineEnd + 1).ToList();
            var next = removable.GetLastToken().GetNextToken();
            var tracked = root.TrackNodes(removable);
            if (kept.Count > 0 && next != default)
            {
                var nextInTracked = tracked.FindToken(next.SpanStart);
                tracked = tracked.ReplaceToken(nextInTracked, nextInTracked.WithLeadingTrivia(kept.Concat(nextInTracked.LeadingTrivia)));
            }

            var current = tracked.GetCurrentNode(removable);
            return current == null ? root : tracked.RemoveNode(current, SyntaxRemoveOptions.KeepNoTrivia) ?? root;
        }

        private static SeparatedSyntaxList<T> WithoutElement<T>(SeparatedSyntaxList<T> list, T element)
            where T : SyntaxNode
        {
            var index = list.IndexOf(element);
            var items = list.ToList();
            var separators = list.GetSeparators().ToList();
            if (index < items.Count - 1 || separators.Count == items.Count)
            {
                // Not last (or a trailing comma follows it): the element goes with the comma after it.
                items.RemoveAt(index);
                separators.RemoveAt(index);
            }
            else
            {
                // Last without a trailing comma: the comma before it goes, and its trailing spacing moves to the new last element.
                var trailing = items[index].GetTrailingTrivia();
                items.RemoveAt(index);
                if (index > 0)
                {
                    separators.RemoveAt(index - 1);
                    items[index - 1] = items[index - 1].WithTrailingTrivia(trailing);
                }
            }

            return SyntaxFactory.SeparatedList(items, separators);
        }

        private static BaseObjectCreationExpressionSyntax? FindCreation(SyntaxNode node) =>
            node as BaseObjectCreationExpressionSyntax ?? node.DescendantNodesAndSelf().OfType<BaseObjectCreationExpressionSyntax>().FirstOrDefault();

        /// <summary><c>new X { A = 1 }</c> becomes <c>new X { A = 1, Temperature = 0.0f }</c>; a wrapper adds <c>Options = new T { … }</c>.</summary>
        private static SyntaxNode AddMember(BaseObjectCreationExpressionSyntax creation, Edit edit)
        {
            var assignments = edit.Assignments;
            if (edit.Wrapper != null && edit.TypeName != null)
            {
                assignments = new[] { (edit.Wrapper, (ExpressionSyntax)NewWithMembers(edit.TypeName, edit.Assignments)) };
            }

            var result = creation;
            foreach (var (member, value) in assignments)
            {
                result = AddOneMember(result, Assign(member, value));
            }

            return result;
        }

        private static BaseObjectCreationExpressionSyntax AddOneMember(BaseObjectCreationExpressionSyntax creation, ExpressionSyntax assignment)
        {
            var initializer = creation.Initializer;
            if (initializer == null)
            {
                var fresh = SyntaxFactory.InitializerExpression(SyntaxKind.ObjectInitializerExpression, SyntaxFactory.SingletonSeparatedList(assignment));
                // new X() { … } reads oddly; drop an empty argument list of an explicit creation.
                if (creation is ObjectCreationExpressionSyntax { ArgumentList.Arguments.Count: 0 } explicitCreation)
                {
                    return explicitCreation.WithArgumentList(null).WithType(explicitCreation.Type.WithTrailingTrivia(SyntaxFactory.Space))
                        .WithInitializer(fresh.WithTrailingTrivia(explicitCreation.GetTrailingTrivia())).WithAdditionalAnnotations(Formatter.Annotation);
                }

                return creation.WithInitializer(fresh).WithAdditionalAnnotations(Formatter.Annotation);
            }

            var expressions = initializer.Expressions;
            var multiline = initializer.OpenBraceToken.GetLocation().GetLineSpan().StartLinePosition.Line
                != initializer.CloseBraceToken.GetLocation().GetLineSpan().StartLinePosition.Line;
            if (multiline && expressions.Count > 0)
            {
                // Keep one member per line: copy the indentation of the existing members.
                var indentation = expressions[0].GetLeadingTrivia();
                var separators = expressions.GetSeparators().ToList();
                var items = expressions.ToList();
                var trailingComma = separators.Count == items.Count;
                var lastSeparator = trailingComma ? separators[separators.Count - 1] : SyntaxFactory.Token(SyntaxKind.CommaToken).WithTrailingTrivia(SyntaxFactory.ElasticCarriageReturnLineFeed);
                if (!trailingComma)
                {
                    items[items.Count - 1] = items[items.Count - 1].WithoutTrailingTrivia();
                    separators.Add(lastSeparator.WithTrailingTrivia(expressions[expressions.Count - 1].GetTrailingTrivia().Add(SyntaxFactory.ElasticCarriageReturnLineFeed)));
                }

                items.Add(assignment.WithLeadingTrivia(indentation));
                if (trailingComma)
                {
                    separators.Add(SyntaxFactory.Token(SyntaxKind.CommaToken).WithTrailingTrivia(lastSeparator.TrailingTrivia));
                }
                else
                {
                    items[items.Count - 1] = items[items.Count - 1].WithTrailingTrivia(SyntaxFactory.ElasticCarriageReturnLineFeed);
                }

                var list = SyntaxFactory.SeparatedList(items, separators);
                return creation.WithInitializer(initializer.WithExpressions(list));
            }

            return creation.WithInitializer(initializer.WithExpressions(expressions.Add(assignment.WithAdditionalAnnotations(Formatter.Annotation))))
                .WithAdditionalAnnotations(Formatter.Annotation);
        }

        /// <summary><c>client.Send(x)</c> becomes <c>client.Send(x, options: new Options { Temperature = 0.0f })</c>.</summary>
        private static SyntaxNode AddArgument(InvocationExpressionSyntax call, Edit edit)
        {
            var argument = SyntaxFactory.Argument(NewWithMembers(edit.TypeName!, edit.Assignments))
                .WithNameColon(SyntaxFactory.NameColon(SyntaxFactory.IdentifierName(edit.Parameter!)));
            return call.WithArgumentList(call.ArgumentList.AddArguments(argument)).WithAdditionalAnnotations(Formatter.Annotation);
        }

        private static ObjectCreationExpressionSyntax NewWithMembers(string typeName, IReadOnlyList<(string Member, ExpressionSyntax Value)> assignments) =>
            SyntaxFactory.ObjectCreationExpression(SyntaxFactory.ParseTypeName(typeName).WithAdditionalAnnotations(Simplifier.Annotation).WithTrailingTrivia(SyntaxFactory.Space))
                .WithInitializer(SyntaxFactory.InitializerExpression(
                    SyntaxKind.ObjectInitializerExpression,
                    SyntaxFactory.SeparatedList<ExpressionSyntax>(assignments.Select(a => Assign(a.Member, a.Value)))))
                .WithAdditionalAnnotations(Formatter.Annotation);

        private static AssignmentExpressionSyntax Assign(string member, ExpressionSyntax value) =>
            SyntaxFactory.AssignmentExpression(SyntaxKind.SimpleAssignmentExpression, SyntaxFactory.IdentifierName(member), value);

        /// <summary>A C# literal of the member's own type, so the fixed code compiles: 0.7f, 0.7, 0.7m, 1, 1L, 1u.</summary>
        internal static bool TryFormat(double value, NumericKind kind, out string literal)
        {
            var fractional = value.ToString("0.0###", CultureInfo.InvariantCulture);
            var whole = System.Math.Round(value).ToString("0", CultureInfo.InvariantCulture);
            literal = kind switch
            {
                NumericKind.Float => fractional + "f",
                NumericKind.Decimal => fractional + "m",
                NumericKind.Int => whole,
                NumericKind.Long => whole + "L",
                NumericKind.UInt when value >= 0 => whole + "u",
                NumericKind.UInt => string.Empty,
                _ => fractional,
            };
            return literal.Length > 0;
        }

        /// <summary>A decoded edit with its literals formatted for the member's type.</summary>
        private sealed class Edit
        {
            private Edit(FixEdit source, int index, string literal, IReadOnlyList<(string Member, string Literal)> extras)
            {
                Source = source;
                Index = index;
                Literal = literal;
                Extras = extras;
            }

            public FixEdit Source { get; }
            /// <summary>Its position among the diagnostic's edits, part of its equivalence key.</summary>
            public int Index { get; }
            public string Literal { get; }
            /// <summary>The extra assignments whose literal can be written (a negative uint cannot; it is left out).</summary>
            public IReadOnlyList<(string Member, string Literal)> Extras { get; }

            public FixEditKind Kind => Source.Kind;
            public Microsoft.CodeAnalysis.Text.TextSpan Span => Source.Span;
            public string Member => Source.Member;
            public string? Wrapper => Source.WrapperMember;
            /// <summary>The type of the new object: the wrapper of an AddMember, the options of an AddArgument.</summary>
            public string? TypeName => Source.Kind == FixEditKind.AddArgument ? Source.OptionsType : Source.WrapperType;
            public string? Parameter => Source.Parameter;
            public string? Experimental => Source.Experimental;

            /// <summary>The member assignments an AddMember/AddArgument writes: the main one, then the extras.</summary>
            public IReadOnlyList<(string Member, ExpressionSyntax Value)> Assignments =>
                new[] { (Member, Literal) }.Concat(Extras).Select(a => (a.Item1, SyntaxFactory.ParseExpression(a.Item2))).ToList();

            private string AssignmentText => string.Join(", ", new[] { (Member, Literal) }.Concat(Extras).Select(a => $"{a.Item1} = {a.Item2}"));

            public string Title => Kind switch
            {
                FixEditKind.AddMember => $"Add {AssignmentText}",
                FixEditKind.AddArgument => $"Pass options with {AssignmentText}",
                FixEditKind.RemoveMember => $"Remove {Member}",
                _ => $"Set {Member} to {Literal}",
            };

            /// <summary>False when the main value has no literal of the member's type (a negative uint).</summary>
            public static bool TryCreate(FixEdit source, int index, out Edit edit)
            {
                edit = null!;
                if (!TryFormat(source.Value, source.NumericKind, out var literal))
                {
                    return false;
                }

                var extras = new List<(string, string)>();
                foreach (var extra in source.Extras)
                {
                    if (TryFormat(extra.Value, extra.Kind, out var extraLiteral))
                    {
                        extras.Add((extra.Member, extraLiteral));
                    }
                }

                edit = new Edit(source, index, literal, extras);
                return true;
            }
        }
    }
}
