using Microsoft.CodeAnalysis;

namespace Temperance.Surfaces
{
    /// <summary>
    /// Finds a type by metadata name through the compilation's merged namespaces, which binding builds anyway.
    /// <c>Compilation.GetTypeByMetadataName</c> asks every referenced module in turn; for the forty-odd SDK names we
    /// look up and the ~170 framework assemblies of a project that was ~40 ms per compilation, charged to Temperance
    /// before any request was seen (benchmark, serial). Here a missing root namespace ends the search at once.
    /// </summary>
    internal static class TypeLookup
    {
        public static INamedTypeSymbol? Find(Compilation compilation, string metadataName)
        {
            INamespaceSymbol current = compilation.GlobalNamespace;
            var start = 0;
            int dot;
            while ((dot = metadataName.IndexOf('.', start)) >= 0)
            {
                if (FindNamespace(current, metadataName.Substring(start, dot - start)) is not { } next)
                {
                    return null;
                }

                current = next;
                start = dot + 1;
            }

            var name = metadataName.Substring(start);
            if (name.IndexOf('+') >= 0)
            {
                return compilation.GetTypeByMetadataName(metadataName); // nested types: rare, keep the compiler's own rules
            }

            var arity = 0;
            var tick = name.IndexOf('`');
            if (tick >= 0)
            {
                if (!int.TryParse(name.Substring(tick + 1), out arity))
                {
                    return null;
                }

                name = name.Substring(0, tick);
            }

            var candidates = current.GetTypeMembers(name, arity);
            if (candidates.Length == 1)
            {
                return candidates[0];
            }

            // None, or the same name in several assemblies: the compiler's rules decide which one (or none) counts.
            return candidates.Length == 0 ? null : compilation.GetTypeByMetadataName(metadataName);
        }

        private static INamespaceSymbol? FindNamespace(INamespaceSymbol container, string name)
        {
            foreach (var member in container.GetMembers(name))
            {
                if (member is INamespaceSymbol ns)
                {
                    return ns;
                }
            }

            return null;
        }
    }
}
