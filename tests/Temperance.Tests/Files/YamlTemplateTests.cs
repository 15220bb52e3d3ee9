using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Files;

/// <summary>YAML prompt templates: execution_settings per service, each judged on its own with its own model.</summary>
public class YamlTemplateTests
{
    [Fact]
    public async Task SeveralServices_EachJudgedWithItsOwnModel()
    {
        const string template = """
            name: DraftTimetableNotice
            description: Drafts a notice about a changed ferry timetable.
            template: |
              Write a short notice for passengers: the {{$route}} crossing now leaves at {{$time}}.
            execution_settings:
              fast:
                model_id: gpt-4o-mini
                {|SAMP005:temperature: 2.4|}
              careful:
                model_id: o3-mini
                {|SAMP007:temperature: 0.3|}
              default:
                temperature: 0.7
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/timetable-notice.yaml", template) }, null);
    }

    [Fact]
    public async Task ExtractionTemplate_AtHighTemperature_Triggers()
    {
        const string template = """
            name: ReadCrewRoster
            template: |
              Extract the name, rank and watch of every crew member from {{$roster}}. Return only JSON.
            execution_settings:
              default:
                {|SAMP001:temperature: 1.2|}
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/crew-roster.yml", template) }, null);
    }

    [Fact]
    public async Task ComputedValues_AreUnknown_AndSilent()
    {
        const string template = """
            name: ReadCrewRoster
            template: Extract the crew list from {{$roster}}.
            execution_settings:
              default:
                temperature: ${TEMPERATURE}
                top_p: "{{$nucleus}}"
            """;
        await Verify.FilesAsync(new[] { ("/Prompts/crew-roster.yaml", template) }, null);
    }

    [Fact]
    public async Task YamlWithoutSettings_IsSilent_AndNotParsed()
    {
        // A CI workflow or a compose file: no sampling key, so nothing is parsed or reported, even when it is not valid YAML.
        await Verify.FilesAsync(new[] { ("/.github/workflows/build.yml", "on: [push\njobs: {"), ("/deploy/compose.yaml", "services:\n  web:\n    image: harbour\n") }, null);
    }

    [Fact]
    public async Task HelmTemplateWithASeedKey_ThatIsNotValidYaml_IsSilent()
    {
        // Go templating makes a Helm chart invalid YAML; its "seed" is a database seed, and the file is nobody's prompt.
        const string chart = "apiVersion: v1\nkind: ConfigMap\ndata:\n  {{- if .Values.seed }}\n  seed: {{ .Values.seed | quote }}\n  {{- end }}\n";
        await Verify.FilesAsync(new[] { ("/deploy/templates/configmap.yaml", chart) }, null);
    }

    [Fact]
    public async Task OtherYamlWithATemperatureKey_IsSilent()
    {
        // A sensor configuration is not a prompt template: neither execution_settings nor an agent's model options.
        await Verify.FilesAsync(new[] { ("/config/sensors.yaml", "engine_room:\n  temperature: 95\n  top_p: 3\n") }, null);
    }

    [Fact]
    public async Task MalformedTemplate_WithSamplingKeys_GivesOneSamp100()
    {
        const string template = "name: Notice\nexecution_settings:\n  default:\n    temperature: [0.7\n";
        await Verify.FilesAsync(new[] { ("/Prompts/notice.yaml", template) }, null,
            Verify.Diagnostic("SAMP100").WithSpan("/Prompts/notice.yaml", 5, 1, 5, 1)
                .WithMessage("Temperance configuration 'Prompts/notice.yaml' has the value 'While parsing a flow sequence, did not find expected ',' or ']'.'; expected YAML that parses (the parser stopped at line 5, column 1); its sampling settings are not checked. The rule that needs it is skipped until this is fixed."));
    }
}
