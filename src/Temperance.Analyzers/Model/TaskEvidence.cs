using System.Collections.Generic;

namespace Temperance.Model
{
    /// <summary>Where a task signal came from, strongest first.</summary>
    internal enum TaskSignalSource
    {
        Annotation,
        EditorConfig,
        ResponseShape,
        Name,
        Prompt,
    }

    /// <summary>One hint about what a call is for, with the text that shows it ("the method name 'ExtractInvoice'").</summary>
    internal sealed class TaskSignal
    {
        public TaskSignal(string kind, TaskSignalSource source, string evidence)
        {
            Kind = kind;
            Source = source;
            Evidence = evidence;
        }

        public string Kind { get; }
        public TaskSignalSource Source { get; }
        public string Evidence { get; }
    }

    /// <summary>The task a request was judged to have, and why.</summary>
    internal sealed class TaskEvidence
    {
        public TaskEvidence(string kind, string because, IReadOnlyList<TaskSignal> signals)
        {
            Kind = kind;
            Because = because;
            Signals = signals;
        }

        public string Kind { get; }
        /// <summary>For messages: "from the JSON-schema response format (…)".</summary>
        public string Because { get; }
        public IReadOnlyList<TaskSignal> Signals { get; }
    }
}
