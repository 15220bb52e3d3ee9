using System.Collections.Generic;
using System.Linq;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP007: a setting the target model rejects (model-family table: always, at a reasoning effort other than none,
    /// with extended thinking on, or in combination) or the IChatClient adapter silently drops (adapter table). Both tables
    /// live in the rules table, each entry with its source; the message names the mode's evidence.
    /// </summary>
    internal static class RejectedSettingRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            var (request, policy) = (input.Request, input.Policy);
            var reported = new HashSet<SettingWrite>();
            var findings = new List<Finding>();
            if (input.Family is { } family)
            {
                foreach (var write in request.Writes)
                {
                    // The provider's default value is accepted (reasoning models take temperature 1), so only other values are rejected.
                    if (write.Kind != ValueKind.Known || IsDefault(input, write) || Why(input, family, write.Setting) is not { } why)
                    {
                        continue;
                    }

                    reported.Add(write);
                    findings.Add(new Finding(Descriptors.SettingRejectedOrDropped, write.Location, new FixPlan().Remove(write),
                        write.Member, "rejected", input.ModelText, why).About(write));
                }

                // Settings of which at most one may be set: every one after the first is rejected together with it.
                var exclusive = family.Exclusive.Select(s => request.Value(s)).Where(v => v.IsKnown && !reported.Contains(v.Last!)).ToList();
                for (var i = 1; i < exclusive.Count; i++)
                {
                    var write = exclusive[i].Last!;
                    reported.Add(write);
                    findings.Add(new Finding(Descriptors.SettingRejectedOrDropped, write.Location, new FixPlan().Remove(write),
                        $"{write.Member} together with {exclusive[0].Last!.Member}", "rejected", input.ModelText,
                        $"family '{family.Name}' takes only one of {string.Join(", ", family.Exclusive.Select(s => s.KeyName()))}, {OptionKeys.ModelExclusive(family.Name)}")
                        .About(write, exclusive[0].Last!));
                }
            }

            if (request.Adapter is { } adapter)
            {
                var (drops, dropsBagKeys, key) = policy.AdapterDrops(adapter);
                foreach (var write in request.Writes)
                {
                    var fromBag = write.FromKey;
                    if (write.Kind != ValueKind.Known || reported.Contains(write) || !(fromBag ? dropsBagKeys : drops.Contains(write.Setting)))
                    {
                        continue;
                    }

                    findings.Add(new Finding(Descriptors.SettingRejectedOrDropped, write.Location, new FixPlan().Remove(write),
                        write.Member, "silently dropped", request.AdapterDisplay ?? adapter,
                        fromBag ? OptionKeys.AdapterDropsBagKeys(adapter) : key).About(write));
                }
            }

            return findings;
        }

        /// <summary>Why the family rejects a setting in this request, with the evidence for the mode; null when it takes it.</summary>
        private static string? Why(RuleInput input, ModelFamily family, Setting setting)
        {
            if (family.RejectsSetting(setting))
            {
                return $"family '{family.Name}', {family.Key}";
            }

            if (family.ReasoningRejects.Contains(setting) && input.ReasoningEffort is { } effort && effort.Effort != Modes.NoReasoning)
            {
                return $"reasoning effort '{effort.Effort}' from {effort.Evidence}; only effort '{Modes.NoReasoning}' takes it, {OptionKeys.ModelReasoningRejects(family.Name)}";
            }

            if (family.ThinkingRejects.Contains(setting) && input.ThinkingEvidence is { } thinking)
            {
                return $"extended thinking is on ({thinking}), {OptionKeys.ModelThinkingRejects(family.Name)}";
            }

            return null;
        }

        private static bool IsDefault(RuleInput input, SettingWrite write) =>
            input.Policy.Default(input.RangeProvider, write.Setting) is { } accepted && accepted.Value == write.Value;
    }
}
