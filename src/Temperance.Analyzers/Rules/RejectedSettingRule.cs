using System.Collections.Generic;
using System.Linq;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP007: a setting the target model rejects (model-family table) or the IChatClient adapter silently drops
    /// (adapter table). Both tables live in the rules table, each entry with its source.
    /// </summary>
    internal static class RejectedSettingRule
    {
        public static IEnumerable<Finding> Evaluate(RuleInput input)
        {
            var (request, policy) = (input.Request, input.Policy);
            var reported = new HashSet<SettingWrite>();
            if (policy.FamilyOf(request.EffectiveModelId) is { } family)
            {
                foreach (var write in request.Writes)
                {
                    // The family's default value is accepted (reasoning models take temperature 1), so only other values are rejected.
                    if (write.Kind != ValueKind.Known || !family.RejectsSetting(write.Setting)
                        || policy.Default(request.Provider, write.Setting) is { } accepted && accepted.Value == write.Value)
                    {
                        continue;
                    }

                    reported.Add(write);
                    yield return new Finding(Descriptors.SettingRejectedOrDropped, write.Location, new FixPlan().Remove(write),
                        write.Member, "rejected", $"model '{request.EffectiveModelId}'", $"family '{family.Name}', {family.Key}").About(write);
                }
            }

            if (request.Adapter is { } adapter)
            {
                var (drops, dropsBagKeys, key) = policy.AdapterDrops(adapter);
                foreach (var write in request.Writes)
                {
                    var fromBag = write.Member.StartsWith("\"", System.StringComparison.Ordinal);
                    if (write.Kind != ValueKind.Known || reported.Contains(write) || !(fromBag ? dropsBagKeys : drops.Contains(write.Setting)))
                    {
                        continue;
                    }

                    yield return new Finding(Descriptors.SettingRejectedOrDropped, write.Location, new FixPlan().Remove(write),
                        write.Member, "silently dropped", request.AdapterDisplay ?? adapter,
                        fromBag ? OptionKeys.AdapterDropsBagKeys(adapter) : key).About(write);
                }
            }
        }
    }
}
