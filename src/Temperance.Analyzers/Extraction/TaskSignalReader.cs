using System;
using System.Collections.Generic;
using System.Linq;
using System.Text.RegularExpressions;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;

namespace Temperance.Extraction
{
    /// <summary>
    /// Reads what the code says about a call's task: an annotation, identifiers, and constant prompt text in the same
    /// block. It only collects signals; deciding the task (and which signal wins) is the policy's job.
    /// </summary>
    internal static class TaskSignalReader
    {
        /// <summary>The annotation a team may declare itself (any namespace): <c>[LlmTask("extraction")]</c>.</summary>
        public const string AnnotationName = "LlmTaskAttribute";

        private const int QuoteLength = 48;

        // The leading verb of an identifier, after splitting on case and digits. Only verbs that name the task without
        // doubt count: nouns in names ("label", "tag", "code", "summary") describe data as often as a call, and a name is
        // weaker evidence than prompt text anyway.
        internal static readonly Dictionary<string, string> NameWords = new Dictionary<string, string>(StringComparer.Ordinal)
        {
            ["extract"] = "extraction",
            ["classify"] = "classification", ["categorize"] = "classification", ["categorise"] = "classification",
            ["grade"] = "evaluation", ["evaluate"] = "evaluation",
            ["translate"] = "translation",
            ["summarize"] = "summarization", ["summarise"] = "summarization",
            ["brainstorm"] = "brainstorming",
        };

        // Phrases in prompt text (lower case). "helpful assistant" and the like say nothing about the task.
        private static readonly (string Phrase, string Kind)[] PromptPhrases =
        {
            ("extract", "extraction"), ("return only json", "extraction"), ("respond only with json", "extraction"),
            ("respond with json", "extraction"), ("reply with json", "extraction"), ("as a json object", "extraction"), ("fill in the fields", "extraction"),
            ("classify", "classification"), ("label the", "classification"), ("label this", "classification"), ("as one of", "classification"),
            ("one of the following labels", "classification"), ("reply with the label", "classification"), ("categorize", "classification"),
            ("categorise", "classification"), ("which category", "classification"),
            ("write a sql", "code"), ("sql query", "code"), ("write a c#", "code"), ("write a function", "code"), ("write a method", "code"),
            ("generate code", "code"), ("return only code", "code"),
            ("grade the", "evaluation"), ("score the", "evaluation"), ("rate the", "evaluation"), ("you are a judge", "evaluation"),
            ("on a scale of", "evaluation"), ("evaluate the", "evaluation"),
            ("translate", "translation"),
            ("summarize", "summarization"), ("summarise", "summarization"), ("summary of", "summarization"),
            ("brainstorm", "brainstorming"), ("come up with ideas", "brainstorming"), ("list ideas", "brainstorming"),
            ("write a poem", "creative"), ("write a story", "creative"), ("short story", "creative"), ("poem about", "creative"),
        };


        /// <summary>An explicit <c>[LlmTask("kind")]</c> on the member, or on its type or an enclosing type.</summary>
        public static TaskSignal? Annotation(ISymbol? member)
        {
            for (var symbol = member; symbol != null; symbol = symbol.ContainingType)
            {
                foreach (var attribute in symbol.GetAttributes())
                {
                    if (attribute.AttributeClass?.Name == AnnotationName
                        && attribute.ConstructorArguments.Length == 1
                        && attribute.ConstructorArguments[0].Value is string kind)
                    {
                        return new TaskSignal(kind.Trim().ToLowerInvariant(), TaskSignalSource.Annotation, $"[LlmTask(\"{kind}\")] on '{symbol.Name}'");
                    }
                }

                if (symbol is INamedTypeSymbol && symbol.ContainingType == null)
                {
                    break;
                }
            }

            return null;
        }

        /// <summary>
        /// Leading task verbs in the names of the containing member, its type and the variable holding the options. In a
        /// test or a test class the member and type name describe the test (<c>GradeEssayTests</c>), not the call under test.
        /// </summary>
        public static IEnumerable<TaskSignal> FromNames(ISymbol? member, ISymbol? holder, bool namesDescribeATest = false)
        {
            var named = new List<(string Name, string What)>();
            if (member != null && !namesDescribeATest)
            {
                named.Add((member.Name, member is IMethodSymbol ? "method name" : "member name"));
                if (member.ContainingType != null)
                {
                    named.Add((member.ContainingType.Name, "type name"));
                }
            }

            if (holder != null)
            {
                named.Add((holder.Name, "variable name"));
            }

            foreach (var (name, what) in named)
            {
                if (KindOfName(name) is { } kind)
                {
                    yield return new TaskSignal(kind, TaskSignalSource.Name, $"the {what} '{name}'");
                }
            }
        }

        /// <summary>
        /// The task named by the leading verb of an identifier (after an optional "Try"): <c>ExtractInvoiceFields</c>,
        /// <c>TryClassifyTicket</c>. Words split as in PascalCase: "SQLQuery" is "SQL" + "Query", digits and underscores
        /// separate, and an acronym's last capital starts the next word. Hand-written rather than a regular expression
        /// because it runs for every request.
        /// </summary>
        internal static string? KindOfName(string name)
        {
            var i = 0;
            var first = true;
            while (i < name.Length)
            {
                if (!IsUpper(name[i]) && !IsLower(name[i]))
                {
                    i++;
                    continue;
                }

                var end = i + 1;
                if (IsUpper(name[i]) && end < name.Length && IsUpper(name[end]))
                {
                    // An acronym runs up to the capital that starts the next word: "SQLQuery" gives "SQL".
                    while (end < name.Length && IsUpper(name[end]))
                    {
                        end++;
                    }

                    if (end < name.Length && IsLower(name[end]))
                    {
                        end--;
                    }
                }
                else
                {
                    while (end < name.Length && IsLower(name[end]))
                    {
                        end++;
                    }
                }

                if (first && end - i == 3 && string.Compare(name, i, "try", 0, 3, StringComparison.OrdinalIgnoreCase) == 0)
                {
                    first = false;
                    i = end;
                    continue;
                }

                return Lookup(name, i, end);
            }

            return null;
        }

        private static bool IsUpper(char c) => c >= 'A' && c <= 'Z';

        private static bool IsLower(char c) => c >= 'a' && c <= 'z';

        private static string? Lookup(string name, int start, int end) =>
            end - start >= 3 && NameWords.TryGetValue(name.Substring(start, end - start).ToLowerInvariant(), out var kind) ? kind : null;

        /// <summary>Constant text among the block's operations: literals, const and static readonly string fields, interpolation text.</summary>
        public static IEnumerable<TaskSignal> FromPrompts(IEnumerable<IOperation> operations) => FromTexts(ConstantTexts(operations));

        /// <summary>Task phrases in prompt texts (a template, an agent's instructions, a prompt file's body), one signal per kind.</summary>
        public static IEnumerable<TaskSignal> FromTexts(IEnumerable<string> texts)
        {
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var text in texts)
            {
                var lower = text.ToLowerInvariant();
                foreach (var (phrase, kind) in PromptPhrases)
                {
                    if (lower.Contains(phrase) && seen.Add(kind))
                    {
                        yield return new TaskSignal(kind, TaskSignalSource.Prompt, $"the prompt text '{Quote(text)}'");
                        break;
                    }
                }
            }
        }

        private static IEnumerable<string> ConstantTexts(IEnumerable<IOperation> operations)
        {
            foreach (var operation in operations)
            {
                switch (operation)
                {
                    case ILiteralOperation { ConstantValue: { HasValue: true, Value: string literal } } when literal.Length > 6:
                        yield return literal;
                        break;
                    case IFieldReferenceOperation { Field: { } field } when field.Type.SpecialType == SpecialType.System_String:
                        if (field.HasConstantValue && field.ConstantValue is string constant)
                        {
                            yield return constant;
                        }
                        else if (field.IsStatic && field.IsReadOnly && StaticReadonlyText(field) is { } text)
                        {
                            yield return text;
                        }

                        break;
                    case IInterpolatedStringTextOperation { Text.ConstantValue: { HasValue: true, Value: string part } }:
                        yield return part;
                        break;
                }
            }
        }

        private static string? StaticReadonlyText(IFieldSymbol field)
        {
            if (field.DeclaringSyntaxReferences.Length != 1
                || field.DeclaringSyntaxReferences[0].GetSyntax() is not VariableDeclaratorSyntax { Initializer.Value: LiteralExpressionSyntax literal })
            {
                return null;
            }

            return literal.Token.Value as string;
        }

        private static string Quote(string text)
        {
            var flat = Regex.Replace(text, @"\s+", " ").Trim();
            return flat.Length <= QuoteLength ? flat : flat.Substring(0, QuoteLength) + "…";
        }
    }
}
