using Microsoft.CodeAnalysis;

namespace Temperance.Model
{
    /// <summary>Where a request is built: the containing member and type, and whether that member is a test.</summary>
    internal sealed class CallContext
    {
        public CallContext(ISymbol? member, INamedTypeSymbol? type, bool isTest)
        {
            Member = member;
            Type = type;
            IsTest = isTest;
        }

        public ISymbol? Member { get; }
        public INamedTypeSymbol? Type { get; }
        public bool IsTest { get; }
    }
}
