using System.Collections.Generic;
using System.Linq;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP001: a temperature above the ceiling for the call's task. An unset temperature counts as the provider's
    /// default where that default really applies (see <see cref="TemperancePolicy.UnsetMeansDefault"/>).
    /// </summary>
    internal static class TaskCeilingRule
    {
        public static IEnumerable<Finding> Evaluate(Request request, TemperancePolicy policy)
        {
            var task = TaskInference.Infer(request, policy);
            if (task == null || policy.TaskCeiling(task.Kind) is not { } ceiling)
            {
                yield break; // no task, or a task without a ceiling (creative, brainstorming)
            }

            // A model that rejects temperature must not be asked for one (SAMP007 covers a temperature written anyway).
            if (policy.FamilyOf(request.EffectiveModelId) is { } family && family.RejectsSetting(Setting.Temperature))
            {
                yield break;
            }

            var target = policy.TaskTemperatureOf(task.Kind)?.Value ?? 0;
            switch (request.KindOf(Setting.Temperature, out _))
            {
                case ValueKind.Known:
                    // One mistake, one warning: a value out of range (SAMP005) or extreme (SAMP009) is reported there.
                    foreach (var write in EffectiveWrites(request).Where(w => w.Value > ceiling.Value
                        && !ValueOutOfRangeRule.IsOutOfRange(w, request.Provider, policy, out _, out _)
                        && !ExtremeTemperatureRule.IsExtreme(w, request.Provider, policy)))
                    {
                        yield return new Finding(
                            Descriptors.TemperatureAboveTaskCeiling, write.Location, new FixPlan().SetValue(write, target),
                            $"Temperature {FixProperties.Show(write.Value)}{Notes.Origin(write)}{Notes.Conditional(write)}",
                            FixProperties.Show(ceiling.Value), task.Kind, "task " + task.Because, ceiling.Key);
                    }

                    break;

                case ValueKind.Unset when policy.UnsetMeansDefault(request.Provider)
                    && policy.Default(request.Provider, Setting.Temperature) is { } providerDefault
                    && providerDefault.Value > ceiling.Value:
                    var fix = new FixPlan();
                    fix.AddUnset(request, (Setting.Temperature, target));

                    yield return new Finding(
                        Descriptors.TemperatureAboveTaskCeiling, request.Location, fix,
                        $"The unset temperature ({request.Provider} default {FixProperties.Show(providerDefault.Value)}, {providerDefault.Key})",
                        FixProperties.Show(ceiling.Value), task.Kind, "task " + task.Because, ceiling.Key);
                    break;
            }
        }

        /// <summary>The write(s) that decide the value: the last one, or every branch of a last conditional.</summary>
        private static IEnumerable<SettingWrite> EffectiveWrites(Request request)
        {
            var temperature = request.Writes.Where(w => w.Setting == Setting.Temperature).ToList();
            if (temperature.Count == 0)
            {
                return temperature;
            }

            var last = temperature[temperature.Count - 1];
            return last.FromConditional
                ? temperature.Where(w => w.Location == last.Location && w.Kind == ValueKind.Known)
                : last.Kind == ValueKind.Known ? new[] { last } : System.Array.Empty<SettingWrite>();
        }
    }
}
