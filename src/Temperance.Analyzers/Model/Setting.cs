namespace Temperance.Model
{
    /// <summary>A sampling setting, independent of how an SDK spells it.</summary>
    internal enum Setting
    {
        Temperature,
        TopP,
        TopK,
        MinP,
        Seed,
        Candidates,
        FrequencyPenalty,
        PresencePenalty,
        RepetitionPenalty,
        /// <summary>ONNX Runtime GenAI's switch between sampling (true) and greedy search (false).</summary>
        DoSample,
    }

    internal static class SettingNames
    {
        /// <summary>The trade name, as used in option keys and messages (top_p, frequency_penalty, …).</summary>
        public static string KeyName(this Setting setting) => setting switch
        {
            Setting.Temperature => "temperature",
            Setting.TopP => "top_p",
            Setting.TopK => "top_k",
            Setting.MinP => "min_p",
            Setting.Seed => "seed",
            Setting.Candidates => "candidates",
            Setting.FrequencyPenalty => "frequency_penalty",
            Setting.PresencePenalty => "presence_penalty",
            Setting.RepetitionPenalty => "repetition_penalty",
            Setting.DoSample => "do_sample",
            _ => setting.ToString().ToLowerInvariant(),
        };

        /// <summary>Every setting, made once (Enum.GetValues allocates a new array per call).</summary>
        private static readonly Setting[] AllSettings = (Setting[])System.Enum.GetValues(typeof(Setting));

        /// <summary>How many settings there are (their values are 0 … Count - 1).</summary>
        public static readonly int Count = AllSettings.Length;

        /// <summary>
        /// The setting a member of a settings type not declared in Surfaces most likely carries, by its name
        /// (<c>Temperature</c>, <c>TopP</c>, <c>top_k</c>, <c>RepeatPenalty</c> …); null for anything else.
        /// </summary>
        public static Setting? OfMemberName(string name) => name.Replace("_", string.Empty).ToLowerInvariant() switch
        {
            "temperature" => Setting.Temperature,
            "topp" => Setting.TopP,
            "topk" => Setting.TopK,
            "minp" => Setting.MinP,
            "seed" or "randomseed" => Setting.Seed,
            "frequencypenalty" => Setting.FrequencyPenalty,
            "presencepenalty" => Setting.PresencePenalty,
            "repeatpenalty" or "repetitionpenalty" => Setting.RepetitionPenalty,
            "candidatecount" or "resultsperprompt" => Setting.Candidates,
            _ => null,
        };

        /// <summary>The setting a trade name stands for, or null.</summary>
        public static Setting? Parse(string name)
        {
            foreach (var setting in AllSettings)
            {
                if (string.Equals(setting.KeyName(), name.Trim(), System.StringComparison.OrdinalIgnoreCase))
                {
                    return setting;
                }
            }

            return null;
        }
    }

    /// <summary>What a request asks the model to return.</summary>
    internal enum ResponseShape
    {
        /// <summary>Nothing in the code says (plain text or the provider's default).</summary>
        Unspecified,
        Text,
        JsonObject,
        JsonSchema,
        /// <summary>Typed structured output such as <c>GetResponseAsync&lt;T&gt;</c>.</summary>
        Structured,
        Grammar,
    }

    /// <summary>How much the analyzer knows about a setting.</summary>
    internal enum ValueKind
    {
        /// <summary>Not written anywhere the analyzer can see: the provider default applies.</summary>
        Unset,
        /// <summary>A compile-time number.</summary>
        Known,
        /// <summary>Comes from a parameter, configuration or anything else not constant: never judged.</summary>
        Unknown,
    }
}
