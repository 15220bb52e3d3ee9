using System.Collections.Immutable;
using System.Linq;
using Microsoft.CodeAnalysis;

namespace Temperance.Rules
{
    /// <summary>The catalog of every Temperance diagnostic. One analyzer owns them all, so a request is extracted once.</summary>
    internal static class Descriptors
    {
        /// <summary>
        /// The rule pages' address: the repository URL the build was given (<c>TemperanceRepositoryUrl</c> in
        /// Directory.Build.props, stored as assembly metadata) plus <c>/blob/main/rules/</c>.
        /// </summary>
        public static readonly string HelpLinkBase = RepositoryUrl().TrimEnd('/') + "/blob/main/rules/";

        private static string RepositoryUrl()
        {
            foreach (var attribute in typeof(Descriptors).Assembly.GetCustomAttributes(typeof(System.Reflection.AssemblyMetadataAttribute), false))
            {
                if (attribute is System.Reflection.AssemblyMetadataAttribute { Key: "TemperanceRepositoryUrl", Value: { Length: > 0 } url })
                {
                    return url;
                }
            }

            return "https://github.com/temperance-analyzers/temperance";
        }

        private const string Sampling = "Sampling";
        private const string Reproducibility = "Reproducibility";
        private const string Compatibility = "Compatibility";
        private const string Configuration = "Configuration";

        public static readonly DiagnosticDescriptor TemperatureAboveTaskCeiling = Create(
            "SAMP001", "Temperature above the ceiling for the call's task",
            "{0} is above the ceiling {1} for task '{2}' ({3}; ceiling from {4})",
            Sampling, DiagnosticSeverity.Warning,
            "Extraction, classification, code and evaluation calls need focused sampling: at a high temperature (or at the provider default, often 1.0) the structure and the fields of the answer change from run to run.");

        public static readonly DiagnosticDescriptor RandomSamplingInExactTest = Create(
            "SAMP002", "Random sampling where a test compares the model's exact output",
            "The test compares this model output exactly ({0}) but sampling is random ({1}); the test passes or fails by chance",
            Reproducibility, DiagnosticSeverity.Warning,
            "A test that compares a model's output with an exact value is only repeatable when sampling is greedy (temperature 0) and, where the SDK has one, seeded.");

        public static readonly DiagnosticDescriptor MissingSeed = Create(
            "SAMP003", "No seed where the run must be reproducible",
            "This run must be reproducible ({0}) but {1} has no seed; set one",
            Reproducibility, DiagnosticSeverity.Warning,
            "On SDKs that offer a seed, a fixed seed makes repeated runs of the same request far more likely to match.");

        public static readonly DiagnosticDescriptor TemperatureAndTopPBothChanged = Create(
            "SAMP004", "Temperature and top-p both moved away from the provider's defaults",
            "Both temperature ({0}) and top-p ({1}) differ from {2}'s defaults (temperature {3}, top-p {4}); change one of them, not both",
            Sampling, DiagnosticSeverity.Warning,
            "Temperature and nucleus (top-p) sampling reshape the same distribution; providers advise changing one, not both, because their combined effect is hard to predict.");

        public static readonly DiagnosticDescriptor ValueOutOfRange = Create(
            "SAMP005", "Sampling value outside the provider's accepted range",
            "{0} = {1} is outside the range {2} that {3} accepts for {4} (rules table: {5}){6}",
            Sampling, DiagnosticSeverity.Warning,
            "A value outside the provider's published range is rejected at run time or clamped without notice.");

        public static readonly DiagnosticDescriptor InertSetting = Create(
            "SAMP006", "Setting made inert by another setting",
            "{0} has no effect because {1}",
            Sampling, DiagnosticSeverity.Info,
            "Some settings cancel others: at temperature 0 decoding is greedy, so top-p and top-k do nothing; with top-k 1 only one token is left, so temperature does nothing.");

        public static readonly DiagnosticDescriptor SettingRejectedOrDropped = Create(
            "SAMP007", "Setting the target model or provider rejects or silently drops",
            "{0} is {1} by {2} ({3})",
            Compatibility, DiagnosticSeverity.Warning,
            "Some models reject sampling settings, and some client adapters drop them silently; the developer believes a setting is in force when it is not.");

        public static readonly DiagnosticDescriptor CandidatesAtTemperatureZero = Create(
            "SAMP008", "Several candidates requested at temperature 0",
            "{0} candidates are requested at temperature 0: greedy decoding makes every candidate the same",
            Sampling, DiagnosticSeverity.Warning,
            "At temperature 0 each candidate follows the same most-likely path, so extra candidates cost tokens and add nothing.");

        public static readonly DiagnosticDescriptor ExtremeTemperature = Create(
            "SAMP009", "Temperature so high the output degrades toward noise",
            "Temperature {0} is above {1} ({2}): sampling this flat drifts toward random tokens{3}",
            Sampling, DiagnosticSeverity.Warning,
            "Temperature divides the logits before the softmax; far above 1 the distribution flattens toward uniform and the output degrades toward noise.");

        public static readonly DiagnosticDescriptor AdvisedAgainst = Create(
            "SAMP010", "Value the model's publisher advises against",
            "{0} = {1} is below {2}, the value the publisher advises keeping for {3} ({4})",
            Compatibility, DiagnosticSeverity.Warning,
            "Some publishers advise against moving a setting away from a value for a model: below it the model may loop or degrade. The request is accepted, so nothing fails; the output just gets worse.");

        public static readonly DiagnosticDescriptor InvalidConfiguration = Create(
            "SAMP100", "Invalid Temperance configuration",
            "Temperance configuration '{0}' has the value '{1}'; expected {2}. The rule that needs it is skipped until this is fixed.",
            Configuration, DiagnosticSeverity.Warning,
            "A Temperance option in .editorconfig or a global config could not be used. Temperance never guesses a value in its place.",
            WellKnownDiagnosticTags.CompilationEnd);

        /// <summary>
        /// Rules with no known false positives: the relaxed preset keeps only these as warnings while a team adopts the
        /// package; every other rule becomes a suggestion there. Derived from <see cref="RuleCatalog"/> (SAMP100 judges only
        /// configuration).
        /// </summary>
        public static ImmutableHashSet<string> NoKnownFalsePositives => Derived.NoKnownFalsePositives;

        /// <summary>Every descriptor: the rules of <see cref="RuleCatalog"/> in ID order, then SAMP100.</summary>
        public static ImmutableArray<DiagnosticDescriptor> All => Derived.All;

        /// <summary>Built on first use, after every descriptor field above exists (RuleCatalog refers to them).</summary>
        private static class Derived
        {
            public static readonly ImmutableArray<DiagnosticDescriptor> All =
                RuleCatalog.All.Select(r => r.Descriptor).OrderBy(d => d.Id, System.StringComparer.Ordinal).Concat(new[] { InvalidConfiguration }).ToImmutableArray();

            public static readonly ImmutableHashSet<string> NoKnownFalsePositives =
                RuleCatalog.All.Where(r => r.NoKnownFalsePositives).Select(r => r.Descriptor.Id).Concat(new[] { InvalidConfiguration.Id }).ToImmutableHashSet();
        }

        private static DiagnosticDescriptor Create(string id, string title, string message, string category, DiagnosticSeverity severity, string description, params string[] tags) =>
            new DiagnosticDescriptor(id, title, message, category, severity, isEnabledByDefault: true, description: description, helpLinkUri: HelpLinkBase + id + ".md", customTags: tags);
    }
}
