using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;

namespace Temperance.Model
{
    /// <summary>
    /// A value the code reads through properties of the project's own classes, outermost first (<c>_options.Sampling.Temperature</c>
    /// is Sampling, Temperature). Unknown to the code; configuration bound to one of those classes may say what it holds.
    /// </summary>
    internal sealed class MemberPath
    {
        public MemberPath(IReadOnlyList<IPropertySymbol> properties)
        {
            Properties = properties;
        }

        public IReadOnlyList<IPropertySymbol> Properties { get; }

        public IPropertySymbol Last => Properties[Properties.Count - 1];

        /// <summary>As the code spells it, for messages: <c>HarbourLlmOptions.Sampling.Temperature</c>.</summary>
        public override string ToString() => Properties[0].ContainingType.Name + "." + string.Join(".", Properties.Select(p => p.Name));
    }
}
