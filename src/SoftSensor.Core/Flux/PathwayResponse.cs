using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Flux;

/// <summary>
/// A flux model put in the form the cycle solves every cycle with the energy parameters free
/// (docs/pathway.md §1). With the ATP balance left out, every flux of the network is linear in four
/// basis fluxes u = [r_X, v_resp, v_maint, v_overflow] (growth, respiration, maintenance drain and
/// the optional overflow branch); the exchange rates are q = Q u and the ATP balance is
///   a·u + P/O · n_O · v_resp = 0,
/// where a holds every ATP coefficient except the oxidative phosphorylation term and n_O is the O
/// atoms respired per unit respiration flux (P/O: ATP per O atom, Hinkle 2005, Biochim. Biophys.
/// Acta 1706). The maintenance drain is Pirt's v_maint = m_ATP X (Pirt 1965, Proc. R. Soc. Lond. B 163).
/// Built once from the model file (allocates); <see cref="PathwaySolve"/> uses it per cycle.
/// </summary>
public sealed class PathwayResponse
{
    /// <summary>Positions of the basis fluxes in u.</summary>
    public const int Growth = 0, Respiration = 1, Maintenance = 2, Overflow = 3, BasisCount = 4;

    private readonly double[] _q;

    /// <summary>Compiles the energetic form of <paramref name="model"/>; throws <see cref="ArgumentException"/> naming what the model lacks.</summary>
    /// <param name="model">The flux model (a respiration reaction that consumes the oxygen compound and makes ATP, a maintenance reaction).</param>
    /// <param name="overflowReaction">The reaction of the overflow branch (e.g. the alcohol dehydrogenase), or null when the model has none.</param>
    public PathwayResponse(FluxModel model, string? overflowReaction)
    {
        ArgumentNullException.ThrowIfNull(model);
        var carriers = model.Metabolites.Where(m => m.IsCarrier).ToList();
        if (carriers.Count != 1)
        {
            throw new ArgumentException($"model '{model.Name}': the pathway stage needs exactly one energy carrier metabolite (ATP, declared with \"carrier\": true); found {carriers.Count}", nameof(model));
        }

        string atp = carriers[0].Id;
        var oxygen = model.Compounds.FirstOrDefault(c => c.Role == CompoundRole.Oxygen)
            ?? throw new ArgumentException($"model '{model.Name}': the pathway stage needs a compound with role oxygen", nameof(model));
        var maintenance = model.Maintenance
            ?? throw new ArgumentException($"model '{model.Name}': the pathway stage needs a \"maintenance\" block (the ATP drain m_ATP)", nameof(model));
        var biomass = model.Biomass ?? throw new ArgumentException($"model '{model.Name}' has no compound with role biomass", nameof(model));
        var substrate = model.Compounds.FirstOrDefault(c => c.Role == CompoundRole.Substrate)
            ?? throw new ArgumentException($"model '{model.Name}' has no compound with role substrate", nameof(model));
        var respiration = model.Reactions.Where(r => r.CoefficientOf(oxygen.Id) < 0 && r.CoefficientOf(atp) > 0).ToList();
        if (respiration.Count != 1)
        {
            throw new ArgumentException($"model '{model.Name}': the pathway stage needs exactly one respiration reaction (consumes {oxygen.Id}, makes {atp}); found {respiration.Count}", nameof(model));
        }

        var resp = respiration[0];
        OxygenAtomsPerRespiration = -2 * resp.CoefficientOf(oxygen.Id);
        ModelPoRatio = resp.CoefficientOf(atp) / OxygenAtomsPerRespiration;
        ModelMaintenanceAtpPerCmmolH = maintenance.AtpMmolPerCmmolBiomassPerH;
        RespirationReaction = resp.Id;
        if (overflowReaction is not null && model.ReactionIndex(overflowReaction) < 0)
        {
            throw new ArgumentException($"overflow reaction '{overflowReaction}' is not a reaction of model '{model.Name}' (reactions: {string.Join(", ", model.Reactions.Select(r => r.Id))})", nameof(overflowReaction));
        }

        HasOverflow = overflowReaction is not null;

        // The same network with the ATP balance taken out and the overflow branch freed (a fixed split
        // of 0 keeps it shut for `softsensor flux`): the four basis fluxes then fix every flux.
        var stripped = model with
        {
            Metabolites = model.Metabolites.Where(m => m.Id != atp).ToList(),
            Reactions = model.Reactions.Select(r => r with { Terms = r.Terms.Where(t => t.Species != atp).ToList() }).ToList(),
            Maintenance = null,
            Splits = model.Splits.Where(sp => sp.Flux != overflowReaction).ToList(),
        };
        var network = FluxNetwork.Compile(stripped);
        var basis = new List<string> { biomass.Id, resp.Id, maintenance.Reaction };
        if (overflowReaction is not null)
        {
            basis.Add(overflowReaction);
        }

        var solver = new FluxSolver(network, basis);
        if (solver.Undetermined.Count > 0)
        {
            throw new ArgumentException($"model '{model.Name}': growth, respiration, maintenance{(overflowReaction is null ? "" : " and overflow")} do not fix the fluxes of {string.Join(", ", solver.Undetermined)}; add a split or name the overflow reaction", nameof(model));
        }

        int nc = model.Compounds.Count;
        _q = new double[nc * BasisCount];
        Atp = new double[BasisCount];
        var s = solver.CreateSolution();
        Span<double> unit = stackalloc double[basis.Count];
        for (int b = 0; b < basis.Count; b++)
        {
            unit.Clear();
            unit[b] = 1;
            solver.Solve(unit, double.NaN, s);
            for (int j = 0; j < nc; j++)
            {
                _q[(j * BasisCount) + b] = network.InNetwork[j] && double.IsFinite(s.Exchange[j]) ? s.Exchange[j] : 0;
            }

            double a = 0;
            for (int k = 0; k < model.Reactions.Count; k++)
            {
                if (model.Reactions[k].Id != resp.Id)
                {
                    a += model.Reactions[k].CoefficientOf(atp) * s.Fluxes[k];
                }
            }

            Atp[b] = a;
        }

        Model = model;
        CompoundCount = nc;
        OxygenIndex = model.CompoundIndex(oxygen.Id);
        CarbonDioxideIndex = model.Compounds.Select((c, i) => (c, i)).FirstOrDefault(p => p.c.Role == CompoundRole.CarbonDioxide, (null!, -1)).Item2;
        SubstrateIndex = model.CompoundIndex(substrate.Id);
        BiomassIndex = model.CompoundIndex(biomass.Id);
        BiomassWeighedGPerCmol = biomass.WeighedMassGPerRateUnit;
        SubstrateGPerCmol = substrate.MassGPerRateUnit;
        SubstrateGamma = substrate.DegreeOfReductionPerRateUnit;
        OverflowProductIndex = -1;
        if (overflowReaction is not null)
        {
            // The overflow product: the compound the branch makes most of besides CO2 (ethanol, acetate).
            double best = 0;
            for (int j = 0; j < nc; j++)
            {
                double v = _q[(j * BasisCount) + Overflow];
                if (j != CarbonDioxideIndex && model.Compounds[j].IsOrganic && v > best)
                {
                    best = v;
                    OverflowProductIndex = j;
                }
            }

            if (OverflowProductIndex < 0)
            {
                throw new ArgumentException($"overflow reaction '{overflowReaction}' of model '{model.Name}' makes no organic exchange compound", nameof(overflowReaction));
            }
        }
    }

    /// <summary>The model.</summary>
    public FluxModel Model { get; }

    /// <summary>Number of exchange compounds (model order).</summary>
    public int CompoundCount { get; }

    /// <summary>Id of the respiration reaction.</summary>
    public string RespirationReaction { get; }

    /// <summary>P/O ratio written in the model (ATP per O atom).</summary>
    public double ModelPoRatio { get; }

    /// <summary>m_ATP of the model, mmol ATP/(C-mmol biomass·h).</summary>
    public double ModelMaintenanceAtpPerCmmolH { get; }

    /// <summary>O atoms consumed per unit respiration flux.</summary>
    public double OxygenAtomsPerRespiration { get; }

    /// <summary>True when an overflow branch is named.</summary>
    public bool HasOverflow { get; }

    /// <summary>ATP net per unit basis flux, without the oxidative phosphorylation term.</summary>
    internal double[] Atp { get; }

    /// <summary>Indices of compounds in the model order (-1 when absent).</summary>
    public int OxygenIndex { get; }

    /// <inheritdoc cref="OxygenIndex"/>
    public int CarbonDioxideIndex { get; }

    /// <inheritdoc cref="OxygenIndex"/>
    public int SubstrateIndex { get; }

    /// <inheritdoc cref="OxygenIndex"/>
    public int BiomassIndex { get; }

    /// <inheritdoc cref="OxygenIndex"/>
    public int OverflowProductIndex { get; }

    /// <summary>Grams of dry weight (ash included) per C-mol biomass.</summary>
    public double BiomassWeighedGPerCmol { get; }

    /// <summary>Degree of reduction of the substrate per C-mol (Roels 1983).</summary>
    public double SubstrateGamma { get; }

    /// <summary>Grams of substrate per C-mol.</summary>
    public double SubstrateGPerCmol { get; }

    /// <summary>Id of the overflow product, or null.</summary>
    public string? OverflowProduct => OverflowProductIndex >= 0 ? Model.Compounds[OverflowProductIndex].Id : null;

    /// <summary>Q[j, b]: rate units of compound j per unit basis flux b.</summary>
    public double Exchange(int compound, int basis) => _q[(compound * BasisCount) + basis];

    /// <summary>q = Q u into <paramref name="rates"/> (model compound order).</summary>
    public void Rates(ReadOnlySpan<double> u, Span<double> rates)
    {
        for (int j = 0; j < CompoundCount; j++)
        {
            double s = 0;
            for (int b = 0; b < BasisCount; b++)
            {
                s += _q[(j * BasisCount) + b] * u[b];
            }

            rates[j] = s;
        }
    }

    /// <summary>One exchange rate of Q u.</summary>
    public double Rate(int compound, ReadOnlySpan<double> u)
    {
        double s = 0;
        for (int b = 0; b < BasisCount; b++)
        {
            s += _q[(compound * BasisCount) + b] * u[b];
        }

        return s;
    }
}
