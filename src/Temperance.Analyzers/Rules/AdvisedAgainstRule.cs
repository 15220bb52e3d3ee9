using System.Collections.Generic;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP010: a value the model's publisher advises against for that model. Today: a temperature below the value the
    /// publisher recommends keeping (Gemini 3: "strongly recommend keeping the temperature parameter at its default value
    /// of 1.0"). The fix writes the recommended value; removing the setting is the alternative.
    /// </summary>
    internal static class AdvisedAgainstRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            if (input.Family is not { RecommendedTemperature: { } advised } family)
            {
                yield break;
            }

            foreach (var write in input.Request.Value(Setting.Temperature).Deciding)
            {
                if (write.Value < advised.Value)
                {
                    yield return new Finding(Descriptors.AdvisedAgainst, write.Location, new FixPlan().SetValue(write, advised.Value).Remove(write),
                        write.Member, FixProperties.Show(write.Value) + Notes.Origin(write), FixProperties.Show(advised.Value), input.ModelText,
                        $"family '{family.Name}', {OptionKeys.ModelRecommendedTemperature(family.Name)}").About(write);
                }
            }
        }
    }
}
