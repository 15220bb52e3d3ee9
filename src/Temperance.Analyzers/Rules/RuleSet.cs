using System;
using System.Collections.Generic;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>The rules, in precedence order. Each is a small function: request + policy -> findings.</summary>
    internal static class RuleSet
    {
        public static readonly IReadOnlyList<Func<Request, TemperancePolicy, IEnumerable<Finding>>> All =
            new Func<Request, TemperancePolicy, IEnumerable<Finding>>[]
            {
                ValueOutOfRangeRule.Evaluate,
                ExtremeTemperatureRule.Evaluate,
                TaskCeilingRule.Evaluate,
                CandidatesAtZeroRule.Evaluate,
                RandomSamplingInTestRule.Evaluate,
                MissingSeedRule.Evaluate,
                RejectedSettingRule.Evaluate,
                TemperatureAndTopPRule.Evaluate,
                InertSettingRule.Evaluate,
            };

        /// <summary>
        /// Rules whose verdict depends on where options are sent (the task, the test, the client's model), not on the
        /// values alone. For options a helper builds and a call site sends, only these are judged at the call site: the
        /// helper's own block already judges the values.
        /// </summary>
        public static bool DependsOnCallSite(Microsoft.CodeAnalysis.DiagnosticDescriptor descriptor) =>
            descriptor == Descriptors.TemperatureAboveTaskCeiling || descriptor == Descriptors.RandomSamplingInExactTest
            || descriptor == Descriptors.MissingSeed || descriptor == Descriptors.SettingRejectedOrDropped;
    }
}
