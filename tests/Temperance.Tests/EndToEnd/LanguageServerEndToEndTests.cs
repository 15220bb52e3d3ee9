using System.Text.Json;
using System.Text.Json.Nodes;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.EndToEnd;

/// <summary>
/// The packed package in an editor: a real language server (csharp-ls, the dotnet tool) opens a consumer project
/// and the findings come back through LSP pull diagnostics, as an editor would show them.
/// </summary>
[Trait("Category", "EndToEnd")]
public class LanguageServerEndToEndTests : IClassFixture<PackageFixture>
{
    private const string ServerVersion = "0.28.0";

    private const string Requests = """
        using OpenAI.Chat;

        namespace Lighthouse;

        public static class Requests
        {
            // SAMP005: OpenAI accepts top_p in [0, 1]
            public static ChatCompletionOptions Tide() => new ChatCompletionOptions { TopP = 1.4f };

            // Silent: within range
            public static ChatCompletionOptions Logbook() => new ChatCompletionOptions { Temperature = 0.2f, TopP = 1f };
        }
        """;

    private const string PoemPrompt = "Write a four-line poem about the lighthouse keeper's cat {{$name}}.";

    private const string PoemConfig = """
        {
          "schema": 1,
          "description": "Writes a short poem about a lighthouse cat",
          "execution_settings": {
            "default": {
              "temperature": 0.9,
              "top_p": 1.7
            }
          }
        }
        """;

    // Solution load, restore-free design-time build and the first analysis share 2 cores: generous, but bounded.
    private static readonly TimeSpan StartupTimeout = TimeSpan.FromSeconds(60);
    private static readonly TimeSpan DiagnosticsTimeout = TimeSpan.FromSeconds(120);

    private static readonly object InstallLock = new();

    private readonly PackageFixture package;

    public LanguageServerEndToEndTests(PackageFixture package)
    {
        this.package = package;
    }

    [Fact]
    public async Task CSharpFile_PullDiagnostics_ReportTheFindingOnItsLine()
    {
        var consumer = package.CreateConsumer("lsp-csharp");
        consumer.Write("Requests.cs", Requests);
        Restore(consumer);

        using var server = await StartServer(consumer);
        var uri = Open(server, consumer, "Requests.cs", "csharp", Requests);

        var items = await PullDiagnostics(server, uri);

        Assert.Equal(new[] { $"SAMP005@{LineOf(Requests, "TopP = 1.4f")}" }, Findings(items));
    }

    /// <summary>
    /// A finding in an MSBuild additional file (a prompt's config.json), reported by the analyzer's additional-file
    /// action. csharp-ls 0.28.0 returns such findings through two pull paths, and this test asks both:
    /// workspace/diagnostic, whose project-wide analysis reports every file a diagnostic is located in; and
    /// textDocument/diagnostic, which finds nothing for an additional document (it only looks up C# documents)
    /// until the file is opened, because didOpen of a file it does not know adds it to the project as a C#
    /// document: from then on the report for that URI carries the analyzer's findings at that path, along with
    /// the compiler's errors for JSON read as C#.
    /// </summary>
    [Fact]
    public async Task AdditionalFile_PullDiagnostics_ReportTheFindingInThePromptConfig()
    {
        // No AdditionalFiles item: the package adds the prompt directory itself.
        var consumer = package.CreateConsumer("lsp-additional");
        Directory.CreateDirectory(Path.Combine(consumer.Directory, "Prompts", "Poem"));
        consumer.Write("Requests.cs", Requests);
        consumer.Write("Prompts/Poem/skprompt.txt", PoemPrompt);
        consumer.Write("Prompts/Poem/config.json", PoemConfig);
        Restore(consumer);

        using var server = await StartServer(consumer);
        var uri = UriOf(consumer, "Prompts/Poem/config.json");

        // Workspace pull first: opening the file below turns it into a (broken) C# document of the project.
        var workspace = await server.Request("workspace/diagnostic",
            new JsonObject { ["previousResultIds"] = new JsonArray() }, DiagnosticsTimeout);
        JsonElement[] ReportedIn(string fileUri) => workspace.GetProperty("items").EnumerateArray()
            .Where(report => report.GetProperty("uri").GetString() == fileUri)
            .SelectMany(report => report.GetProperty("items").EnumerateArray())
            .ToArray();

        // The analyzer did run in this session: the C# file's finding is there.
        Assert.Equal(new[] { $"SAMP005@{LineOf(Requests, "TopP = 1.4f")}" }, Findings(ReportedIn(UriOf(consumer, "Requests.cs"))));

        Open(server, consumer, "Prompts/Poem/config.json", "json", PoemConfig);
        var documentItems = await PullDiagnostics(server, uri);

        var topP = LineOf(PoemConfig, "\"top_p\"");
        var expected = new[] { $"SAMP004@{topP}", $"SAMP005@{topP}" };
        var fromWorkspace = Findings(ReportedIn(uri));
        var fromDocument = Findings(documentItems);
        Assert.True(
            fromWorkspace.Intersect(expected).Any() && fromDocument.Intersect(expected).Any(),
            $"expected SAMP004 or SAMP005 on line {topP} of config.json; workspace/diagnostic gave [{string.Join(", ", fromWorkspace)}], " +
            $"textDocument/diagnostic gave [{string.Join(", ", fromDocument)}]\n---\nworkspace report: {workspace}\n---\nServer said:\n{server.ServerLog}");
    }

    private static void Restore(Consumer consumer)
    {
        // The server's design-time build does not restore: the project must come with its assets.
        var restore = consumer.Run("restore");
        Assert.True(restore.ExitCode == 0, restore.ToString());
    }

    /// <summary>Starts csharp-ls on the consumer's folder, with analyzers on, and completes the LSP handshake.</summary>
    private static async Task<LanguageServerClient> StartServer(Consumer consumer)
    {
        var server = new LanguageServerClient(
            InstallServer(),
            "--loglevel info",
            consumer.Directory,
            new Dictionary<string, string>
            {
                ["NUGET_PACKAGES"] = consumer.Packages,
                ["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1",
                ["DOTNET_NOLOGO"] = "1",
                ["MSBUILDDISABLENODEREUSE"] = "1",
            },
            AnswerServerRequest);
        try
        {
            var root = new Uri(consumer.Directory).AbsoluteUri;
            await server.Request("initialize", new JsonObject
            {
                ["processId"] = Environment.ProcessId,
                ["rootUri"] = root,
                ["workspaceFolders"] = new JsonArray(new JsonObject { ["uri"] = root, ["name"] = "consumer" }),
                ["capabilities"] = new JsonObject
                {
                    // csharp-ls reads its settings only by asking for them (workspace/configuration), never from
                    // initializationOptions; it asks at "initialized" when the client says it can answer.
                    ["workspace"] = new JsonObject { ["configuration"] = true },
                    ["textDocument"] = new JsonObject
                    {
                        ["diagnostic"] = new JsonObject { ["dynamicRegistration"] = false },
                        ["synchronization"] = new JsonObject { ["dynamicRegistration"] = false },
                    },
                },
            }, StartupTimeout);
            server.Notify("initialized", new JsonObject());
            return server;
        }
        catch
        {
            server.Dispose();
            throw;
        }
    }

    /// <summary>Answers the server's requests: its "csharp" settings section with analyzers on (off by default); null otherwise.</summary>
    private static JsonNode? AnswerServerRequest(string method, JsonNode? parameters)
    {
        if (method != "workspace/configuration")
        {
            return null;
        }

        var answers = new JsonArray();
        foreach (var item in parameters?["items"]?.AsArray() ?? new JsonArray())
        {
            answers.Add(item?["section"]?.GetValue<string>() == "csharp"
                ? new JsonObject { ["analyzersEnabled"] = true }
                : null);
        }

        return answers;
    }

    private static string UriOf(Consumer consumer, string relativePath) =>
        new Uri(Path.Combine(consumer.Directory, relativePath)).AbsoluteUri;

    private static string Open(LanguageServerClient server, Consumer consumer, string relativePath, string languageId, string text)
    {
        var uri = UriOf(consumer, relativePath);
        server.Notify("textDocument/didOpen", new JsonObject
        {
            ["textDocument"] = new JsonObject { ["uri"] = uri, ["languageId"] = languageId, ["version"] = 1, ["text"] = text },
        });
        return uri;
    }

    /// <summary>textDocument/diagnostic; csharp-ls answers it only once the solution has loaded.</summary>
    private static async Task<JsonElement[]> PullDiagnostics(LanguageServerClient server, string uri)
    {
        var report = await server.Request("textDocument/diagnostic",
            new JsonObject { ["textDocument"] = new JsonObject { ["uri"] = uri } }, DiagnosticsTimeout);
        Assert.True(report.GetProperty("kind").GetString() == "full", report.GetRawText());
        return report.GetProperty("items").EnumerateArray().ToArray();
    }

    /// <summary>"SAMPnnn@line" (0-based line, as LSP counts) for each of Temperance's diagnostics, sorted.</summary>
    private static string[] Findings(IEnumerable<JsonElement> items) =>
        items
            .Where(d => d.TryGetProperty("code", out var code) && code.ValueKind == JsonValueKind.String && code.GetString()!.StartsWith("SAMP", StringComparison.Ordinal))
            .Select(d => $"{d.GetProperty("code").GetString()}@{d.GetProperty("range").GetProperty("start").GetProperty("line").GetInt32()}")
            .OrderBy(s => s, StringComparer.Ordinal)
            .ToArray();

    private static int LineOf(string text, string marker) =>
        Array.FindIndex(text.Split('\n'), line => line.Contains(marker, StringComparison.Ordinal));

    /// <summary>
    /// csharp-ls as a dotnet tool, installed once into the test output through the machine's NuGet source (the
    /// repository's nuget.config clears none; the consumers' offline config would not have it).
    /// </summary>
    private static string InstallServer()
    {
        var toolPath = Path.Combine(AppContext.BaseDirectory, "tools", "csharp-ls-" + ServerVersion);
        var executable = Path.Combine(toolPath, OperatingSystem.IsWindows() ? "csharp-ls.exe" : "csharp-ls");
        lock (InstallLock)
        {
            if (!File.Exists(executable))
            {
                var install = DotNet.Run(TestReferences.RepositoryRoot,
                    $"tool install csharp-ls --version {ServerVersion} --tool-path \"{toolPath}\"", timeoutSeconds: 300);
                Assert.True(install.ExitCode == 0 && File.Exists(executable), install.ToString());
            }
        }

        return executable;
    }
}
