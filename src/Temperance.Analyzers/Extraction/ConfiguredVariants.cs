using System.Collections.Generic;
using System.Globalization;
using System.Text;
using System.Threading;
using Microsoft.CodeAnalysis;
using Temperance.Model;

namespace Temperance.Extraction
{
    /// <summary>
    /// A request that reads values through configuration-bound properties (<c>Temperature = _options.Temperature</c>,
    /// <c>new ChatClient(_options.Model, key)</c>) becomes one request per environment that gives them different values:
    /// appsettings.json alone, then each appsettings.{Environment}.json over it. Each copy carries Known writes that say which
    /// file decided them and is otherwise the same request, still located at the C# write; rules judge each copy like any
    /// request and never learn where values came from. Without a bound class the request is frozen as it is (Unknown).
    /// </summary>
    internal static class ConfiguredVariants
    {
        public static void Freeze(RequestDraft draft, ProjectConfiguration? configuration, CancellationToken cancellationToken, List<ExtractedRequest> into)
        {
            if (configuration == null || !ReadsProjectMembers(draft))
            {
                into.Add(draft.Freeze());
                return;
            }

            var writes = draft.Writes;
            var writeValues = new IReadOnlyList<ConfiguredValue>?[writes.Count];
            var bound = false;
            for (var i = 0; i < writes.Count; i++)
            {
                if (writes[i] is { Kind: ValueKind.Unknown, ReadFrom: { } path })
                {
                    writeValues[i] = configuration.ValuesOf(path, cancellationToken);
                    bound |= writeValues[i] != null;
                }
            }

            var modelValues = draft.ModelId == null && draft.ModelIdFrom is { } model && IsText(model) ? configuration.ValuesOf(model, cancellationToken) : null;
            var clientValues = draft.ClientModelId == null && draft.ClientModelIdFrom is { } client && IsText(client) ? configuration.ValuesOf(client, cancellationToken) : null;
            if (!bound && modelValues == null && clientValues == null)
            {
                into.Add(draft.Freeze());
                return;
            }

            // One copy per environment, skipping an environment whose values are those of a copy already made (it sets none of them).
            var environments = configuration.Environments(cancellationToken);
            var seen = new HashSet<string>();
            for (var e = 0; e < environments.Count; e++)
            {
                var signature = new StringBuilder();
                var resolved = new SettingWrite[writes.Count];
                var known = false;
                for (var i = 0; i < writes.Count; i++)
                {
                    resolved[i] = writes[i];
                    if (writeValues[i]?[e] is { Text: { } text, Origin: { } origin } && Number(text, writes[i].LiteralKind, writes[i].ReadFrom!.Last.Type) is { } number)
                    {
                        resolved[i] = writes[i].Resolved(number, origin);
                        known = true;
                        signature.Append(number.ToString("R", CultureInfo.InvariantCulture)).Append(origin);
                    }

                    signature.Append('|');
                }

                var modelId = draft.ModelId ?? ModelId(modelValues, e);
                var clientModelId = draft.ClientModelId ?? ModelId(clientValues, e);
                var modelOrigin = draft.ModelId != null ? null
                    : modelId != null ? modelValues![e].Origin
                    : draft.ClientModelId != null ? null
                    : clientModelId != null ? clientValues![e].Origin
                    : null;
                known |= modelOrigin != null;
                signature.Append(modelId).Append('|').Append(clientModelId).Append('|').Append(modelOrigin);
                if (seen.Add(signature.ToString()))
                {
                    into.Add(draft.Freeze(resolved, modelId, clientModelId, modelOrigin, known ? environments[e] : null));
                }
            }
        }

        private static bool ReadsProjectMembers(RequestDraft draft)
        {
            if (draft.ModelIdFrom != null || draft.ClientModelIdFrom != null)
            {
                return true;
            }

            foreach (var write in draft.Writes)
            {
                if (write.ReadFrom != null && write.Kind == ValueKind.Unknown)
                {
                    return true;
                }
            }

            return false;
        }

        private static bool IsText(MemberPath path) => path.Last.Type.SpecialType == SpecialType.System_String;

        /// <summary>A configured model id; an address or a sentence is not one (a syntax fallback may have read the wrong argument).</summary>
        private static string? ModelId(IReadOnlyList<ConfiguredValue>? values, int environment) =>
            values?[environment].Text is { Length: > 0 } text && text.IndexOf("://", System.StringComparison.Ordinal) < 0 && text.IndexOf(' ') < 0 ? text : null;

        /// <summary>
        /// The number a configured text binds to, as the binder converts it (invariant culture); null when it would not bind
        /// (a fraction for a whole-number member, a word), which leaves the value Unknown.
        /// </summary>
        private static double? Number(string text, NumericKind kind, ITypeSymbol memberType)
        {
            text = text.Trim();
            if (memberType.SpecialType == SpecialType.System_Boolean)
            {
                return bool.TryParse(text, out var flag) ? (flag ? 1 : 0) : null; // a greedy-search switch (do_sample)
            }

            if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var number) || double.IsNaN(number) || double.IsInfinity(number))
            {
                return null;
            }

            switch (kind)
            {
                case NumericKind.Float:
                    // As a float holds it, shown by its shortest text (1.4, not 1.39999998).
                    return double.Parse(((float)number).ToString("R", CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
                case NumericKind.Int or NumericKind.Long or NumericKind.UInt:
                    return number == System.Math.Floor(number) ? number : null;
                default:
                    return number;
            }
        }
    }
}
