using System;
using System.Collections.Generic;
using System.Collections.Immutable;
using System.IO;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Diagnostics;
using Microsoft.CodeAnalysis.Text;

namespace Temperance.Policy
{
    /// <summary>
    /// Where a configuration key is written, and what was probably meant when it is wrong. The package adds the build's
    /// .editorconfig and .globalconfig files as additional files, so a compilation-wide problem can point at its line.
    /// </summary>
    internal static class ConfigSource
    {
        /// <summary>
        /// The line that sets <paramref name="key"/> in one of the analyzer config files the build passed as additional
        /// files; the first file that mentions it when no line matches exactly; null when none does.
        /// </summary>
        public static Location? Find(ImmutableArray<AdditionalText> files, string key, System.Threading.CancellationToken cancellationToken)
        {
            Location? mention = null;
            foreach (var file in files)
            {
                if (!IsConfigFile(file.Path) || file.GetText(cancellationToken) is not { } text)
                {
                    continue;
                }

                foreach (var line in text.Lines)
                {
                    var content = line.ToString();
                    var start = content.Length - content.TrimStart().Length;
                    if (string.CompareOrdinal(content, start, key, 0, key.Length) != 0)
                    {
                        continue;
                    }

                    var rest = content.Substring(start + key.Length).TrimStart();
                    if (rest.StartsWith("=", StringComparison.Ordinal) || rest.StartsWith(":", StringComparison.Ordinal))
                    {
                        var span = TextSpan.FromBounds(line.Start + start, line.End);
                        return Location.Create(file.Path, span, text.Lines.GetLinePositionSpan(span));
                    }
                }

                if (mention == null && text.ToString().IndexOf(key, StringComparison.Ordinal) >= 0)
                {
                    mention = Location.Create(file.Path, default, default);
                }
            }

            return mention;
        }

        private static bool IsConfigFile(string path)
        {
            var name = Path.GetFileName(path);
            return name.Equals(".editorconfig", StringComparison.OrdinalIgnoreCase)
                || name.EndsWith(".globalconfig", StringComparison.OrdinalIgnoreCase)
                || name.EndsWith(".editorconfig", StringComparison.OrdinalIgnoreCase);
        }

        /// <summary>" (did you mean 'extraction'?)" for the candidate nearest to a wrong value, when one is close; else empty.</summary>
        public static string Suggestion(string wrong, IEnumerable<string> candidates)
        {
            string? best = null;
            var bestDistance = int.MaxValue;
            foreach (var candidate in candidates)
            {
                var distance = Distance(wrong.ToLowerInvariant(), candidate.ToLowerInvariant());
                if (distance < bestDistance)
                {
                    best = candidate;
                    bestDistance = distance;
                }
            }

            // Close means a typo or two, not a different word: at most a quarter of the word, and at least one edit allowed.
            return best != null && bestDistance > 0 && bestDistance <= Math.Max(1, Math.Min(3, best.Length / 4)) ? $" (did you mean '{best}'?)" : string.Empty;
        }

        /// <summary>Edit distance with adjacent transpositions (optimal string alignment).</summary>
        internal static int Distance(string a, string b)
        {
            var d = new int[a.Length + 1, b.Length + 1];
            for (var i = 0; i <= a.Length; i++)
            {
                d[i, 0] = i;
            }

            for (var j = 0; j <= b.Length; j++)
            {
                d[0, j] = j;
            }

            for (var i = 1; i <= a.Length; i++)
            {
                for (var j = 1; j <= b.Length; j++)
                {
                    var cost = a[i - 1] == b[j - 1] ? 0 : 1;
                    d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + cost);
                    if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
                    {
                        d[i, j] = Math.Min(d[i, j], d[i - 2, j - 2] + 1);
                    }
                }
            }

            return d[a.Length, b.Length];
        }
    }
}
