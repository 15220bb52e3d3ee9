namespace System.Runtime.CompilerServices
{
    /// <summary>Lets netstandard2.0 code declare <c>init</c> accessors (the compiler needs this type to exist).</summary>
    internal static class IsExternalInit
    {
    }
}
