namespace Temperance.Model
{
    /// <summary>How far a request's options get, as far as the code shows.</summary>
    internal enum Reach
    {
        /// <summary>Built, then serialised, logged, asserted, set up on a mock or dropped: never sent to a model.</summary>
        NotSent,
        /// <summary>Returned, stored in a field or property, or handed to code we cannot read: sent elsewhere, if at all.</summary>
        Escapes,
        /// <summary>Passed to a declared send, directly, through a carrier object or through the project's own helper.</summary>
        Sent,
    }
}
