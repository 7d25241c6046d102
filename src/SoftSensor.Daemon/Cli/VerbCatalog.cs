using System.CommandLine;
using System.Diagnostics.CodeAnalysis;

namespace SoftSensor.Daemon.Cli;

/// <summary>Finds every <see cref="IVerb"/> in this assembly and builds the root command.</summary>
internal static class VerbCatalog
{
    [UnconditionalSuppressMessage("Trimming", "IL2072", Justification = "Verbs are concrete types of this assembly.")]
    public static RootCommand BuildRoot()
    {
        var root = new RootCommand("softsensor: an advisory soft sensor for fed-batch bioreactors (OUR, CER, RQ, elemental balances, growth rate, biomass).");
        var verbs = typeof(VerbCatalog).Assembly.GetTypes()
            .Where(t => typeof(IVerb).IsAssignableFrom(t) && t is { IsAbstract: false, IsInterface: false })
            .OrderBy(t => t.Name, StringComparer.Ordinal);
        foreach (var type in verbs)
        {
            var verb = (IVerb)Activator.CreateInstance(type)!;
            root.Subcommands.Add(verb.Build());
        }

        return root;
    }
}
