using System.Collections.Generic;
using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Temperance.Model;

namespace Temperance.Extraction
{
    /// <summary>
    /// A request while extraction is still reading it: writes, model, shape, send and test facts are filled in as the
    /// block's operations are read, then <see cref="Freeze()"/> makes the immutable <see cref="Request"/> and its
    /// <see cref="FixAnchors"/>. Nothing outside Extraction sees a draft.
    /// </summary>
    internal sealed class RequestDraft
    {
        private readonly List<SettingWrite> writes = new List<SettingWrite>();

        public RequestDraft(string provider, string surface, Location location, CallContext context, bool originVisible)
        {
            Provider = provider;
            Surface = surface;
            Location = location;
            Context = context;
            OriginVisible = originVisible;
        }

        public string Provider { get; }
        public string Surface { get; }
        public Location Location { get; }
        public CallContext Context { get; }
        public bool OriginVisible { get; }
        public IReadOnlyList<SettingWrite> Writes => writes;
        public HashSet<Setting> UndeclaredSettings { get; } = new HashSet<Setting>();
        public string? ModelId { get; set; }
        public string? ClientModelId { get; set; }
        /// <summary>When the model id is not constant but read from a property of the project's classes (configuration may bind it).</summary>
        public MemberPath? ModelIdFrom { get; set; }
        public MemberPath? ClientModelIdFrom { get; set; }
        public string? Endpoint { get; set; }
        public ResponseShape ResponseShape { get; set; }
        public string? ResponseShapeEvidence { get; set; }
        public Dictionary<string, ModeValue> Modes { get; } = new Dictionary<string, ModeValue>(System.StringComparer.Ordinal);
        public IMethodSymbol? SendingCall { get; set; }
        public Location? SendingCallLocation { get; set; }
        public string? Adapter { get; set; }
        public string? AdapterDisplay { get; set; }
        public bool IsImplicit { get; set; }
        public bool SeedAvailable { get; set; }
        public string? ExactAssertion { get; set; }
        public Location? ExactAssertionLocation { get; set; }
        public string? ExactAssertionIn { get; set; }
        public string? BorrowedFrom { get; set; }
        public Reach Reach { get; set; } = Reach.Sent;
        public string? ReachNote { get; set; }
        public string? TestDouble { get; set; }
        public List<TaskSignal> TaskSignals { get; } = new List<TaskSignal>();

        // Fix anchors, frozen into FixAnchors.
        public Dictionary<Setting, MemberTarget> AddTargets { get; } = new Dictionary<Setting, MemberTarget>();
        public IParameterSymbol? OmittedParameter { get; set; }
        public string? OmittedOptionsType { get; set; }
        public Dictionary<Setting, MemberTarget> OmittedMembers { get; } = new Dictionary<Setting, MemberTarget>();

        public void Add(SettingWrite write) => writes.Add(write);

        public void AddRange(IEnumerable<SettingWrite> more) => writes.AddRange(more);

        public ExtractedRequest Freeze() => Freeze(writes.ToArray(), ModelId, ClientModelId, null, null);

        /// <summary>The request with values resolved elsewhere (<see cref="ConfiguredVariants"/>): its writes, model ids and which copy it is.</summary>
        public ExtractedRequest Freeze(IReadOnlyList<SettingWrite> resolvedWrites, string? modelId, string? clientModelId, string? modelIdOrigin, string? variant)
        {
            var request = new Request
            {
                Provider = Provider,
                Surface = Surface,
                Location = Location,
                Context = Context,
                OriginVisible = OriginVisible,
                Writes = resolvedWrites,
                UndeclaredSettings = UndeclaredSettings.ToImmutableHashSet(),
                ModelId = modelId,
                ClientModelId = clientModelId,
                ModelIdOrigin = modelIdOrigin,
                Variant = variant,
                Endpoint = Endpoint,
                ResponseShape = ResponseShape,
                ResponseShapeEvidence = ResponseShapeEvidence,
                Modes = new Dictionary<string, ModeValue>(Modes),
                SendingCall = SendingCall,
                SendingCallLocation = SendingCallLocation,
                Adapter = Adapter,
                AdapterDisplay = AdapterDisplay,
                IsImplicit = IsImplicit,
                SeedAvailable = SeedAvailable,
                ExactAssertion = ExactAssertion,
                ExactAssertionLocation = ExactAssertionLocation,
                ExactAssertionIn = ExactAssertionIn,
                BorrowedFrom = BorrowedFrom,
                Reach = Reach,
                ReachNote = ReachNote,
                TestDouble = TestDouble,
                TaskSignals = TaskSignals.ToArray(),
            };
            var anchors = new FixAnchors(
                new Dictionary<Setting, MemberTarget>(AddTargets),
                IsImplicit ? SendingCallLocation : null,
                IsImplicit ? OmittedParameter?.Name : null,
                IsImplicit ? OmittedOptionsType : null,
                new Dictionary<Setting, MemberTarget>(OmittedMembers));
            return new ExtractedRequest(request, anchors);
        }
    }
}
