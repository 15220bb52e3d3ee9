using System.Collections.Generic;
using System.Linq;
using Temperance.Model;

namespace Temperance.Policy
{
    /// <summary>
    /// Decides a request's task from its signals, strongest first: annotation, then <c>temperance.task</c>, then prompt
    /// text, then leading verbs of names; a structured response format counts only beside a name or prompt that agrees.
    /// Weak signals count only when they agree.
    /// </summary>
    internal static class TaskInference
    {
        private static readonly HashSet<string> StructuredKinds = new HashSet<string> { "classification", "evaluation", "code", "tool_use", "extraction" };

        /// <summary>The request's task under a policy (rules read it once per request through <c>RuleInput.Task</c>).</summary>
        public static TaskEvidence? Infer(Request request, TemperancePolicy policy)
        {
            if (policy.TaskKindInvalid)
            {
                return null; // temperance.task is reported (SAMP100); no other signal stands in for what the team wrote
            }

            var annotation = request.TaskSignals.FirstOrDefault(s => s.Source == TaskSignalSource.Annotation);
            if (annotation != null && OptionKeys.TaskKinds.Contains(annotation.Kind))
            {
                return new TaskEvidence(annotation.Kind, "from " + annotation.Evidence, new[] { annotation });
            }

            if (policy.TaskKind is { } configured)
            {
                var signal = new TaskSignal(configured, TaskSignalSource.EditorConfig, $"'{OptionKeys.Task} = {configured}' in .editorconfig");
                return new TaskEvidence(configured, "from " + signal.Evidence, new[] { signal });
            }

            // Prompt text outranks names: when the prompts agree among themselves, names that disagree are ignored.
            var prompts = request.TaskSignals.Where(s => s.Source == TaskSignalSource.Prompt).ToList();
            var promptKinds = prompts.Select(s => s.Kind).Distinct().ToList();
            var weak = promptKinds.Count == 1 ? prompts : request.TaskSignals.Where(s => s.Source is TaskSignalSource.Name or TaskSignalSource.Prompt).ToList();
            var weakKinds = weak.Select(s => s.Kind).Distinct().ToList();
            var agreed = weakKinds.Count == 1 ? weakKinds[0] : null;

            if (IsStructured(request.ResponseShape))
            {
                // A structured answer alone is not a task (a recipe or a story outline comes back as JSON too); with a name
                // or prompt that agrees it decides: extraction, or another structured task the names and prompts name.
                var shape = new TaskSignal("extraction", TaskSignalSource.ResponseShape, ShapeText(request));
                if (agreed != null && StructuredKinds.Contains(agreed))
                {
                    var first = weak.First(s => s.Kind == agreed);
                    return new TaskEvidence(agreed, $"from {first.Evidence} and {shape.Evidence}", new[] { first, shape });
                }

                return null;
            }

            if (agreed != null)
            {
                var supporting = weak.Where(s => s.Kind == agreed).ToList();
                return new TaskEvidence(agreed, "from " + string.Join(" and ", supporting.Select(s => s.Evidence).Distinct().Take(2)), supporting);
            }

            return null; // no signal, or weak signals that disagree
        }

        private static bool IsStructured(ResponseShape shape) =>
            shape is ResponseShape.JsonObject or ResponseShape.JsonSchema or ResponseShape.Structured or ResponseShape.Grammar;

        private static string ShapeText(Request request)
        {
            var what = request.ResponseShape switch
            {
                ResponseShape.JsonSchema => "the JSON-schema response format",
                ResponseShape.JsonObject => "the JSON response format",
                ResponseShape.Structured => "the typed structured-output call",
                ResponseShape.Grammar => "the grammar-constrained output",
                _ => "the response format",
            };
            return request.ResponseShapeEvidence == null ? what : $"{what} ({request.ResponseShapeEvidence})";
        }
    }
}
