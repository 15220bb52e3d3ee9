namespace Temperance.Model
{
    /// <summary>Names of the modes a request can be in, as the rules table spells them.</summary>
    internal static class Modes
    {
        /// <summary>How much a reasoning model reasons before answering (none, minimal, low, medium, high …).</summary>
        public const string ReasoningEffort = "reasoning_effort";
        /// <summary>Extended thinking (enabled / disabled).</summary>
        public const string Thinking = "thinking";

        /// <summary>The reasoning effort at which a model does not reason (and takes sampling settings where its family allows).</summary>
        public const string NoReasoning = "none";

        /// <summary>Values of the thinking mode that turn it on.</summary>
        public static readonly string[] ThinkingOn = { "enabled" };
    }

    /// <summary>A mode a request is put in, as written: its value (lower case; null when not a constant) and the code that says so.</summary>
    internal sealed class ModeValue
    {
        public ModeValue(string mode, string? value, string evidence)
        {
            Mode = mode;
            Value = value;
            Evidence = evidence;
        }

        public string Mode { get; }
        public string? Value { get; }
        public string Evidence { get; }
    }
}
