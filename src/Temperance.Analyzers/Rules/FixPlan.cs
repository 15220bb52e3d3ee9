using System.Collections.Generic;
using System.Collections.Immutable;
using System.Linq;
using Microsoft.CodeAnalysis;
using Temperance.Model;

namespace Temperance.Rules
{
    /// <summary>
    /// Builds the edits of one finding as <see cref="FixEdit"/> values; <see cref="Properties"/> encodes them for the
    /// diagnostic (the format, both ways, is in FixEdit.cs). Edit 0 is the primary fix.
    /// </summary>
    internal sealed class FixPlan
    {
        private readonly List<FixEdit> edits = new List<FixEdit>();
        private bool combined;

        public FixPlan SetValue(SettingWrite write, double value)
        {
            // In code the value expression is replaced; in a settings file, the value's text.
            if (write.ValueSyntax != null || write.InFile != null)
            {
                edits.Add(FixEdit.SetValue(write.ValueSyntax?.Span ?? write.InFile!.Value, write.Member, value, write.LiteralKind));
            }

            return this;
        }

        public FixPlan Remove(SettingWrite write)
        {
            // A settings-file entry is removed only where the reader found a span that leaves the file valid.
            if (write.InFile == null || !write.InFile.Removal.IsEmpty)
            {
                edits.Add(FixEdit.RemoveMember(write.InFile?.Removal ?? write.Location.SourceSpan, write.Member, write.LiteralKind));
            }

            return this;
        }

        public FixPlan AddMember(SyntaxNode creation, string member, double value, NumericKind kind, string? wrapperMember, string? wrapperType)
        {
            edits.Add(FixEdit.AddMember(creation.Span, member, value, kind, wrapperMember, wrapperType));
            return this;
        }

        public FixPlan AddArgument(Location call, string parameter, string optionsType, string member, double value, NumericKind kind)
        {
            edits.Add(FixEdit.AddArgument(call.SourceSpan, parameter, optionsType, member, value, kind));
            return this;
        }

        /// <summary>
        /// Writes settings nobody has written yet, wherever the request allows: into the options creation (or a new nested
        /// options object), else as an options argument of a call that passes none. The first setting decides the edit;
        /// the others join it when they belong to the same object. False when there is nowhere to write.
        /// </summary>
        public bool AddUnset(FixAnchors anchors, params (Setting Setting, double Value)[] settings)
        {
            var (first, value) = settings[0];
            if (anchors.Members.TryGetValue(first, out var target))
            {
                AddMember(target.Creation, target.Member, value, target.Kind, target.WrapperMember, target.WrapperType).Experimental(target.Experimental);
                foreach (var (other, otherValue) in settings.Skip(1))
                {
                    if (anchors.Members.TryGetValue(other, out var more) && more.Creation == target.Creation && more.WrapperMember == target.WrapperMember)
                    {
                        AlsoAssign(more.Member, more.Kind, otherValue, more.Experimental);
                    }
                }

                return true;
            }

            if (anchors.Call != null && anchors.OmittedParameter != null && anchors.OmittedOptionsType != null
                && anchors.OmittedMembers.TryGetValue(first, out var omitted))
            {
                AddArgument(anchors.Call, anchors.OmittedParameter, anchors.OmittedOptionsType, omitted.Member, value, omitted.Kind).Experimental(omitted.Experimental);
                foreach (var (other, otherValue) in settings.Skip(1))
                {
                    if (anchors.OmittedMembers.TryGetValue(other, out var more))
                    {
                        AlsoAssign(more.Member, more.Kind, otherValue, more.Experimental);
                    }
                }

                return true;
            }

            return false;
        }

        /// <summary>
        /// Adds another assignment to the last edit (an AddMember or AddArgument), and its experimental id if any.
        /// Does nothing before the first edit.
        /// </summary>
        public FixPlan AlsoAssign(string member, NumericKind kind, double value, string? experimental)
        {
            if (edits.Count > 0)
            {
                edits[edits.Count - 1] = edits[edits.Count - 1].WithExtra(new FixAssignment(member, kind, value)).WithExperimental(experimental);
            }

            return this;
        }

        /// <summary>The last edit raises experimental-API diagnostic <paramref name="id"/>; null does nothing.</summary>
        public FixPlan Experimental(string? id)
        {
            if (id != null && edits.Count > 0)
            {
                edits[edits.Count - 1] = edits[edits.Count - 1].WithExperimental(id);
            }

            return this;
        }

        /// <summary>All edits are applied as one code action.</summary>
        public FixPlan Combined()
        {
            combined = true;
            return this;
        }

        public ImmutableDictionary<string, string?> Properties => FixProperties.Encode(new FixEdits(edits.ToImmutableArray(), combined));
    }
}
