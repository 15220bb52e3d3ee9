using System.Collections.Generic;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>SAMP009: a temperature so high the output degrades toward noise (above 1.5 by default).</summary>
    internal static class ExtremeTemperatureRule
    {
        public static IEnumerable<Finding> Evaluate(Request request, TemperancePolicy policy)
        {
            foreach (var write in request.Writes)
            {
                if (write.Setting != Setting.Temperature || write.Kind != ValueKind.Known)
                {
                    continue;
                }

                if (policy.ExtremeTemperature is not { } threshold || write.Value <= threshold.Value)
                {
                    continue;
                }

                if (ValueOutOfRangeRule.IsOutOfRange(write, request.Provider, policy, out _, out _))
                {
                    continue; // SAMP005 already covers it
                }

                var recommended = Recommended.Temperature(policy);
                var (locations, properties) = FixProperties.SetValueEdit(write, recommended.Value);
                yield return new Finding(
                    Descriptors.ExtremeTemperature, write.Location, locations, properties,
                    FixProperties.Show(write.Value) + Notes.Origin(write), FixProperties.Show(threshold.Value), threshold.Key, Notes.Conditional(write));
            }
        }
    }
}
