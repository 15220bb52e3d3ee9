using static Temperance.Tests.Precision.ExpectedFinding;
using static Temperance.Tests.Precision.PrecisionCase;

namespace Temperance.Tests.Precision;

/// <summary>One finding a case must produce: the rule and a piece of the source line it is reported on.</summary>
public sealed record ExpectedFinding(string Id, string LineContains)
{
    public static ExpectedFinding At(string id, string lineContains) => new(id, lineContains);

    public override string ToString() => $"{Id} on a line containing '{LineContains}'";
}

/// <summary>
/// One scenario of the precision corpus: the files of one project (compiled together under <see cref="AssemblyName"/>),
/// extra global-config lines, and the findings it must produce (none for a silent case).
/// </summary>
public sealed record PrecisionCase(
    string Name,
    string AssemblyName,
    IReadOnlyList<string> Sources,
    IReadOnlyList<ExpectedFinding> Expected,
    IReadOnlyList<string> GlobalConfig)
{
    public bool IsSilent => Expected.Count == 0;

    /// <summary>The names of a corpus's cases, as theory data (cases are looked up by name so test names stay readable).</summary>
    public static Xunit.TheoryData<string> Names(IEnumerable<PrecisionCase> cases)
    {
        var names = new Xunit.TheoryData<string>();
        foreach (var @case in cases)
        {
            names.Add(@case.Name);
        }

        return names;
    }

    /// <summary>A case that must report nothing.</summary>
    public static PrecisionCase Silent(string name, string assembly, params string[] sources) =>
        new(name, assembly, sources, Array.Empty<ExpectedFinding>(), Array.Empty<string>());

    /// <summary>A case that must report exactly <paramref name="expected"/>.</summary>
    public static PrecisionCase Fires(string name, string assembly, ExpectedFinding[] expected, params string[] sources) =>
        new(name, assembly, sources, expected, Array.Empty<string>());

    public override string ToString() => Name;
}

/// <summary>
/// A realistic corpus for measuring precision: about two thirds are what the test projects of .NET LLM applications
/// really do with sampling settings without ever reaching a model (serialising, cloning, mapping, telemetry markers,
/// mocks, fakes and canned transports declared in other files), one third are true findings that must survive.
/// </summary>
public static class PrecisionCorpus
{
    public static IReadOnlyList<PrecisionCase> Cases { get; } = Build();

    public static PrecisionCase Find(string name) => Cases.Single(c => c.Name == name);

    private static IReadOnlyList<PrecisionCase> Build()
    {
        var cases = new List<PrecisionCase>();
        cases.AddRange(SerialisationCloningAndMapping());
        cases.AddRange(TelemetryAndLogging());
        cases.AddRange(MockingLibraries());
        cases.AddRange(FakeClientsDeclaredInTheTests());
        cases.AddRange(CannedTransports());
        cases.AddRange(RealClientsWithoutExactOutput());
        cases.AddRange(ProductCodeThatNeverSends());
        cases.AddRange(LiveTwinsInProductCode());
        cases.AddRange(LiveTwinsInTestCode());
        return cases;
    }

    // ==== silent: options built in tests to check how they are serialised, cloned, merged or converted ================

    private static IEnumerable<PrecisionCase> SerialisationCloningAndMapping()
    {
        yield return Silent("MappingTest_ChatOptionsToOpenAIOptions_IsSilent", "Harbour.Tests",
            """
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;

            namespace Harbour.Booking.Ai;

            public static class FerryChatOptionsMapper
            {
                public static ChatCompletionOptions ToOpenAI(ChatOptions source)
                {
                    var target = new ChatCompletionOptions
                    {
                        Temperature = source.Temperature,
                        TopP = source.TopP,
                        MaxOutputTokenCount = source.MaxOutputTokens,
                        FrequencyPenalty = source.FrequencyPenalty,
                        PresencePenalty = source.PresencePenalty,
                    };
                    target.Seed = source.Seed;
                    foreach (var stop in source.StopSequences ?? [])
                    {
                        target.StopSequences.Add(stop);
                    }

                    return target;
                }
            }
            """,
            """
            using Harbour.Booking.Ai;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Harbour.Booking.Tests;

            public class FerryChatOptionsMapperTests
            {
                [Fact]
                public void ToOpenAI_CopiesEverySamplingSetting()
                {
                    var options = new ChatOptions
                    {
                        Temperature = 1.7f,
                        TopP = 0.35f,
                        MaxOutputTokens = 300,
                        FrequencyPenalty = 0.5f,
                        PresencePenalty = -0.5f,
                        Seed = 11,
                        StopSequences = ["END"],
                    };

                    var mapped = FerryChatOptionsMapper.ToOpenAI(options);

                    Assert.Equal(1.7f, mapped.Temperature);
                    Assert.Equal(0.35f, mapped.TopP);
                    Assert.Equal(300, mapped.MaxOutputTokenCount);
                    Assert.Equal(11L, mapped.Seed);
                    Assert.Equal(new[] { "END" }, mapped.StopSequences);
                }

                [Fact]
                public void ToOpenAI_PassesAnOutOfRangeTopPThrough_ForTheServiceToReject()
                {
                    var mapped = FerryChatOptionsMapper.ToOpenAI(new ChatOptions { TopP = 1.4f });
                    Assert.Equal(1.4f, mapped.TopP);
                }

                [Theory]
                [InlineData(2.5f)]
                [InlineData(-0.1f)]
                public void ToOpenAI_DoesNotClamp(float temperature)
                {
                    var mapped = FerryChatOptionsMapper.ToOpenAI(new ChatOptions { Temperature = temperature });
                    Assert.Equal(temperature, mapped.Temperature);
                }
            }
            """);

        yield return Silent("SerialisationTest_ChatCompletionOptions_ModelReaderWriter_IsSilent", "GardenCentre.Catalogue.Tests",
            """
            using System;
            using System.ClientModel.Primitives;
            using System.Text.Json;
            using OpenAI.Chat;
            using Xunit;

            namespace GardenCentre.Catalogue.Tests;

            public class CatalogueRequestWireFormatTests
            {
                [Fact]
                public void SamplingSettings_AreWrittenWithTheirWireNames()
                {
                    var options = new ChatCompletionOptions
                    {
                        Temperature = 1.9f,
                        TopP = 0.2f,
                        FrequencyPenalty = 2.5f,
                        MaxOutputTokenCount = 120,
                    };

                    BinaryData json = ModelReaderWriter.Write(options);
                    using var document = JsonDocument.Parse(json.ToString());
                    var root = document.RootElement;

                    Assert.Equal(1.9, root.GetProperty("temperature").GetDouble(), 3);
                    Assert.Equal(0.2, root.GetProperty("top_p").GetDouble(), 3);
                    Assert.Equal(2.5, root.GetProperty("frequency_penalty").GetDouble(), 3);
                    Assert.Equal(120, root.GetProperty("max_completion_tokens").GetInt32());
                }

                [Fact]
                public void UnsetTemperature_IsLeftOutOfThePayload()
                {
                    var options = new ChatCompletionOptions { MaxOutputTokenCount = 64 };
                    var json = ModelReaderWriter.Write(options).ToString();
                    Assert.DoesNotContain("\"temperature\"", json);
                }
            }
            """);

        yield return Silent("SerialisationTest_ChatOptions_JsonRoundTrip_NUnit_IsSilent", "LendingDesk.Tests",
            """
            using System.Text.Json;
            using Microsoft.Extensions.AI;
            using NUnit.Framework;

            namespace LendingDesk.Assistant.Tests;

            [TestFixture]
            public class SavedPromptSettingsTests
            {
                [Test]
                public void ChatOptions_SurviveAJsonRoundTrip()
                {
                    var options = new ChatOptions
                    {
                        ModelId = "gpt-4o-mini",
                        Temperature = 2.5f,
                        TopK = -3,
                        Seed = 1234,
                        AdditionalProperties = new AdditionalPropertiesDictionary { ["branch"] = "Eastgate" },
                    };

                    string json = JsonSerializer.Serialize(options, AIJsonUtilities.DefaultOptions);
                    var copy = JsonSerializer.Deserialize<ChatOptions>(json, AIJsonUtilities.DefaultOptions);

                    Assert.That(copy, Is.Not.Null);
                    Assert.That(copy!.Temperature, Is.EqualTo(2.5f));
                    Assert.That(copy.TopK, Is.EqualTo(-3));
                    Assert.That(copy.Seed, Is.EqualTo(1234L));
                    Assert.That(copy.ModelId, Is.EqualTo("gpt-4o-mini"));
                }
            }
            """);

        yield return Silent("CloneTest_ChatOptionsClone_IsIndependent_FluentAssertions_IsSilent", "Crumb.Orders.Tests",
            """
            using FluentAssertions;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Crumb.Orders.Tests;

            public class ChatOptionsCloneTests
            {
                [Fact]
                public void Clone_CopiesSamplingSettings_AndSharesNothing()
                {
                    var original = new ChatOptions { Temperature = 0f, TopP = 0.5f, TopK = 40, StopSequences = ["###"] };

                    var clone = original.Clone();
                    clone.Temperature = 1.6f;
                    clone.StopSequences!.Add("---");

                    original.Temperature.Should().Be(0f);
                    original.StopSequences.Should().Equal("###");
                    clone.TopP.Should().Be(0.5f);
                    clone.TopK.Should().Be(40);
                    clone.Temperature.Should().Be(1.6f);
                }
            }
            """);

        yield return Silent("MergeTest_ProjectOptionsMerger_DefaultsInStaticField_IsSilent", "Spokes.Workshop.Tests",
            """
            using Microsoft.Extensions.AI;

            namespace Spokes.Workshop.Ai;

            public static class RepairChatOptions
            {
                public static ChatOptions Merge(ChatOptions defaults, ChatOptions? overrides)
                {
                    var merged = defaults.Clone();
                    if (overrides is null)
                    {
                        return merged;
                    }

                    merged.Temperature = overrides.Temperature ?? merged.Temperature;
                    merged.TopP = overrides.TopP ?? merged.TopP;
                    merged.MaxOutputTokens = overrides.MaxOutputTokens ?? merged.MaxOutputTokens;
                    merged.ModelId = overrides.ModelId ?? merged.ModelId;
                    return merged;
                }
            }
            """,
            """
            using Microsoft.Extensions.AI;
            using Spokes.Workshop.Ai;
            using Xunit;

            namespace Spokes.Workshop.Tests;

            public class RepairChatOptionsTests
            {
                private static readonly ChatOptions WorkshopDefaults = new() { Temperature = 0.2f, TopP = 0.9f, MaxOutputTokens = 400 };

                [Fact]
                public void Overrides_WinOverTheDefaults()
                {
                    var merged = RepairChatOptions.Merge(WorkshopDefaults, new ChatOptions { Temperature = 1.7f, ModelId = "gpt-4o" });

                    Assert.Equal(1.7f, merged.Temperature);
                    Assert.Equal(0.9f, merged.TopP);
                    Assert.Equal("gpt-4o", merged.ModelId);
                }

                [Fact]
                public void NoOverrides_ReturnsACopyOfTheDefaults()
                {
                    var merged = RepairChatOptions.Merge(WorkshopDefaults, null);

                    Assert.NotSame(WorkshopDefaults, merged);
                    Assert.Equal(0.2f, merged.Temperature);
                }
            }
            """);

        yield return Silent("ConversionTest_ExtensionDataToOpenAIPromptExecutionSettings_IsSilent", "Gallery.AudioGuide.Tests",
            """
            using System.Collections.Generic;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Gallery.AudioGuide.Tests;

            public class ExecutionSettingsConversionTests
            {
                [Fact]
                public void ExtensionData_IsReadIntoTypedOpenAISettings()
                {
                    var generic = new PromptExecutionSettings
                    {
                        ModelId = "gpt-4o-mini",
                        ExtensionData = new Dictionary<string, object>
                        {
                            ["temperature"] = 1.8,
                            ["top_p"] = 0.3,
                            ["max_tokens"] = 250,
                            ["seed"] = 99L,
                        },
                    };

                    var typed = OpenAIPromptExecutionSettings.FromExecutionSettings(generic);

                    Assert.Equal(1.8, typed.Temperature);
                    Assert.Equal(0.3, typed.TopP);
                    Assert.Equal(250, typed.MaxTokens);
                    Assert.Equal(99L, typed.Seed);
                }

                [Fact]
                public void TypedSettings_ComeBackAsTheyAre()
                {
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 2.4, TopP = 0.1 };
                    Assert.Same(settings, OpenAIPromptExecutionSettings.FromExecutionSettings(settings));
                }
            }
            """);

        yield return Silent("ConversionTest_PromptExecutionSettingsToChatOptions_IsSilent", "Gallery.AudioGuide.Tests",
            """
            using Microsoft.Extensions.AI;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Gallery.AudioGuide.Tests;

            public class ChatOptionsBridgeTests
            {
                [Fact]
                public void ToChatOptions_CarriesTheSamplingSettingsAcross()
                {
                    var settings = new OpenAIPromptExecutionSettings { ModelId = "gpt-4o", Temperature = 1.6, TopP = 0.4, Seed = 5, MaxTokens = 180 };

                    ChatOptions? options = settings.ToChatOptions(kernel: null);

                    Assert.NotNull(options);
                    Assert.Equal(1.6f, options!.Temperature);
                    Assert.Equal(0.4f, options.TopP);
                    Assert.Equal(5L, options.Seed);
                    Assert.Equal(180, options.MaxOutputTokens);
                }
            }
            """);

        yield return Silent("RoundTripTest_MSTest_ModelReaderWriterReadBack_IsSilent", "PawsClinic.Triage.Tests",
            """
            using System;
            using System.ClientModel.Primitives;
            using Microsoft.VisualStudio.TestTools.UnitTesting;
            using OpenAI.Chat;

            namespace PawsClinic.Triage.Tests;

            [TestClass]
            public class StoredRequestOptionsTests
            {
                [TestMethod]
                public void Options_RoundTripThroughTheStoredFormat()
                {
                    var options = new ChatCompletionOptions { Temperature = 0f, TopP = 0.05f, FrequencyPenalty = -2.5f };

                    BinaryData stored = ModelReaderWriter.Write(options);
                    var restored = ModelReaderWriter.Read<ChatCompletionOptions>(stored)!;

                    Assert.AreEqual(0f, restored.Temperature);
                    Assert.AreEqual(0.05f, restored.TopP);
                    Assert.AreEqual(-2.5f, restored.FrequencyPenalty);
                }
            }
            """);

        yield return new PrecisionCase("TestProjectByBuildProperty_SampleOptionsHelpers_IsSilent", "Ferry.Acceptance",
            new[]
            {
                """
                using Microsoft.Extensions.AI;
                using OpenAI.Chat;

                namespace Ferry.Acceptance.Support;

                /// <summary>Sample requests the validation tests feed to the request checker.</summary>
                public static class SampleRequests
                {
                    public static ChatOptions Stormy() => new() { Temperature = 1.9f, TopP = 0.3f };

                    public static ChatCompletionOptions OutOfRange => new() { Temperature = 3f };
                }
                """,
                """
                using System.Text.Json;
                using Ferry.Acceptance.Support;
                using Microsoft.Extensions.AI;
                using Xunit;

                namespace Ferry.Acceptance;

                public class SampleRequestTests
                {
                    [Fact]
                    public void Stormy_SerialisesBothSettings()
                    {
                        var json = JsonSerializer.Serialize(SampleRequests.Stormy(), AIJsonUtilities.DefaultOptions);
                        Assert.Contains("\"temperature\":1.9", json);
                    }

                    [Fact]
                    public void OutOfRange_KeepsItsValue()
                    {
                        Assert.Equal(3f, SampleRequests.OutOfRange.Temperature);
                    }
                }
                """,
            },
            Array.Empty<ExpectedFinding>(),
            new[] { "build_property.IsTestProject = true" });

        yield return Silent("ValidationTest_ProjectGuardGivenOutOfRangeOptions_NUnit_IsSilent", "PawsClinic.Triage.Tests",
            """
            using System.Collections.Generic;
            using OpenAI.Chat;

            namespace PawsClinic.Triage.Ai;

            /// <summary>Checks sampling settings read from clinic configuration before the assistant starts.</summary>
            public static class SamplingGuard
            {
                public static IReadOnlyList<string> Validate(ChatCompletionOptions options)
                {
                    var problems = new List<string>();
                    if (options.Temperature is < 0f or > 2f)
                    {
                        problems.Add($"temperature {options.Temperature} is outside [0, 2]");
                    }

                    if (options.TopP is < 0f or > 1f)
                    {
                        problems.Add($"top_p {options.TopP} is outside [0, 1]");
                    }

                    if (options.Temperature is not null && options.TopP is not null)
                    {
                        problems.Add("set temperature or top_p, not both");
                    }

                    return problems;
                }
            }
            """,
            """
            using NUnit.Framework;
            using OpenAI.Chat;
            using PawsClinic.Triage.Ai;

            namespace PawsClinic.Triage.Tests;

            [TestFixture]
            public class SamplingGuardTests
            {
                [Test]
                public void OutOfRangeTemperature_IsRejected()
                {
                    var problems = SamplingGuard.Validate(new ChatCompletionOptions { Temperature = 3.5f });
                    Assert.That(problems, Has.Some.Contains("outside [0, 2]"));
                }

                [Test]
                public void BothKnobsMoved_AndTopPOutOfRange_AreBothReported()
                {
                    var options = new ChatCompletionOptions { Temperature = 0.4f, TopP = 1.7f };
                    var problems = SamplingGuard.Validate(options);
                    Assert.That(problems, Has.Count.EqualTo(2));
                }

                [Test]
                public void SensibleOptions_PassTheGuard()
                {
                    Assert.That(SamplingGuard.Validate(new ChatCompletionOptions { Temperature = 0.3f }), Is.Empty);
                }
            }
            """);

        yield return Silent("SerialisationTheory_MemberDataOptions_IsSilent", "GardenCentre.Catalogue.Tests",
            """
            using System.Text.Json;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace GardenCentre.Catalogue.Tests;

            public class ChatOptionsSerialisationTheoryTests
            {
                public static TheoryData<ChatOptions> OptionsToRoundTrip => new()
                {
                    new ChatOptions { Temperature = 0f, TopP = 0.5f },
                    new ChatOptions { TopK = -1, Seed = 3 },
                    new ChatOptions { Temperature = 2.5f, FrequencyPenalty = 4f },
                };

                [Theory]
                [MemberData(nameof(OptionsToRoundTrip))]
                public void RoundTrip_KeepsEverySetting(ChatOptions options)
                {
                    var json = JsonSerializer.Serialize(options, AIJsonUtilities.DefaultOptions);
                    var copy = JsonSerializer.Deserialize<ChatOptions>(json, AIJsonUtilities.DefaultOptions)!;

                    Assert.Equal(options.Temperature, copy.Temperature);
                    Assert.Equal(options.TopP, copy.TopP);
                    Assert.Equal(options.TopK, copy.TopK);
                    Assert.Equal(options.FrequencyPenalty, copy.FrequencyPenalty);
                }
            }
            """);
    }

    // ==== silent: telemetry and logging tests writing marker values into options sent to a fake client ================

    private const string RecordingChatClient = """
        using System;
        using System.Collections.Generic;
        using System.Runtime.CompilerServices;
        using System.Threading;
        using System.Threading.Tasks;
        using Microsoft.Extensions.AI;

        namespace Harbour.Telemetry.Tests.Fakes;

        public sealed class RecordingChatClient : IChatClient
        {
            private readonly string _reply;

            public RecordingChatClient(string reply = "Sailing on time.") => _reply = reply;

            public List<ChatOptions?> ReceivedOptions { get; } = new();

            public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
            {
                ReceivedOptions.Add(options);
                return Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, _reply))
                {
                    ModelId = options?.ModelId ?? "recorded-model",
                    Usage = new UsageDetails { InputTokenCount = 10, OutputTokenCount = 4 },
                    FinishReason = ChatFinishReason.Stop,
                });
            }

            public async IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, [EnumeratorCancellation] CancellationToken cancellationToken = default)
            {
                ReceivedOptions.Add(options);
                await Task.Yield();
                yield return new ChatResponseUpdate(ChatRole.Assistant, _reply);
            }

            public object? GetService(Type serviceType, object? serviceKey = null) => serviceType.IsInstanceOfType(this) ? this : null;

            public void Dispose()
            {
            }
        }
        """;

    private static IEnumerable<PrecisionCase> TelemetryAndLogging()
    {
        yield return Silent("TelemetryTest_OpenTelemetryTags_MarkerValues_FakeInOtherFile_IsSilent", "Harbour.Telemetry.Tests",
            RecordingChatClient,
            """
            using System;
            using System.Collections.Generic;
            using System.Diagnostics;
            using System.Threading.Tasks;
            using Harbour.Telemetry.Tests.Fakes;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Harbour.Telemetry.Tests;

            public sealed class ChatTelemetryTests : IDisposable
            {
                private const string SourceName = "Harbour.Telemetry.Tests";
                private readonly List<Activity> _activities = new();
                private readonly ActivityListener _listener;

                public ChatTelemetryTests()
                {
                    _listener = new ActivityListener
                    {
                        ShouldListenTo = source => source.Name == SourceName,
                        Sample = (ref ActivityCreationOptions<ActivityContext> _) => ActivitySamplingResult.AllDataAndRecorded,
                        ActivityStopped = activity => _activities.Add(activity),
                    };
                    ActivitySource.AddActivityListener(_listener);
                }

                public void Dispose() => _listener.Dispose();

                [Fact]
                public async Task RequestTags_CarryTheSamplingSettingsVerbatim()
                {
                    using var client = new ChatClientBuilder(new RecordingChatClient())
                        .UseOpenTelemetry(sourceName: SourceName)
                        .Build();

                    // Marker values no model would accept: the test only checks that they reach the span untouched.
                    var options = new ChatOptions
                    {
                        ModelId = "tag-probe",
                        Temperature = 42f,
                        TopP = 100f,
                        TopK = 7,
                        FrequencyPenalty = 3f,
                        PresencePenalty = -5f,
                        Seed = 31337,
                    };

                    await client.GetResponseAsync("Is the 07:15 to Skerry Island running?", options);

                    var activity = Assert.Single(_activities);
                    Assert.Equal(42.0, Convert.ToDouble(activity.GetTagItem("gen_ai.request.temperature")));
                    Assert.Equal(100.0, Convert.ToDouble(activity.GetTagItem("gen_ai.request.top_p")));
                    Assert.Equal(7, Convert.ToInt32(activity.GetTagItem("gen_ai.request.top_k")));
                    Assert.Equal("tag-probe", activity.GetTagItem("gen_ai.request.model"));
                }

                [Fact]
                public async Task StreamingRequestTags_CarryTheSamplingSettingsToo()
                {
                    var fake = new RecordingChatClient("Delayed 10 minutes.");
                    using var client = new ChatClientBuilder(fake).UseOpenTelemetry(sourceName: SourceName).Build();

                    await foreach (var _ in client.GetStreamingResponseAsync("Status of the 18:30?", new ChatOptions { Temperature = 9f, TopP = 0f }))
                    {
                    }

                    Assert.Equal(9.0, Convert.ToDouble(Assert.Single(_activities).GetTagItem("gen_ai.request.temperature")));
                    Assert.Equal(9f, Assert.Single(fake.ReceivedOptions)!.Temperature);
                }
            }
            """);

        yield return Silent("LoggingTest_UseLogging_FakeClientAndLoggerInOtherFiles_IsSilent", "GardenCentre.Catalogue.Tests",
            """
            using System;
            using System.Collections.Generic;
            using Microsoft.Extensions.Logging;

            namespace GardenCentre.Catalogue.Tests.Support;

            public sealed class CapturingLoggerFactory : ILoggerFactory
            {
                public List<string> Lines { get; } = new();

                public ILogger CreateLogger(string categoryName) => new CapturingLogger(Lines);

                public void AddProvider(ILoggerProvider provider)
                {
                }

                public void Dispose()
                {
                }

                private sealed class CapturingLogger(List<string> lines) : ILogger
                {
                    public IDisposable? BeginScope<TState>(TState state) where TState : notnull => null;

                    public bool IsEnabled(LogLevel logLevel) => true;

                    public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter) =>
                        lines.Add(formatter(state, exception));
                }
            }
            """,
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace GardenCentre.Catalogue.Tests.Support;

            public sealed class StaticCatalogueChatClient(string answer) : IChatClient
            {
                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, answer)));

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System.Threading.Tasks;
            using GardenCentre.Catalogue.Tests.Support;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace GardenCentre.Catalogue.Tests;

            public class CatalogueChatLoggingTests
            {
                [Fact]
                public async Task TraceLogging_RecordsTheCall()
                {
                    var loggerFactory = new CapturingLoggerFactory();
                    IChatClient client = new ChatClientBuilder(new StaticCatalogueChatClient("Lavender 'Hidcote', 2L pot, £6.99"))
                        .UseLogging(loggerFactory)
                        .Build();

                    var options = new ChatOptions { Temperature = 1.95f, TopP = 0.15f, MaxOutputTokens = 40 };
                    var response = await client.GetResponseAsync("Describe plant #4471 for the web shop.", options);

                    Assert.Equal("Lavender 'Hidcote', 2L pot, £6.99", response.Text);
                    Assert.Contains(loggerFactory.Lines, line => line.Contains("GetResponseAsync"));
                }
            }
            """);
    }

    // ==== silent: clients that are Moq / NSubstitute / FakeItEasy doubles =============================================

    private static IEnumerable<PrecisionCase> MockingLibraries()
    {
        yield return Silent("MoqTest_NarratorGetsTheMock_VerifyMentionsTheOptions_IsSilent", "Harbour.Tests",
            """
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Harbour.Timetable;

            public sealed class TimetableNarrator(IChatClient chatClient)
            {
                public async Task<string> DescribeAsync(string route, ChatOptions options, CancellationToken cancellationToken = default)
                {
                    var messages = new[]
                    {
                        new ChatMessage(ChatRole.System, "You announce ferry departures in one friendly sentence."),
                        new ChatMessage(ChatRole.User, $"Next departures on {route}"),
                    };
                    var response = await chatClient.GetResponseAsync(messages, options, cancellationToken);
                    return response.Text;
                }
            }
            """,
            """
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Harbour.Timetable;
            using Microsoft.Extensions.AI;
            using Moq;
            using Xunit;

            namespace Harbour.Timetable.Tests;

            public class TimetableNarratorTests
            {
                [Fact]
                public async Task DescribeAsync_PassesTheCallersOptionsThrough()
                {
                    var chatClient = new Mock<IChatClient>();
                    chatClient
                        .Setup(c => c.GetResponseAsync(It.IsAny<IEnumerable<ChatMessage>>(), It.IsAny<ChatOptions>(), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(new ChatResponse(new ChatMessage(ChatRole.Assistant, "The 09:40 to Skerry leaves from pier 4.")));
                    var options = new ChatOptions { Temperature = 1.8f, TopP = 0.6f };
                    var narrator = new TimetableNarrator(chatClient.Object);

                    var text = await narrator.DescribeAsync("Skerry", options);

                    Assert.Equal("The 09:40 to Skerry leaves from pier 4.", text);
                    chatClient.Verify(c => c.GetResponseAsync(It.IsAny<IEnumerable<ChatMessage>>(), options, It.IsAny<CancellationToken>()), Times.Once);
                }

                [Fact]
                public async Task TheMock_AnswersOnlyTheMarkedTemperature()
                {
                    var mock = new Mock<IChatClient>();
                    mock.Setup(c => c.GetResponseAsync(It.IsAny<IEnumerable<ChatMessage>>(), It.Is<ChatOptions>(o => o.Temperature == 2.5f), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(new ChatResponse(new ChatMessage(ChatRole.Assistant, "ok")));

                    var response = await mock.Object.GetResponseAsync("ping", new ChatOptions { Temperature = 2.5f });

                    Assert.Equal("ok", response.Text);
                }
            }
            """);

        yield return Silent("NSubstituteTest_SubstituteInFieldInitializer_ReceivedWithArgIs_IsSilent", "LendingDesk.Tests",
            """
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using NSubstitute;
            using Xunit;

            namespace LendingDesk.Assistant.Tests;

            public class OverdueReminderTests
            {
                private readonly IChatClient _chat = Substitute.For<IChatClient>();

                public OverdueReminderTests()
                {
                    _chat.GetResponseAsync(Arg.Any<IEnumerable<ChatMessage>>(), Arg.Any<ChatOptions?>(), Arg.Any<CancellationToken>())
                        .Returns(new ChatResponse(new ChatMessage(ChatRole.Assistant, "Your copy of 'The Salt Road' was due on 3 March.")));
                }

                [Fact]
                public async Task Reminder_TextComesFromTheModel()
                {
                    var options = new ChatOptions { Temperature = 0.9f, MaxOutputTokens = 80 };

                    var response = await _chat.GetResponseAsync("Write an overdue reminder for loan 5512.", options);

                    Assert.Equal("Your copy of 'The Salt Road' was due on 3 March.", response.Text);
                    await _chat.Received(1).GetResponseAsync(
                        Arg.Any<IEnumerable<ChatMessage>>(),
                        Arg.Is<ChatOptions?>(o => o != null && o.Temperature == 0.9f),
                        Arg.Any<CancellationToken>());
                }
            }
            """);

        yield return Silent("FakeItEasyTest_AdvisorGetsTheFake_CallToMentionsTheOptions_IsSilent", "GardenCentre.Catalogue.Tests",
            """
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace GardenCentre.Advice;

            public sealed class PlantCareAdvisor
            {
                private readonly IChatClient _client;

                public PlantCareAdvisor(IChatClient client) => _client = client;

                public async Task<string> AdviseAsync(string plant, ChatOptions options, CancellationToken cancellationToken = default)
                {
                    var response = await _client.GetResponseAsync(
                        new[]
                        {
                            new ChatMessage(ChatRole.System, "You are a garden-centre adviser. Answer in two sentences."),
                            new ChatMessage(ChatRole.User, $"How do I care for {plant}?"),
                        },
                        options,
                        cancellationToken);
                    return response.Text.Trim();
                }
            }
            """,
            """
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using FakeItEasy;
            using GardenCentre.Advice;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace GardenCentre.Advice.Tests;

            public class PlantCareAdvisorTests
            {
                [Fact]
                public async Task Advice_IsTheModelsAnswerTrimmed()
                {
                    var client = A.Fake<IChatClient>();
                    A.CallTo(() => client.GetResponseAsync(A<IEnumerable<ChatMessage>>._, A<ChatOptions?>._, A<CancellationToken>._))
                        .Returns(new ChatResponse(new ChatMessage(ChatRole.Assistant, "  Water weekly. Full sun.  ")));
                    var advisor = new PlantCareAdvisor(client);
                    var options = new ChatOptions { Temperature = 1.6f, TopP = 0.4f };

                    var advice = await advisor.AdviseAsync("rosemary", options);

                    Assert.Equal("Water weekly. Full sun.", advice);
                    A.CallTo(() => client.GetResponseAsync(A<IEnumerable<ChatMessage>>._, options, A<CancellationToken>._)).MustHaveHappenedOnceExactly();
                }
            }
            """);

        yield return Silent("MoqTest_MockOfOpenAIChatClient_PassedToNotifier_IsSilent", "LendingDesk.Tests",
            """
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace LendingDesk.Holds;

            public sealed class HoldNotifier(ChatClient chat)
            {
                public async Task<string> ComposeAsync(string title, string branch, ChatCompletionOptions options)
                {
                    var messages = new List<ChatMessage>
                    {
                        new SystemChatMessage("You write one-sentence notices telling members a reserved book is ready."),
                        new UserChatMessage($"'{title}' is ready at {branch}."),
                    };
                    ChatCompletion completion = await chat.CompleteChatAsync(messages, options);
                    return completion.Content[0].Text;
                }
            }
            """,
            """
            using System;
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using LendingDesk.Holds;
            using Moq;
            using OpenAI.Chat;
            using Xunit;

            namespace LendingDesk.Holds.Tests;

            public class HoldNotifierTests
            {
                private const string CompletionJson = "{\"id\":\"chatcmpl-hold\",\"object\":\"chat.completion\",\"created\":1730000000,\"model\":\"gpt-4o-mini\",\"choices\":[{\"index\":0,\"message\":{\"role\":\"assistant\",\"content\":\"Your reserved copy of 'Pond Life' is waiting at Eastgate.\"},\"finish_reason\":\"stop\"}]}";

                [Fact]
                public async Task Notice_IsTheCompletionText()
                {
                    var completion = ModelReaderWriter.Read<ChatCompletion>(BinaryData.FromString(CompletionJson))!;
                    var chat = new Mock<ChatClient>();
                    chat.Setup(c => c.CompleteChatAsync(It.IsAny<IEnumerable<ChatMessage>>(), It.IsAny<ChatCompletionOptions>(), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(ClientResult.FromValue(completion, Mock.Of<PipelineResponse>()));
                    var notifier = new HoldNotifier(chat.Object);

                    var text = await notifier.ComposeAsync("Pond Life", "Eastgate", new ChatCompletionOptions { Temperature = 1.3f, TopP = 0.5f });

                    Assert.Equal("Your reserved copy of 'Pond Life' is waiting at Eastgate.", text);
                }
            }
            """);

        yield return Silent("MoqTest_MockedChatCompletionServiceInKernelServices_IsSilent", "Crumb.Orders.Tests",
            """
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.DependencyInjection;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Moq;
            using Xunit;

            namespace Crumb.Orders.Tests;

            public class AllergenNoticeTests
            {
                [Fact]
                public async Task Notice_IsTheMockedCompletion()
                {
                    var completion = new Mock<IChatCompletionService>();
                    completion
                        .Setup(s => s.GetChatMessageContentsAsync(It.IsAny<ChatHistory>(), It.IsAny<PromptExecutionSettings?>(), It.IsAny<Kernel?>(), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(new List<ChatMessageContent> { new(AuthorRole.Assistant, "Contains: wheat, egg, milk. May contain: sesame.") });
                    var builder = Kernel.CreateBuilder();
                    builder.Services.AddSingleton(completion.Object);
                    var kernel = builder.Build();
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 1.7, TopP = 0.9 };

                    var result = await kernel.InvokePromptAsync("Write the allergen notice for the sourdough loaf.", new KernelArguments(settings));

                    Assert.Equal("Contains: wheat, egg, milk. May contain: sesame.", result.GetValue<string>());
                    completion.Verify(
                        s => s.GetChatMessageContentsAsync(It.IsAny<ChatHistory>(), It.Is<PromptExecutionSettings?>(p => p is OpenAIPromptExecutionSettings), It.IsAny<Kernel?>(), It.IsAny<CancellationToken>()),
                        Times.Once);
                }
            }
            """);

        yield return Silent("NSubstituteTest_SubstituteOllamaApiClient_StreamedReply_IsSilent", "Allotments.Planner.Tests",
            """
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using NSubstitute;
            using OllamaSharp;
            using OllamaSharp.Models;
            using OllamaSharp.Models.Chat;
            using Xunit;

            namespace Allotments.Planner.Tests;

            public class PestAlertTests
            {
                [Fact]
                public async Task Alert_IsTheStreamedMessage()
                {
                    var ollama = Substitute.For<IOllamaApiClient>();
                    ollama.ChatAsync(Arg.Any<ChatRequest>(), Arg.Any<CancellationToken>())
                        .Returns(Stream("Blackfly ", "on plot 9 broad beans."));
                    var request = new ChatRequest
                    {
                        Model = "llama3.2",
                        Messages = [new Message(ChatRole.User, "Write a pest alert for plot 9.")],
                        Options = new RequestOptions { Temperature = 2.4f, MinP = 1.5f },
                    };

                    var alert = "";
                    await foreach (var chunk in ollama.ChatAsync(request))
                    {
                        alert += chunk?.Message.Content;
                    }

                    Assert.Equal("Blackfly on plot 9 broad beans.", alert);
                }

                private static async IAsyncEnumerable<ChatResponseStream?> Stream(params string[] parts)
                {
                    foreach (var part in parts)
                    {
                        await Task.Yield();
                        yield return new ChatResponseStream { Message = new Message(ChatRole.Assistant, part) };
                    }
                }
            }
            """);
    }

    // ==== silent: fake IChatClient classes declared in other files of the test project =================================

    private static IEnumerable<PrecisionCase> FakeClientsDeclaredInTheTests()
    {
        yield return Silent("FakeClientInOtherFile_UsedDirectly_IsSilent", "LendingDesk.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace LendingDesk.Tests.Doubles;

            public sealed class CannedLendingChatClient : IChatClient
            {
                private readonly Queue<string> _answers;

                public CannedLendingChatClient(params string[] answers) => _answers = new Queue<string>(answers);

                public int Calls { get; private set; }

                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
                {
                    Calls++;
                    return Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, _answers.Dequeue())));
                }

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException("The lending desk never streams.");

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System.Threading.Tasks;
            using LendingDesk.Tests.Doubles;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace LendingDesk.Tests;

            public class RenewalAnswerTests
            {
                [Fact]
                public async Task Renewal_AnswerIsShownVerbatim()
                {
                    IChatClient client = new CannedLendingChatClient("Renewed until 14 April.");
                    var options = new ChatOptions { Temperature = 0.9f };

                    var response = await client.GetResponseAsync("Renew loan 8812 for two weeks.", options);

                    Assert.Equal("Renewed until 14 April.", response.Text);
                }

                [Fact]
                public async Task GreedyRequest_GoesToTheCannedClientToo()
                {
                    var client = new CannedLendingChatClient("Due 2 May.");

                    var response = await client.GetResponseAsync(new[] { new ChatMessage(ChatRole.User, "When is loan 9001 due?") }, new ChatOptions { Temperature = 0f });

                    Assert.Equal("Due 2 May.", response.Text);
                    Assert.Equal(1, client.Calls);
                }
            }
            """);

        yield return Silent("FakeClientInOtherFile_FieldSetInTestConstructor_IsSilent", "Crumb.Orders.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Linq;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Crumb.Orders.Tests.Fakes;

            public sealed class ScriptedOrderChatClient(IReadOnlyDictionary<string, string> script) : IChatClient
            {
                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
                {
                    var prompt = messages.Last().Text;
                    return Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, script[prompt])));
                }

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using Crumb.Orders.Tests.Fakes;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Crumb.Orders.Tests;

            public class CakeInscriptionTests
            {
                private readonly IChatClient _client;

                public CakeInscriptionTests()
                {
                    _client = new ScriptedOrderChatClient(new Dictionary<string, string>
                    {
                        ["Inscription for order 311"] = "Happy 40th, Maura!",
                    });
                }

                [Fact]
                public async Task Inscription_IsTakenFromTheModel()
                {
                    var options = new ChatOptions { Temperature = 1.1f, TopP = 0.8f, MaxOutputTokens = 20 };

                    var response = await _client.GetResponseAsync("Inscription for order 311", options);

                    Assert.Equal("Happy 40th, Maura!", response.Text);
                }
            }
            """);

        yield return Silent("FakeClientInOtherFile_ThroughClassFixtureProperty_IsSilent", "Spokes.Workshop.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Spokes.Workshop.Tests.Fakes;

            public sealed class ReplayWorkshopChatClient : IChatClient
            {
                private readonly string _reply;

                public ReplayWorkshopChatClient(string reply) => _reply = reply;

                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, _reply)));

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System;
            using Microsoft.Extensions.AI;
            using Spokes.Workshop.Tests.Fakes;

            namespace Spokes.Workshop.Tests;

            public sealed class WorkshopChatFixture : IDisposable
            {
                public WorkshopChatFixture()
                {
                    Client = new ReplayWorkshopChatClient("Replace the rear derailleur hanger; 25 minutes.");
                }

                public IChatClient Client { get; }

                public void Dispose() => Client.Dispose();
            }
            """,
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Spokes.Workshop.Tests;

            public class RepairEstimateTests : IClassFixture<WorkshopChatFixture>
            {
                private readonly WorkshopChatFixture _fixture;

                public RepairEstimateTests(WorkshopChatFixture fixture) => _fixture = fixture;

                [Fact]
                public async Task Estimate_IsTheModelsSentence()
                {
                    var response = await _fixture.Client.GetResponseAsync("Bent hanger on a 2019 gravel bike. Estimate?", new ChatOptions { Temperature = 0.7f });

                    Assert.Equal("Replace the rear derailleur hanger; 25 minutes.", response.Text);
                }
            }
            """);

        yield return Silent("FakeClientInOtherFile_ThroughChatClientBuilderWithFunctions_IsSilent", "Gallery.AudioGuide.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Linq;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Gallery.AudioGuide.Tests.Fakes;

            /// <summary>Answers every request with the last user message, prefixed, so tests can see what reached the model.</summary>
            public sealed class EchoExhibitChatClient : IChatClient
            {
                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, "[echo] " + messages.Last(m => m.Role == ChatRole.User).Text)));

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System.Threading.Tasks;
            using Gallery.AudioGuide.Tests.Fakes;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Gallery.AudioGuide.Tests;

            public class ExhibitDescriptionTests
            {
                [Fact]
                public async Task Description_PassesThroughTheFunctionInvokingPipeline()
                {
                    IChatClient client = new ChatClientBuilder(new EchoExhibitChatClient())
                        .UseFunctionInvocation()
                        .Build();
                    var options = new ChatOptions
                    {
                        Temperature = 1.25f,
                        TopP = 0.5f,
                        Tools = [AIFunctionFactory.Create((string room) => $"Room {room} is open", "room_status")],
                    };

                    var response = await client.GetResponseAsync("Describe the whale skeleton in Room 3.", options);

                    Assert.Equal("[echo] Describe the whale skeleton in Room 3.", response.Text);
                }
            }
            """);

        yield return Silent("FakeClientInOtherFile_ThroughCreateClientHelperOfABaseClass_IsSilent", "PawsClinic.Triage.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace PawsClinic.Triage.Tests.Fakes;

            public sealed class CannedTriageChatClient : IChatClient
            {
                private readonly Queue<string> _replies;

                public CannedTriageChatClient(IEnumerable<string> replies) => _replies = new Queue<string>(replies);

                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, _replies.Dequeue())) { ModelId = options?.ModelId });

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using Microsoft.Extensions.AI;
            using PawsClinic.Triage.Tests.Fakes;

            namespace PawsClinic.Triage.Tests;

            public abstract class TriageTestBase
            {
                protected static IChatClient CreateClient(params string[] replies) =>
                    new ChatClientBuilder(new CannedTriageChatClient(replies))
                        .ConfigureOptions(options => options.ModelId ??= "triage-test")
                        .Build();
            }
            """,
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace PawsClinic.Triage.Tests;

            public class TriageAdviceTests : TriageTestBase
            {
                [Fact]
                public async Task OvernightVomiting_IsUrgent()
                {
                    var client = CreateClient("URGENT");
                    var options = new ChatOptions { Temperature = 0.8f, ResponseFormat = ChatResponseFormat.Text };

                    var response = await client.GetResponseAsync("Dog, 4 years, vomiting since last night. How soon should it be seen?", options);

                    Assert.Equal("URGENT", response.Text);
                    Assert.Equal("triage-test", response.ModelId);
                }
            }
            """);

        yield return Silent("FakeStreamingClientInOtherFile_AccumulatedTextComparedExactly_IsSilent", "Municipal.Pool.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Runtime.CompilerServices;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Municipal.Pool.Tests.Fakes;

            public sealed class LaneBotStreamingClient(params string[] chunks) : IChatClient
            {
                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, string.Concat(chunks))));

                public async IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, [EnumeratorCancellation] CancellationToken cancellationToken = default)
                {
                    foreach (var chunk in chunks)
                    {
                        await Task.Yield();
                        yield return new ChatResponseUpdate(ChatRole.Assistant, chunk);
                    }
                }

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System.Text;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Municipal.Pool.Tests.Fakes;
            using Xunit;

            namespace Municipal.Pool.Tests;

            public class LaneBotStreamingTests
            {
                [Fact]
                public async Task StreamedUpdates_AreConcatenated()
                {
                    using IChatClient client = new LaneBotStreamingClient("Lane 1 ", "is ", "reserved ", "for ", "aqua-fit.");
                    var text = new StringBuilder();

                    await foreach (var update in client.GetStreamingResponseAsync("Which lane is reserved at 10:00?", new ChatOptions { Temperature = 1.3f, TopP = 0.85f }))
                    {
                        text.Append(update.Text);
                    }

                    Assert.Equal("Lane 1 is reserved for aqua-fit.", text.ToString());
                }
            }
            """);

        yield return Silent("DecoratorOfTheProjectWrappingAFake_IsSilent", "Spokes.Workshop.Tests",
            """
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Spokes.Workshop.Ai;

            /// <summary>Fills in the workshop's defaults where the caller left a setting unset.</summary>
            public sealed class WorkshopDefaultsChatClient : DelegatingChatClient
            {
                public WorkshopDefaultsChatClient(IChatClient inner)
                    : base(inner)
                {
                }

                public override Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
                {
                    options = options?.Clone() ?? new ChatOptions();
                    options.ModelId ??= "gpt-4o-mini";
                    options.MaxOutputTokens ??= 300;
                    return base.GetResponseAsync(messages, options, cancellationToken);
                }
            }
            """,
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Spokes.Workshop.Tests.Fakes;

            public sealed class CapturingChatClient : IChatClient
            {
                public ChatOptions? LastOptions { get; private set; }

                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
                {
                    LastOptions = options;
                    return Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, "captured")));
                }

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Spokes.Workshop.Ai;
            using Spokes.Workshop.Tests.Fakes;
            using Xunit;

            namespace Spokes.Workshop.Tests;

            public class WorkshopDefaultsChatClientTests
            {
                [Fact]
                public async Task CallerSettings_AreKept_AndDefaultsFilledIn()
                {
                    var inner = new CapturingChatClient();
                    var client = new WorkshopDefaultsChatClient(inner);

                    await client.GetResponseAsync("Quote for truing a rear wheel.", new ChatOptions { Temperature = 1.7f, TopP = 0.2f });

                    Assert.Equal(1.7f, inner.LastOptions!.Temperature);
                    Assert.Equal(0.2f, inner.LastOptions.TopP);
                    Assert.Equal("gpt-4o-mini", inner.LastOptions.ModelId);
                    Assert.Equal(300, inner.LastOptions.MaxOutputTokens);
                }
            }
            """);

        yield return Silent("ConfigureOptionsMiddleware_CallerOptionsWin_FakeRecorder_IsSilent", "Choir.Rota.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Choir.Rota.Tests.Fakes;

            public sealed class OptionsRecordingChatClient : IChatClient
            {
                public List<ChatOptions?> Received { get; } = new();

                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default)
                {
                    Received.Add(options?.Clone());
                    return Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, "The altos.")));
                }

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System.Threading.Tasks;
            using Choir.Rota.Tests.Fakes;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Choir.Rota.Tests;

            public class RotaClientPipelineTests
            {
                [Fact]
                public async Task CallerOptions_BeatTheMiddlewareDefaults()
                {
                    var recorder = new OptionsRecordingChatClient();
                    IChatClient client = new ChatClientBuilder(recorder)
                        .ConfigureOptions(o => o.Temperature ??= 0.2f)
                        .Build();

                    await client.GetResponseAsync("Who sings the descant on Sunday?", new ChatOptions { Temperature = 1.6f });
                    var second = await client.GetResponseAsync("Who sings the descant on Sunday?");

                    Assert.Equal(1.6f, recorder.Received[0]!.Temperature);
                    Assert.Equal(0.2f, recorder.Received[1]!.Temperature);
                    Assert.Equal("The altos.", second.Text);
                }
            }
            """);

        yield return Silent("SemanticKernel_AsChatCompletionService_OverFakeInOtherFile_IsSilent", "LendingDesk.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace LendingDesk.Tests.Doubles;

            public sealed class ShelfmarkChatClient(string answer) : IChatClient
            {
                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, answer)));

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System.Threading.Tasks;
            using LendingDesk.Tests.Doubles;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace LendingDesk.Tests;

            public class CatalogueSearchServiceTests
            {
                [Fact]
                public async Task Search_AnswerComesBackThroughTheAdapter()
                {
                    IChatCompletionService service = new ShelfmarkChatClient("Shelfmark 641.5 ROD, second floor.").AsChatCompletionService();
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 1.9, MaxTokens = 40 };

                    var reply = await service.GetChatMessageContentAsync("Where is 'Roast Chicken and Other Stories'?", settings);

                    Assert.Equal("Shelfmark 641.5 ROD, second floor.", reply.Content);
                }
            }
            """);

        yield return Silent("FakeClientInOtherFile_ProtectedPropertyOfABaseTestClass_IsSilent", "LendingDesk.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace LendingDesk.Tests.Doubles;

            public sealed class FakeDeskChatClient(string answer) : IChatClient
            {
                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, answer)));

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using LendingDesk.Tests.Doubles;
            using Microsoft.Extensions.AI;

            namespace LendingDesk.Tests;

            public abstract class DeskAssistantTestBase
            {
                protected IChatClient Chat { get; } = new FakeDeskChatClient("Yes, the Eastgate branch has a hearing loop.");
            }
            """,
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace LendingDesk.Tests;

            public class AccessibilityAnswerTests : DeskAssistantTestBase
            {
                [Fact]
                public async Task HearingLoop_AnswerIsPassedOn()
                {
                    var response = await Chat.GetResponseAsync("Does the Eastgate branch have a hearing loop?", new ChatOptions { Temperature = 1.0f, TopK = 50 });

                    Assert.Equal("Yes, the Eastgate branch has a hearing loop.", response.Text);
                }
            }
            """);

        yield return Silent("MeaiStyle_TestChatClientWithCallbacks_ThroughAsBuilder_IsSilent", "Municipal.Pool.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Municipal.Pool.Tests.Fakes;

            public sealed class TestChatClient : IChatClient
            {
                public Func<IEnumerable<ChatMessage>, ChatOptions?, CancellationToken, Task<ChatResponse>>? GetResponseAsyncCallback { get; set; }

                public Func<IEnumerable<ChatMessage>, ChatOptions?, CancellationToken, IAsyncEnumerable<ChatResponseUpdate>>? GetStreamingResponseAsyncCallback { get; set; }

                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    GetResponseAsyncCallback!.Invoke(messages, options, cancellationToken);

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    GetStreamingResponseAsyncCallback!.Invoke(messages, options, cancellationToken);

                public object? GetService(Type serviceType, object? serviceKey = null) =>
                    serviceKey is null && serviceType.IsInstanceOfType(this) ? this : null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Municipal.Pool.Tests.Fakes;
            using Xunit;

            namespace Municipal.Pool.Tests;

            public class LaneBookingPipelineTests
            {
                [Fact]
                public async Task Options_ReachTheInnerClientUnchanged()
                {
                    ChatOptions expectedOptions = new() { Temperature = 1.75f, TopP = 0.25f, TopK = 3, Seed = 7 };
                    ChatResponse expectedResponse = new(new ChatMessage(ChatRole.Assistant, "Lane 3 booked for 07:00."));
                    using var innerClient = new TestChatClient
                    {
                        GetResponseAsyncCallback = (messages, options, cancellationToken) =>
                        {
                            Assert.Same(expectedOptions, options);
                            return Task.FromResult(expectedResponse);
                        },
                    };
                    using IChatClient client = innerClient.AsBuilder().UseFunctionInvocation().Build();

                    var response = await client.GetResponseAsync("Book lane 3 at 07:00.", expectedOptions);

                    Assert.Same(expectedResponse, response);
                    Assert.Equal("Lane 3 booked for 07:00.", response.Text);
                }
            }
            """);

        yield return Silent("SemanticKernel_FakeChatCompletionServiceClass_RegisteredInKernel_IsSilent", "Choir.Rota.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.ChatCompletion;

            namespace Choir.Rota.Tests.Fakes;

            public sealed class CannedChatCompletionService(string reply) : IChatCompletionService
            {
                public List<PromptExecutionSettings?> ReceivedSettings { get; } = new();

                public IReadOnlyDictionary<string, object?> Attributes { get; } = new Dictionary<string, object?>();

                public Task<IReadOnlyList<ChatMessageContent>> GetChatMessageContentsAsync(ChatHistory chatHistory, PromptExecutionSettings? executionSettings = null, Kernel? kernel = null, CancellationToken cancellationToken = default)
                {
                    ReceivedSettings.Add(executionSettings);
                    return Task.FromResult<IReadOnlyList<ChatMessageContent>>(new[] { new ChatMessageContent(AuthorRole.Assistant, reply) });
                }

                public IAsyncEnumerable<StreamingChatMessageContent> GetStreamingChatMessageContentsAsync(ChatHistory chatHistory, PromptExecutionSettings? executionSettings = null, Kernel? kernel = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();
            }
            """,
            """
            using System.Linq;
            using System.Threading.Tasks;
            using Choir.Rota.Tests.Fakes;
            using Microsoft.Extensions.DependencyInjection;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Choir.Rota.Tests;

            public class HymnNumberPromptTests
            {
                [Fact]
                public async Task Prompt_ReturnsTheCannedHymnNumber()
                {
                    var fake = new CannedChatCompletionService("Hymn 417");
                    var builder = Kernel.CreateBuilder();
                    builder.Services.AddSingleton<IChatCompletionService>(fake);
                    Kernel kernel = builder.Build();

                    var result = await kernel.InvokePromptAsync(
                        "Which hymn opens Sunday's service?",
                        new KernelArguments(new OpenAIPromptExecutionSettings { Temperature = 1.8, TopP = 0.2 }));

                    Assert.Equal("Hymn 417", result.ToString());
                    Assert.Equal(1.8, ((OpenAIPromptExecutionSettings)fake.ReceivedSettings.Single()!).Temperature);
                }
            }
            """);
    }

    // ==== silent: real SDK clients built over canned HTTP handlers and pipeline transports of the test project ========

    private const string ChatCompletionJsonTemplate =
        "{\\\"id\\\":\\\"chatcmpl-1\\\",\\\"object\\\":\\\"chat.completion\\\",\\\"created\\\":1730000000,\\\"model\\\":\\\"gpt-4o-mini\\\",\\\"choices\\\":[{\\\"index\\\":0,\\\"message\\\":{\\\"role\\\":\\\"assistant\\\",\\\"content\\\":\\\"TEXT\\\"},\\\"finish_reason\\\":\\\"stop\\\"}],\\\"usage\\\":{\\\"prompt_tokens\\\":31,\\\"completion_tokens\\\":17,\\\"total_tokens\\\":48}}";

    /// <summary>A C# string literal (quotes included) holding an OpenAI chat completion whose message is <paramref name="text"/>.</summary>
    private static string CompletionLiteral(string text) => "\"" + ChatCompletionJsonTemplate.Replace("TEXT", text) + "\"";

    private static IEnumerable<PrecisionCase> CannedTransports()
    {
        yield return Silent("OpenAIChatClient_OverCannedHttpHandlerInOtherFile_IsSilent", "Harbour.Tests",
            """
            using System.Collections.Generic;
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Harbour.Booking.Tests.Http;

            public sealed class CannedHandler : HttpMessageHandler
            {
                private readonly string _json;

                public CannedHandler(string json) => _json = json;

                public List<string> RequestBodies { get; } = new();

                protected override async Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    if (request.Content is not null)
                    {
                        RequestBodies.Add(await request.Content.ReadAsStringAsync(cancellationToken));
                    }

                    return new HttpResponseMessage(HttpStatusCode.OK)
                    {
                        Content = new StringContent(_json, Encoding.UTF8, "application/json"),
                    };
                }
            }
            """,
            """
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Collections.Generic;
            using System.Net.Http;
            using System.Threading.Tasks;
            using Harbour.Booking.Tests.Http;
            using OpenAI;
            using OpenAI.Chat;
            using Xunit;

            namespace Harbour.Booking.Tests;

            public class BookingConfirmationTests
            {
                private const string CompletionJson = COMPLETION;

                [Fact]
                public async Task Confirmation_IsReadFromTheCompletion()
                {
                    var client = new ChatClient("gpt-4o-mini", new ApiKeyCredential("k"), new OpenAIClientOptions { Transport = new HttpClientPipelineTransport(new HttpClient(new CannedHandler(CompletionJson))) });
                    var options = new ChatCompletionOptions { Temperature = 1.2f, MaxOutputTokenCount = 60 };

                    ChatCompletion completion = await client.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Confirm booking HB-2207.") }, options);

                    Assert.Equal("Booking HB-2207 confirmed: 2 adults, 1 car, 09:40 to Skerry.", completion.Content[0].Text);
                }
            }
            """.Replace("COMPLETION", CompletionLiteral("Booking HB-2207 confirmed: 2 adults, 1 car, 09:40 to Skerry.")));

        yield return Silent("OpenAIChatClient_OverRecordingPipelineTransportInOtherFile_IsSilent", "GardenCentre.Catalogue.Tests",
            """
            using System.ClientModel.Primitives;
            using System.Collections.Generic;
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace GardenCentre.Catalogue.Tests.Transport;

            /// <summary>Keeps every request body and answers with one recorded completion.</summary>
            public sealed class RecordingTransport : HttpClientPipelineTransport
            {
                public RecordingTransport(string responseJson)
                    : base(new HttpClient(new JsonReplyHandler(responseJson)))
                {
                }

                public List<string> SentBodies { get; } = new();

                protected override void OnSendingRequest(PipelineMessage message, HttpRequestMessage httpRequest)
                {
                    if (httpRequest.Content is not null)
                    {
                        SentBodies.Add(httpRequest.Content.ReadAsStringAsync().GetAwaiter().GetResult());
                    }

                    base.OnSendingRequest(message, httpRequest);
                }

                private sealed class JsonReplyHandler(string json) : HttpMessageHandler
                {
                    protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken) =>
                        Task.FromResult(new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(json, Encoding.UTF8, "application/json") });
                }
            }
            """,
            """
            using System.ClientModel;
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using GardenCentre.Catalogue.Tests.Transport;
            using OpenAI;
            using OpenAI.Chat;
            using Xunit;

            namespace GardenCentre.Catalogue.Tests;

            public class SeedlingDescriptionRequestTests
            {
                private const string ReplyJson = COMPLETION;

                [Fact]
                public async Task Request_CarriesTheSamplingSettingsOnTheWire()
                {
                    var transport = new RecordingTransport(ReplyJson);
                    var chat = new ChatClient("gpt-4o-mini", new ApiKeyCredential("test"), new OpenAIClientOptions { Transport = transport });
                    var options = new ChatCompletionOptions { Temperature = 0.6f, TopP = 0.7f, PresencePenalty = 2.4f };

                    ChatCompletion completion = await chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Describe our tomato 'Gardener's Delight' seedlings.") }, options);

                    var body = Assert.Single(transport.SentBodies);
                    Assert.Contains("\"temperature\":0.6", body);
                    Assert.Contains("\"presence_penalty\":2.4", body);
                    Assert.Equal("Sturdy 9cm seedlings, ready to plant out after the last frost.", completion.Content[0].Text);
                }
            }
            """.Replace("COMPLETION", CompletionLiteral("Sturdy 9cm seedlings, ready to plant out after the last frost.")));

        yield return Silent("OllamaApiClient_OverStubHandler_FieldsSetInTestConstructor_IsSilent", "Allotments.Planner.Tests",
            """
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Allotments.Planner.Tests.Stubs;

            /// <summary>Streams the given chunks as Ollama's newline-delimited chat responses.</summary>
            public sealed class OllamaStubHandler : HttpMessageHandler
            {
                private readonly string[] _chunks;

                public OllamaStubHandler(params string[] chunks) => _chunks = chunks;

                protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    var lines = new StringBuilder();
                    for (var i = 0; i < _chunks.Length; i++)
                    {
                        var done = i == _chunks.Length - 1 ? "true" : "false";
                        lines.Append("{\"model\":\"llama3.2\",\"created_at\":\"2025-03-01T08:00:00Z\",\"message\":{\"role\":\"assistant\",\"content\":\"")
                            .Append(_chunks[i])
                            .Append("\"},\"done\":")
                            .Append(done)
                            .Append("}\n");
                    }

                    return Task.FromResult(new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(lines.ToString(), Encoding.UTF8, "application/x-ndjson") });
                }
            }
            """,
            """
            using System;
            using System.Net.Http;
            using System.Threading.Tasks;
            using Allotments.Planner.Tests.Stubs;
            using OllamaSharp;
            using OllamaSharp.Models;
            using OllamaSharp.Models.Chat;
            using Xunit;

            namespace Allotments.Planner.Tests;

            public class SowingCalendarTests
            {
                private readonly OllamaStubHandler _handler;
                private readonly OllamaApiClient _ollama;

                public SowingCalendarTests()
                {
                    _handler = new OllamaStubHandler("Sow broad beans ", "in late February.");
                    _ollama = new OllamaApiClient(new HttpClient(_handler) { BaseAddress = new Uri("http://localhost:11434") }, "llama3.2");
                }

                [Fact]
                public async Task Advice_IsTheStreamedTextJoined()
                {
                    var request = new ChatRequest
                    {
                        Model = "llama3.2",
                        Messages = [new Message(ChatRole.User, "When do I sow broad beans on plot 17?")],
                        Options = new RequestOptions { Temperature = 0f, TopK = 20, TopP = 0.5f },
                    };

                    var text = "";
                    await foreach (var chunk in _ollama.ChatAsync(request))
                    {
                        text += chunk?.Message.Content;
                    }

                    Assert.Equal("Sow broad beans in late February.", text);
                }
            }
            """);

        yield return Silent("SemanticKernel_KernelOverReplayHandlerInOtherFile_IsSilent", "Choir.Rota.Tests",
            """
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Choir.Rota.Tests.Http;

            public sealed class ReplayHandler(string json) : HttpMessageHandler
            {
                public int Requests { get; private set; }

                protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    Requests++;
                    return Task.FromResult(new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(json, Encoding.UTF8, "application/json") });
                }
            }
            """,
            """
            using System.Net.Http;
            using System.Threading.Tasks;
            using Choir.Rota.Tests.Http;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Choir.Rota.Tests;

            public class RotaSummaryTests
            {
                private const string ReplyJson = COMPLETION;

                [Fact]
                public async Task Summary_IsTheFunctionResult()
                {
                    var kernel = Kernel.CreateBuilder()
                        .AddOpenAIChatCompletion("gpt-4o-mini", "test-key", httpClient: new HttpClient(new ReplayHandler(ReplyJson)))
                        .Build();
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 1.4, TopP = 0.6, MaxTokens = 120 };

                    var result = await kernel.InvokePromptAsync(
                        "Summarise next month's choir rota: {{$rota}}",
                        new KernelArguments(settings) { ["rota"] = "Sopranos lead on 4 and 18 May; altos on 11 May." });

                    Assert.Equal("Sopranos lead on 4 and 18 May; altos on 11 May.", result.ToString());
                }
            }
            """.Replace("COMPLETION", CompletionLiteral("Sopranos lead on 4 and 18 May; altos on 11 May.")));

        yield return Silent("SemanticKernel_OpenAIChatCompletionService_FromHelperOverHandler_IsSilent", "Municipal.Pool.Tests",
            """
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Municipal.Pool.Tests.Http;

            public sealed class FixedReplyHandler : HttpMessageHandler
            {
                private readonly string _json;

                public FixedReplyHandler(string json) => _json = json;

                protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken) =>
                    Task.FromResult(new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(_json, Encoding.UTF8, "application/json") });
            }
            """,
            """
            using System.Net.Http;
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Municipal.Pool.Tests.Http;
            using Xunit;

            namespace Municipal.Pool.Tests;

            public class LaneTimetableServiceTests
            {
                private const string ReplyJson = COMPLETION;

                private static OpenAIChatCompletionService CreateService(string replyJson) =>
                    new("gpt-4o-mini", "test-key", httpClient: new HttpClient(new FixedReplyHandler(replyJson)));

                [Fact]
                public async Task LaneAnswer_IsTheAssistantContent()
                {
                    var service = CreateService(ReplyJson);
                    var history = new ChatHistory("You answer questions about the municipal pool's lane timetable.");
                    history.AddUserMessage("When is the fast lane open on Tuesday?");
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 0, TopP = 0.2 };

                    var reply = await service.GetChatMessageContentAsync(history, settings);

                    Assert.Equal("Fast lane: Tuesday 06:30-09:00 and 19:00-21:00.", reply.Content);
                }
            }
            """.Replace("COMPLETION", CompletionLiteral("Fast lane: Tuesday 06:30-09:00 and 19:00-21:00.")));

        yield return Silent("AzureOpenAIClient_OverRecordedHandlerInOtherFile_IsSilent", "PawsClinic.Triage.Tests",
            """
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace PawsClinic.Triage.Tests.Http;

            public sealed class RecordedAzureHandler : HttpMessageHandler
            {
                private const string Body = COMPLETION;

                protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken) =>
                    Task.FromResult(new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(Body, Encoding.UTF8, "application/json") });
            }
            """.Replace("COMPLETION", CompletionLiteral("Reminder: give Biscuit 5 ml of Metacam with food at 8am.")),
            """
            using System;
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Collections.Generic;
            using System.Net.Http;
            using System.Threading.Tasks;
            using Azure.AI.OpenAI;
            using OpenAI.Chat;
            using PawsClinic.Triage.Tests.Http;
            using Xunit;

            namespace PawsClinic.Triage.Tests;

            public class DosageReminderTests
            {
                [Fact]
                public async Task Reminder_IsTheCompletionText()
                {
                    var azure = new AzureOpenAIClient(
                        new Uri("https://paws-clinic.openai.azure.com/"),
                        new ApiKeyCredential("test-key"),
                        new AzureOpenAIClientOptions { Transport = new HttpClientPipelineTransport(new HttpClient(new RecordedAzureHandler())) });
                    ChatClient chat = azure.GetChatClient("gpt-4o-deployment");
                    var options = new ChatCompletionOptions { Temperature = 2.2f };

                    ChatCompletion completion = await chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Remind Biscuit's owner about the 5 ml dose.") }, options);

                    Assert.Equal("Reminder: give Biscuit 5 ml of Metacam with food at 8am.", completion.Content[0].Text);
                }
            }
            """);

        yield return Silent("AsIChatClient_OverStubHandler_FromHelper_TopKWouldBeDropped_IsSilent", "Harbour.Tests",
            """
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Harbour.Crossings.Tests.Http;

            public sealed class StubCompletionsHandler(string json) : HttpMessageHandler
            {
                protected override Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken) =>
                    Task.FromResult(new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(json, Encoding.UTF8, "application/json") });
            }
            """,
            """
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Net.Http;
            using System.Threading.Tasks;
            using Harbour.Crossings.Tests.Http;
            using Microsoft.Extensions.AI;
            using OpenAI;
            using Xunit;

            namespace Harbour.Crossings.Tests;

            public class CrossingTimeTests
            {
                private const string ReplyJson = COMPLETION;

                private static IChatClient CreateClient(string replyJson) =>
                    new OpenAI.Chat.ChatClient("gpt-4o-mini", new ApiKeyCredential("k"), new OpenAIClientOptions { Transport = new HttpClientPipelineTransport(new HttpClient(new StubCompletionsHandler(replyJson))) })
                        .AsIChatClient();

                [Fact]
                public async Task CrossingTime_IsTheAdaptersText()
                {
                    using var client = CreateClient(ReplyJson);

                    var response = await client.GetResponseAsync("How long is the crossing to Skerry?", new ChatOptions { TopK = 20, Temperature = 0.4f });

                    Assert.Equal("About 35 minutes in calm weather.", response.Text);
                    Assert.Equal(ChatRole.Assistant, response.Messages[0].Role);
                }
            }
            """.Replace("COMPLETION", CompletionLiteral("About 35 minutes in calm weather.")));

        yield return Silent("MeaiStyle_VerbatimHttpHandler_ThroughCreateChatClientHelper_IsSilent", "Harbour.Tests",
            """
            using System;
            using System.Net;
            using System.Net.Http;
            using System.Text;
            using System.Text.Json.Nodes;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Harbour.Fares.Tests.Http;

            /// <summary>Checks the request body against the expected JSON and answers with a fixed body.</summary>
            public sealed class VerbatimHttpHandler(string expectedInput, string output) : HttpMessageHandler
            {
                protected override async Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    var actual = await request.Content!.ReadAsStringAsync(cancellationToken);
                    if (!JsonNode.DeepEquals(JsonNode.Parse(expectedInput), JsonNode.Parse(actual)))
                    {
                        throw new InvalidOperationException($"Unexpected request body: {actual}");
                    }

                    return new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(output, Encoding.UTF8, "application/json") };
                }
            }
            """,
            """
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Net.Http;
            using System.Threading.Tasks;
            using Harbour.Fares.Tests.Http;
            using Microsoft.Extensions.AI;
            using OpenAI;
            using Xunit;

            namespace Harbour.Fares.Tests;

            public class FareQuoteChatClientTests
            {
                private const string ExpectedRequest = "{\"messages\":[{\"role\":\"user\",\"content\":\"Fare for a car and two adults to Skerry?\"}],\"model\":\"gpt-4o-mini\",\"temperature\":0.25,\"top_p\":0.5,\"seed\":42}";
                private const string Reply = COMPLETION;

                [Fact]
                public async Task Options_AreSentAsOpenAIParameters()
                {
                    using VerbatimHttpHandler handler = new(ExpectedRequest, Reply);
                    using HttpClient httpClient = new(handler);
                    using IChatClient client = CreateChatClient(httpClient, "gpt-4o-mini");

                    var response = await client.GetResponseAsync("Fare for a car and two adults to Skerry?", new ChatOptions { Temperature = 0.25f, TopP = 0.5f, Seed = 42 });

                    Assert.Equal("48 pounds return.", response.Text);
                }

                private static IChatClient CreateChatClient(HttpClient httpClient, string modelId) =>
                    new OpenAIClient(new ApiKeyCredential("apikey"), new OpenAIClientOptions { Transport = new HttpClientPipelineTransport(httpClient) })
                        .GetChatClient(modelId)
                        .AsIChatClient();
            }
            """.Replace("COMPLETION", CompletionLiteral("48 pounds return.")));

        yield return Silent("SkStyle_DelegatingHandlerStubInFieldsSetWithThis_IsSilent", "Crumb.Orders.Tests",
            """
            using System.Net;
            using System.Net.Http;
            using System.Threading;
            using System.Threading.Tasks;

            namespace Crumb.Orders.Tests.Http;

            /// <summary>Returns whatever response the test put in; never calls an inner handler.</summary>
            public sealed class HttpMessageHandlerStub : DelegatingHandler
            {
                public HttpResponseMessage ResponseToReturn { get; set; } = new(HttpStatusCode.OK);

                public string? RequestContent { get; private set; }

                protected override async Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
                {
                    RequestContent = request.Content is null ? null : await request.Content.ReadAsStringAsync(cancellationToken);
                    return ResponseToReturn;
                }
            }
            """,
            """
            using System;
            using System.Net;
            using System.Net.Http;
            using System.Threading.Tasks;
            using Crumb.Orders.Tests.Http;
            using Microsoft.SemanticKernel.ChatCompletion;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Crumb.Orders.Tests;

            public sealed class CelebrationCakeServiceTests : IDisposable
            {
                private const string ReplyJson = COMPLETION;
                private readonly HttpMessageHandlerStub _messageHandlerStub;
                private readonly HttpClient _httpClient;

                public CelebrationCakeServiceTests()
                {
                    this._messageHandlerStub = new HttpMessageHandlerStub();
                    this._httpClient = new HttpClient(this._messageHandlerStub, false);
                }

                [Fact]
                public async Task Settings_AreSerialisedIntoTheRequest()
                {
                    var service = new OpenAIChatCompletionService("gpt-4o-mini", "NOKEY", httpClient: this._httpClient);
                    this._messageHandlerStub.ResponseToReturn = new HttpResponseMessage(HttpStatusCode.OK) { Content = new StringContent(ReplyJson) };
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 0.5, TopP = 0.3, FrequencyPenalty = 1.6, PresencePenalty = -1.4, MaxTokens = 90 };

                    var reply = await service.GetChatMessageContentsAsync(new ChatHistory("Describe the three-tier lemon cake."), settings);

                    Assert.Equal("Three tiers of lemon sponge with elderflower buttercream.", reply[0].Content);
                    Assert.Contains("\"temperature\":0.5", this._messageHandlerStub.RequestContent);
                }

                public void Dispose()
                {
                    this._httpClient.Dispose();
                    this._messageHandlerStub.Dispose();
                }
            }
            """.Replace("COMPLETION", CompletionLiteral("Three tiers of lemon sponge with elderflower buttercream.")));

        yield return Silent("OpenAIClient_OverCustomPipelineTransportSubclassInOtherFile_IsSilent", "LendingDesk.Tests",
            """
            using System;
            using System.ClientModel;
            using System.ClientModel.Primitives;
            using System.Collections.Generic;
            using System.IO;
            using System.Text;
            using System.Threading;
            using System.Threading.Tasks;

            namespace LendingDesk.Tests.Transport;

            /// <summary>Answers every request with one recorded JSON body, without any network.</summary>
            public sealed class RecordedResponseTransport : PipelineTransport
            {
                private readonly string _json;

                public RecordedResponseTransport(string json) => _json = json;

                public List<string> RequestBodies { get; } = new();

                protected override PipelineMessage CreateMessageCore() => new RecordedMessage(new RecordedRequest());

                protected override void ProcessCore(PipelineMessage message)
                {
                    if (message.Request.Content is { } content)
                    {
                        using var buffer = new MemoryStream();
                        content.WriteTo(buffer);
                        RequestBodies.Add(Encoding.UTF8.GetString(buffer.ToArray()));
                    }

                    ((RecordedMessage)message).Answer(new RecordedResponse(_json));
                }

                protected override ValueTask ProcessCoreAsync(PipelineMessage message)
                {
                    ProcessCore(message);
                    return ValueTask.CompletedTask;
                }

                private sealed class RecordedMessage(PipelineRequest request) : PipelineMessage(request)
                {
                    public void Answer(PipelineResponse response) => Response = response;
                }

                private sealed class RecordedRequest : PipelineRequest
                {
                    private readonly RecordedHeaders _headers = new();

                    protected override string MethodCore { get; set; } = "POST";

                    protected override Uri? UriCore { get; set; }

                    protected override PipelineRequestHeaders HeadersCore => _headers;

                    protected override BinaryContent? ContentCore { get; set; }

                    public override void Dispose()
                    {
                    }
                }

                private sealed class RecordedHeaders : PipelineRequestHeaders
                {
                    private readonly Dictionary<string, string> _values = new(StringComparer.OrdinalIgnoreCase);

                    public override void Add(string name, string value) => _values[name] = value;

                    public override void Set(string name, string value) => _values[name] = value;

                    public override bool Remove(string name) => _values.Remove(name);

                    public override bool TryGetValue(string name, out string? value) => _values.TryGetValue(name, out value);

                    public override bool TryGetValues(string name, out IEnumerable<string>? values)
                    {
                        values = _values.TryGetValue(name, out var value) ? new[] { value } : null;
                        return values != null;
                    }

                    public override IEnumerator<KeyValuePair<string, string>> GetEnumerator() => _values.GetEnumerator();
                }

                private sealed class RecordedResponse(string json) : PipelineResponse
                {
                    private readonly BinaryData _content = BinaryData.FromString(json);

                    public override int Status => 200;

                    public override string ReasonPhrase => "OK";

                    protected override PipelineResponseHeaders HeadersCore => new NoResponseHeaders();

                    public override Stream? ContentStream
                    {
                        get => _content.ToStream();
                        set { }
                    }

                    public override BinaryData Content => _content;

                    public override BinaryData BufferContent(CancellationToken cancellationToken = default) => _content;

                    public override ValueTask<BinaryData> BufferContentAsync(CancellationToken cancellationToken = default) => new(_content);

                    public override void Dispose()
                    {
                    }
                }

                private sealed class NoResponseHeaders : PipelineResponseHeaders
                {
                    public override bool TryGetValue(string name, out string? value)
                    {
                        value = null;
                        return false;
                    }

                    public override bool TryGetValues(string name, out IEnumerable<string>? values)
                    {
                        values = null;
                        return false;
                    }

                    public override IEnumerator<KeyValuePair<string, string>> GetEnumerator() => new List<KeyValuePair<string, string>>().GetEnumerator();
                }
            }
            """,
            """
            using System.ClientModel;
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using LendingDesk.Tests.Transport;
            using OpenAI;
            using OpenAI.Chat;
            using Xunit;

            namespace LendingDesk.Tests;

            public class InterLibraryLoanTests
            {
                private const string ReplyJson = COMPLETION;

                [Fact]
                public async Task LoanRequest_AnswerAndWireSettings()
                {
                    var transport = new RecordedResponseTransport(ReplyJson);
                    var client = new OpenAIClient(new ApiKeyCredential("test"), new OpenAIClientOptions { Transport = transport });
                    ChatClient chat = client.GetChatClient("gpt-4o-mini");
                    var options = new ChatCompletionOptions { Temperature = 0f, TopP = 0.4f, FrequencyPenalty = -3f };

                    ChatCompletion completion = await chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Can Eastgate borrow 'Moorland Birds' from the county store?") }, options);

                    Assert.Equal("Yes: request ILL-3307 placed, about five working days.", completion.Content[0].Text);
                    Assert.Contains("\"frequency_penalty\":-3", Assert.Single(transport.RequestBodies));
                }
            }
            """.Replace("COMPLETION", CompletionLiteral("Yes: request ILL-3307 placed, about five working days.")));
    }

    // ==== silent: real clients whose tests assert on response metadata or tolerant checks only ========================

    private static IEnumerable<PrecisionCase> RealClientsWithoutExactOutput()
    {
        yield return Silent("RealOpenAIChatClient_AssertsFinishReasonRoleAndUsage_IsSilent", "GardenCentre.Catalogue.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            namespace GardenCentre.Catalogue.Tests.Live;

            public class CatalogueCompletionMetadataTests
            {
                private readonly ChatClient _chat = new("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing");

                [Fact]
                public async Task ShortLimit_StopsOnLengthAndReportsUsage()
                {
                    var options = new ChatCompletionOptions { MaxOutputTokenCount = 12 };

                    ChatCompletion completion = await _chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage("Tell me about every perennial in the spring catalogue, a paragraph each.") }, options);

                    Assert.Equal(ChatFinishReason.Length, completion.FinishReason);
                    Assert.Equal(ChatMessageRole.Assistant, completion.Role);
                    Assert.Equal(12, completion.Usage.OutputTokenCount);
                    Assert.StartsWith("gpt-4o-mini", completion.Model);
                }
            }
            """);

        yield return Silent("RealIChatClient_AssertsRoleUsageAndFinishReason_IsSilent", "LendingDesk.Tests",
            """
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace LendingDesk.Tests.Live;

            public class LiveChatMetadataTests
            {
                [Fact]
                public async Task Response_HasAssistantRole_AndRespectsTheTokenLimit()
                {
                    IChatClient client = new OpenAI.Chat.ChatClient("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing").AsIChatClient();

                    var response = await client.GetResponseAsync("Tell me the full history of the county library service.", new ChatOptions { MaxOutputTokens = 12 });

                    Assert.Equal(ChatRole.Assistant, response.Messages[0].Role);
                    Assert.Equal(12L, response.Usage?.OutputTokenCount);
                    Assert.Equal(ChatFinishReason.Length, response.FinishReason);
                }
            }
            """);

        yield return Silent("RealClientInTestClass_PresetsOnlyCompared_AndLiveCallTolerant_IsSilent", "Municipal.Pool.Tests",
            """
            using System;
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            namespace Municipal.Pool.Tests.Live;

            public class PoolAssistantIntegrationTests
            {
                private readonly ChatClient _chat = new("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing");

                [Fact]
                public void HolidayPreset_IsWarmerThanTheRegularOne()
                {
                    var holiday = new ChatCompletionOptions { Temperature = 1.6f, TopP = 0.9f };
                    var regular = new ChatCompletionOptions { Temperature = 0.3f };

                    Assert.True(holiday.Temperature > regular.Temperature);
                }

                [Fact]
                public async Task OpeningHours_MentionTheEarlySwim()
                {
                    var completion = await _chat.CompleteChatAsync(
                        new List<ChatMessage> { new UserChatMessage("When does the pool open on Saturday?") },
                        new ChatCompletionOptions { Temperature = 0.2f, MaxOutputTokenCount = 50 });

                    Assert.Contains("07:00", completion.Value.Content[0].Text);
                }
            }
            """);
    }

    // ==== silent: product code that builds options and only logs or serialises them ================================

    private static IEnumerable<PrecisionCase> ProductCodeThatNeverSends()
    {
        yield return Silent("ProductCode_RequestPreview_SerialisesOptionsOnly_IsSilent", "Harbour",
            """
            using System.ClientModel.Primitives;
            using Microsoft.Extensions.Logging;
            using OpenAI.Chat;

            namespace Harbour.Booking.Admin;

            /// <summary>The admin page's "what would we send" preview for the storm-warning preset.</summary>
            public sealed class StormPresetPreview
            {
                private readonly ILogger<StormPresetPreview> _logger;

                public StormPresetPreview(ILogger<StormPresetPreview> logger) => _logger = logger;

                public string Render()
                {
                    var options = new ChatCompletionOptions { Temperature = 2.5f, TopP = 1.3f, MaxOutputTokenCount = 200 };
                    string json = ModelReaderWriter.Write(options).ToString();
                    _logger.LogInformation("Storm preset preview: {Json}", json);
                    return json;
                }
            }
            """);

        yield return Silent("ProductCode_StartupLogsLegacyPreset_IsSilent", "GardenCentre.Catalogue",
            """
            using System.Text.Json;
            using Microsoft.Extensions.AI;
            using Microsoft.Extensions.Logging;

            namespace GardenCentre.Catalogue.Startup;

            public sealed class CatalogueAssistantStartup
            {
                private readonly ILogger _logger;

                public CatalogueAssistantStartup(ILogger<CatalogueAssistantStartup> logger) => _logger = logger;

                public void ExplainRetiredPreset()
                {
                    // Shows operators what the retired preset looked like, so old support tickets still make sense.
                    var retired = new ChatOptions { Temperature = 1.9f, TopP = 1.2f, TopK = -1 };
                    _logger.LogWarning("Retired preset {@Preset} is no longer used; see ADR-012.", retired);
                    _logger.LogInformation("Retired preset as JSON: {Json}", JsonSerializer.Serialize(retired, AIJsonUtilities.DefaultOptions));
                }
            }
            """);
    }

    // ==== true findings in product code =================================================================================

    private static IEnumerable<PrecisionCase> LiveTwinsInProductCode()
    {
        yield return Fires("Product_TaglinesAtTemperature2_5_RealChatClient_SAMP005", "Harbour",
            new[] { At("SAMP005", "Temperature = 2.5f") },
            """
            using System;
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Harbour.Marketing;

            public sealed class SeasonalTaglineWriter
            {
                private readonly ChatClient _chat = new("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? throw new InvalidOperationException("OPENAI_API_KEY is not set"));

                public async Task<string> WriteAsync(string season)
                {
                    var options = new ChatCompletionOptions
                    {
                        Temperature = 2.5f,
                        MaxOutputTokenCount = 40,
                    };
                    var messages = new List<ChatMessage>
                    {
                        new SystemChatMessage("You write short taglines for a harbour ferry company's posters."),
                        new UserChatMessage($"A tagline for the {season} timetable."),
                    };

                    ChatCompletion completion = await _chat.CompleteChatAsync(messages, options);
                    return completion.Content[0].Text;
                }
            }
            """);

        yield return Fires("Product_InvoiceExtractionAtTemperature1_2_SAMP001", "Spokes.Workshop",
            new[] { At("SAMP001", "Temperature = 1.2f") },
            """
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Spokes.Workshop.Purchasing;

            public sealed class SupplierInvoiceReader
            {
                private readonly ChatClient _chat;

                public SupplierInvoiceReader(string apiKey) => _chat = new ChatClient("gpt-4o-mini", apiKey);

                public async Task<string> ReadAsync(string invoiceText)
                {
                    var options = new ChatCompletionOptions { Temperature = 1.2f };
                    ChatCompletion completion = await _chat.CompleteChatAsync(
                        new List<ChatMessage>
                        {
                            new SystemChatMessage("Extract the invoice fields as JSON: supplier, invoice number, date, total."),
                            new UserChatMessage(invoiceText),
                        },
                        options);
                    return completion.Content[0].Text;
                }
            }
            """);

        yield return Fires("Product_ClassificationPromptWithoutTemperature_SAMP001", "Crumb.Orders",
            new[] { At("SAMP001", "_chat.CompleteChatAsync(") },
            """
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Crumb.Orders.Support;

            public sealed class ComplaintRouter
            {
                private readonly ChatClient _chat;

                public ComplaintRouter(ChatClient chat) => _chat = chat;

                public async Task<string> RouteAsync(string complaint)
                {
                    ChatCompletion completion = await _chat.CompleteChatAsync(
                        new SystemChatMessage("Classify the complaint as one of: late-delivery, wrong-item, quality, allergy."),
                        new UserChatMessage(complaint));
                    return completion.Content[0].Text.Trim();
                }
            }
            """);

        yield return Fires("Product_FactoryMethodReturnsTemperature1_8_SAMP009", "GardenCentre.Catalogue",
            new[] { At("SAMP009", "Temperature = 1.8f") },
            """
            using Microsoft.Extensions.AI;

            namespace GardenCentre.Catalogue.Marketing;

            public static class PosterCopyOptions
            {
                public static ChatOptions ForSpringSale() => new()
                {
                    ModelId = "gpt-4o",
                    Temperature = 1.8f,
                    MaxOutputTokens = 60,
                };
            }
            """);

        yield return Fires("Product_TemperatureAndTopPBothMoved_SAMP004", "Crumb.Orders",
            new[] { At("SAMP004", "TopP = 0.85f") },
            """
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace Crumb.Orders.Shop;

            public sealed class WindowCardService
            {
                private readonly ChatClient _chat;

                public WindowCardService(ChatClient chat) => _chat = chat;

                public async Task<string> CardTextAsync(string loaf)
                {
                    var options = new ChatCompletionOptions { Temperature = 0.6f, TopP = 0.85f, MaxOutputTokenCount = 80 };
                    var completion = await _chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage($"A two-line shop-window card for our {loaf}.") }, options);
                    return completion.Value.Content[0].Text;
                }
            }
            """);

        yield return Fires("Product_SemanticKernelSettingsThroughKernelArguments_SAMP005", "Choir.Rota",
            new[] { At("SAMP005", "Temperature = 2.2") },
            """
            using System.Threading.Tasks;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            namespace Choir.Rota.Newsletter;

            public sealed class RehearsalNoteWriter
            {
                private readonly Kernel _kernel;

                public RehearsalNoteWriter(string apiKey)
                {
                    _kernel = Kernel.CreateBuilder().AddOpenAIChatCompletion("gpt-4o-mini", apiKey).Build();
                }

                public async Task<string> WriteAsync(string piece)
                {
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 2.2, MaxTokens = 150 };
                    var result = await _kernel.InvokePromptAsync(
                        "Write a cheerful rehearsal note about {{$piece}} for the choir newsletter.",
                        new KernelArguments(settings) { ["piece"] = piece });
                    return result.ToString();
                }
            }
            """);

        yield return Fires("Product_OllamaGreedyWithTopK_SAMP006", "Allotments.Planner",
            new[] { At("SAMP006", "TopK = 20") },
            """
            using System;
            using System.Text;
            using System.Threading.Tasks;
            using OllamaSharp;
            using OllamaSharp.Models;
            using OllamaSharp.Models.Chat;

            namespace Allotments.Planner.Advice;

            public sealed class CompostAdvisor
            {
                private readonly IOllamaApiClient _ollama = new OllamaApiClient(new Uri("http://localhost:11434"), "llama3.2");

                public async Task<string> AdviseAsync(string question)
                {
                    var request = new ChatRequest
                    {
                        Model = "llama3.2",
                        Messages = [new Message(ChatRole.User, question)],
                        Options = new RequestOptions { Temperature = 0f, TopK = 20 },
                        Stream = false,
                    };

                    var answer = new StringBuilder();
                    await foreach (var chunk in _ollama.ChatAsync(request))
                    {
                        answer.Append(chunk?.Message.Content);
                    }

                    return answer.ToString();
                }
            }
            """);

        yield return Fires("Product_ReasoningModelGivenATemperature_SAMP007", "PawsClinic.Triage",
            new[] { At("SAMP007", "Temperature = 0.2f") },
            """
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI;
            using OpenAI.Chat;

            namespace PawsClinic.Triage.Discharge;

            public sealed class OwnerLetterWriter
            {
                private readonly OpenAIClient _openAI;

                public OwnerLetterWriter(OpenAIClient openAI) => _openAI = openAI;

                public async Task<string> WriteAsync(string notes)
                {
                    ChatClient chat = _openAI.GetChatClient("o3-mini");
                    var options = new ChatCompletionOptions { Temperature = 0.2f, MaxOutputTokenCount = 800 };
                    ChatCompletion completion = await chat.CompleteChatAsync(
                        new List<ChatMessage> { new UserChatMessage("Write an owner-facing letter from these vet notes: " + notes) },
                        options);
                    return completion.Content[0].Text;
                }
            }
            """);

        yield return Fires("Product_RawPayloadThreeCandidatesAtZero_SAMP008", "Municipal.Pool",
            new[] { At("SAMP008", "n = 3") },
            """
            using System.Net.Http;
            using System.Net.Http.Json;
            using System.Threading.Tasks;

            namespace Municipal.Pool.Lessons;

            public sealed class LessonNameSuggester
            {
                private readonly HttpClient _http;

                public LessonNameSuggester(HttpClient http) => _http = http;

                public async Task<string> SuggestAsync(string level)
                {
                    var payload = new
                    {
                        model = "gpt-4o-mini",
                        messages = new[] { new { role = "user", content = $"Suggest a fun name for a {level} swimming class." } },
                        temperature = 0,
                        n = 3,
                    };

                    using var response = await _http.PostAsJsonAsync("v1/chat/completions", payload);
                    response.EnsureSuccessStatusCode();
                    return await response.Content.ReadAsStringAsync();
                }
            }
            """);

        yield return Fires("Product_OptionsPassedToGatewayHelperInOtherFile_SAMP009", "LendingDesk",
            new[] { At("SAMP009", "Temperature = 1.9f") },
            """
            using System.Collections.Generic;
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace LendingDesk.Assistant;

            public sealed class ReadingListGateway
            {
                private readonly ChatClient _chat;

                public ReadingListGateway(ChatClient chat) => _chat = chat;

                public async Task<string> CompleteAsync(string prompt, ChatCompletionOptions options)
                {
                    ChatCompletion completion = await _chat.CompleteChatAsync(new List<ChatMessage> { new UserChatMessage(prompt) }, options);
                    return completion.Content[0].Text;
                }
            }
            """,
            """
            using System.Threading.Tasks;
            using OpenAI.Chat;

            namespace LendingDesk.Assistant;

            public sealed class ReadingListComposer
            {
                private readonly ReadingListGateway _gateway;

                public ReadingListComposer(ReadingListGateway gateway) => _gateway = gateway;

                public Task<string> ComposeAsync(string theme)
                {
                    var options = new ChatCompletionOptions { Temperature = 1.9f, MaxOutputTokenCount = 400 };
                    return _gateway.CompleteAsync($"Recommend eight novels for a reading group on the theme '{theme}'.", options);
                }
            }
            """);

        yield return Fires("Product_DefaultOptionsPropertyWithTopPAboveOne_SAMP005", "Spokes.Workshop",
            new[] { At("SAMP005", "TopP = 1.3f") },
            """
            using Microsoft.Extensions.AI;

            namespace Spokes.Workshop.Reminders;

            public sealed class ServiceReminderSettings
            {
                public ChatOptions DefaultOptions { get; } = new()
                {
                    ModelId = "gpt-4o-mini",
                    TopP = 1.3f,
                    MaxOutputTokens = 120,
                };
            }
            """);

        yield return Fires("Product_AsIChatClientDropsTopK_SAMP007", "Harbour",
            new[] { At("SAMP007", "TopK = 30") },
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI;

            namespace Harbour.Crossings;

            public sealed class CrossingConditionsService
            {
                private readonly OpenAIClient _openAI;

                public CrossingConditionsService(OpenAIClient openAI) => _openAI = openAI;

                public async Task<string> DescribeAsync(string forecast)
                {
                    IChatClient client = _openAI.GetChatClient("gpt-4o-mini").AsIChatClient();
                    var response = await client.GetResponseAsync($"Describe crossing conditions for passengers: {forecast}", new ChatOptions { Temperature = 0.5f, TopK = 30 });
                    return response.Text;
                }
            }
            """);

        yield return Fires("Product_ConfigureOptionsDefaultsInTheClientPipeline_SAMP005", "Choir.Rota",
            new[] { At("SAMP005", "options.TopP = 1.5f") },
            """
            using Microsoft.Extensions.AI;

            namespace Choir.Rota.Setup;

            public static class RotaChatClientFactory
            {
                public static IChatClient Create(IChatClient inner) =>
                    new ChatClientBuilder(inner)
                        .ConfigureOptions(options =>
                        {
                            options.ModelId ??= "gpt-4o-mini";
                            options.TopP = 1.5f;
                        })
                        .Build();
            }
            """);
    }

    // ==== true findings in test code: options sent to a real client ===================================================

    private static IEnumerable<PrecisionCase> LiveTwinsInTestCode()
    {
        yield return Fires("Test_RealChatClientFromApiKey_ExactTextNoTemperature_SAMP002", "LendingDesk.Tests",
            new[] { At("SAMP002", "Chat.CompleteChatAsync(") },
            """
            using System;
            using System.ClientModel;
            using System.Threading.Tasks;
            using OpenAI.Chat;
            using Xunit;

            namespace LendingDesk.Tests.Live;

            public class OpeningHoursLiveTests
            {
                private static readonly ChatClient Chat = new("gpt-4o-mini", new ApiKeyCredential(Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing"));

                [Fact]
                public async Task SundayHours_AreAnsweredExactly()
                {
                    ChatCompletion completion = await Chat.CompleteChatAsync(
                        new SystemChatMessage("You are the Eastgate branch library's help desk."),
                        new UserChatMessage("When is the branch open on Sunday?"));

                    Assert.Equal("10:00-16:00", completion.Content[0].Text);
                }
            }
            """);

        yield return Fires("Test_SameClassRealAndFakeClient_OnlyTheRealOneFires_SAMP002", "Harbour.Tests",
            new[] { At("SAMP002", "to Skerry leave from?") },
            """
            using System;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;

            namespace Harbour.Piers.Tests.Fakes;

            public sealed class DockedChatClient(string answer) : IChatClient
            {
                public Task<ChatResponse> GetResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    Task.FromResult(new ChatResponse(new ChatMessage(ChatRole.Assistant, answer)));

                public IAsyncEnumerable<ChatResponseUpdate> GetStreamingResponseAsync(IEnumerable<ChatMessage> messages, ChatOptions? options = null, CancellationToken cancellationToken = default) =>
                    throw new NotSupportedException();

                public object? GetService(Type serviceType, object? serviceKey = null) => null;

                public void Dispose()
                {
                }
            }
            """,
            """
            using System;
            using System.ClientModel;
            using System.Threading.Tasks;
            using Harbour.Piers.Tests.Fakes;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            namespace Harbour.Piers.Tests;

            public class PierAnswerTests
            {
                private static IChatClient LiveClient() =>
                    new ChatClient("gpt-4o-mini", new ApiKeyCredential(Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing")).AsIChatClient();

                [Fact]
                public async Task Live_PierForTheEarlyFerry()
                {
                    var client = LiveClient();
                    var response = await client.GetResponseAsync("Which pier does the 06:50 to Skerry leave from?", new ChatOptions { Temperature = 0.7f });
                    Assert.Equal("Pier 4", response.Text);
                }

                [Fact]
                public async Task Offline_PierForTheEarlyFerry()
                {
                    IChatClient client = new DockedChatClient("Pier 4");
                    var response = await client.GetResponseAsync("Which pier does the 06:50 leave from?", new ChatOptions { Temperature = 0.7f });
                    Assert.Equal("Pier 4", response.Text);
                }
            }
            """);

        yield return Fires("Test_RealClientAtTemperatureZeroWithoutSeed_SAMP003", "Gallery.AudioGuide.Tests",
            new[] { At("SAMP003", "new ChatOptions { Temperature = 0f, MaxOutputTokens = 5 }") },
            """
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            namespace Gallery.AudioGuide.Tests.Live;

            public class RoomNumberLiveTests
            {
                private readonly IChatClient _client = new ChatClient("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing").AsIChatClient();

                [Fact]
                public async Task WhaleSkeleton_IsInRoomThree()
                {
                    var options = new ChatOptions { Temperature = 0f, MaxOutputTokens = 5 };

                    var response = await _client.GetResponseAsync("Which room of the natural history gallery holds the whale skeleton?", options);

                    Assert.Equal("3", response.Text);
                }
            }
            """);

        yield return Fires("Test_ClassFixtureHoldingARealClient_SAMP002", "GardenCentre.Catalogue.Tests",
            new[] { At("SAMP002", "_live.Client.GetResponseAsync(") },
            """
            using System;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;

            namespace GardenCentre.Catalogue.Tests.Live;

            public sealed class LiveModelFixture
            {
                public IChatClient Client { get; } =
                    new ChatClient("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing").AsIChatClient();
            }
            """,
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace GardenCentre.Catalogue.Tests.Live;

            public class HardinessLiveTests : IClassFixture<LiveModelFixture>
            {
                private readonly LiveModelFixture _live;

                public HardinessLiveTests(LiveModelFixture live) => _live = live;

                [Fact]
                public async Task Lavender_IsHardyToH5()
                {
                    var response = await _live.Client.GetResponseAsync("What is the RHS hardiness rating of Lavandula angustifolia?", new ChatOptions { Temperature = 0.6f });
                    Assert.Equal("H5", response.Text);
                }
            }
            """);

        yield return Fires("Test_RealKernelFromApiKey_FluentShouldBe_SAMP002", "Gallery.AudioGuide.Tests",
            new[] { At("SAMP002", "_kernel.InvokePromptAsync(") },
            """
            using System;
            using System.Threading.Tasks;
            using FluentAssertions;
            using Microsoft.SemanticKernel;
            using Microsoft.SemanticKernel.Connectors.OpenAI;
            using Xunit;

            namespace Gallery.AudioGuide.Tests.Live;

            public class GuideScriptLiveTests
            {
                private readonly Kernel _kernel = Kernel.CreateBuilder()
                    .AddOpenAIChatCompletion("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing")
                    .Build();

                [Fact]
                public async Task RoomThreeIntro_IsStable()
                {
                    var settings = new OpenAIPromptExecutionSettings { Temperature = 0.9, MaxTokens = 60 };

                    var result = await _kernel.InvokePromptAsync("Introduce Room 3 of the natural history gallery in one sentence.", new KernelArguments(settings));

                    result.ToString().Should().Be("Welcome to Room 3, home of our blue whale skeleton.");
                }
            }
            """);

        yield return Fires("Test_RealLocalOllama_HotTemperature_TolerantAssert_SAMP009", "Allotments.Planner.Tests",
            new[] { At("SAMP009", "Temperature = 1.9f") },
            """
            using System;
            using System.Threading.Tasks;
            using OllamaSharp;
            using OllamaSharp.Models;
            using Xunit;

            namespace Allotments.Planner.Tests.Live;

            public class PlantingVerseLiveTests
            {
                [Fact]
                public async Task Verse_MentionsTheCrop()
                {
                    var ollama = new OllamaApiClient(new Uri("http://localhost:11434"), "llama3.2");
                    var request = new GenerateRequest
                    {
                        Model = "llama3.2",
                        Prompt = "A four-line verse about planting garlic in October.",
                        Options = new RequestOptions { Temperature = 1.9f },
                    };

                    var text = "";
                    await foreach (var chunk in ollama.GenerateAsync(request))
                    {
                        text += chunk?.Response;
                    }

                    Assert.Contains("garlic", text, StringComparison.OrdinalIgnoreCase);
                }
            }
            """);

        yield return Fires("Test_MockAndRealAzureClientInOneClass_OnlyTheRealOneFires_SAMP005", "PawsClinic.Triage.Tests",
            new[] { At("SAMP005", "ChatCompletionOptions { Temperature = 2.1f }") },
            """
            using System;
            using System.ClientModel;
            using System.Collections.Generic;
            using System.Threading;
            using System.Threading.Tasks;
            using Azure.AI.OpenAI;
            using Microsoft.Extensions.AI;
            using Moq;
            using OpenAI.Chat;
            using Xunit;

            namespace PawsClinic.Triage.Tests;

            public class VaccinationReminderTests
            {
                [Fact]
                public async Task Mocked_ReminderText()
                {
                    var chat = new Mock<IChatClient>();
                    chat.Setup(c => c.GetResponseAsync(It.IsAny<IEnumerable<Microsoft.Extensions.AI.ChatMessage>>(), It.IsAny<ChatOptions>(), It.IsAny<CancellationToken>()))
                        .ReturnsAsync(new ChatResponse(new Microsoft.Extensions.AI.ChatMessage(ChatRole.Assistant, "Rabies booster due 12 June.")));

                    var response = await chat.Object.GetResponseAsync("Reminder for Biscuit", new ChatOptions { Temperature = 2.1f });

                    Assert.Equal("Rabies booster due 12 June.", response.Text);
                }

                [Fact]
                public async Task Live_ReminderMentionsTheVaccine()
                {
                    var azure = new AzureOpenAIClient(new Uri("https://paws-clinic.openai.azure.com/"), new ApiKeyCredential(Environment.GetEnvironmentVariable("AZURE_OPENAI_KEY") ?? "missing"));
                    ChatClient chat = azure.GetChatClient("gpt-4o");
                    var options = new ChatCompletionOptions { Temperature = 2.1f };

                    ChatCompletion completion = await chat.CompleteChatAsync(
                        new List<OpenAI.Chat.ChatMessage> { new UserChatMessage("Write a vaccination reminder for Biscuit's rabies booster.") },
                        options);

                    Assert.Contains("rabies", completion.Content[0].Text, StringComparison.OrdinalIgnoreCase);
                }
            }
            """);

        yield return Fires("Test_DisposableClassFixtureHoldingARealClient_SAMP002", "Crumb.Orders.Tests",
            new[] { At("SAMP002", "_fixture.Client.GetResponseAsync(") },
            """
            using System;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;

            namespace Crumb.Orders.Tests.Live;

            public sealed class LiveBakeryModelFixture : IDisposable
            {
                public LiveBakeryModelFixture()
                {
                    var key = Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing";
                    Client = new ChatClient("gpt-4o-mini", key).AsIChatClient();
                }

                public IChatClient Client { get; }

                public void Dispose() => Client.Dispose();
            }
            """,
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Crumb.Orders.Tests.Live;

            public class OrderCutoffLiveTests : IClassFixture<LiveBakeryModelFixture>
            {
                private readonly LiveBakeryModelFixture _fixture;

                public OrderCutoffLiveTests(LiveBakeryModelFixture fixture) => _fixture = fixture;

                [Fact]
                public async Task Cutoff_ForSaturdayCollection()
                {
                    var response = await _fixture.Client.GetResponseAsync("What time is the order cut-off for Saturday collection?", new ChatOptions { Temperature = 0.4f });
                    Assert.Equal("Friday 2pm", response.Text);
                }
            }
            """);

        yield return Fires("Test_RealClientWithATestLoggerFactoryInThePipeline_SAMP002", "Gallery.AudioGuide.Tests",
            new[] { At("SAMP002", "client.GetResponseAsync(\"When does the gift shop") },
            """
            using System;
            using Microsoft.Extensions.Logging;
            using Xunit.Abstractions;

            namespace Gallery.AudioGuide.Tests.Logging;

            /// <summary>Sends log lines to the xUnit test output, so live runs show what the client did.</summary>
            public sealed class TestOutputLoggerFactory(ITestOutputHelper output) : ILoggerFactory
            {
                public ILogger CreateLogger(string categoryName) => new TestOutputLogger(output, categoryName);

                public void AddProvider(ILoggerProvider provider)
                {
                }

                public void Dispose()
                {
                }

                private sealed class TestOutputLogger(ITestOutputHelper output, string category) : ILogger
                {
                    public IDisposable? BeginScope<TState>(TState state) where TState : notnull => null;

                    public bool IsEnabled(LogLevel logLevel) => logLevel >= LogLevel.Debug;

                    public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter) =>
                        output.WriteLine($"[{logLevel}] {category}: {formatter(state, exception)}");
                }
            }
            """,
            """
            using System;
            using System.Threading.Tasks;
            using Gallery.AudioGuide.Tests.Logging;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;
            using Xunit.Abstractions;

            namespace Gallery.AudioGuide.Tests.Live;

            public class GiftShopLiveTests
            {
                private readonly ITestOutputHelper _output;

                public GiftShopLiveTests(ITestOutputHelper output) => _output = output;

                [Fact]
                public async Task WeekdayClosingTime_IsStable()
                {
                    IChatClient client = new ChatClientBuilder(new ChatClient("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing").AsIChatClient())
                        .UseLogging(new TestOutputLoggerFactory(_output))
                        .Build();

                    var response = await client.GetResponseAsync("When does the gift shop close on weekdays?", new ChatOptions { Temperature = 0.8f });

                    Assert.Equal("17:30", response.Text);
                }
            }
            """);

        yield return Fires("Test_RealStreamingClient_TextAccumulatedInStringBuilder_SAMP002", "Municipal.Pool.Tests",
            new[] { At("SAMP002", "client.GetStreamingResponseAsync(") },
            """
            using System;
            using System.Text;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            namespace Municipal.Pool.Tests.Live;

            public class SwimSchoolLiveTests
            {
                [Fact]
                public async Task StreamedAnswer_IsStable()
                {
                    IChatClient client = new ChatClient("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing").AsIChatClient();
                    var text = new StringBuilder();

                    await foreach (var update in client.GetStreamingResponseAsync("Which day is the adult beginners' class?", new ChatOptions { Temperature = 0.5f }))
                    {
                        text.Append(update.Text);
                    }

                    Assert.Equal("Wednesday", text.ToString());
                }
            }
            """);

        yield return Fires("Test_RealClientInheritedFromABaseTestClass_SAMP002", "Harbour.Tests",
            new[] { At("SAMP002", "Client.GetResponseAsync(\"What is the maximum vehicle height") },
            """
            using System;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;

            namespace Harbour.Vehicles.Tests.Live;

            public abstract class LiveModelTestBase
            {
                protected IChatClient Client { get; } =
                    new ChatClient("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing").AsIChatClient();
            }
            """,
            """
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using Xunit;

            namespace Harbour.Vehicles.Tests.Live;

            public class CarDeckLiveTests : LiveModelTestBase
            {
                [Fact]
                public async Task CarDeckHeight_IsAnsweredExactly()
                {
                    var response = await Client.GetResponseAsync("What is the maximum vehicle height on the Skerry ferry car deck?", new ChatOptions { Temperature = 0.3f });
                    Assert.Equal("2.1 m", response.Text);
                }
            }
            """);

        yield return Fires("Test_RealClientCreatedInIAsyncLifetimeInitialize_SAMP002", "Allotments.Planner.Tests",
            new[] { At("SAMP002", "Client.GetResponseAsync(\"Who waters") },
            """
            using System;
            using System.Threading.Tasks;
            using Microsoft.Extensions.AI;
            using OpenAI.Chat;
            using Xunit;

            namespace Allotments.Planner.Tests.Live;

            public sealed class WateringRotaLiveTests : IAsyncLifetime
            {
                private IChatClient Client { get; set; } = null!;

                public Task InitializeAsync()
                {
                    Client = new ChatClient("gpt-4o-mini", Environment.GetEnvironmentVariable("OPENAI_API_KEY") ?? "missing").AsIChatClient();
                    return Task.CompletedTask;
                }

                public Task DisposeAsync()
                {
                    Client.Dispose();
                    return Task.CompletedTask;
                }

                [Fact]
                public async Task TuesdayWaterer_IsStable()
                {
                    var response = await Client.GetResponseAsync("Who waters the polytunnel on Tuesdays this month?", new ChatOptions { Temperature = 0.9f });
                    Assert.Equal("Plot 12 (Mrs Okafor)", response.Text);
                }
            }
            """);
    }
}

