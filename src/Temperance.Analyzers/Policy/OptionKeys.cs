using Temperance.Model;

namespace Temperance.Policy
{
    /// <summary>Every option key Temperance reads. All live under <c>temperance.</c>, lower case, words joined by '_'.</summary>
    internal static class OptionKeys
    {
        public const string Prefix = "temperance.";
        public const string ExtremeTemperature = "temperance.extreme_temperature";
        public const string Task = "temperance.task";

        /// <summary><c>temperance.provider.openai.temperature.max</c> and its siblings <c>.min</c> and <c>.default</c>.</summary>
        public static string ProviderLimit(string provider, Setting setting, string bound) =>
            $"temperance.provider.{provider}.{setting.KeyName()}.{bound}";

        /// <summary><c>temperance.task.extraction.temperature</c>: the value fixes write for that task.</summary>
        public static string TaskTemperature(string kind) => $"temperance.task.{kind}.temperature";

        public static readonly string[] TaskKinds =
        {
            "extraction", "classification", "code", "evaluation", "tool_use",
            "summarization", "translation", "conversation", "creative", "brainstorming",
        };
    }
}
