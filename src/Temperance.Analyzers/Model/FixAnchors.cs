using System.Collections.Generic;
using Microsoft.CodeAnalysis;

namespace Temperance.Model
{
    /// <summary>
    /// Where a fix can write a setting the request does not write yet: a member of the options creation (or of a nested
    /// options object a fix creates), else an options argument of a send that passes none. Kept beside the request, not in
    /// it: these are places in the code, not facts about the request.
    /// </summary>
    internal sealed class FixAnchors
    {
        public static readonly FixAnchors None = new FixAnchors(new Dictionary<Setting, MemberTarget>(), null, null, null, new Dictionary<Setting, MemberTarget>());

        public FixAnchors(IReadOnlyDictionary<Setting, MemberTarget> members, Location? call, string? omittedParameter, string? omittedOptionsType,
            IReadOnlyDictionary<Setting, MemberTarget> omittedMembers)
        {
            Members = members;
            Call = call;
            OmittedParameter = omittedParameter;
            OmittedOptionsType = omittedOptionsType;
            OmittedMembers = omittedMembers;
        }

        /// <summary>Per setting, the creation a member can be added to; a setting missing here cannot be added there.</summary>
        public IReadOnlyDictionary<Setting, MemberTarget> Members { get; }
        /// <summary>The send that passes no options (where an options argument can be added).</summary>
        public Location? Call { get; }
        /// <summary>The omitted options parameter a fix can fill, the options type it creates (fully qualified) and its members.</summary>
        public string? OmittedParameter { get; }
        public string? OmittedOptionsType { get; }
        public IReadOnlyDictionary<Setting, MemberTarget> OmittedMembers { get; }
    }
}
