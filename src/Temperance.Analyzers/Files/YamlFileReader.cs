using System;
using System.Collections.Generic;
using System.IO;
using Microsoft.CodeAnalysis.Text;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace Temperance.Files
{
    /// <summary>
    /// Reads a YAML settings file (or the front matter of a prompt file) into a <see cref="FileNode"/> tree with YamlDotNet.
    /// Only the first document is read; spans come from YamlDotNet's marks, shifted by where the YAML starts in the file.
    /// </summary>
    internal static class YamlFileReader
    {
        public static FileNode? Read(SourceText text, TextSpan yaml, out FileParseError? error)
        {
            error = null;
            try
            {
                var stream = new YamlStream();
                stream.Load(new StringReader(text.ToString(yaml)));
                return stream.Documents.Count == 0 ? null : Convert(stream.Documents[0].RootNode, text, yaml.Start);
            }
            catch (YamlException e)
            {
                // The line is the file's, not the front matter's.
                var line = (int)e.Start.Line + text.Lines.GetLineFromPosition(yaml.Start).LineNumber;
                error = new FileParseError(Innermost(e).Message.Trim(), line, (int)e.Start.Column);
                return null;
            }
        }

        /// <summary>
        /// The span of a front matter: the YAML between a first line <c>---</c> and the next line <c>---</c>; null when the
        /// file has none.
        /// </summary>
        public static TextSpan? FrontMatter(SourceText text)
        {
            if (text.Lines.Count < 2 || text.ToString(text.Lines[0].Span).TrimEnd() != "---")
            {
                return null;
            }

            for (var i = 1; i < text.Lines.Count; i++)
            {
                if (text.ToString(text.Lines[i].Span).TrimEnd() == "---")
                {
                    return TextSpan.FromBounds(text.Lines[1].Start, text.Lines[i].Start);
                }
            }

            return null;
        }

        private static FileNode Convert(YamlNode node, SourceText text, int offset)
        {
            var span = SpanOf(node, text, offset);
            switch (node)
            {
                case YamlMappingNode mapping:
                {
                    var entries = new List<FileEntry>();
                    foreach (var pair in mapping.Children)
                    {
                        if (pair.Key is YamlScalarNode { Value: { } key })
                        {
                            var keySpan = SpanOf(pair.Key, text, offset);
                            var value = Convert(pair.Value, text, offset);
                            entries.Add(new FileEntry(key, keySpan, value, Removal(text, keySpan, value, mapping.Style == YamlDotNet.Core.Events.MappingStyle.Flow)));
                        }
                    }

                    return FileNode.Mapping(span, entries);
                }

                case YamlSequenceNode sequence:
                {
                    var items = new List<FileNode>();
                    foreach (var item in sequence.Children)
                    {
                        items.Add(Convert(item, text, offset));
                    }

                    return FileNode.Sequence(span, items);
                }

                case YamlScalarNode scalar:
                {
                    var quoted = scalar.Style is ScalarStyle.SingleQuoted or ScalarStyle.DoubleQuoted;
                    var isNull = !quoted && (scalar.Value is null or "" or "~" or "null" or "Null" or "NULL");
                    return FileNode.Scalar(span, isNull ? null : scalar.Value, quoted);
                }

                default:
                    return FileNode.Scalar(span, null, quoted: false); // an alias: not followed
            }
        }

        private static TextSpan SpanOf(YamlNode node, SourceText text, int offset)
        {
            var start = Math.Min(text.Length, offset + (int)node.Start.Index);
            var end = Math.Min(text.Length, Math.Max(start, offset + (int)node.End.Index));
            return TextSpan.FromBounds(start, end);
        }

        /// <summary>
        /// A block entry with a one-line scalar value is removed with its line; anything else (flow style, a nested block)
        /// gets an empty span: no removal is offered for it.
        /// </summary>
        private static TextSpan Removal(SourceText text, TextSpan key, FileNode value, bool flow)
        {
            if (flow || value.Kind != FileNodeKind.Scalar)
            {
                return default;
            }

            var line = text.Lines.GetLineFromPosition(key.Start);
            if (!JsonFileReader.IsBlank(text, line.Start, key.Start) || text.Lines.GetLineFromPosition(value.Span.End).LineNumber != line.LineNumber)
            {
                return default;
            }

            return TextSpan.FromBounds(line.Start, line.EndIncludingLineBreak);
        }

        private static Exception Innermost(Exception e)
        {
            while (e.InnerException != null)
            {
                e = e.InnerException;
            }

            return e;
        }
    }
}
