using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Flux;

/// <summary>
/// A metabolic network read from a model file: the exchange compounds (shared with the elemental
/// balance), the balanced metabolites and cofactors, the reactions, their parameters, the carbon
/// splits and the maintenance demand (docs/methods.md §3). The compounds and balances are the
/// elemental-balance model of the same file (<see cref="ModelReader"/>). Immutable; compile it once with
/// <see cref="FluxNetwork.Compile"/> and solve many times.
/// </summary>
public sealed record FluxModel(
    StoichiometricModel Stoichiometry,
    IReadOnlyList<Metabolite> Metabolites,
    IReadOnlyList<Reaction> Reactions,
    IReadOnlyList<FluxParameter> Parameters,
    IReadOnlyList<FluxSplit> Splits,
    MaintenanceDemand? Maintenance)
{
    /// <summary>Name of the model.</summary>
    public string Name => Stoichiometry.Name;

    /// <summary>The exchange compounds, read by the elemental-balance model reader (file order).</summary>
    public IReadOnlyList<Compound> Compounds => Stoichiometry.Compounds;

    /// <summary>Id of the biomass compound in shipped models.</summary>
    public const string BiomassId = "biomass";

    /// <summary>Reads a model from JSON text; throws <see cref="FluxModelException"/> naming the field at fault.</summary>
    public static FluxModel Load(string json) => FluxModelReader.Parse(json);

    /// <summary>The biomass compound (role biomass), or null.</summary>
    public Compound? Biomass => Compounds.FirstOrDefault(c => c.Role == CompoundRole.Biomass);

    /// <summary>Index of a compound by id, or -1.</summary>
    public int CompoundIndex(string id)
    {
        for (int i = 0; i < Compounds.Count; i++)
        {
            if (Compounds[i].Id == id)
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>Index of a reaction by id, or -1.</summary>
    public int ReactionIndex(string id)
    {
        for (int i = 0; i < Reactions.Count; i++)
        {
            if (Reactions[i].Id == id)
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>
    /// Biomass concentration in C-mmol/L from dry weight in g/L (ash included), with the biomass
    /// compound's formula and ash fraction: X_C = X_g / (M / (1 - ash)) * 1000.
    /// </summary>
    public double BiomassCmmolPerL(double biomassGPerL)
    {
        var b = Biomass ?? throw new InvalidOperationException($"model '{Name}' has no compound with role biomass");
        return biomassGPerL / b.WeighedMassGPerRateUnit * 1000.0;
    }
}
