using System.Collections.Generic;
using System.Threading;
using System.Threading.Tasks;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CodeActions;
using Microsoft.CodeAnalysis.CodeFixes;
using Microsoft.CodeAnalysis.Text;
using Temperance.Rules;

namespace Temperance.CodeFixes
{
    /// <summary>
    /// The same edits applied to a settings file (a prompt directory's config.json, a YAML template, an agent definition):
    /// there a SetValue replaces the value's text and a RemoveMember deletes the span the reader chose so the file stays
    /// valid. Adding a setting to a file is not offered: where and how to write a new key is the file format's business.
    /// </summary>
    internal static class SettingsFileFixes
    {
        public static Task RegisterAsync(CodeFixContext context)
        {
            foreach (var diagnostic in context.Diagnostics)
            {
                if (!FixProperties.TryDecode(diagnostic.Properties, out var fix))
                {
                    continue;
                }

                var edits = new List<(FixEdit Edit, int Index, string Text, string Title)>();
                for (var index = 0; index < fix.Edits.Length; index++)
                {
                    var edit = fix.Edits[index];
                    if (edit.Kind == FixEditKind.SetValue && TemperanceCodeFixProvider.TryFormat(edit.Value, edit.NumericKind, out var literal))
                    {
                        edits.Add((edit, index, literal, $"Set {edit.Member} to {literal}"));
                    }
                    else if (edit.Kind == FixEditKind.RemoveMember)
                    {
                        edits.Add((edit, index, string.Empty, $"Remove {edit.Member}"));
                    }
                }

                if (edits.Count == 0 || (fix.Combined && edits.Count != fix.Edits.Length))
                {
                    continue; // a combined fix applied in part would be a different fix
                }

                var document = context.TextDocument;
                if (fix.Combined)
                {
                    context.RegisterCodeFix(
                        CodeAction.Create(string.Join(" and ", edits.ConvertAll(e => e.Title)), ct => ApplyAsync(document, edits, ct), FixProperties.PrimaryKey),
                        diagnostic);
                    continue;
                }

                for (var i = 0; i < edits.Count; i++)
                {
                    var one = new[] { edits[i] };
                    var key = i == 0 ? FixProperties.PrimaryKey : FixProperties.Key(diagnostic.Id, edits[i].Edit.Kind, edits[i].Index);
                    context.RegisterCodeFix(CodeAction.Create(edits[i].Title, ct => ApplyAsync(document, one, ct), key), diagnostic);
                }
            }

            return Task.CompletedTask;
        }

        private static async Task<Solution> ApplyAsync(TextDocument document, IReadOnlyList<(FixEdit Edit, int Index, string Text, string Title)> edits, CancellationToken cancellationToken)
        {
            var text = await document.GetTextAsync(cancellationToken).ConfigureAwait(false);
            var changes = new List<TextChange>();
            foreach (var edit in edits)
            {
                if (edit.Edit.Span.End <= text.Length)
                {
                    changes.Add(new TextChange(edit.Edit.Span, edit.Text));
                }
            }

            changes.Sort((a, b) => a.Span.Start.CompareTo(b.Span.Start));
            var solution = document.Project.Solution;
            return solution.GetAdditionalDocument(document.Id) != null
                ? solution.WithAdditionalDocumentText(document.Id, text.WithChanges(changes))
                : solution;
        }
    }
}
