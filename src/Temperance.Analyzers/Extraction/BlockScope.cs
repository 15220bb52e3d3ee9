using System.Collections.Generic;
using System.Linq;
using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.Operations;
using Temperance.Model;
using Temperance.Surfaces;

namespace Temperance.Extraction
{
    /// <summary>What every reader of one operation block shares: the surfaces, where the block is, and its operations walked once.</summary>
    internal sealed class BlockScope
    {
        private readonly IReadOnlyList<IOperation> blocks;
        private IReadOnlyList<IOperation>? operations;
        private Dictionary<ILocalSymbol, IOperation?>? localInitializers;

        public BlockScope(SurfaceCatalog catalog, CallContext context, IReadOnlyList<IOperation> blocks)
        {
            Catalog = catalog;
            Context = context;
            this.blocks = blocks;
        }

        public SurfaceCatalog Catalog { get; }
        public CallContext Context { get; }

        /// <summary>Every operation of the block, walked once and shared by all readers (locals, prompts, test assertions).</summary>
        public IReadOnlyList<IOperation> Operations => operations ??= blocks.SelectMany(b => b.DescendantsAndSelf()).ToList();

        /// <summary>The value a local of this block is declared with, if any.</summary>
        public IOperation? LocalInitializer(ILocalSymbol local)
        {
            if (localInitializers == null)
            {
                localInitializers = new Dictionary<ILocalSymbol, IOperation?>(SymbolEqualityComparer.Default);
                foreach (var declarator in Operations.OfType<IVariableDeclaratorOperation>())
                {
                    localInitializers[declarator.Symbol] = declarator.Initializer?.Value;
                }
            }

            return localInitializers.TryGetValue(local, out var initializer) ? initializer : null;
        }
    }
}
