using System.Collections.Generic;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP001: a temperature above the ceiling for the call's task. An unset temperature counts as the provider's
    /// default where that default really applies (see <see cref="Policy.TemperancePolicy.UnsetMeansDefault"/>).
    /// </summary>
    internal static class TaskCeilingRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            var (request, policy, task) = (input.Request, input.Policy, input.Task);
            if (task == null || policy.TaskCeiling(task.Kind) is not { } ceiling)
            {
                yield break; // no task, or a task without a ceiling (creative, brainstorming)
            }

            // A model that takes no temperature (SAMP007 covers one written anyway), or whose publisher advises keeping its
            // default (SAMP010 covers a lower one), has nothing to tune down.
            if (!input.TemperatureIsTunable)
            {
                yield break;
            }

            var target = policy.TaskTemperatureOf(task.Kind)?.Value ?? 0;
            var temperature = request.Value(Setting.Temperature);
            switch (temperature.Kind)
            {
                case ValueKind.Known:
                    foreach (var write in temperature.Deciding)
                    {
                        if (write.Value > ceiling.Value)
                        {
                            yield return new Finding(
                                Descriptors.TemperatureAboveTaskCeiling, write.Location, new FixPlan().SetValue(write, target),
                                $"Temperature {FixProperties.Show(write.Value)}{Notes.Origin(write)}{Notes.Conditional(write)}",
                                FixProperties.Show(ceiling.Value), task.Kind, "task " + task.Because, ceiling.Key).About(write);
                        }
                    }

                    break;

                case ValueKind.Unset when policy.UnsetMeansDefault(input.Provider)
                    && policy.Default(input.RangeProvider, Setting.Temperature) is { } providerDefault
                    && providerDefault.Value > ceiling.Value:
                    var fix = new FixPlan();
                    fix.AddUnset(input.Anchors, (Setting.Temperature, target));

                    yield return new Finding(
                        Descriptors.TemperatureAboveTaskCeiling, request.Location, fix,
                        $"The unset temperature ({input.Provider} default {FixProperties.Show(providerDefault.Value)}, {providerDefault.Key})",
                        FixProperties.Show(ceiling.Value), task.Kind, "task " + task.Because, ceiling.Key);
                    break;
            }
        }
    }
}
