using System.Collections.Generic;

namespace Temperance.Model
{
    /// <summary>
    /// What a request ends up with for one setting: a Known value, Unset (the provider default applies) or Unknown
    /// (computed at run time, never judged), with the writes that decided it.
    /// </summary>
    internal sealed class SettingValue
    {
        private static readonly SettingWrite[] None = new SettingWrite[0];

        private SettingValue(ValueKind kind, double value, IReadOnlyList<SettingWrite> deciding, SettingWrite? last)
        {
            Kind = kind;
            Value = value;
            Deciding = deciding;
            Last = last;
        }

        public ValueKind Kind { get; }
        /// <summary>The value, meaningful only when <see cref="Kind"/> is Known: the worst (highest) branch of a conditional.</summary>
        public double Value { get; }
        /// <summary>The Known writes that decide the value: the last write, or every branch of a last conditional.</summary>
        public IReadOnlyList<SettingWrite> Deciding { get; }
        /// <summary>The last write in source order (where a fix edits the value); null when nobody writes the setting.</summary>
        public SettingWrite? Last { get; }

        public bool IsKnown => Kind == ValueKind.Known;

        /// <summary>Known and equal to <paramref name="value"/>.</summary>
        public bool Is(double value) => Kind == ValueKind.Known && Value == value;

        /// <summary>
        /// The effective value, worst branch: the last unconditional write wins, in source order; when the last write is a
        /// conditional, its highest Known branch stands for the value and any Unknown branch makes it Unknown. A setting
        /// nobody writes is Unset when <paramref name="unwrittenIsUnset"/> (the options' creation is visible), else Unknown.
        /// </summary>
        public static SettingValue Effective(Setting setting, IReadOnlyList<SettingWrite> writes, bool unwrittenIsUnset)
        {
            SettingWrite? last = null;
            foreach (var write in writes)
            {
                if (write.Setting == setting)
                {
                    last = write;
                }
            }

            if (last == null)
            {
                return new SettingValue(unwrittenIsUnset ? ValueKind.Unset : ValueKind.Unknown, 0, None, null);
            }

            if (!last.FromConditional)
            {
                return last.Kind == ValueKind.Known
                    ? new SettingValue(ValueKind.Known, last.Value, new[] { last }, last)
                    : new SettingValue(last.Kind, 0, None, last);
            }

            var worst = double.NegativeInfinity;
            var branches = new List<SettingWrite>();
            foreach (var branch in writes)
            {
                if (branch.Setting != setting || !branch.FromConditional || branch.Location != last.Location)
                {
                    continue;
                }

                if (branch.Kind != ValueKind.Known)
                {
                    return new SettingValue(ValueKind.Unknown, 0, None, last);
                }

                branches.Add(branch);
                worst = System.Math.Max(worst, branch.Value);
            }

            return new SettingValue(ValueKind.Known, worst, branches, last);
        }
    }
}
