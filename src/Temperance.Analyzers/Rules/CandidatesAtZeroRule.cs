using System.Collections.Generic;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>SAMP008: more than one candidate at temperature 0, where greedy decoding makes them all the same.</summary>
    internal static class CandidatesAtZeroRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            var candidates = input.Request.Value(Setting.Candidates);
            var temperature = input.Request.Value(Setting.Temperature);
            if (!candidates.IsKnown || candidates.Value <= 1 || !temperature.Is(0))
            {
                yield break;
            }

            var fix = new FixPlan().SetValue(candidates.Last!, 1);
            if (input.Policy.CandidatesTemperature is { } raised)
            {
                fix.SetValue(temperature.Last!, raised.Value);
            }

            yield return new Finding(Descriptors.CandidatesAtTemperatureZero, candidates.Last!.Location, fix, FixProperties.Show(candidates.Value))
                .About(candidates.Last!, temperature.Last!);
        }
    }
}
