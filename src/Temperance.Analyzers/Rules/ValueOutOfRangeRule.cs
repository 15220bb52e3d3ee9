using System.Collections.Generic;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>SAMP005: a written value outside the provider's accepted range (from the rules table).</summary>
    internal static class ValueOutOfRangeRule
    {
        public static IEnumerable<Finding> Evaluate(Request request, TemperancePolicy policy)
        {
            foreach (var write in request.Writes)
            {
                if (!IsOutOfRange(write, request.Provider, policy, out var min, out var max))
                {
                    continue;
                }

                var fixValue = write.Value < min!.Value.Value ? min.Value.Value : max!.Value.Value;
                fixValue = Integral(write) ? (write.Value < min.Value.Value ? System.Math.Ceiling(fixValue) : System.Math.Floor(fixValue)) : fixValue;
                var limitKey = write.Value < min.Value.Value ? min.Value.Key : max!.Value.Key;

                // Clamping a temperature to a high maximum (2.0) would land on SAMP009; write the recommended value instead.
                if (write.Setting == Setting.Temperature && policy.ExtremeTemperature is { } extreme && fixValue > extreme.Value)
                {
                    fixValue = Recommended.Temperature(request, policy).Value;
                }

                yield return new Finding(
                    Descriptors.ValueOutOfRange, write.Location, new FixPlan().SetValue(write, fixValue),
                    write.Member, FixProperties.Show(write.Value) + Notes.Origin(write), RangeText(min, max), request.Provider,
                    write.Setting.KeyName(), limitKey, Notes.Conditional(write));
            }
        }

        /// <summary>Shared with SAMP009, which yields to this rule (one mistake, one warning).</summary>
        public static bool IsOutOfRange(SettingWrite write, string provider, TemperancePolicy policy, out Limit? min, out Limit? max)
        {
            min = policy.Min(provider, write.Setting);
            max = policy.Max(provider, write.Setting);
            if (write.Kind != ValueKind.Known || (min == null && max == null))
            {
                return false;
            }

            // A range whose bounds are inverted is a configuration error (SAMP100), not a reason to warn on code.
            if (min != null && max != null && min.Value.Value > max.Value.Value)
            {
                policy.ReportInvertedRange(min.Value, max.Value);
                return false;
            }

            var tooLow = min != null && write.Value < min.Value.Value;
            var tooHigh = max != null && write.Value > max.Value.Value;
            if (!tooLow && !tooHigh)
            {
                return false;
            }

            // Messages and fixes need both ends; an open end is shown as unbounded.
            min ??= new Limit(double.NegativeInfinity, "(no minimum)");
            max ??= new Limit(double.PositiveInfinity, "(no maximum)");
            return true;
        }

        private static bool Integral(SettingWrite write) =>
            write.LiteralKind is NumericKind.Int or NumericKind.Long or NumericKind.UInt;

        private static string RangeText(Limit? min, Limit? max)
        {
            var low = min == null || double.IsNegativeInfinity(min.Value.Value) ? "-∞" : FixProperties.Show(min.Value.Value);
            var high = max == null || double.IsPositiveInfinity(max.Value.Value) ? "∞" : FixProperties.Show(max.Value.Value);
            return $"[{low}, {high}]";
        }
    }
}
