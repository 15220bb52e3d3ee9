using System.Collections.Immutable;
using Microsoft.CodeAnalysis;

namespace Temperance.Rules
{
    /// <summary>What a rule found, plus the edits a fix should make (carried in diagnostic Properties, spans included).</summary>
    internal sealed class Finding
    {
        public Finding(DiagnosticDescriptor descriptor, Location location, FixPlan fix, params object[] messageArgs)
        {
            Descriptor = descriptor;
            Location = location;
            Properties = fix.Properties;
            MessageArgs = messageArgs;
        }

        private Finding(Finding original, Location location)
        {
            Descriptor = original.Descriptor;
            Location = location;
            Properties = original.Properties;
            MessageArgs = original.MessageArgs;
        }

        /// <summary>The same finding reported elsewhere (at the call site that sends options a helper built).</summary>
        public Finding At(Location location) => new Finding(this, location);

        public DiagnosticDescriptor Descriptor { get; }
        public Location Location { get; }
        public ImmutableDictionary<string, string?> Properties { get; }
        public object[] MessageArgs { get; }

        public Diagnostic ToDiagnostic() =>
            Diagnostic.Create(Descriptor, Location, additionalLocations: null, Properties, MessageArgs);
    }
}
