using System.Collections.Generic;
using Microsoft.CodeAnalysis;

namespace Temperance.Model
{
    /// <summary>
    /// One model request as the code builds it: which provider, every sampling setting that is written
    /// (or not), the model id when constant, the response shape and where the request lives.
    /// Rules read only this; they never walk Roslyn trees.
    /// </summary>
    internal sealed class Request
    {
        private readonly List<SettingWrite> writes = new List<SettingWrite>();

        public Request(string provider, string surface, Location location, CallContext context, bool originVisible)
        {
            Provider = provider;
            Surface = surface;
            Location = location;
            Context = context;
            OriginVisible = originVisible;
        }

        /// <summary>Provider key of the rules table (openai, ollama, generic, …).</summary>
        public string Provider { get; }
        /// <summary>The type that carries the settings, for messages (<c>ChatCompletionOptions</c>).</summary>
        public string Surface { get; }
        /// <summary>The expression that creates the options (or the first write when the creation is not visible).</summary>
        public Location Location { get; }
        public CallContext Context { get; }
        /// <summary>
        /// True when the creation is visible, so a setting nobody writes is really Unset (provider default).
        /// False for options that come from a parameter, a helper or a field mutated here: unwritten settings are Unknown.
        /// </summary>
        public bool OriginVisible { get; }
        public string? ModelId { get; set; }
        public ResponseShape ResponseShape { get; set; }
        /// <summary>The response-format evidence as written, for messages ("ChatResponseFormat.CreateJsonSchemaFormat").</summary>
        public string? ResponseShapeEvidence { get; set; }
        /// <summary>The method the options are passed to, when visible in the same block.</summary>
        public IMethodSymbol? SendingCall { get; set; }
        public Location? SendingCallLocation { get; set; }

        /// <summary>The model id from the client that sends the request, when constant (<c>new ChatClient("gpt-4o", …)</c>).</summary>
        public string? ClientModelId { get; set; }
        /// <summary>The model id the request goes to: the options' own, else the client's.</summary>
        public string? EffectiveModelId => ModelId ?? ClientModelId;

        /// <summary>The IChatClient adapter the request goes through, when its creation is visible in the same block.</summary>
        public string? Adapter { get; set; }
        public string? AdapterDisplay { get; set; }

        /// <summary>
        /// True when no options object is passed at all (<c>client.CompleteChat(messages)</c>): every setting is Unset and
        /// the request lives at the call. <see cref="OmittedParameter"/> names the parameter a fix can fill.
        /// </summary>
        public bool IsImplicit { get; set; }
        public IParameterSymbol? OmittedParameter { get; set; }
        /// <summary>Where a fix adds an unset setting (temperature, seed); a setting missing here cannot be added.</summary>
        public Dictionary<Setting, MemberTarget> AddTargets { get; } = new Dictionary<Setting, MemberTarget>();
        public MemberTarget? TemperatureTarget => AddTargets.TryGetValue(Setting.Temperature, out var target) ? target : null;

        /// <summary>The options type a fix passes when the call has none (fully qualified), and the members it can set.</summary>
        public string? OmittedOptionsType { get; set; }
        public Dictionary<Setting, MemberTarget> OmittedMembers { get; } = new Dictionary<Setting, MemberTarget>();

        /// <summary>True when the surface can carry a seed at all (Anthropic and OpenAI Responses cannot).</summary>
        public bool SeedAvailable { get; set; }

        /// <summary>In a test: the exact assertion the model's output reaches ("Assert.Equal"), and where.</summary>
        public string? ExactAssertion { get; set; }
        public Location? ExactAssertionLocation { get; set; }
        /// <summary>The test that makes the assertion, when it is not the member sending the request (a helper's caller).</summary>
        public string? ExactAssertionIn { get; set; }
        /// <summary>
        /// The helper whose returned options this call site sends (<c>CompleteChat(messages, Options())</c>): findings that
        /// depend on the call site are reported here, at the helper call.
        /// </summary>
        public string? BorrowedFrom { get; set; }

        /// <summary>How far the options get (see <see cref="Model.Reach"/>), and in words why, for the inventory.</summary>
        public Reach Reach { get; set; } = Reach.Sent;
        public string? ReachNote { get; set; }
        /// <summary>The double the request is sent to, when it is one ("a Moq double (Mock)"): sampling means nothing there.</summary>
        public string? TestDouble { get; set; }

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

        /// <summary>Task hints gathered by extraction: identifiers, prompt text, annotations. Policy turns them into a task.</summary>
        public List<TaskSignal> TaskSignals { get; } = new List<TaskSignal>();

        public IReadOnlyList<SettingWrite> Writes => writes;

        public void Add(SettingWrite write) => writes.Add(write);

        public void AddRange(IEnumerable<SettingWrite> more) => writes.AddRange(more);

        /// <summary>The last write of a setting in source order, or null when nobody writes it.</summary>
        public SettingWrite? LastWrite(Setting setting)
        {
            SettingWrite? last = null;
            foreach (var write in writes)
            {
                if (write.Setting == setting)
                {
                    last = write;
                }
            }

            return last;
        }

        /// <summary>
        /// Settings the options type carries in members Surfaces does not declare (a connector's settings class derived from
        /// a declared base): their defaults and ranges are not known, so they are Unknown rather than Unset.
        /// </summary>
        public HashSet<Setting> UndeclaredSettings { get; } = new HashSet<Setting>();

        /// <summary>What the request ends up with for a setting: the last unconditional write wins, in source order.</summary>
        public ValueKind KindOf(Setting setting, out double value)
        {
            value = 0;
            var tail = LastWrite(setting);
            if (tail == null)
            {
                return OriginVisible && !UndeclaredSettings.Contains(setting) ? ValueKind.Unset : ValueKind.Unknown;
            }

            if (!tail.FromConditional)
            {
                value = tail.Value;
                return tail.Kind;
            }

            // Conditional branches: the worst (highest) known branch stands for the value; an unknown branch makes it unknown.
            var worst = double.NegativeInfinity;
            foreach (var branch in writes)
            {
                if (branch.Setting != setting || !branch.FromConditional || branch.Location != tail.Location)
                {
                    continue;
                }

                if (branch.Kind != ValueKind.Known)
                {
                    return ValueKind.Unknown;
                }

                worst = System.Math.Max(worst, branch.Value);
            }

            value = worst;
            return ValueKind.Known;
        }

        /// <summary>The task, once inferred for this request (a request belongs to one file, so to one policy).</summary>
        internal TaskEvidence? InferredTask { get; set; }
        internal bool TaskInferred { get; set; }
    }
}
