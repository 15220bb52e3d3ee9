using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// What a rule sees: one request, where fixes can write beside it, the policy of its file, and its task (inferred once
    /// here, because several rules ask; the request itself is never written to).
    /// </summary>
    internal sealed class RuleInput
    {
        private TaskEvidence? task;
        private bool taskInferred;

        public RuleInput(ExtractedRequest extracted, TemperancePolicy policy)
        {
            Request = extracted.Request;
            Anchors = extracted.Anchors;
            Policy = policy;
        }

        public Request Request { get; }
        public FixAnchors Anchors { get; }
        public TemperancePolicy Policy { get; }

        public TaskEvidence? Task
        {
            get
            {
                if (!taskInferred)
                {
                    task = TaskInference.Infer(Request, Policy);
                    taskInferred = true;
                }

                return task;
            }
        }
    }
}
