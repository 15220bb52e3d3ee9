using System.Collections.Generic;
using System.Collections.Immutable;
using Microsoft.CodeAnalysis;

namespace Temperance.Model
{
    /// <summary>
    /// One model request as the code (or a file) builds it: which provider, every sampling setting that is written (or
    /// not), the model id when constant, the response shape, where it lives and how far its options get. Immutable: it is
    /// made once by extraction and read by rules, policy and the inventory, which never walk Roslyn trees or write here.
    /// Where a fix can add a setting is not a fact about the request; it lives beside it in <see cref="FixAnchors"/>.
    /// </summary>
    internal sealed class Request
    {
        private static readonly SettingWrite[] NoWrites = new SettingWrite[0];
        private static readonly TaskSignal[] NoSignals = new TaskSignal[0];
        private static readonly IReadOnlyDictionary<string, ModeValue> NoModes = new Dictionary<string, ModeValue>();

        /// <summary>Provider key of the rules table (openai, ollama, generic, …).</summary>
        public string Provider { get; init; } = string.Empty;
        /// <summary>The type that carries the settings, for messages (<c>ChatCompletionOptions</c>).</summary>
        public string Surface { get; init; } = string.Empty;
        /// <summary>The expression that creates the options (or the first write when the creation is not visible).</summary>
        public Location Location { get; init; } = Location.None;
        public CallContext Context { get; init; } = null!;
        /// <summary>
        /// True when the creation is visible, so a setting nobody writes is really Unset (provider default).
        /// False for options that come from a parameter, a helper or a field mutated here: unwritten settings are Unknown.
        /// </summary>
        public bool OriginVisible { get; init; }

        public IReadOnlyList<SettingWrite> Writes { get; init; } = NoWrites;
        /// <summary>
        /// Settings the options type carries in members Surfaces does not declare (a connector's settings class derived from
        /// a declared base): their defaults and ranges are not known, so they are Unknown rather than Unset.
        /// </summary>
        public ImmutableHashSet<Setting> UndeclaredSettings { get; init; } = ImmutableHashSet<Setting>.Empty;

        public string? ModelId { get; init; }
        /// <summary>The model id from the client that sends the request, when constant (<c>new ChatClient("gpt-4o", …)</c>).</summary>
        public string? ClientModelId { get; init; }
        /// <summary>The server the client is pointed at, when constant (<c>http://localhost:11434/v1</c>).</summary>
        public string? Endpoint { get; init; }
        /// <summary>The model id the request goes to: the options' own, else the client's.</summary>
        public string? EffectiveModelId => ModelId ?? ClientModelId;
        /// <summary>Where <see cref="EffectiveModelId"/> came from when it is not written in code (a configuration key and its file), for messages.</summary>
        public string? ModelIdOrigin { get; init; }

        /// <summary>
        /// For one of several copies of a request whose values come from configuration: the deciding files of this copy
        /// (one copy per environment that changes a value). The analyzer reports a finding once per location and message,
        /// not once per location, so each environment's value is judged and named. Null for a request read from code alone.
        /// </summary>
        public string? Variant { get; init; }
        public ResponseShape ResponseShape { get; init; }
        /// <summary>The response-format evidence as written, for messages ("ChatResponseFormat.CreateJsonSchemaFormat").</summary>
        public string? ResponseShapeEvidence { get; init; }

        /// <summary>Modes the request is put in (<see cref="Modes"/>): reasoning effort, extended thinking.</summary>
        public IReadOnlyDictionary<string, ModeValue> Modes { get; init; } = NoModes;

        /// <summary>The method the options are passed to, when visible.</summary>
        public IMethodSymbol? SendingCall { get; init; }
        public Location? SendingCallLocation { get; init; }
        /// <summary>The IChatClient adapter the request goes through (rules-table key), and how messages name it.</summary>
        public string? Adapter { get; init; }
        public string? AdapterDisplay { get; init; }
        /// <summary>True when no options object is passed at all (<c>client.CompleteChat(messages)</c>): every setting is Unset.</summary>
        public bool IsImplicit { get; init; }
        /// <summary>True when the surface can carry a seed at all (Anthropic and OpenAI Responses cannot).</summary>
        public bool SeedAvailable { get; init; }

        /// <summary>In a test: the exact assertion the model's output reaches ("Assert.Equal"), and where.</summary>
        public string? ExactAssertion { get; init; }
        public Location? ExactAssertionLocation { get; init; }
        /// <summary>The test that makes the assertion, when it is not the member sending the request (a helper's caller).</summary>
        public string? ExactAssertionIn { get; init; }
        /// <summary>
        /// The helper whose returned options this call site sends (<c>CompleteChat(messages, Options())</c>): findings that
        /// depend on the call site are reported here, at the helper call.
        /// </summary>
        public string? BorrowedFrom { get; init; }

        /// <summary>How far the options get (see <see cref="Model.Reach"/>), and in words why, for the inventory.</summary>
        public Reach Reach { get; init; } = Reach.Sent;
        public string? ReachNote { get; init; }
        /// <summary>The double the request is sent to, when it is one ("a Moq double (Mock)"): sampling means nothing there.</summary>
        public string? TestDouble { get; init; }
        /// <summary>Task hints gathered by extraction: identifiers, prompt text, annotations. Policy turns them into a task.</summary>
        public IReadOnlyList<TaskSignal> TaskSignals { get; init; } = NoSignals;

        /// <summary>
        /// Judged only when the options reach a model: sent to a client that is not a double, or (outside test code) kept
        /// or handed on where they are sent later. Rules never see the others.
        /// </summary>
        public bool IsJudged => TestDouble == null && (Reach == Reach.Sent || (Reach == Reach.Escapes && !Context.InTestCode));

        /// <summary>Why a request is not judged, for the inventory; null when it is.</summary>
        public string? SilentBecause =>
            TestDouble != null ? (Context.InTestCode ? "sent to a test double: " : "sent to a client that reaches no model: ") + TestDouble
            : Reach == Reach.NotSent ? "never sent to a model" + (ReachNote == null ? string.Empty : $" ({ReachNote})")
            : Reach == Reach.Escapes && Context.InTestCode ? $"test code that never sends it ({ReachNote})"
            : null;

        /// <summary>The effective value of a setting, worst branch (see <see cref="SettingValue.Effective"/>), computed once per setting.</summary>
        public SettingValue Value(Setting setting)
        {
            var cache = values ??= new SettingValue?[SettingNames.Count];
            return cache[(int)setting] ??= SettingValue.Effective(setting, Writes, OriginVisible && !UndeclaredSettings.Contains(setting));
        }

        // Rules ask for the same few settings many times; a request is immutable, so the answers are too.
        private SettingValue?[]? values;

        /// <summary>The last write of a setting in source order, or null when nobody writes it.</summary>
        public SettingWrite? LastWrite(Setting setting) => Value(setting).Last;
    }
}
