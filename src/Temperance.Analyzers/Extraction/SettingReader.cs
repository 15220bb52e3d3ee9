using System.Collections.Generic;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>
    /// Reads the writes of one options object as its surface declares them: typed members, the model and response-format
    /// members, nested option objects, string-keyed bags and hand-built payload keys.
    /// </summary>
    internal sealed class SettingReader
    {
        private readonly SurfaceCatalog catalog;

        public SettingReader(SurfaceCatalog catalog)
        {
            this.catalog = catalog;
        }

        /// <summary>A visible creation of options: its initializer, where fixes can add members, and whether it can carry a seed.</summary>
        public RequestDraft ReadCreation(SurfaceDefinition surface, IObjectCreationOperation creation, RequestDraft request)
        {
            MarkUndeclared(request, creation.Type, surface);
            ReadInitializer(surface, creation.Initializer, request);
            FixAnchorFinder.AddTargets(catalog, request, creation, surface);
            request.SeedAvailable = FixAnchorFinder.SeedAvailable(catalog, surface, creation.Type);
            return request;
        }

        /// <summary>Options created as a container's nested member (<c>Options = new RequestOptions { … }</c>) belong to the container's request.</summary>
        public bool IsNestedInContainer(IObjectCreationOperation creation)
        {
            var parent = creation.Parent;
            while (parent is IConversionOperation)
            {
                parent = parent.Parent;
            }

            return parent is ISimpleAssignmentOperation { Target: IPropertyReferenceOperation member, Parent: IObjectOrCollectionInitializerOperation }
                && catalog.Find(member.Property.ContainingType) is { } container
                && container.NestedMembers.Contains(member.Property.Name);
        }

        public void ReadInitializer(SurfaceDefinition surface, IObjectOrCollectionInitializerOperation? initializer, RequestDraft request)
        {
            if (initializer == null)
            {
                return;
            }

            foreach (var element in initializer.Initializers)
            {
                switch (element)
                {
                    case ISimpleAssignmentOperation { Target: IPropertyReferenceOperation property } assignment:
                        ReadMember(surface, property.Property, assignment.Value, assignment.Syntax, request);
                        break;
                    // Get-only collections: AdditionalProperties = { ["N"] = 2 }
                    case IMemberInitializerOperation { InitializedMember: IPropertyReferenceOperation bag } memberInitializer
                        when bag.Property.Name == surface.BagMember:
                        ReadKeyed(surface.Keys, memberInitializer.Initializer, new Instance(request, null, null));
                        break;
                }
            }
        }

        public void ReadMember(SurfaceDefinition surface, IPropertySymbol property, IOperation value, SyntaxNode syntax, RequestDraft request)
        {
            var name = property.Name;
            if (surface.Members.TryGetValue(name, out var setting) && catalog.Find(property.ContainingType) != null)
            {
                request.AddRange(ValueReader.Read(setting, name, value, property.Type, syntax.GetLocation()));
            }
            else if (request.UndeclaredSettings.Count > 0 && SettingNames.OfMemberName(name) is { } undeclared && request.UndeclaredSettings.Contains(undeclared))
            {
                // Written, but on a member whose provider, range and default are not declared: known to be set, value not judged.
                request.Add(new SettingWrite(undeclared, ValueKind.Unknown, 0, name, syntax.GetLocation(), null, NumericKind.Double, false, null));
            }
            else if (name == surface.ModelMember)
            {
                request.ModelId = ValueReader.ConstantString(value) ?? request.ModelId;
                request.ModelIdFrom = request.ModelId == null ? MemberPaths.Of(value) : null;
            }
            else if (name == surface.ResponseFormatMember)
            {
                ResponseShapeReader.Set(request, value);
            }
            else if (surface.ModeMembers.TryGetValue(name, out var mode))
            {
                request.Modes[mode] = new ModeValue(mode, ValueReader.ConstantName(value), ResponseShapeReader.Evidence(syntax));
            }
            else if (surface.HasModeUnder(name) && ValueReader.Unwrap(value) is IObjectCreationOperation { Initializer: { } modeObject })
            {
                // ReasoningOptions = new ResponseReasoningOptions { ReasoningEffortLevel = … }: a mode one object down.
                foreach (var element in modeObject.Initializers)
                {
                    if (element is ISimpleAssignmentOperation { Target: IPropertyReferenceOperation inner } innerAssignment
                        && surface.ModeMembers.TryGetValue(name + "." + inner.Property.Name, out var innerMode))
                    {
                        request.Modes[innerMode] = new ModeValue(innerMode, ValueReader.ConstantName(innerAssignment.Value), ResponseShapeReader.Evidence(innerAssignment.Syntax));
                    }
                }
            }
            else if (surface.NestedMembers.Contains(name))
            {
                if (ValueReader.Unwrap(value) is IObjectCreationOperation child && catalog.Find(child.Type) is { } childSurface)
                {
                    ReadInitializer(childSurface, child.Initializer, request);
                    FixAnchorFinder.AddTargets(catalog, request, child, childSurface);
                }
            }
            else if (name == surface.BagMember && ValueReader.Unwrap(value) is IObjectCreationOperation { Initializer: { } bagInitializer })
            {
                ReadKeyed(surface.Keys, bagInitializer, new Instance(request, null, null));
            }
        }

        /// <summary>
        /// A type derived from a declared surface (another provider's connector settings) with sampling members of its own
        /// that Surfaces does not declare: those settings are Unknown, never reported as unset.
        /// </summary>
        public void MarkUndeclared(RequestDraft request, ITypeSymbol? type, SurfaceDefinition surface)
        {
            for (var current = type as INamedTypeSymbol; current != null && catalog.TypeOf(surface.MetadataName) is { } declared
                && !SymbolEqualityComparer.Default.Equals(current.OriginalDefinition, declared); current = current.BaseType)
            {
                foreach (var member in current.GetMembers())
                {
                    if (member is IPropertySymbol { IsStatic: false } property && !surface.Members.ContainsKey(property.Name)
                        && SettingNames.OfMemberName(property.Name) is { } setting)
                    {
                        request.UndeclaredSettings.Add(setting);
                    }
                }
            }
        }

        /// <summary>A string-keyed initializer, in either form: <c>["temperature"] = 0.2</c> or <c>{ "temperature", 0.2 }</c>.</summary>
        public static void ReadKeyed(IReadOnlyDictionary<string, Setting> keys, IObjectOrCollectionInitializerOperation initializer, Instance instance)
        {
            foreach (var element in initializer.Initializers)
            {
                if (KeyedEntry(element) is { } entry)
                {
                    ReadKey(keys, entry.Key, entry.Value, element.Syntax, instance);
                }
            }
        }

        /// <summary>The key and value of one keyed initializer element, when the key is a constant string.</summary>
        public static (string Key, IOperation Value)? KeyedEntry(IOperation element) => element switch
        {
            ISimpleAssignmentOperation { Target: IPropertyReferenceOperation { Property.IsIndexer: true, Arguments.Length: 1 } indexer } assignment
                when ValueReader.ConstantString(indexer.Arguments[0].Value) is { } key => (key, assignment.Value),
            IInvocationOperation { TargetMethod.Name: "Add", Arguments.Length: 2 } add
                when ValueReader.ConstantString(add.Arguments[0].Value) is { } addKey => (addKey, add.Arguments[1].Value),
            _ => null,
        };

        public static void ReadKey(IReadOnlyDictionary<string, Setting> keys, string key, IOperation value, SyntaxNode syntax, Instance instance)
        {
            if (instance.IsPayload && key == RawJsonSurface.ModelKey)
            {
                instance.PayloadHasModel = true;
                instance.Request.ModelId = ValueReader.ConstantString(value);
                instance.Request.ModelIdFrom = instance.Request.ModelId == null ? MemberPaths.Of(value) : null;
                return;
            }

            if (instance.IsPayload && RawJsonSurface.ModeKeys.TryGetValue(key, out var mode))
            {
                instance.PayloadHasRequestShape = true;
                if (mode.Member == null)
                {
                    instance.Request.Modes[mode.Mode] = new ModeValue(mode.Mode, ValueReader.ConstantName(value), ResponseShapeReader.Evidence(syntax));
                }
                else if (ValueReader.Unwrap(value) is IObjectCreationOperation { Initializer: { } nested })
                {
                    // ["thinking"] = new Dictionary<string, object> { ["type"] = "enabled" }: the mode one object down.
                    foreach (var element in nested.Initializers)
                    {
                        if (KeyedEntry(element) is { } entry && entry.Key == mode.Member)
                        {
                            instance.Request.Modes[mode.Mode] = new ModeValue(mode.Mode, ValueReader.ConstantName(entry.Value), ResponseShapeReader.Evidence(syntax));
                        }
                    }
                }

                return;
            }

            if (instance.IsPayload && RawJsonSurface.FormatKeys.Contains(key))
            {
                instance.PayloadHasRequestShape = true;
                instance.Request.ResponseShape = ResponseShape.JsonObject;
                instance.Request.ResponseShapeEvidence = ResponseShapeReader.Evidence(syntax);
                return;
            }

            if (instance.IsPayload && RawJsonSurface.RequestKeys.Contains(key))
            {
                instance.PayloadHasRequestShape = true;
            }

            if (keys.TryGetValue(key, out var setting))
            {
                instance.PayloadSamplingKeys++;
                instance.Request.AddRange(ValueReader.Read(setting, $"\"{key}\"", value, null, syntax.GetLocation(), fromKey: true));
            }
        }
    }
}
