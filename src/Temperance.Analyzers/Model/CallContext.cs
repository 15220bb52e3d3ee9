using Microsoft.CodeAnalysis;

namespace Temperance.Model
{
    /// <summary>Where a request is built: the containing member and type, and whether that member is a test.</summary>
    internal sealed class CallContext
    {
        public CallContext(ISymbol? member, INamedTypeSymbol? type, bool isTest, bool inTestCode = false, bool inTestClass = false)
        {
            Member = member;
            Type = type;
            IsTest = isTest;
            InTestCode = isTest || inTestCode || inTestClass;
            NamesDescribeATest = isTest || inTestClass;
        }

        public ISymbol? Member { get; }
        public INamedTypeSymbol? Type { get; }
        /// <summary>A test method, or a helper a test calls.</summary>
        public bool IsTest { get; }
        /// <summary>
        /// Any code of a test: a test or its helper, a member of a class that has tests, or anything in a test project
        /// (<c>IsTestProject</c>). Options built here count only when they are sent to a real client.
        /// </summary>
        public bool InTestCode { get; }
        /// <summary>A test or a member of a test class: its own names describe the test, not the call it makes.</summary>
        public bool NamesDescribeATest { get; }
    }
}
