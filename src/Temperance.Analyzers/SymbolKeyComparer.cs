using System.Collections.Generic;
using Microsoft.CodeAnalysis;

namespace Temperance
{
    /// <summary>
    /// Equality for (symbol, key) pairs used as per-compilation cache keys: symbols compare with
    /// <see cref="SymbolEqualityComparer.Default"/>, which a plain tuple would not use.
    /// </summary>
    internal sealed class SymbolKeyComparer<TSymbol, TKey> : IEqualityComparer<(TSymbol Symbol, TKey Key)>
        where TSymbol : ISymbol
    {
        public static readonly SymbolKeyComparer<TSymbol, TKey> Instance = new SymbolKeyComparer<TSymbol, TKey>();

        public bool Equals((TSymbol Symbol, TKey Key) x, (TSymbol Symbol, TKey Key) y) =>
            EqualityComparer<TKey>.Default.Equals(x.Key, y.Key) && SymbolEqualityComparer.Default.Equals(x.Symbol, y.Symbol);

        public int GetHashCode((TSymbol Symbol, TKey Key) obj) =>
            (SymbolEqualityComparer.Default.GetHashCode(obj.Symbol) * 397) ^ (obj.Key == null ? 0 : EqualityComparer<TKey>.Default.GetHashCode(obj.Key));
    }
}
