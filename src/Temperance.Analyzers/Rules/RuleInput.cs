using System.Linq;
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
            if (policy.ResolveModel(Request.EffectiveModelId) is { } model)
            {
                ModelId = model.Id;
                ModelMappedBy = model.MappedBy;
                Family = policy.FamilyOf(model.Id);
            }

            // An OpenAI-compatible client pointed at a local runtime talks to that runtime: its ranges and defaults apply.
            var atEndpoint = policy.ProviderAt(Request.Endpoint);
            Provider = atEndpoint?.Provider ?? Request.Provider;
            // A provider-agnostic request (a raw payload, ChatOptions) to a model of a known family is judged on that
            // provider's ranges: { model = "gpt-4o-mini", temperature = 2.8 } is out of OpenAI's range, not merely extreme.
            RangeProvider = Provider == Surfaces.Providers.Generic && Family?.Provider is { } inferred ? inferred : Provider;
        }

        /// <summary>
        /// The provider the request goes to: the endpoint's (a local runtime's address), else the surface's. Whether an unset
        /// value is the provider's default is asked of this one (ChatOptions stay generic: client middleware may fill them).
        /// </summary>
        public string Provider { get; }

        /// <summary>The model the request goes to, after deployment/alias mapping; null when not constant.</summary>
        public string? ModelId { get; }
        /// <summary>The <c>temperance.deployment.*</c> key that mapped the code's name to <see cref="ModelId"/>, if any.</summary>
        public string? ModelMappedBy { get; }
        public ModelFamily? Family { get; }
        /// <summary>The provider whose ranges and defaults apply to written values (the request's own, or its model family's for a generic request).</summary>
        public string RangeProvider { get; }

        /// <summary>
        /// The model as messages name it: "model 'o3-mini'", "model 'o3-mini' (deployment 'extractor-prod', temperance.deployment.extractor-prod)",
        /// and where a model id not written in code came from ("(from configuration 'HarbourLlm:Model' in appsettings.json)").
        /// </summary>
        public string ModelText =>
            (ModelMappedBy == null ? $"model '{ModelId}'" : $"model '{ModelId}' ('{Request.EffectiveModelId}' mapped by {ModelMappedBy})")
            + (Request.ModelIdOrigin == null ? string.Empty : $" (from {Request.ModelIdOrigin})");

        /// <summary>
        /// The reasoning effort in force and what says so: as written, else the family's default; null when the family is
        /// not a reasoning family or the written value is not constant.
        /// </summary>
        public (string Effort, string Evidence)? ReasoningEffort
        {
            get
            {
                if (Request.Modes.TryGetValue(Modes.ReasoningEffort, out var written))
                {
                    return written.Value == null ? null : (written.Value, written.Evidence);
                }

                return Family?.ReasoningDefault is { } fallback ? (fallback, $"the model's default reasoning effort '{fallback}'") : null;
            }
        }

        /// <summary>True when the request turns extended thinking on, with the code that does.</summary>
        public string? ThinkingEvidence =>
            Request.Modes.TryGetValue(Modes.Thinking, out var thinking) && System.Array.IndexOf(Modes.ThinkingOn, thinking.Value) >= 0 ? thinking.Evidence : null;

        /// <summary>
        /// Whether a fix may lower the temperature: the model takes one in this request, and its publisher does not advise
        /// keeping a given value (Gemini 3: 1.0). Fixes never write a value the model rejects or its publisher advises against.
        /// </summary>
        public bool TemperatureIsTunable => !ModelRejects(Setting.Temperature) && Family?.RecommendedTemperature == null;

        /// <summary>
        /// Whether the model takes this setting at all in this request (not rejected always, nor in the mode it is in):
        /// fixes never write a setting the model would reject.
        /// </summary>
        public bool ModelRejects(Setting setting)
        {
            if (Family == null)
            {
                return false;
            }

            return Family.RejectsSetting(setting)
                || (Family.ReasoningRejects.Contains(setting) && ReasoningEffort is { } effort && effort.Effort != Modes.NoReasoning)
                || (Family.ThinkingRejects.Contains(setting) && ThinkingEvidence != null);
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
