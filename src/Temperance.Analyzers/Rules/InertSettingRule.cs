using System.Collections.Generic;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP006 (Info): a setting another setting cancels. Temperature 0 is greedy decoding, so truncating the candidate
    /// set (top-p below 1, top-k above 1, min-p above 0) changes nothing; top-k 1 or top-p 0 leaves one token, so
    /// temperature has nothing to reshape; <c>do_sample = false</c> is greedy search, so every sampling knob is ignored.
    /// </summary>
    internal static class InertSettingRule
    {
        private const string Greedy = "temperature is 0: decoding is greedy and always takes the most likely token";
        private const string GreedySearch = "do_sample is false: the runtime then runs greedy search and ignores sampling settings";

        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            var request = input.Request;
            var temperature = request.Value(Setting.Temperature);
            var inert = new List<Finding>();
            if (temperature.Is(0))
            {
                Inert(request, Setting.TopP, v => v < 1, Greedy, inert);
                Inert(request, Setting.TopK, v => v > 1, Greedy, inert);
                Inert(request, Setting.MinP, v => v > 0, Greedy, inert);
            }

            if (request.Value(Setting.TopK).Is(1) && temperature.IsKnown && temperature.Value > 0)
            {
                Inert(request, Setting.Temperature, v => v > 0, "top-k is 1: only the single most likely token is left to sample", inert);
            }

            // top-p 0 keeps only the most likely token (providers treat it as greedy), so temperature has nothing to reshape.
            if (request.Value(Setting.TopP).Is(0) && temperature.IsKnown && temperature.Value > 0)
            {
                Inert(request, Setting.Temperature, v => v > 0, "top-p is 0: only the single most likely token is left to sample", inert);
            }

            // An unset do_sample is not judged: its built-in default is false (greedy), but the model folder's genai_config.json
            // decides for most models, and the analyzer cannot see it (rules table, onnx_genai.do_sample.default).
            if (request.Value(Setting.DoSample).Is(0))
            {
                foreach (var setting in new[] { Setting.Temperature, Setting.TopP, Setting.TopK })
                {
                    Inert(request, setting, _ => true, GreedySearch, inert);
                }
            }

            return inert;
        }

        private static void Inert(Request request, Setting setting, System.Func<double, bool> inert, string because, List<Finding> found)
        {
            var value = request.Value(setting);
            if (!value.IsKnown || !inert(value.Value))
            {
                return;
            }

            var write = value.Last!;
            found.Add(new Finding(Descriptors.InertSetting, write.Location, new FixPlan().Remove(write),
                $"{write.Member} = {FixProperties.Show(value.Value)}", because).About(write));
        }
    }
}
