using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Hand-built JSON payloads (anonymous objects, string-keyed dictionaries, JsonObject) read by the keys of
    /// <see cref="RawJsonSurface"/>. A payload becomes a request only when it is one (<see cref="Instance.IsRequest"/>).
    /// </summary>
    internal static class PayloadReader
    {
        private const string SurfaceName = "JSON payload";

        public static Instance FromDictionary(IObjectCreationOperation creation, CallContext context)
        {
            var instance = New(creation, context);
            if (creation.Initializer != null)
            {
                SettingReader.ReadKeyed(RawJsonSurface.Keys, creation.Initializer, instance);
            }

            return instance;
        }

        public static Instance FromAnonymous(IAnonymousObjectCreationOperation creation, CallContext context)
        {
            var instance = New(creation, context);
            ReadAnonymous(creation, instance);
            return instance;
        }

        /// <summary>Methods that serialise or post a payload (declared in <see cref="RawJsonSurface"/>).</summary>
        public static bool IsSerialisation(IMethodSymbol method)
        {
            var type = method.ContainingType;
            return type != null && RawJsonSurface.SerialiserTypes.Contains(type.Name) && IsSerialiserNamespace(type.ContainingNamespace?.ToDisplayString());
        }

        private static bool IsSerialiserNamespace(string? ns)
        {
            if (ns == null)
            {
                return false;
            }

            foreach (var candidate in RawJsonSurface.SerialiserNamespaces)
            {
                if (ns.StartsWith(candidate, System.StringComparison.Ordinal))
                {
                    return true;
                }
            }

            return false;
        }

        private static Instance New(IOperation creation, CallContext context)
        {
            var request = new RequestDraft(Providers.Generic, SurfaceName, creation.Syntax.GetLocation(), context, originVisible: true);
            return new Instance(request, creation, Instances.HolderOf(creation)) { IsPayload = true, PayloadSent = IsSerialisedInPlace(creation) };
        }

        private static void ReadAnonymous(IAnonymousObjectCreationOperation creation, Instance instance)
        {
            foreach (var element in creation.Initializers)
            {
                if (element is not ISimpleAssignmentOperation { Target: IPropertyReferenceOperation property } assignment)
                {
                    continue;
                }

                if (property.Property.Name == RawJsonSurface.NestedOptionsKey && ValueReader.Unwrap(assignment.Value) is IAnonymousObjectCreationOperation nested)
                {
                    instance.PayloadHasRequestShape = true;
                    ReadAnonymous(nested, instance);
                    continue;
                }

                // "thinking": { type = "enabled" }, "reasoning": { effort = "low" }: a mode one object down.
                if (RawJsonSurface.ModeKeys.TryGetValue(property.Property.Name, out var mode) && mode.Member != null
                    && ValueReader.Unwrap(assignment.Value) is IAnonymousObjectCreationOperation modeObject)
                {
                    instance.PayloadHasRequestShape = true;
                    foreach (var inner in modeObject.Initializers)
                    {
                        if (inner is ISimpleAssignmentOperation { Target: IPropertyReferenceOperation member } innerAssignment && member.Property.Name == mode.Member)
                        {
                            instance.Request.Modes[mode.Mode] = new ModeValue(mode.Mode, ValueReader.ConstantName(innerAssignment.Value), ResponseShapeReader.Evidence(assignment.Syntax));
                        }
                    }

                    continue;
                }

                SettingReader.ReadKey(RawJsonSurface.Keys, property.Property.Name, assignment.Value, assignment.Syntax, instance);
            }
        }

        /// <summary>A payload written straight into a send or serialise call: <c>PostAsJsonAsync(url, new { … })</c>.</summary>
        private static bool IsSerialisedInPlace(IOperation creation)
        {
            var parent = creation.Parent;
            while (parent is IConversionOperation or IArgumentOperation or IParenthesizedOperation)
            {
                if (parent is IArgumentOperation { Parent: IInvocationOperation call } && IsSerialisation(call.TargetMethod))
                {
                    return true;
                }

                parent = parent.Parent;
            }

            return false;
        }
    }
}
