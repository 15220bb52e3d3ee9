using System.Collections.Generic;

namespace Temperance.Surfaces
{
    /// <summary>
    /// What is known about the code around model calls that never reaches a model: test doubles and canned transports,
    /// places options end up without being sent, response members that are metadata rather than sampled text, and the
    /// factories that turn a method into a tool the model calls. Pure data; Extraction reads it.
    /// </summary>
    internal static class TestingSurfaces
    {
        /// <summary>Mocking libraries: any type or call in these namespaces makes a test double (<c>Mock&lt;T&gt;.Object</c>, <c>Substitute.For</c>, <c>A.Fake</c>).</summary>
        public static readonly string[] MockingNamespaces = { "Moq", "NSubstitute", "FakeItEasy", "Castle.DynamicProxy", "Telerik.JustMock" };

        /// <summary>
        /// Transports under an SDK client: a subclass declared in the project (a handler returning recorded JSON, a
        /// pipeline transport) means the client never reaches a model.
        /// </summary>
        public static readonly string[] TransportBaseTypes =
        {
            "System.Net.Http.HttpMessageHandler",
            "System.ClientModel.Primitives.PipelineTransport",
            "Azure.Core.Pipeline.HttpPipelineTransport",
        };

        /// <summary>Calls that make a double: <c>Substitute.For</c>, <c>A.Fake</c>, <c>Mock.Of</c> (read by syntax in other files).</summary>
        public static readonly (string Owner, string Method)[] MockFactories = { ("Substitute", "For"), ("A", "Fake"), ("Mock", "Of") };

        /// <summary>Moq's double type, created with <c>new Mock&lt;T&gt;()</c>.</summary>
        public const string MockType = "Mock";

        /// <summary>A hand-written client over HTTP may well call a model: a class holding one is not a stand-in.</summary>
        public const string HttpClientType = "System.Net.Http.HttpClient";

        /// <summary>A handler that passes requests on to an inner handler, and the member that sets it.</summary>
        public const string DelegatingHandlerType = "System.Net.Http.DelegatingHandler";
        public const string InnerHandlerMember = "InnerHandler";

        /// <summary>SDK base classes of client decorators: a class deriving from one is judged by the client it wraps.</summary>
        public static readonly string[] DecoratorBaseTypes = { "Microsoft.Extensions.AI.DelegatingChatClient" };

        /// <summary>In-process test servers: a client pointed at one talks to the test, not to a model.</summary>
        public static readonly string[] TestServerTypes =
        {
            "Microsoft.AspNetCore.TestHost.TestServer",
            "Microsoft.AspNetCore.Mvc.Testing.WebApplicationFactory`1",
            "WireMock.Server.WireMockServer",
        };

        /// <summary>
        /// Namespaces whose methods consume options without sending them: serialisers, loggers and telemetry, test
        /// frameworks and assertion libraries. Options that end here (and nowhere else) never reach a model.
        /// </summary>
        public static readonly string[] SinkNamespaces =
        {
            "System.Text.Json", "Newtonsoft.Json", "System.ClientModel.Primitives", "System.Diagnostics", "Microsoft.Extensions.Logging",
            "Xunit", "NUnit", "Microsoft.VisualStudio.TestTools", "FluentAssertions", "AwesomeAssertions", "Shouldly",
            "VerifyTests", "VerifyXunit", "VerifyNUnit", "VerifyMSTest", "Snapshooter",
        };

        /// <summary>
        /// Members of a response that the provider fills in rather than samples: comparing them exactly says nothing about
        /// sampling (role, token usage, ids, finish reason, timestamps).
        /// </summary>
        public static readonly HashSet<string> ResponseMetadataMembers = new HashSet<string>(System.StringComparer.Ordinal)
        {
            "Role", "AuthorName", "Usage", "InputTokenCount", "OutputTokenCount", "TotalTokenCount", "InputTokens", "OutputTokens", "TotalTokens",
            "PromptTokens", "CompletionTokens", "ModelId", "Model", "Id", "ResponseId", "MessageId", "ConversationId", "FinishReason", "StopReason",
            "CreatedAt", "Created", "SystemFingerprint", "Count", "Length",
        };

        /// <summary>Methods that turn a delegate into a tool the model calls: the delegate's arguments are chosen by the model.</summary>
        public static readonly (string Type, string Method)[] ToolFactories =
        {
            ("Microsoft.Extensions.AI.AIFunctionFactory", "Create"),
            ("Microsoft.SemanticKernel.KernelFunctionFactory", "CreateFromMethod"),
            ("Microsoft.SemanticKernel.KernelExtensions", "CreateFunctionFromMethod"),
        };
    }
}
