using System.Collections.Generic;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>SAMP009: a temperature so high the output degrades toward noise (above 1.5 by default).</summary>
    internal static class ExtremeTemperatureRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            if (input.Policy.ExtremeTemperature is not { } threshold)
            {
                yield break;
            }

            foreach (var write in input.Request.Writes)
            {
                if (write.Setting != Setting.Temperature || write.Kind != ValueKind.Known || write.Value <= threshold.Value)
                {
                    continue;
                }

                yield return new Finding(
                    Descriptors.ExtremeTemperature, write.Location, new FixPlan().SetValue(write, Recommended.Temperature(input).Value),
                    FixProperties.Show(write.Value) + Notes.Origin(write), FixProperties.Show(threshold.Value), threshold.Key, Notes.Conditional(write)).About(write);
            }
        }
    }
}
