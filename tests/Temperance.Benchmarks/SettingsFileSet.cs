using System.Text;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Text;

namespace Temperance.Benchmarks;

/// <summary>An additional file over text in memory, as the build would pass one from disk.</summary>
public sealed class TextFile : AdditionalText
{
    private readonly SourceText text;

    public TextFile(string path, string content)
    {
        Path = path;
        // Decoded from bytes as the compiler reads a file: a large file becomes a chunked text, whose ToString() copies.
        using var stream = new MemoryStream(Encoding.UTF8.GetBytes(content));
        text = SourceText.From(stream, Encoding.UTF8);
    }

    public override string Path { get; }

    public override SourceText GetText(CancellationToken cancellationToken = default) => text;
}

/// <summary>
/// Generated settings files: Semantic Kernel prompt directories (config.json with 1-3 services beside a skprompt.txt of
/// a few hundred characters), one large appsettings.json (nested sections, comments, trailing commas, a few sampling
/// keys bound under one section) and YAML files without any sampling key (CI workflows, compose files, manifests).
/// Every name and prompt is an invented scenario.
/// </summary>
public sealed class SettingsFileSet
{
    public required List<AdditionalText> PromptDirectories { get; init; } // every config.json, then every skprompt.txt
    public required List<AdditionalText> Yaml { get; init; }
    public required AdditionalText AppSettings { get; init; }
    public int Directories => PromptDirectories.Count / 2;
    public IEnumerable<AdditionalText> All => PromptDirectories.Concat(Yaml).Append(AppSettings);

    private static readonly (string Place, string[] Functions, string Setting)[] Themes =
    {
        ("FerryDesk", new[] { "AnswerTimetableQuestion", "ExtractBookingDetails", "DraftDelayNotice", "ClassifyComplaint", "TranslateBoardingNotice" },
            "the Gullhaven ferry line's help desk, which answers passengers about crossings, vehicle deck space and cancelled sailings"),
        ("Bakery", new[] { "WriteSpecialsBoard", "ExtractOrderLines", "SuggestPairing", "SummarizeReviews", "ClassifyAllergenQuestion" },
            "the Crumb & Kettle bakery, which takes orders for rye loaves, cardamom buns and birthday cakes by phone and message"),
        ("Lighthouse", new[] { "WriteKeeperLog", "SummarizeWeatherWatch", "ExtractVesselSightings", "DraftVisitorGuide", "AnswerTourQuestion" },
            "the Skerry Point lighthouse, whose volunteers keep a log of lamp checks, fog signals and passing vessels"),
        ("Orchard", new[] { "PlanHarvestRota", "ExtractPickerHours", "WriteTastingNotes", "ClassifyPestReport", "DraftMarketNewsletter" },
            "the Hollow Lane cider orchard, which lists apple varieties, picking days and pressing schedules for its members"),
        ("BikeShop", new[] { "DiagnoseRepairRequest", "ExtractPartsList", "WriteRideRouteBlurb", "SummarizeServiceHistory", "AnswerRentalQuestion" },
            "the Spoke & Sprocket repair shop, which books wheel truing, brake bleeds and weekend rentals"),
        ("TideOffice", new[] { "ExplainTideTable", "ExtractMooringRequest", "DraftHarbourBulletin", "ClassifyHazardReport", "TranslateSafetyCard" },
            "the Wrenmouth harbour office, which publishes tide tables and assigns moorings to visiting boats"),
        ("Choir", new[] { "WriteConcertProgramme", "ExtractRehearsalAbsences", "SuggestRepertoire", "SummarizeCommitteeMinutes", "DraftTicketReminder" },
            "the Riverside community choir, which rehearses on Thursdays and sings two concerts a season"),
        ("Greenhouse", new[] { "PlanWateringSchedule", "ExtractSeedOrder", "WritePlantLabel", "ClassifySeedlingProblem", "AnswerOpenDayQuestion" },
            "the Thornbury glasshouses, which grow tomatoes, chillies and citrus for a weekly market stall"),
    };

    private static readonly string[] Sentences =
    {
        "Keep the answer under {0} words and use plain language a first-time visitor understands.",
        "If the question is about something the text below does not cover, say so and suggest calling the front desk.",
        "Use the facts in the context only; never invent opening hours, prices or dates.",
        "Write in a warm, practical tone, as a member of staff who has worked there for years would.",
        "When a date is mentioned, repeat it in full so it cannot be misread.",
        "List each item on its own line, with the quantity first.",
        "End with one short sentence that tells the reader what happens next.",
        "Do not mention staff by name unless the context already does.",
    };

    public static SettingsFileSet Generate(int directories, int yamlFiles, int appSettingsKeys, string root = "/bench/settings")
    {
        var configs = new List<AdditionalText>();
        var prompts = new List<AdditionalText>();
        for (var d = 0; d < directories; d++)
        {
            var theme = Themes[d % Themes.Length];
            var function = theme.Functions[d / Themes.Length % theme.Functions.Length];
            var directory = $"{root}/Plugins/{theme.Place}/{function}{d:D3}";
            configs.Add(new TextFile(directory + "/config.json", Config(d, function, theme.Setting)));
            prompts.Add(new TextFile(directory + "/skprompt.txt", Prompt(d, function, theme.Setting)));
        }

        // The package's order (buildTransitive targets): every config.json, then every skprompt.txt.
        prompts.InsertRange(0, configs);

        var yaml = Enumerable.Range(0, yamlFiles).Select(AdditionalText (i) => (i % 3) switch
        {
            0 => new TextFile($"{root}/.github/workflows/build-{i:D3}.yml", Workflow(i)),
            1 => new TextFile($"{root}/deploy/compose-{i:D3}.yaml", Compose(i)),
            _ => new TextFile($"{root}/deploy/k8s/service-{i:D3}.yaml", Manifest(i)),
        }).ToList();
        return new SettingsFileSet { PromptDirectories = prompts, Yaml = yaml, AppSettings = new TextFile($"{root}/appsettings.json", AppSettingsJson(appSettingsKeys)) };
    }

    /// <summary>
    /// 1-3 services with sampling keys. About one directory in four has a finding: temperature and top_p both moved,
    /// top_p above 1 for an OpenAI model, a reasoning model given a temperature, or an extraction prompt sent hot.
    /// </summary>
    private static string Config(int index, string function, string setting)
    {
        var text = new StringBuilder();
        text.AppendLine("{");
        if (index % 5 == 0)
        {
            text.AppendLine("  // hand-edited: keep the description short, it is shown in the plugin list");
        }

        text.AppendLine("  \"schema\": 1,");
        text.AppendLine($"  \"description\": \"{Describe(function)} for {setting.Split(',')[0]}\",");
        text.AppendLine("  \"execution_settings\": {");
        var services = 1 + index % 3;
        // Extraction and classification prompts are sent cool, except the few meant to be found.
        var cool = function.StartsWith("Extract", StringComparison.Ordinal) || function.StartsWith("Classify", StringComparison.Ordinal);
        for (var s = 0; s < services; s++)
        {
            var body = (index % 4, s) switch
            {
                (0, 0) when index % 8 == 0 => "\"temperature\": 0.8, \"top_p\": 0.6, \"max_tokens\": 400",         // both moved
                (1, 0) => "\"model_id\": \"gpt-4o-mini\", \"top_p\": 1.4, \"max_tokens\": 300",                      // out of range for OpenAI
                (2, 1) when index % 8 == 2 => "\"model_id\": \"o3-mini\", \"temperature\": 0.2",                       // rejected by a reasoning model
                (_, 0) when function.StartsWith("Extract", StringComparison.Ordinal) && index % 3 == 0 => "\"temperature\": 1.1",
                (_, 0) => $"\"temperature\": {(cool ? "0" : $"0.{3 + index % 5}")}, \"max_tokens\": {200 + index % 7 * 50}",
                (_, 1) => $"\"model_id\": \"gpt-4o-mini\", \"temperature\": {(cool ? "0" : $"0.{2 + index % 4}")}, \"presence_penalty\": 0.{index % 3}",
                _ => $"\"model_id\": \"llama3.1:8b\", \"temperature\": {(cool ? "0.1" : $"0.{4 + index % 3}")}, \"top_k\": 40, \"seed\": {index}",
            };
            var name = s switch { 0 => "default", 1 => "gpt", _ => "local" };
            text.AppendLine($"    \"{name}\": {{ {body} }}{(s < services - 1 || index % 6 == 0 ? "," : string.Empty)}"); // a trailing comma now and then
        }

        text.AppendLine("  },");
        text.AppendLine("  \"input_variables\": [ { \"name\": \"question\", \"description\": \"What the visitor asked\", \"is_required\": true } ]");
        text.AppendLine("}");
        return text.ToString();
    }

    private static string Describe(string function) => function switch
    {
        _ when function.StartsWith("Extract", StringComparison.Ordinal) => "Extracts the details as JSON",
        _ when function.StartsWith("Classify", StringComparison.Ordinal) => "Sorts the message into one category",
        _ when function.StartsWith("Summarize", StringComparison.Ordinal) => "Summarises the text in a few lines",
        _ when function.StartsWith("Translate", StringComparison.Ordinal) => "Translates the notice",
        _ => "Writes a short reply",
    };

    private static string Prompt(int index, string function, string setting)
    {
        var text = new StringBuilder();
        text.Append($"You help {setting}. ");
        text.Append(function.StartsWith("Extract", StringComparison.Ordinal)
            ? "Extract every detail the message gives and return only JSON with the fields listed below. "
            : $"Your task: {Describe(function).ToLowerInvariant()} to the message below. ");
        for (var i = 0; i < 3; i++)
        {
            text.Append(string.Format(System.Globalization.CultureInfo.InvariantCulture, Sentences[(index + i * 3) % Sentences.Length], 60 + index % 5 * 20)).Append(' ');
        }

        text.AppendLine().AppendLine("Context: {{$context}}").AppendLine("Message: {{$question}}");
        return text.ToString();
    }

    private static string Workflow(int index) => $$"""
        name: build-{{index}}
        on:
          push:
            branches: [ main ]
          pull_request:
        jobs:
          build:
            runs-on: ubuntu-latest
            timeout-minutes: 20
            steps:
              - uses: actions/checkout@v4
              - uses: actions/setup-dotnet@v4
                with:
                  dotnet-version: '10.0.x'
              - name: Restore
                run: dotnet restore Harbour.sln
              - name: Build
                run: dotnet build Harbour.sln -c Release --no-restore
              - name: Test
                run: dotnet test Harbour.sln -c Release --no-build --logger trx
              - name: Upload results
                if: always()
                uses: actions/upload-artifact@v4
                with:
                  name: results-{{index}}
                  path: '**/*.trx'
        """;

    private static string Compose(int index) => $$"""
        services:
          web:
            image: registry.example/bakery-web:{{index}}.4
            ports:
              - "80{{index % 90 + 10}}:8080"
            environment:
              ASPNETCORE_ENVIRONMENT: Staging
              ConnectionStrings__Orders: "Host=db;Database=orders;Username=app"
            depends_on:
              - db
              - cache
          db:
            image: postgres:16
            volumes:
              - orders-data:/var/lib/postgresql/data
            healthcheck:
              test: ["CMD", "pg_isready", "-U", "app"]
              interval: 10s
              retries: 5
          cache:
            image: redis:7
        volumes:
          orders-data:
        """;

    private static string Manifest(int index) => $$"""
        apiVersion: v1
        kind: Service
        metadata:
          name: tide-office-{{index}}
          labels:
            app: tide-office
            tier: backend
        spec:
          selector:
            app: tide-office
          ports:
            - name: http
              port: 80
              targetPort: 8080
        ---
        apiVersion: apps/v1
        kind: Deployment
        metadata:
          name: tide-office-{{index}}
        spec:
          replicas: 2
          template:
            spec:
              containers:
                - name: api
                  image: registry.example/tide-office:{{index}}.1
                  resources:
                    limits: { cpu: "500m", memory: "256Mi" }
        """;

    /// <summary>
    /// A large appsettings.json: sections of routes, stores and flags, nested three deep, with comments and trailing
    /// commas (Json.NET reads both); one section binds a few sampling settings, so the file is parsed, not only scanned.
    /// </summary>
    private static string AppSettingsJson(int keys)
    {
        var text = new StringBuilder();
        text.AppendLine("{");
        text.AppendLine("  // Shared settings for every environment; secrets come from the vault, never from here.");
        text.AppendLine("  \"Logging\": { \"LogLevel\": { \"Default\": \"Information\", \"Microsoft.AspNetCore\": \"Warning\", }, },");
        text.AppendLine("  \"Assistant\": { \"ModelId\": \"gpt-4o-mini\", \"Temperature\": 0.4, \"TopP\": 0.9, \"MaxOutputTokens\": 600 },");
        var written = 10; // the keys above, and AllowedHosts below
        var section = 0;
        while (written < keys)
        {
            text.AppendLine($"  \"Harbour{section:D3}\": {{");
            text.AppendLine($"    // berths and routes of pier {section}");
            written++;
            for (var route = 0; route < 8 && written < keys; route++)
            {
                text.AppendLine($"    \"Route{route:D2}\": {{");
                text.AppendLine($"      \"Name\": \"Pier {section} to Islet {route} via the north channel\",");
                text.AppendLine($"      \"Endpoint\": \"https://timetable.example/api/v2/piers/{section}/routes/{route}/departures\",");
                text.AppendLine($"      \"CrossingMinutes\": {25 + route * 5},");
                text.AppendLine($"      \"VehicleDeck\": {{ \"Cars\": {12 + route}, \"Vans\": {route % 4}, \"Bicycles\": 20, }},");
                text.AppendLine("      \"Announcement\": \"Boarding closes ten minutes before departure; bring your ticket reference.\",");
                text.AppendLine($"      \"Notes\": \"Crew change at the far quay on Sundays. In a westerly above force six the crossing goes round the south side of islet {route}, which adds about fifteen minutes; tell drivers of high vehicles before they board.\",");
                text.AppendLine("    },");
                written += 10;
            }

            text.AppendLine($"    \"Enabled\": {(section % 7 == 0 ? "false" : "true")},");
            text.AppendLine("  },");
            written++;
            section++;
        }

        text.AppendLine("  \"AllowedHosts\": \"*\"");
        text.AppendLine("}");
        return text.ToString();
    }

    /// <summary>The same appsettings.json without the section that binds sampling settings: only the cheap scan runs.</summary>
    public static string WithoutSamplingKeys(string appSettings) =>
        string.Join("\n", appSettings.Split('\n').Where(l => !l.Contains("\"Assistant\"", StringComparison.Ordinal)));

    /// <summary>The property names in a JSON text (what "keys" means in the printed size).</summary>
    public static int CountKeys(string json)
    {
        using var reader = new Newtonsoft.Json.JsonTextReader(new StringReader(json));
        var keys = 0;
        while (reader.Read())
        {
            keys += reader.TokenType == Newtonsoft.Json.JsonToken.PropertyName ? 1 : 0;
        }

        return keys;
    }
}
