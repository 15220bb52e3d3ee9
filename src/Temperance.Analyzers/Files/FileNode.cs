using System;
using System.Collections.Generic;
using Microsoft.CodeAnalysis.Text;

namespace Temperance.Files
{
    /// <summary>
    /// A parsed settings file, whatever its syntax (JSON or YAML): mappings, sequences and scalars, each with the span
    /// of its text, so a rule can report on a key and a fix can rewrite a value. Keys are matched ignoring case, as the
    /// .NET configuration binder and the prompt-template loaders do.
    /// </summary>
    internal sealed class FileNode
    {
        private static readonly FileEntry[] NoEntries = new FileEntry[0];
        private static readonly FileNode[] NoItems = new FileNode[0];

        private FileNode(FileNodeKind kind, TextSpan span, string? text, bool quoted, IReadOnlyList<FileEntry> entries, IReadOnlyList<FileNode> items)
        {
            Kind = kind;
            Span = span;
            Text = text;
            Quoted = quoted;
            Entries = entries;
            Items = items;
        }

        public FileNodeKind Kind { get; }
        /// <summary>The node's text in the file (for a scalar, the value as written, quotes included).</summary>
        public TextSpan Span { get; }
        /// <summary>A scalar's value (unquoted, unescaped); null for mappings and sequences and for a JSON/YAML null.</summary>
        public string? Text { get; }
        public bool Quoted { get; }
        public IReadOnlyList<FileEntry> Entries { get; }
        public IReadOnlyList<FileNode> Items { get; }

        public static FileNode Scalar(TextSpan span, string? text, bool quoted) => new FileNode(FileNodeKind.Scalar, span, text, quoted, NoEntries, NoItems);

        public static FileNode Mapping(TextSpan span, IReadOnlyList<FileEntry> entries) => new FileNode(FileNodeKind.Mapping, span, null, false, entries, NoItems);

        public static FileNode Sequence(TextSpan span, IReadOnlyList<FileNode> items) => new FileNode(FileNodeKind.Sequence, span, null, false, NoEntries, items);

        /// <summary>The entry under <paramref name="key"/> (ignoring case), or null.</summary>
        public FileEntry? Entry(string key)
        {
            foreach (var entry in Entries)
            {
                if (string.Equals(entry.Key, key, StringComparison.OrdinalIgnoreCase))
                {
                    return entry;
                }
            }

            return null;
        }

        /// <summary>The node at a path of keys (<c>model</c>, <c>options</c>), or null.</summary>
        public FileNode? At(params string[] path)
        {
            var node = this;
            foreach (var key in path)
            {
                node = node?.Entry(key)?.Value;
            }

            return node;
        }

        /// <summary>A scalar's text under <paramref name="key"/>, or null.</summary>
        public string? TextOf(string key) => Entry(key)?.Value is { Kind: FileNodeKind.Scalar } scalar ? scalar.Text : null;
    }

    internal enum FileNodeKind
    {
        Scalar,
        Mapping,
        Sequence,
    }

    /// <summary>One key of a mapping: its name and span, its value, and the span a removal deletes (the whole entry).</summary>
    internal sealed class FileEntry
    {
        public FileEntry(string key, TextSpan keySpan, FileNode value, TextSpan removal)
        {
            Key = key;
            KeySpan = keySpan;
            Value = value;
            Removal = removal;
        }

        public string Key { get; }
        public TextSpan KeySpan { get; }
        public FileNode Value { get; }
        /// <summary>What deleting this entry removes, so the file stays valid (a JSON comma, a YAML line).</summary>
        public TextSpan Removal { get; }
        /// <summary>From the key to the end of the value: where diagnostics about the entry go.</summary>
        public TextSpan Span => TextSpan.FromBounds(KeySpan.Start, Math.Max(KeySpan.End, Value.Span.End));
    }

    /// <summary>Why a file could not be read: the parser's message and where it stopped (1-based line and column).</summary>
    internal sealed class FileParseError
    {
        public FileParseError(string message, int line, int column)
        {
            Message = message;
            Line = line;
            Column = column;
        }

        public string Message { get; }
        public int Line { get; }
        public int Column { get; }
    }
}
