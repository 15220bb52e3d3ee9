using System.Collections.Generic;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP002: a test compares the model's exact output while sampling is random (temperature unset or above 0).
    /// Reported on the request call. Its fix sets temperature 0 and, where the SDK has one, the seed; so it stands for a
    /// missing seed in such a test (<see cref="Precedence"/>).
    /// </summary>
    internal static class RandomSamplingInTestRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            var (request, policy) = (input.Request, input.Policy);
            if (!request.Context.IsTest || request.ExactAssertion == null || request.SendingCallLocation == null)
            {
                yield break;
            }

            var temperature = request.Value(Setting.Temperature);
            string why;
            if (temperature.IsKnown && temperature.Value > 0)
            {
                why = $"temperature {FixProperties.Show(temperature.Value)}";
            }
            else if (temperature.Kind == ValueKind.Unset)
            {
                var providerDefault = policy.Default(input.RangeProvider, Setting.Temperature);
                why = providerDefault == null ? "temperature unset"
                    : input.RangeProvider == Surfaces.Providers.Generic ? $"temperature unset, so the provider's default (usually {FixProperties.Show(providerDefault.Value.Value)}) applies"
                    : $"temperature unset, so {input.RangeProvider}'s default {FixProperties.Show(providerDefault.Value.Value)} applies";
            }
            else
            {
                yield break; // temperature 0 (SAMP003 asks for the seed) or Unknown (never judged)
            }

            if (!request.SeedAvailable)
            {
                why += $"; {request.Surface} has no seed, so even temperature 0 is only best effort";
            }

            // A model that takes no temperature, or whose publisher advises keeping one, gets guidance instead of a value.
            if (!input.TemperatureIsTunable)
            {
                var because = input.ModelRejects(Setting.Temperature) ? "takes no temperature"
                    : $"should keep temperature {FixProperties.Show(input.Family!.RecommendedTemperature!.Value.Value)} (its publisher's advice)";
                yield return new Finding(Descriptors.RandomSamplingInExactTest, request.SendingCallLocation, new FixPlan(),
                    $"{request.ExactAssertion} in '{request.ExactAssertionIn ?? request.Context.Member?.Name}'",
                    $"{why}; {input.ModelText} {because}, so compare tolerantly (parse the answer and check its fields, a schema or a semantic check) or replay a recorded response");
                yield break;
            }

            var seed = policy.TestSeed?.Value ?? 0;
            var fix = new FixPlan();
            // A test_seed that is not a number is reported (SAMP100); the fix then sets temperature only, never a stand-in seed.
            var seedUnset = request.Value(Setting.Seed).Kind == ValueKind.Unset && request.SeedAvailable && !policy.TestSeedInvalid;
            if (temperature.Last is { } temperatureWrite)
            {
                fix.SetValue(temperatureWrite, 0);
                if (seedUnset)
                {
                    fix.AddUnset(input.Anchors, (Setting.Seed, seed));
                }
            }
            else if (seedUnset)
            {
                fix.AddUnset(input.Anchors, (Setting.Temperature, 0), (Setting.Seed, seed));
            }
            else
            {
                fix.AddUnset(input.Anchors, (Setting.Temperature, 0));
            }

            yield return new Finding(Descriptors.RandomSamplingInExactTest, request.SendingCallLocation, fix.Combined(),
                $"{request.ExactAssertion} in '{request.ExactAssertionIn ?? request.Context.Member?.Name}'", why);
        }
    }
}
