using System.Collections.Generic;
using System.Linq;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP006 (Info): a setting another setting cancels. Temperature 0 is greedy decoding, so truncating the candidate
    /// set (top-p below 1, top-k above 1, min-p above 0) changes nothing; top-k 1 or top-p 0 leaves one token, so
    /// temperature has nothing to reshape; ONNX <c>do_sample = false</c> is greedy search, so every sampling knob is ignored.
    /// </summary>
    internal static class InertSettingRule
    {
        private const string Greedy = "temperature is 0: decoding is greedy and always takes the most likely token";

        public static IEnumerable<Finding> Evaluate(Request request, TemperancePolicy policy)
        {
            var temperature = request.KindOf(Setting.Temperature, out var t);
            if (temperature == ValueKind.Known && t == 0)
            {
                foreach (var finding in Inert(request, Setting.TopP, v => v < 1, Greedy))
                {
                    yield return finding;
                }

                foreach (var finding in Inert(request, Setting.TopK, v => v > 1, Greedy))
                {
                    yield return finding;
                }

                foreach (var finding in Inert(request, Setting.MinP, v => v > 0, Greedy))
                {
                    yield return finding;
                }
            }

            if (request.KindOf(Setting.TopK, out var k) == ValueKind.Known && k == 1 && temperature == ValueKind.Known && t > 0)
            {
                foreach (var finding in Inert(request, Setting.Temperature, v => v > 0, "top-k is 1: only the single most likely token is left to sample"))
                {
                    yield return finding;
                }
            }

            // top-p 0 keeps only the most likely token (providers treat it as greedy), so temperature has nothing to reshape.
            if (request.KindOf(Setting.TopP, out var p) == ValueKind.Known && p == 0 && temperature == ValueKind.Known && t > 0)
            {
                foreach (var finding in Inert(request, Setting.Temperature, v => v > 0, "top-p is 0: only the single most likely token is left to sample"))
                {
                    yield return finding;
                }
            }

            if (request.KindOf(Setting.DoSample, out var sample) == ValueKind.Known && sample == 0)
            {
                const string Search = "do_sample is false: ONNX Runtime GenAI then runs greedy search and ignores sampling settings";
                foreach (var setting in new[] { Setting.Temperature, Setting.TopP, Setting.TopK })
                {
                    foreach (var finding in Inert(request, setting, _ => true, Search))
                    {
                        yield return finding;
                    }
                }
            }
        }

        private static IEnumerable<Finding> Inert(Request request, Setting setting, System.Func<double, bool> inert, string because)
        {
            if (request.KindOf(setting, out var value) != ValueKind.Known || !inert(value))
            {
                yield break;
            }

            var write = request.LastWrite(setting)!;
            yield return new Finding(Descriptors.InertSetting, write.Location, new FixPlan().Remove(write),
                $"{write.Member} = {FixProperties.Show(value)}", because);
        }
    }
}
