using System.Collections.Generic;
using Temperance.Model;

namespace Temperance.Surfaces
{
    /// <summary>
    /// How the SDKs spell "answer in JSON, a JSON schema, a grammar or plain text": the factories, static members, types
    /// and wire strings a response-format value is built from. Extraction reads a value by these and nothing else.
    /// </summary>
    internal static class ResponseFormats
    {
        /// <summary>A factory whose name contains this builds a schema format (OpenAI <c>CreateJsonSchemaFormat</c>, M.E.AI <c>ForJsonSchema</c>).</summary>
        public const string SchemaFactoryNamePart = "JsonSchema";

        /// <summary>Factories named exactly (OpenAI chat and Responses, Azure AI Inference).</summary>
        public static readonly IReadOnlyDictionary<string, ResponseShape> Factories = new Dictionary<string, ResponseShape>(System.StringComparer.Ordinal)
        {
            ["CreateJsonObjectFormat"] = ResponseShape.JsonObject,
            ["CreateTextFormat"] = ResponseShape.Text,
        };

        /// <summary>A factory that makes a schema format when given a schema and a plain JSON format without one.</summary>
        public const string JsonOrSchemaFactory = "CreateJsonFormat";

        /// <summary>Static members (M.E.AI <c>ChatResponseFormat.Json</c> / <c>.Text</c>, SDK enums).</summary>
        public static readonly IReadOnlyDictionary<string, ResponseShape> StaticMembers = new Dictionary<string, ResponseShape>(System.StringComparer.Ordinal)
        {
            ["Json"] = ResponseShape.JsonObject,
            ["JsonObject"] = ResponseShape.JsonObject,
            ["JsonSchema"] = ResponseShape.JsonSchema,
            ["Text"] = ResponseShape.Text,
        };

        /// <summary>Types created with <c>new</c> (LLamaSharp <c>Grammar</c>, Anthropic <c>JsonOutputFormat</c>, M.E.AI <c>ChatResponseFormatJson</c>).</summary>
        public static readonly IReadOnlyDictionary<string, ResponseShape> CreatedTypes = new Dictionary<string, ResponseShape>(System.StringComparer.Ordinal)
        {
            ["Grammar"] = ResponseShape.Grammar,
            ["JsonOutputFormat"] = ResponseShape.JsonSchema,
            ["ChatResponseFormatJson"] = ResponseShape.JsonSchema,
        };

        /// <summary>Wire strings (OllamaSharp <c>Format = "json"</c>, raw payloads' <c>response_format</c>).</summary>
        public static readonly IReadOnlyDictionary<string, ResponseShape> Literals = new Dictionary<string, ResponseShape>(System.StringComparer.Ordinal)
        {
            ["json"] = ResponseShape.JsonObject,
            ["json_object"] = ResponseShape.JsonObject,
            ["text"] = ResponseShape.Text,
        };

        /// <summary>The kind argument of a shape method (ONNX Runtime GenAI <c>SetGuidance("json_schema", …)</c>); anything else is a grammar.</summary>
        public static ResponseShape OfShapeMethodKind(string? kind) =>
            kind is "json_schema" or "json" ? ResponseShape.JsonSchema : ResponseShape.Grammar;
    }
}
