namespace Temperance.Model
{
    /// <summary>What extraction hands on: a request, and the places in code where a fix can add what it lacks.</summary>
    internal sealed class ExtractedRequest
    {
        public ExtractedRequest(Request request, FixAnchors anchors)
        {
            Request = request;
            Anchors = anchors;
        }

        public Request Request { get; }
        public FixAnchors Anchors { get; }
    }
}
