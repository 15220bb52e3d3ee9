namespace Temperance.Model
{
    /// <summary>Names of the modes a request can be in, as the rules table spells them.</summary>
    internal static class Modes
    {
        /// <summary>How much a reasoning model reasons before answering (none, minimal, low, medium, high …).</summary>
        public const string ReasoningEffort = "reasoning_effort";
        /// <summary>Extended thinking (enabled / disabled).</summary>
        public const string Thinking = "thinking";
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
