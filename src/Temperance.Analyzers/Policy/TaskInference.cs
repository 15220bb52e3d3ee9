using System.Collections.Generic;
using System.Linq;
using Temperance.Model;

namespace Temperance.Policy
{
    /// <summary>
    /// Decides a request's task from its signals, strongest first: annotation, then <c>temperance.task</c>, then the
    /// response shape, then names and prompt text. Weak signals (names, prompts) count only when they all agree.
    /// </summary>
    internal static class TaskInference
    {
        private static readonly HashSet<string> StructuredKinds = new HashSet<string> { "classification", "evaluation", "code", "tool_use", "extraction" };

        /// <summary>The request's task, computed once: several rules ask.</summary>
        public static TaskEvidence? Infer(Request request, TemperancePolicy policy)
        {
            if (!request.TaskInferred)
            {
                request.InferredTask = Compute(request, policy);
                request.TaskInferred = true;
            }

            return request.InferredTask;
        }

        private static TaskEvidence? Compute(Request request, TemperancePolicy policy)
        {
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

            var weak = request.TaskSignals.Where(s => s.Source is TaskSignalSource.Name or TaskSignalSource.Prompt).ToList();
            var weakKinds = weak.Select(s => s.Kind).Distinct().ToList();
            var agreed = weakKinds.Count == 1 ? weakKinds[0] : null;

            if (IsStructured(request.ResponseShape))
            {
                var shape = new TaskSignal("extraction", TaskSignalSource.ResponseShape, ShapeText(request));
                // A structured answer is extraction unless the names and prompts agree it is another structured task.
                if (agreed != null && agreed != "extraction" && StructuredKinds.Contains(agreed))
                {
                    var first = weak.First();
                    return new TaskEvidence(agreed, $"from {first.Evidence} and {shape.Evidence}", new[] { first, shape });
                }

                return new TaskEvidence("extraction", "from " + shape.Evidence, new[] { shape });
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
