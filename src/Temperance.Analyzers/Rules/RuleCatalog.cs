using System;
using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;

namespace Temperance.Rules
{
    /// <summary>
    /// One definition per rule: its descriptor, its function, and what the rest of the package derives from it (the
    /// fixer's IDs, the relaxed preset, which rules are judged at a helper's call site). Adding a rule is a descriptor in
    /// <see cref="Descriptors"/>, a line here, its function, its page in <c>rules/</c> and its tests; the meta-tests check
    /// the README table, the presets and the release tracking against this list.
    /// </summary>
    internal static class RuleCatalog
    {
        internal sealed class RuleDefinition
        {
            public RuleDefinition(DiagnosticDescriptor descriptor, Func<RuleInput, IEnumerable<Finding>> evaluate, bool fixable = true,
                bool dependsOnCallSite = false, bool noKnownFalsePositives = false)
            {
                Descriptor = descriptor;
                Evaluate = evaluate;
                Fixable = fixable;
                DependsOnCallSite = dependsOnCallSite;
                NoKnownFalsePositives = noKnownFalsePositives;
            }

            public DiagnosticDescriptor Descriptor { get; }
            public Func<RuleInput, IEnumerable<Finding>> Evaluate { get; }
            /// <summary>Its findings carry an edit the one code-fix provider applies.</summary>
            public bool Fixable { get; }
            /// <summary>
            /// Its verdict depends on where options are sent (the task, the test, the client's model), not on the values
            /// alone: for options a helper builds and a call site sends, only these are judged at the call site.
            /// </summary>
            public bool DependsOnCallSite { get; }
            /// <summary>No known false positives: the relaxed preset keeps it a warning while a team adopts the package.</summary>
            public bool NoKnownFalsePositives { get; }
        }

        public static readonly IReadOnlyList<RuleDefinition> All = new[]
        {
            new RuleDefinition(Descriptors.ValueOutOfRange, ValueOutOfRangeRule.Evaluate, noKnownFalsePositives: true),
            new RuleDefinition(Descriptors.ExtremeTemperature, ExtremeTemperatureRule.Evaluate, noKnownFalsePositives: true),
            new RuleDefinition(Descriptors.TemperatureAboveTaskCeiling, TaskCeilingRule.Evaluate, dependsOnCallSite: true),
            new RuleDefinition(Descriptors.CandidatesAtTemperatureZero, CandidatesAtZeroRule.Evaluate),
            new RuleDefinition(Descriptors.RandomSamplingInExactTest, RandomSamplingInTestRule.Evaluate, dependsOnCallSite: true),
            new RuleDefinition(Descriptors.MissingSeed, MissingSeedRule.Evaluate, dependsOnCallSite: true),
            new RuleDefinition(Descriptors.SettingRejectedOrDropped, RejectedSettingRule.Evaluate, dependsOnCallSite: true),
            new RuleDefinition(Descriptors.AdvisedAgainst, AdvisedAgainstRule.Evaluate, dependsOnCallSite: true),
            new RuleDefinition(Descriptors.TemperatureAndTopPBothChanged, TemperatureAndTopPRule.Evaluate),
            new RuleDefinition(Descriptors.InertSetting, InertSettingRule.Evaluate),
        };

        /// <summary>Every finding of one request, after <see cref="Precedence"/>.</summary>
        public static IEnumerable<Finding> Judge(RuleInput input) =>
            Precedence.Apply(All.SelectMany(rule => rule.Evaluate(input)).ToList());

        public static bool DependsOnCallSite(DiagnosticDescriptor descriptor) =>
            All.Any(rule => rule.Descriptor == descriptor && rule.DependsOnCallSite);

        /// <summary>The IDs the code-fix provider serves.</summary>
        public static IEnumerable<string> FixableIds => All.Where(r => r.Fixable).Select(r => r.Descriptor.Id);
    }
}
