using System.Collections.Generic;
using System.Linq;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP004: temperature and top-p both changed from the provider's defaults. A value written out that equals the
    /// default is no change; temperature 0 or top-p 0 is SAMP006's case (one of them is then inert, not fighting).
    /// </summary>
    internal static class TemperatureAndTopPRule
    {
        public static IEnumerable<Finding> Evaluate(Request request, TemperancePolicy policy)
        {
            if (request.KindOf(Setting.Temperature, out var temperature) != ValueKind.Known
                || request.KindOf(Setting.TopP, out var topP) != ValueKind.Known
                || temperature == 0 || topP == 0)
            {
                yield break; // greedy either way: SAMP006 names the inert setting
            }

            if (policy.Default(request.Provider, Setting.Temperature) is not { } defaultTemperature
                || policy.Default(request.Provider, Setting.TopP) is not { } defaultTopP
                || temperature == defaultTemperature.Value || topP == defaultTopP.Value)
            {
                yield break;
            }

            // A model that rejects either setting is SAMP007's to report.
            if (policy.FamilyOf(request.EffectiveModelId) is { } family && (family.RejectsSetting(Setting.Temperature) || family.RejectsSetting(Setting.TopP)))
            {
                yield break;
            }

            var topPWrite = request.LastWrite(Setting.TopP)!;
            var temperatureWrite = request.LastWrite(Setting.Temperature)!;

            // One mistake, one warning: a value out of range (SAMP005) or extreme (SAMP009) is the thing to fix first.
            if (ValueOutOfRangeRule.IsOutOfRange(topPWrite, request.Provider, policy, out _, out _)
                || ValueOutOfRangeRule.IsOutOfRange(temperatureWrite, request.Provider, policy, out _, out _)
                || ExtremeTemperatureRule.IsExtreme(temperatureWrite, request.Provider, policy))
            {
                yield break;
            }
            yield return new Finding(
                Descriptors.TemperatureAndTopPBothChanged, topPWrite.Location, new FixPlan().Remove(topPWrite).Remove(temperatureWrite),
                FixProperties.Show(temperature), FixProperties.Show(topP), request.Provider,
                FixProperties.Show(defaultTemperature.Value), FixProperties.Show(defaultTopP.Value));
        }
    }
}
