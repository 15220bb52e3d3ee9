using System.Collections.Generic;
using System.Collections.Immutable;
using Microsoft.CodeAnalysis;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>
    /// What a rule found: where, the message arguments, the edits a fix should make (carried in diagnostic Properties),
    /// and the writes it is about, so <see cref="Precedence"/> can tell when two findings are one mistake.
    /// </summary>
    internal sealed class Finding
    {
        private static readonly SettingWrite[] NoWrites = new SettingWrite[0];

        public Finding(DiagnosticDescriptor descriptor, Location location, FixPlan fix, params object[] messageArgs)
            : this(descriptor, location, fix.Properties, messageArgs, NoWrites)
        {
        }

        private Finding(DiagnosticDescriptor descriptor, Location location, ImmutableDictionary<string, string?> properties, object[] messageArgs, IReadOnlyList<SettingWrite> concerns)
        {
            Descriptor = descriptor;
            Location = location;
            Properties = properties;
            MessageArgs = messageArgs;
            Concerns = concerns;
        }

        public DiagnosticDescriptor Descriptor { get; }
        public Location Location { get; }
        public ImmutableDictionary<string, string?> Properties { get; }
        public object[] MessageArgs { get; }
        /// <summary>The writes the finding is about (none for a finding about a setting nobody writes).</summary>
        public IReadOnlyList<SettingWrite> Concerns { get; }

        /// <summary>The same finding, about these writes.</summary>
        public Finding About(params SettingWrite[] writes) => new Finding(Descriptor, Location, Properties, MessageArgs, writes);

        /// <summary>The same finding reported elsewhere (at the call site that sends options a helper built).</summary>
        public Finding At(Location location) => new Finding(Descriptor, location, Properties, MessageArgs, Concerns);

        public Diagnostic ToDiagnostic() =>
            Diagnostic.Create(Descriptor, Location, additionalLocations: null, Properties, MessageArgs);
    }
}
