using System.Collections.Generic;
using System.Linq;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>SAMP008: more than one candidate at temperature 0, where greedy decoding makes them all the same.</summary>
    internal static class CandidatesAtZeroRule
    {
        public static IEnumerable<Finding> Evaluate(Request request, TemperancePolicy policy)
        {
            if (request.KindOf(Setting.Candidates, out var candidates) != ValueKind.Known || candidates <= 1
                || request.KindOf(Setting.Temperature, out var temperature) != ValueKind.Known || temperature != 0)
            {
                yield break;
            }

            var candidatesWrite = request.LastWrite(Setting.Candidates)!;
            var temperatureWrite = request.LastWrite(Setting.Temperature)!;
            var fix = new FixPlan().SetValue(candidatesWrite, 1);
            if (policy.CandidatesTemperature is { } raised)
            {
                fix.SetValue(temperatureWrite, raised.Value);
            }

            yield return new Finding(Descriptors.CandidatesAtTemperatureZero, candidatesWrite.Location, fix, FixProperties.Show(candidates));
        }
    }
}
