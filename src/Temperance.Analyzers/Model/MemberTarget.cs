using Microsoft.CodeAnalysis;

namespace Temperance.Model
{
    /// <summary>
    /// Where a fix can write a setting that is not written yet: the options creation (or, for a container such as
    /// Ollama's ChatRequest, a new nested options object), with the member's name and literal type.
    /// </summary>
    internal sealed class MemberTarget
    {
        public MemberTarget(SyntaxNode creation, string member, NumericKind kind, string? wrapperMember, string? wrapperType, string? experimental = null)
        {
            Creation = creation;
            Member = member;
            Kind = kind;
            WrapperMember = wrapperMember;
            WrapperType = wrapperType;
            Experimental = experimental;
        }

        /// <summary>The diagnostic id of an [Experimental] member (OpenAI's Seed is OPENAI001): a fix must keep the code compiling.</summary>
        public string? Experimental { get; }

        public SyntaxNode Creation { get; }
        public string Member { get; }
        public NumericKind Kind { get; }
        /// <summary>Set when the member lives on a nested object the fix must create (<c>Options = new RequestOptions { … }</c>).</summary>
        public string? WrapperMember { get; }
        public string? WrapperType { get; }
    }
}
