using System.Collections.Generic;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP004: temperature and top-p both changed from the provider's defaults. A value written out that equals the
    /// default is no change, and at temperature 0 or top-p 0 decoding is greedy, so they cannot fight. When one of them cancels the other, or is rejected, out of range or extreme, that finding
    /// stands instead (<see cref="Precedence"/>).
    /// </summary>
    internal static class TemperatureAndTopPRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            var (request, policy) = (input.Request, input.Policy);
            var temperature = request.Value(Setting.Temperature);
            var topP = request.Value(Setting.TopP);
            if (!temperature.IsKnown || !topP.IsKnown
                || temperature.Value == 0 || topP.Value == 0 // greedy either way: they cannot fight
                || policy.Default(input.RangeProvider, Setting.Temperature) is not { } defaultTemperature
                || policy.Default(input.RangeProvider, Setting.TopP) is not { } defaultTopP
                || temperature.Value == defaultTemperature.Value || topP.Value == defaultTopP.Value)
            {
                yield break;
            }

            var topPWrite = topP.Last!;
            var temperatureWrite = temperature.Last!;
            yield return new Finding(
                Descriptors.TemperatureAndTopPBothChanged, topPWrite.Location, new FixPlan().Remove(topPWrite).Remove(temperatureWrite),
                FixProperties.Show(temperature.Value), FixProperties.Show(topP.Value), input.RangeProvider,
                FixProperties.Show(defaultTemperature.Value), FixProperties.Show(defaultTopP.Value)).About(topPWrite, temperatureWrite);
        }
    }
}
