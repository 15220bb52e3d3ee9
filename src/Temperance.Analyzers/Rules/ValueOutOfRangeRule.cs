using System.Collections.Generic;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>SAMP005: a written value outside the provider's accepted range (from the rules table).</summary>
    internal static class ValueOutOfRangeRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            var (request, policy) = (input.Request, input.Policy);
            foreach (var write in request.Writes)
            {
                if (write.Kind != ValueKind.Known || policy.Range(input.RangeProvider, write.Setting) is not { } range)
                {
                    continue;
                }

                var tooLow = range.Min != null && write.Value < range.Min.Value.Value;
                var tooHigh = range.Max != null && write.Value > range.Max.Value.Value;
                if (!tooLow && !tooHigh)
                {
                    continue;
                }

                var limit = tooLow ? range.Min!.Value : range.Max!.Value;
                var fixValue = limit.Value;
                if (Integral(write))
                {
                    fixValue = tooLow ? System.Math.Ceiling(fixValue) : System.Math.Floor(fixValue);
                }

                // Clamping a temperature to a high maximum (2.0) would land on SAMP009, and clamping it below a value the
                // publisher advises keeping would land on SAMP010: write the recommended value instead.
                if (write.Setting == Setting.Temperature
                    && ((policy.ExtremeTemperature is { } extreme && fixValue > extreme.Value) || input.Family?.RecommendedTemperature?.Value > fixValue))
                {
                    fixValue = Recommended.Temperature(input).Value;
                }

                yield return new Finding(
                    Descriptors.ValueOutOfRange, write.Location, new FixPlan().SetValue(write, fixValue),
                    write.Member, FixProperties.Show(write.Value) + Notes.Origin(write), RangeText(range.Min, range.Max), input.RangeProvider,
                    write.Setting.KeyName(), limit.Key, Notes.Conditional(write)).About(write);
            }
        }

        private static bool Integral(SettingWrite write) =>
            write.LiteralKind is NumericKind.Int or NumericKind.Long or NumericKind.UInt;

        /// <summary>An open end is shown as unbounded.</summary>
        private static string RangeText(Limit? min, Limit? max)
        {
            var low = min == null ? "-∞" : FixProperties.Show(min.Value.Value);
            var high = max == null ? "∞" : FixProperties.Show(max.Value.Value);
            return $"[{low}, {high}]";
        }
    }
}
