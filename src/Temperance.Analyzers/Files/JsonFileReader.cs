using System;
using System.Collections.Generic;
using System.IO;
using Microsoft.CodeAnalysis.Text;
using Newtonsoft.Json;

namespace Temperance.Files
{
    /// <summary>
    /// Reads a JSON settings file into a <see cref="FileNode"/> tree with Json.NET, which takes comments and trailing
    /// commas as appsettings.json is written. Json.NET gives the position at the end of each token; the start is found by
    /// stepping back over the token's own characters.
    /// </summary>
    internal static class JsonFileReader
    {
        public static FileNode? Read(SourceText text, out FileParseError? error)
        {
            error = null;
            try
            {
                using var reader = new JsonTextReader(new StringReader(WithoutBom(text.ToString()))) { DateParseHandling = DateParseHandling.None, FloatParseHandling = FloatParseHandling.Double };
                if (!ReadSkippingComments(reader))
                {
                    return null; // empty file
                }

                var root = ReadValue(reader, text, LineStarts(text));
                if (ReadSkippingComments(reader))
                {
                    error = new FileParseError("Additional text after the end of the JSON value.", reader.LineNumber, reader.LinePosition);
                    return null;
                }

                return root;
            }
            catch (JsonException e)
            {
                var info = e as JsonReaderException;
                error = new FileParseError(FirstSentence(e.Message), info?.LineNumber ?? 0, info?.LinePosition ?? 0);
                return null;
            }
        }

        /// <summary>
        /// Whether a JSON file parses, without building its tree: a plain pass of the reader, for a large file that is only
        /// checked (appsettings.json, whose values are read where C# binds them).
        /// </summary>
        public static FileParseError? Validate(string content)
        {
            try
            {
                using var reader = new JsonTextReader(new StringReader(WithoutBom(content))) { DateParseHandling = DateParseHandling.None };
                var depth = 0;
                var complete = false;
                while (ReadSkippingComments(reader))
                {
                    if (complete)
                    {
                        return new FileParseError("Additional text after the end of the JSON value.", reader.LineNumber, reader.LinePosition);
                    }

                    switch (reader.TokenType)
                    {
                        case JsonToken.StartObject:
                        case JsonToken.StartArray:
                            depth++;
                            break;
                        case JsonToken.EndObject:
                        case JsonToken.EndArray:
                            depth--;
                            break;
                    }

                    complete = depth == 0 && reader.TokenType != JsonToken.PropertyName;
                }

                return complete || depth == 0 && reader.LineNumber == 0 ? null // complete, or an empty file
                    : new FileParseError("Unexpected end of the file.", reader.LineNumber, reader.LinePosition);
            }
            catch (JsonException e)
            {
                var info = e as JsonReaderException;
                return new FileParseError(FirstSentence(e.Message), info?.LineNumber ?? 0, info?.LinePosition ?? 0);
            }
        }

        private static FileNode ReadValue(JsonTextReader reader, SourceText text, int[] lines)
        {
            switch (reader.TokenType)
            {
                case JsonToken.StartObject:
                {
                    var start = End(reader, lines) - 1;
                    var entries = new List<FileEntry>();
                    var previousEnd = start + 1;
                    while (Next(reader) != JsonToken.EndObject)
                    {
                        if (reader.TokenType != JsonToken.PropertyName || reader.Value is not string name)
                        {
                            throw Unsupported(reader);
                        }

                        var keySpan = KeySpan(text, ColonOffset(reader, lines));
                        Next(reader);
                        var value = ReadValue(reader, text, lines);
                        entries.Add(new FileEntry(name, keySpan, value, Removal(text, previousEnd, keySpan.Start, value.Span.End)));
                        previousEnd = value.Span.End;
                    }

                    return FileNode.Mapping(TextSpan.FromBounds(start, End(reader, lines)), entries);
                }

                case JsonToken.StartArray:
                {
                    var start = End(reader, lines) - 1;
                    var items = new List<FileNode>();
                    while (Next(reader) != JsonToken.EndArray)
                    {
                        items.Add(ReadValue(reader, text, lines));
                    }

                    return FileNode.Sequence(TextSpan.FromBounds(start, End(reader, lines)), items);
                }

                case JsonToken.String:
                {
                    var end = End(reader, lines);
                    return FileNode.Scalar(TextSpan.FromBounds(StringStart(text, end - 1), end), (string?)reader.Value, quoted: true);
                }

                case JsonToken.StartConstructor:
                case JsonToken.Raw:
                case JsonToken.Bytes:
                case JsonToken.Undefined:
                    // Json.NET extensions (new Date(…)) that no prompt loader or configuration provider reads.
                    throw Unsupported(reader);

                default:
                {
                    // Numbers, true, false, null: the raw text is the value (1.0 stays "1.0", as a fix must see it).
                    var end = End(reader, lines);
                    var start = end;
                    while (start > 0 && IsBareTokenChar(text[start - 1]))
                    {
                        start--;
                    }

                    var raw = text.ToString(TextSpan.FromBounds(start, end));
                    return FileNode.Scalar(TextSpan.FromBounds(start, end), reader.TokenType == JsonToken.Null ? null : raw, quoted: false);
                }
            }
        }

        private static JsonToken Next(JsonTextReader reader)
        {
            if (!ReadSkippingComments(reader))
            {
                throw new JsonReaderException("Unexpected end of the file.", reader.Path, reader.LineNumber, reader.LinePosition, null);
            }

            return reader.TokenType;
        }

        private static bool ReadSkippingComments(JsonTextReader reader)
        {
            while (reader.Read())
            {
                if (reader.TokenType != JsonToken.Comment)
                {
                    return true;
                }
            }

            return false;
        }

        /// <summary>A byte-order mark left in the text (one the decoder kept) read as a space: same length, same positions.</summary>
        private static string WithoutBom(string content) => content.Length > 0 && content[0] == '\uFEFF' ? " " + content.Substring(1) : content;

        private static JsonReaderException Unsupported(JsonTextReader reader) =>
            new JsonReaderException($"Unsupported JSON token {reader.TokenType}.", reader.Path, reader.LineNumber, reader.LinePosition, null);

        /// <summary>
        /// Where each line starts, as Json.NET counts lines (\r\n, \r or \n). Not Roslyn's lines: those also break at
        /// U+2028, U+2029 and U+0085, which may sit inside a JSON string.
        /// </summary>
        private static int[] LineStarts(SourceText text)
        {
            var starts = new List<int> { 0 };
            for (var i = 0; i < text.Length; i++)
            {
                if (text[i] == '\r' && i + 1 < text.Length && text[i + 1] == '\n')
                {
                    i++;
                }

                if (text[i] is '\r' or '\n')
                {
                    starts.Add(i + 1);
                }
            }

            return starts.ToArray();
        }

        /// <summary>The offset just after the token the reader is on (Json.NET's line position counts from 1 to the token's last character).</summary>
        private static int End(JsonTextReader reader, int[] lines) =>
            lines[Math.Max(0, Math.Min(reader.LineNumber - 1, lines.Length - 1))] + reader.LinePosition;

        /// <summary>For a property name, Json.NET stops on the colon that follows it.</summary>
        private static int ColonOffset(JsonTextReader reader, int[] lines) => Math.Max(0, End(reader, lines) - 1);

        private static TextSpan KeySpan(SourceText text, int colon)
        {
            var end = colon;
            while (end > 0 && char.IsWhiteSpace(text[end - 1]))
            {
                end--;
            }

            if (end > 0 && text[end - 1] is '"' or '\'')
            {
                return TextSpan.FromBounds(StringStart(text, end - 1), end);
            }

            var start = end;
            while (start > 0 && IsBareTokenChar(text[start - 1]))
            {
                start--;
            }

            return TextSpan.FromBounds(start, end);
        }

        /// <summary>The opening quote of the string whose closing quote is at <paramref name="close"/> (escaped quotes skipped).</summary>
        private static int StringStart(SourceText text, int close)
        {
            var quote = text[close];
            for (var i = close - 1; i >= 0; i--)
            {
                if (text[i] != quote)
                {
                    continue;
                }

                var backslashes = 0;
                for (var j = i - 1; j >= 0 && text[j] == '\\'; j--)
                {
                    backslashes++;
                }

                if (backslashes % 2 == 0)
                {
                    return i;
                }
            }

            return close;
        }

        private static bool IsBareTokenChar(char c) => char.IsLetterOrDigit(c) || c is '.' or '-' or '+' or '_' or '$';

        /// <summary>
        /// What deleting an entry removes: the entry and its comma (the following one, or the preceding one for the last
        /// entry), and the whole line when the entry had it to itself.
        /// </summary>
        private static TextSpan Removal(SourceText text, int previousEnd, int start, int end)
        {
            var after = end;
            while (after < text.Length && text[after] is ' ' or '\t')
            {
                after++;
            }

            if (after < text.Length && text[after] == ',')
            {
                end = after + 1;
            }
            else
            {
                // The last entry: its comma is the first thing after the previous value that is neither space nor a comment.
                var comma = NextToken(text, previousEnd, start);
                if (comma >= 0 && text[comma] == ',')
                {
                    return TextSpan.FromBounds(comma, end);
                }
            }

            var line = text.Lines.GetLineFromPosition(start);
            var lastLine = text.Lines.GetLineFromPosition(end);
            if (IsBlank(text, line.Start, start) && IsBlank(text, end, lastLine.End))
            {
                return TextSpan.FromBounds(line.Start, lastLine.EndIncludingLineBreak);
            }

            return TextSpan.FromBounds(start, end);
        }

        /// <summary>The offset of the first character in [start, end) that is neither white space nor inside a comment; -1 if none.</summary>
        private static int NextToken(SourceText text, int start, int end)
        {
            for (var i = start; i < end; i++)
            {
                if (char.IsWhiteSpace(text[i]))
                {
                    continue;
                }

                if (text[i] == '/' && i + 1 < end && text[i + 1] == '/')
                {
                    while (i < end && text[i] != '\n' && text[i] != '\r')
                    {
                        i++;
                    }

                    continue;
                }

                if (text[i] == '/' && i + 1 < end && text[i + 1] == '*')
                {
                    var close = text.ToString(TextSpan.FromBounds(i + 2, end)).IndexOf("*/", StringComparison.Ordinal);
                    if (close < 0)
                    {
                        return -1;
                    }

                    i += close + 3;
                    continue;
                }

                return i;
            }

            return -1;
        }

        internal static bool IsBlank(SourceText text, int start, int end)
        {
            for (var i = start; i < end; i++)
            {
                if (!char.IsWhiteSpace(text[i]))
                {
                    return false;
                }
            }

            return true;
        }

        private static string FirstSentence(string message)
        {
            var path = message.IndexOf(" Path '", StringComparison.Ordinal);
            return (path > 0 ? message.Substring(0, path) : message).Trim();
        }
    }
}
