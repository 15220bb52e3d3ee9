using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>Reads what shape of answer a response-format value asks for, by the declarations in <see cref="ResponseFormats"/>.</summary>
    internal static class ResponseShapeReader
    {
        private const int EvidenceLength = 60;

        public static void Set(RequestDraft request, IOperation value)
        {
            var shape = ShapeOf(value);
            if (shape != ResponseShape.Unspecified)
            {
                request.ResponseShape = shape;
                request.ResponseShapeEvidence = Evidence(value.Syntax);
            }
        }

        /// <summary>The first declared factory, static member, type or wire string inside the value; anything else is Unspecified.</summary>
        public static ResponseShape ShapeOf(IOperation value)
        {
            foreach (var operation in value.DescendantsAndSelf())
            {
                var shape = operation switch
                {
                    IInvocationOperation call => OfFactory(call),
                    IPropertyReferenceOperation { Property.IsStatic: true } property => Lookup(ResponseFormats.StaticMembers, property.Property.Name),
                    IObjectCreationOperation creation => Lookup(ResponseFormats.CreatedTypes, creation.Type?.Name),
                    ILiteralOperation { ConstantValue: { HasValue: true, Value: string text } } => Lookup(ResponseFormats.Literals, text),
                    _ => ResponseShape.Unspecified,
                };
                if (shape != ResponseShape.Unspecified)
                {
                    return shape;
                }
            }

            return ResponseShape.Unspecified;
        }

        /// <summary>The code as written, shortened for messages.</summary>
        public static string Evidence(SyntaxNode syntax)
        {
            var text = syntax.ToString().Replace("\r", " ").Replace("\n", " ");
            return text.Length <= EvidenceLength ? text : text.Substring(0, EvidenceLength) + "…";
        }

        private static ResponseShape OfFactory(IInvocationOperation call)
        {
            var name = call.TargetMethod.Name;
            if (name.Contains(ResponseFormats.SchemaFactoryNamePart))
            {
                return ResponseShape.JsonSchema;
            }

            if (name == ResponseFormats.JsonOrSchemaFactory)
            {
                return call.Arguments.Any(a => a.ArgumentKind == ArgumentKind.Explicit) ? ResponseShape.JsonSchema : ResponseShape.JsonObject;
            }

            return Lookup(ResponseFormats.Factories, name);
        }

        private static ResponseShape Lookup(System.Collections.Generic.IReadOnlyDictionary<string, ResponseShape> table, string? name) =>
            name != null && table.TryGetValue(name, out var shape) ? shape : ResponseShape.Unspecified;
    }
}
