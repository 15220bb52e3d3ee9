using System.Collections.Generic;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP003: no seed where a run must be reproducible: a test comparing exact output at temperature 0, an evaluation
    /// (LLM-as-judge) task, or everywhere with <c>temperance.require_seed = always</c>. Only on surfaces that have a seed.
    /// A test comparing exact output is judged here only at temperature 0: at a random temperature it is SAMP002's, whose
    /// fix sets the seed too (<see cref="Precedence"/>), and at an Unknown temperature nothing is judged.
    /// </summary>
    internal static class MissingSeedRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            var (request, policy) = (input.Request, input.Policy);
            var mode = policy.RequireSeed;
            if (mode == "never" || !request.SeedAvailable || request.Value(Setting.Seed).Kind != ValueKind.Unset)
            {
                yield break;
            }

            string? why = null;
            if (request.Context.IsTest && request.ExactAssertion != null && request.Value(Setting.Temperature).Is(0))
            {
                why = $"the test '{request.ExactAssertionIn ?? request.Context.Member?.Name}' compares its exact output with {request.ExactAssertion}";
            }
            else if (request.ExactAssertion == null && input.Task is { Kind: "evaluation" } task)
            {
                why = $"an evaluation task, {task.Because}, must grade the same answer the same way";
            }
            else if (mode == "always" && !(request.Context.IsTest && request.ExactAssertion != null))
            {
                why = $"'{OptionKeys.RequireSeed} = always'";
            }

            if (why == null)
            {
                yield break;
            }

            // The seed a fix writes comes from temperance.test_seed; when that is not a number (SAMP100) there is no fix.
            var fix = new FixPlan();
            if (!policy.TestSeedInvalid)
            {
                fix.AddUnset(input.Anchors, (Setting.Seed, policy.TestSeed?.Value ?? 0));
            }

            yield return new Finding(Descriptors.MissingSeed, request.Location, fix, why, request.Surface);
        }
    }
}
