using System.Collections.Generic;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>SAMP009: a temperature so high the output degrades toward noise (above 1.5 by default).</summary>
    internal static class ExtremeTemperatureRule
    {
        /// <summary>Shared with SAMP001, which yields to this rule; this rule yields to SAMP005.</summary>
        public static bool IsExtreme(SettingWrite write, string provider, TemperancePolicy policy) =>
            write.Setting == Setting.Temperature && write.Kind == ValueKind.Known
            && policy.ExtremeTemperature is { } threshold && write.Value > threshold.Value
            && !ValueOutOfRangeRule.IsOutOfRange(write, provider, policy, out _, out _);

        public static IEnumerable<Finding> Evaluate(Request request, TemperancePolicy policy)
        {
            foreach (var write in request.Writes)
            {
                if (write.Setting != Setting.Temperature || write.Kind != ValueKind.Known)
                {
                    continue;
                }

                if (!IsExtreme(write, request.Provider, policy) || policy.ExtremeTemperature is not { } threshold)
                {
                    continue;
                }

                var recommended = Recommended.Temperature(request, policy);
                yield return new Finding(
                    Descriptors.ExtremeTemperature, write.Location, new FixPlan().SetValue(write, recommended.Value),
                    FixProperties.Show(write.Value) + Notes.Origin(write), FixProperties.Show(threshold.Value), threshold.Key, Notes.Conditional(write));
            }
        }
    }
}
