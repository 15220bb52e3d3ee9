namespace Temperance.Inventory;

/// <summary>How much the code says about a setting, as the report shows it.</summary>
public static class SettingState
{
    /// <summary>A compile-time number written in the code (a literal, a constant, the worst branch of a conditional).</summary>
    public const string Known = "known";

    /// <summary>Not written, and the provider's documented default applies (the analyzer judges it so).</summary>
    public const string Default = "default";

    /// <summary>Not written, and something outside the call may fill it in: no number is shown or plotted.</summary>
    public const string Unset = "unset";

    /// <summary>Read at run time (a parameter, configuration, a field): never judged.</summary>
    public const string Unknown = "unknown";
}

/// <summary>
/// One setting of a request as the report shows it. <see cref="Value"/> is a number only for <see cref="SettingState.Known"/>
/// and <see cref="SettingState.Default"/>; <see cref="Source"/> says where it came from ("literal", "constant 'Hot'",
/// "default of the provider", "unset (left to the client)", "unknown (from parameter 'heat')").
/// </summary>
public sealed record SettingRow(string Name, double? Value, string Source, string State = SettingState.Known);

/// <summary>One finding on a request: the rule, its page, and the line the diagnostic points at.</summary>
public sealed record FindingRow(string Id, string Severity, string Message, string? HelpLink = null, string? Title = null, string? File = null, int Line = 0);

/// <summary>One LLM request found in the code.</summary>
/// <param name="Sdk">The options type that carries the settings (<c>ChatCompletionOptions</c>).</param>
/// <param name="Library">The SDK that type belongs to (<c>OpenAI</c>, <c>Microsoft.Extensions.AI</c>).</param>
/// <param name="Ceiling">The task's temperature ceiling (SAMP001) from the rules table and the project's options, when the task has one.</param>
/// <param name="CeilingKey">The option key the ceiling came from.</param>
/// <param name="Layers">Where the settings come from: "file" (a prompt directory, template, agent definition), "code", "configuration".</param>
public sealed record RequestRow(
    string Project, string File, int Line, string Sdk, string Provider, string? Model,
    string? Task, string? TaskEvidence, IReadOnlyList<SettingRow> Settings, IReadOnlyList<FindingRow> Findings,
    string? NotJudged = null, string Library = "", double? Ceiling = null, string? CeilingKey = null,
    string? Family = null, string? ModelSource = null, IReadOnlyList<string>? Layers = null)
{
    /// <summary>Where the effective settings come from when more than one layer sets them ("code + configuration"), else null.</summary>
    public string? LayerLine => Layers is { Count: > 1 } ? string.Join(" + ", Layers) : null;

    /// <summary>The model, its family from the rules table and where both came from, in one line ("o3-mini, family openai_reasoning (the client; temperance.deployment.x)").</summary>
    public string? ModelLine => Model == null ? null : Model + (Family == null ? string.Empty : $", family {Family}") + (ModelSource == null ? string.Empty : $" ({ModelSource})");

    public SettingRow Temperature => Settings.First(s => s.Name == "temperature");

    public SettingRow? Setting(string name) => Settings.FirstOrDefault(s => s.Name == name);
}
