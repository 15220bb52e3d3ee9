using System;
using System.Collections.Generic;
using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>Which syntax a settings file is written in, and where in it the settings are.</summary>
    internal enum SettingsFileSyntax
    {
        Json,
        Yaml,
        /// <summary>A prompt file opening with a YAML front matter between two <c>---</c> lines; the rest is the prompt.</summary>
        FrontMatter,
    }

    /// <summary>
    /// One kind of file that holds requests outside C#: how to recognise it, where its settings blocks are, where it names
    /// its model and provider, and which of its texts say what the call is for. Declared here, read by one generic reader
    /// (Files/FileRequestReader), exactly as the SDK surfaces are for code.
    /// </summary>
    internal sealed class FileSurface
    {
        public FileSurface(string name, SettingsFileSyntax syntax)
        {
            Name = name;
            Syntax = syntax;
        }

        /// <summary>How messages and the inventory name it ("prompt directory").</summary>
        public string Name { get; }
        public SettingsFileSyntax Syntax { get; }
        /// <summary>A file name this kind always has (<c>config.json</c>); null when the extension decides.</summary>
        public string? FileName { get; init; }
        /// <summary>A file that must sit beside it (<c>skprompt.txt</c>), whose text is the prompt.</summary>
        public string? SiblingPrompt { get; init; }
        /// <summary>The path of keys that must be present for the file to be of this kind (<c>execution_settings</c>).</summary>
        public string[][] RecognisedBy { get; init; } = new string[0][];
        /// <summary>Paths of which at least one must also be present (none: the recognising keys are enough).</summary>
        public string[][] AlsoNeedsOneOf { get; init; } = new string[0][];
        /// <summary>Paths to settings blocks; <c>*</c> stands for every entry of a mapping (one block per service id).</summary>
        public string[][] Blocks { get; init; } = new string[0][];
        /// <summary>Keys inside a block that name the model.</summary>
        public string[] BlockModelKeys { get; init; } = new string[0];
        /// <summary>Paths from the file's root that name the model (a scalar; for a <c>provider/model</c> string the model part counts).</summary>
        public string[][] ModelPaths { get; init; } = new string[0][];
        /// <summary>A path whose value names the provider, and the rules-table provider each value means.</summary>
        public string[]? ProviderPath { get; init; }
        public IReadOnlyDictionary<string, string> ProviderValues { get; init; } = new Dictionary<string, string>();
        /// <summary>Paths whose text names the function (task evidence from its leading verb).</summary>
        public string[][] NamePaths { get; init; } = new string[0][];
        /// <summary>Paths whose text is prompt text or a description of it (task evidence from its phrases).</summary>
        public string[][] PromptPaths { get; init; } = new string[0][];
        /// <summary>Paths whose presence asks for structured output (an output schema).</summary>
        public string[][] SchemaPaths { get; init; } = new string[0][];
    }

    /// <summary>
    /// The settings files Temperance reads, checked against the loaders' documentation on 2026-12-02:
    /// Semantic Kernel prompt directories and YAML prompt templates (PromptTemplateConfig: name, description, template,
    /// execution_settings keyed by service id, each with model_id) [api: learn.microsoft.com/semantic-kernel/prompts/configure-prompts];
    /// declarative agents (Semantic Kernel and Agent Framework: model → id, model → options → temperature / topP)
    /// [api: learn.microsoft.com/agent-framework/agents/declarative]; Prompty front matter (model → configuration → type /
    /// azure_deployment, model → parameters) [api: microsoft.github.io/promptflow/how-to-guides/develop-a-prompty].
    /// </summary>
    internal static class FileSurfaces
    {
        private static readonly string[][] SkBlocks = { new[] { "execution_settings", "*" }, new[] { "completion" } };

        public static readonly FileSurface PromptDirectory = new FileSurface("prompt directory", SettingsFileSyntax.Json)
        {
            FileName = "config.json",
            SiblingPrompt = "skprompt.txt",
            RecognisedBy = new[] { new[] { "execution_settings" }, new[] { "completion" } },
            Blocks = SkBlocks,
            BlockModelKeys = new[] { "model_id" },
            NamePaths = new[] { new[] { "name" } },
            PromptPaths = new[] { new[] { "description" } },
        };

        public static readonly FileSurface PromptTemplate = new FileSurface("prompt template", SettingsFileSyntax.Yaml)
        {
            RecognisedBy = new[] { new[] { "execution_settings" } },
            Blocks = SkBlocks,
            BlockModelKeys = new[] { "model_id" },
            NamePaths = new[] { new[] { "name" } },
            PromptPaths = new[] { new[] { "template" }, new[] { "description" } },
        };

        public static readonly FileSurface AgentDefinition = new FileSurface("agent definition", SettingsFileSyntax.Yaml)
        {
            RecognisedBy = new[] { new[] { "model", "options" } },
            // The shape alone is weak (an oven profile has model → options → temperature too): an agent file also says
            // what it is (kind: Prompt, type: chat_completion_agent) or gives the agent instructions.
            AlsoNeedsOneOf = new[] { new[] { "kind" }, new[] { "type" }, new[] { "instructions" } },
            Blocks = new[] { new[] { "model", "options" } },
            ModelPaths = new[] { new[] { "model", "id" } },
            NamePaths = new[] { new[] { "name" } },
            PromptPaths = new[] { new[] { "instructions" }, new[] { "description" } },
            SchemaPaths = new[] { new[] { "outputSchema" }, new[] { "output_schema" } },
        };

        public static readonly FileSurface FrontMatterPrompt = new FileSurface("front-matter prompt", SettingsFileSyntax.FrontMatter)
        {
            RecognisedBy = new[] { new[] { "model", "parameters" }, new[] { "config" } },
            // Prompty: model → parameters; the .prompt format: config.
            Blocks = new[] { new[] { "model", "parameters" }, new[] { "config" } },
            ModelPaths = new[] { new[] { "model", "configuration", "azure_deployment" }, new[] { "model", "configuration", "model" }, new[] { "model" } },
            ProviderPath = new[] { "model", "configuration", "type" },
            ProviderValues = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase) { ["azure_openai"] = Providers.OpenAI, ["openai"] = Providers.OpenAI },
            NamePaths = new[] { new[] { "name" } },
            PromptPaths = new[] { new[] { "description" } },
            SchemaPaths = new[] { new[] { "output", "schema" } },
        };

        /// <summary>
        /// Service ids that name a provider (<c>execution_settings: { openai: { … } }</c>): the block goes to that provider.
        /// Any other service id (<c>default</c>, <c>fast</c>, a deployment) says nothing about where the request goes.
        /// </summary>
        public static readonly IReadOnlyDictionary<string, string> ServiceProviders = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase)
        {
            ["openai"] = Providers.OpenAI,
            ["azure_openai"] = Providers.OpenAI,
            ["azureopenai"] = Providers.OpenAI,
            ["ollama"] = Providers.Ollama,
        };

        /// <summary>YAML files are one of two kinds, told apart by their keys; the first that matches wins.</summary>
        public static readonly FileSurface[] Yaml = { PromptTemplate, AgentDefinition };

        /// <summary>
        /// Sampling keys in settings files, matched ignoring case: the trade names, their camel-case spellings (agent
        /// definitions write <c>topP</c>) and the candidate-count names the loaders use.
        /// </summary>
        public static readonly IReadOnlyDictionary<string, Setting> Keys = BuildKeys();

        /// <summary>Keys that put a request in a mode: a scalar, or a mapping and the key inside it that holds the value.</summary>
        public static readonly IReadOnlyDictionary<string, (string Mode, string? Member)> ModeKeys =
            new Dictionary<string, (string, string?)>(StringComparer.OrdinalIgnoreCase)
            {
                ["reasoning_effort"] = (Modes.ReasoningEffort, null),
                ["reasoningEffort"] = (Modes.ReasoningEffort, null),
                ["reasoning"] = (Modes.ReasoningEffort, "effort"),
                ["thinking"] = (Modes.Thinking, "type"),
            };

        /// <summary>The response-format key of a block, and the values (or a mapping's <c>type</c>) that ask for JSON.</summary>
        public static readonly string[] FormatKeys = { "response_format", "responseFormat" };

        private static Dictionary<string, Setting> BuildKeys()
        {
            var keys = new Dictionary<string, Setting>(StringComparer.OrdinalIgnoreCase)
            {
                ["n"] = Setting.Candidates,
                ["results_per_prompt"] = Setting.Candidates,
                ["candidate_count"] = Setting.Candidates,
                ["candidateCount"] = Setting.Candidates,
                ["repeat_penalty"] = Setting.RepetitionPenalty,
            };
            foreach (Setting setting in Enum.GetValues(typeof(Setting)))
            {
                if (setting is Setting.DoSample or Setting.Candidates)
                {
                    continue;
                }

                keys[setting.KeyName()] = setting;
                keys[setting.KeyName().Replace("_", string.Empty)] = setting; // topP, frequencyPenalty (ignoring case)
            }

            return keys;
        }

        /// <summary>
        /// Cheap test before any parsing: the text mentions a sampling key at all. Files without one cost a scan and nothing more.
        /// </summary>
        public static bool MayHoldSettings(string text)
        {
            foreach (var key in QuickKeys)
            {
                if (text.IndexOf(key, StringComparison.OrdinalIgnoreCase) >= 0)
                {
                    return true;
                }
            }

            return false;
        }

        /// <summary>
        /// Text that marks a YAML file as a prompt template (<c>execution_settings</c>) or an agent definition (a model with
        /// options), for deciding whether a file that does not parse is worth a SAMP100.
        /// </summary>
        public static bool LooksLikeYamlSettings(string text) =>
            text.IndexOf("execution_settings", StringComparison.Ordinal) >= 0
            || (text.IndexOf("model:", StringComparison.Ordinal) >= 0 && text.IndexOf("options:", StringComparison.Ordinal) >= 0);

        private static readonly string[] QuickKeys = { "temperature", "top_p", "topP", "top_k", "topK", "seed", "penalty", "min_p", "minP", "reasoning", "thinking" };
    }
}
