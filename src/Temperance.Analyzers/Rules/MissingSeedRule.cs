using System.Collections.Generic;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP003: no seed where a run must be reproducible: a test comparing exact output at temperature 0, an evaluation
    /// (LLM-as-judge) task, or everywhere with <c>temperance.require_seed = always</c>. Only on surfaces that have a seed.
    /// </summary>
    internal static class MissingSeedRule
    {
        public static IEnumerable<Finding> Evaluate(Request request, TemperancePolicy policy)
        {
            var mode = policy.RequireSeed;
            if (mode == "never" || !request.SeedAvailable || request.KindOf(Setting.Seed, out _) != ValueKind.Unset)
            {
                yield break;
            }

            var temperatureKind = request.KindOf(Setting.Temperature, out var temperature);
            string? why = null;
            if (request.Context.IsTest && request.ExactAssertion != null && temperatureKind == ValueKind.Known && temperature == 0)
            {
                why = $"the test '{request.ExactAssertionIn ?? request.Context.Member?.Name}' compares its exact output with {request.ExactAssertion}";
            }
            else if (request.ExactAssertion == null && TaskInference.Infer(request, policy) is { Kind: "evaluation" } task)
            {
                why = $"an evaluation task, {task.Because}, must grade the same answer the same way";
            }
            else if (mode == "always" && !(request.Context.IsTest && request.ExactAssertion != null))
            {
                why = $"'{OptionKeys.RequireSeed} = always'";
            }

            if (why == null)
            {
                yield break; // in an exact test with random sampling, SAMP002 covers the seed
            }

            // The seed a fix writes comes from temperance.test_seed; when that is not a number (SAMP100) there is no fix.
            var fix = new FixPlan();
            if (!policy.TestSeedInvalid)
            {
                fix.AddUnset(request, (Setting.Seed, policy.TestSeed?.Value ?? 0));
            }

            yield return new Finding(Descriptors.MissingSeed, request.Location, fix, why, request.Surface);
        }
    }
}
