using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;

namespace Temperance.Rules
{
    /// <summary>
    /// One mistake, one warning: which finding makes which other one redundant. Rules never ask each other; the table is
    /// applied once to all findings of a request, before severities and locations are decided.
    /// </summary>
    internal static class Precedence
    {
        /// <summary>Where two findings must meet for one to stand for the other.</summary>
        internal enum Scope
        {
            /// <summary>Both are about at least one same write.</summary>
            SharedWrite,
            /// <summary>Both are about the same request.</summary>
            SameRequest,
        }

        internal sealed class Entry
        {
            public Entry(DiagnosticDescriptor winner, DiagnosticDescriptor loser, Scope scope, string why)
            {
                Winner = winner;
                Loser = loser;
                Scope = scope;
                Why = why;
            }

            public DiagnosticDescriptor Winner { get; }
            public DiagnosticDescriptor Loser { get; }
            public Scope Scope { get; }
            public string Why { get; }
        }

        public static readonly IReadOnlyList<Entry> Table = new[]
        {
            new Entry(Descriptors.ValueOutOfRange, Descriptors.ExtremeTemperature, Scope.SharedWrite,
                "a value the provider rejects is fixed first; it is not also reported as extreme"),
            new Entry(Descriptors.ValueOutOfRange, Descriptors.TemperatureAboveTaskCeiling, Scope.SharedWrite,
                "a value the provider rejects is fixed first; its task ceiling comes after"),
            new Entry(Descriptors.ExtremeTemperature, Descriptors.TemperatureAboveTaskCeiling, Scope.SharedWrite,
                "a temperature that degrades any task is not also above one task's ceiling"),
            new Entry(Descriptors.ValueOutOfRange, Descriptors.TemperatureAndTopPBothChanged, Scope.SharedWrite,
                "a rejected temperature or top-p is fixed before the two are balanced"),
            new Entry(Descriptors.ExtremeTemperature, Descriptors.TemperatureAndTopPBothChanged, Scope.SharedWrite,
                "an extreme temperature is fixed before the two are balanced"),
            new Entry(Descriptors.InertSetting, Descriptors.TemperatureAndTopPBothChanged, Scope.SharedWrite,
                "when one of the two cancels the other they do not fight: the inert one is named"),
            new Entry(Descriptors.SettingRejectedOrDropped, Descriptors.TemperatureAndTopPBothChanged, Scope.SharedWrite,
                "a setting the model rejects or the adapter drops is not in force, so it does not fight the other"),
            new Entry(Descriptors.SettingRejectedOrDropped, Descriptors.ValueOutOfRange, Scope.SharedWrite,
                "a setting the model rejects or the adapter drops is removed, not clamped"),
            new Entry(Descriptors.SettingRejectedOrDropped, Descriptors.ExtremeTemperature, Scope.SharedWrite,
                "a temperature the model rejects or the adapter drops is removed, not lowered"),
            new Entry(Descriptors.ValueOutOfRange, Descriptors.AdvisedAgainst, Scope.SharedWrite,
                "a value the provider rejects is fixed first, to the value the publisher advises"),
            new Entry(Descriptors.SettingRejectedOrDropped, Descriptors.AdvisedAgainst, Scope.SharedWrite,
                "a temperature the model rejects or the adapter drops is removed, not raised"),
            new Entry(Descriptors.RandomSamplingInExactTest, Descriptors.MissingSeed, Scope.SameRequest,
                "in a test comparing exact output with random sampling, the fix sets temperature 0 and the seed together"),
        };

        /// <summary>The findings of one request, without those another finding stands for.</summary>
        public static IEnumerable<Finding> Apply(IReadOnlyList<Finding> findings)
        {
            if (findings.Count < 2)
            {
                return findings;
            }

            return findings.Where(candidate => !findings.Any(other => !ReferenceEquals(other, candidate) && Outranks(other, candidate)));
        }

        /// <summary>True when <paramref name="winner"/> stands for <paramref name="loser"/> by an entry of the table.</summary>
        public static bool Outranks(Finding winner, Finding loser)
        {
            foreach (var entry in Table)
            {
                if (entry.Winner == winner.Descriptor && entry.Loser == loser.Descriptor
                    && (entry.Scope == Scope.SameRequest || winner.Concerns.Any(w => loser.Concerns.Contains(w))))
                {
                    return true;
                }
            }

            return false;
        }
    }
}
