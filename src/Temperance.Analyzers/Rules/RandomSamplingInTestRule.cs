using System.Collections.Generic;
using Temperance.Model;
using Temperance.Policy;

namespace Temperance.Rules
{
    /// <summary>
    /// SAMP002: a test compares the model's exact output while sampling is random (temperature unset or above 0).
    /// Reported on the request call. Its fix sets temperature 0 and, where the SDK has one, the seed; so a missing seed in
    /// such a test is this rule's, not SAMP003's.
    /// </summary>
    internal static class RandomSamplingInTestRule
    {
        public static IEnumerable<Finding> Evaluate(Request request, TemperancePolicy policy)
        {
            if (!request.Context.IsTest || request.ExactAssertion == null || request.ClientIsTestDouble || request.SendingCallLocation == null)
            {
                yield break;
            }

            var kind = request.KindOf(Setting.Temperature, out var temperature);
            string why;
            if (kind == ValueKind.Known && temperature > 0)
            {
                why = $"temperature {FixProperties.Show(temperature)}";
            }
            else if (kind == ValueKind.Unset)
            {
                var providerDefault = policy.Default(request.Provider, Setting.Temperature);
                why = providerDefault == null ? "temperature unset"
                    : request.Provider == Surfaces.Providers.Generic ? $"temperature unset, so the provider's default (usually {FixProperties.Show(providerDefault.Value.Value)}) applies"
                    : $"temperature unset, so {request.Provider}'s default {FixProperties.Show(providerDefault.Value.Value)} applies";
            }
            else
            {
                yield break; // temperature 0 (SAMP003 asks for the seed) or Unknown (never judged)
            }

            if (!request.SeedAvailable)
            {
                why += $"; {request.Surface} has no seed, so even temperature 0 is only best effort";
            }

            var seed = policy.TestSeed?.Value ?? 0;
            var fix = new FixPlan();
            var temperatureWrite = LastWrite(request, Setting.Temperature);
            var seedUnset = request.KindOf(Setting.Seed, out _) == ValueKind.Unset && request.SeedAvailable;
            if (temperatureWrite != null)
            {
                fix.SetValue(temperatureWrite, 0);
                if (seedUnset && request.AddTargets.TryGetValue(Setting.Seed, out var seedTarget))
                {
                    fix.AddMember(seedTarget.Creation, seedTarget.Member, seed, seedTarget.Kind, seedTarget.WrapperMember, seedTarget.WrapperType).Experimental(seedTarget.Experimental);
                }
            }
            else if (request.TemperatureTarget is { } target)
            {
                fix.AddMember(target.Creation, target.Member, 0, target.Kind, target.WrapperMember, target.WrapperType);
                if (seedUnset && request.AddTargets.TryGetValue(Setting.Seed, out var seedTarget) && seedTarget.Creation == target.Creation && seedTarget.WrapperMember == target.WrapperMember)
                {
                    fix.AlsoAssign(seedTarget.Member, seedTarget.Kind, seed, seedTarget.Experimental);
                }
            }
            else if (request.IsImplicit && request.OmittedParameter != null && request.OmittedOptionsType != null
                && request.OmittedMembers.TryGetValue(Setting.Temperature, out var omitted))
            {
                fix.AddArgument(request.SendingCallLocation, request.OmittedParameter.Name, request.OmittedOptionsType, omitted.Member, 0, omitted.Kind);
                if (seedUnset && request.OmittedMembers.TryGetValue(Setting.Seed, out var omittedSeed))
                {
                    fix.AlsoAssign(omittedSeed.Member, omittedSeed.Kind, seed, omittedSeed.Experimental);
                }
            }

            yield return new Finding(Descriptors.RandomSamplingInExactTest, request.SendingCallLocation, fix.Combined(),
                $"{request.ExactAssertion} in '{request.Context.Member?.Name}'", why);
        }

        internal static SettingWrite? LastWrite(Request request, Setting setting)
        {
            SettingWrite? last = null;
            foreach (var write in request.Writes)
            {
                if (write.Setting == setting)
                {
                    last = write;
                }
            }

            return last;
        }
    }
}
