using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>Values fixes write, taken from the rules table.</summary>
    internal static class Recommended
    {
        /// <summary>Neutral temperature when no task is known: the model's own distribution, unscaled.</summary>
        public const double NeutralTemperature = 1.0;

        /// <summary>The task's table temperature when a task is known (inferred or configured), else the neutral 1.0.</summary>
        public static Limit Temperature(RuleInput input)
        {
            if (input.Family?.RecommendedTemperature is { } advised)
            {
                return advised; // the publisher's value for this model wins over any task value
            }

            if (input.Task is { } task && input.Policy.TaskTemperatureOf(task.Kind) is { } value)
            {
                return value;
            }

            return new Limit(NeutralTemperature, "no task known: the model's unscaled distribution");
        }
    }

    /// <summary>Pieces of messages several rules share.</summary>
    internal static class Notes
    {
        public static string Conditional(SettingWrite write) =>
            write.FromConditional ? " (one branch of a conditional; the worst branch is judged)" : string.Empty;

        public static string Origin(SettingWrite write) =>
            write.Origin == null ? string.Empty : $" (from {write.Origin})";
    }
}
