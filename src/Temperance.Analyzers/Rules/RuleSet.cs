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
    }
}
