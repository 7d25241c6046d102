using SoftSensor.Core.Chemistry;

namespace SoftSensor.Core.Flux;

/// <summary>
/// A flux model compiled into matrices (docs/methods.md §3): the balance of every intracellular
/// metabolite, S_int (metabolites x reactions), the fixed splits, the maintenance row, the exchange
/// matrix T (compounds x reactions, in rate units: C-mol for organics, mol otherwise) and the element
/// matrix E of the exchange compounds (elements x compounds, per rate unit). Built once per model.
/// </summary>
public sealed class FluxNetwork
{
    private FluxNetwork(FluxModel model)
    {
        Model = model;
        int nr = model.Reactions.Count, nm = model.Metabolites.Count, nc = model.Compounds.Count;
        Internal = new double[nm, nr];
        Exchange = new double[nc, nr];
        for (int k = 0; k < nr; k++)
        {
            foreach (var t in model.Reactions[k].Terms)
            {
                int j = model.CompoundIndex(t.Species);
                if (j >= 0)
                {
                    Exchange[j, k] += t.Coefficient * model.Compounds[j].RateUnitsPerFormulaUnit();
                }
                else
                {
                    int i = IndexOfMetabolite(model, t.Species);
                    Internal[i, k] += t.Coefficient;
                }
            }
        }

        var fixedSplits = model.Splits.Where(s => s.IsFixed).ToList();
        Splits = new double[fixedSplits.Count, nr];
        for (int s = 0; s < fixedSplits.Count; s++)
        {
            Splits[s, model.ReactionIndex(fixedSplits[s].Flux)] += 1;
            foreach (string per in fixedSplits[s].Per)
            {
                Splits[s, model.ReactionIndex(per)] -= fixedSplits[s].Ratio!.Value;
            }
        }

        MaintenanceReaction = model.Maintenance is { } mt ? model.ReactionIndex(mt.Reaction) : -1;
        var inNetwork = new bool[nc];
        for (int j = 0; j < nc; j++)
        {
            for (int k = 0; k < nr; k++)
            {
                inNetwork[j] |= Exchange[j, k] != 0;
            }
        }

        InNetwork = inNetwork;

        BalancedElements = Elements.All.Where(e => model.Compounds.Any(c => c.Formula[e] != 0)).ToList();
        ElementMatrix = new double[BalancedElements.Count, nc];
        DegreeOfReduction = new double[nc];
        for (int j = 0; j < nc; j++)
        {
            var perUnit = model.Compounds[j].Formula;
            double units = model.Compounds[j].RateUnitsPerFormulaUnit();
            for (int e = 0; e < BalancedElements.Count; e++)
            {
                ElementMatrix[e, j] = perUnit[BalancedElements[e]] / units;
            }

            DegreeOfReduction[j] = perUnit.DegreeOfReduction / units;
        }

        Imbalances = ReactionBalanceCheck.Check(model);
        ExtraEquations = ExtraEquationCount.Of(this);
    }

    /// <summary>The model compiled.</summary>
    public FluxModel Model { get; }

    /// <summary>S_int: net coefficient of metabolite i in reaction k.</summary>
    internal double[,] Internal { get; }

    /// <summary>T: rate units of compound j made per unit flux of reaction k.</summary>
    internal double[,] Exchange { get; }

    /// <summary>One row per fixed split: v_flux - ratio * sum(v_per) = 0.</summary>
    internal double[,] Splits { get; }

    /// <summary>Index of the maintenance reaction, or -1.</summary>
    public int MaintenanceReaction { get; }

    /// <summary>True for each compound that takes part in at least one reaction.</summary>
    public IReadOnlyList<bool> InNetwork { get; }

    /// <summary>Elements present in the exchange compounds, in the row order of the element matrix.</summary>
    public IReadOnlyList<Element> BalancedElements { get; }

    /// <summary>E: atoms of element e per rate unit of compound j.</summary>
    internal double[,] ElementMatrix { get; }

    /// <summary>Degree of reduction per rate unit of each compound (Roels 1983).</summary>
    internal double[] DegreeOfReduction { get; }

    /// <summary>Reactions that do not conserve an element (empty for a balanced network).</summary>
    public IReadOnlyList<ReactionImbalance> Imbalances { get; }

    /// <summary>
    /// Number of independent equations the network imposes on the exchange rates beyond the
    /// black-box elemental balances of the same compounds (docs/methods.md §3).
    /// </summary>
    public int ExtraEquations { get; }

    /// <summary>Compiles <paramref name="model"/>.</summary>
    public static FluxNetwork Compile(FluxModel model) => new(model);

    /// <summary>Compiles the model in <paramref name="json"/> (see <see cref="FluxModel.Load"/>).</summary>
    public static FluxNetwork Load(string json) => new(FluxModel.Load(json));

    /// <summary>
    /// Closure of the elemental balances for exchange rates <paramref name="exchange"/> (rate units):
    /// residual[e] = sum_j E[e, j] q_j for each of <see cref="BalancedElements"/>, then the
    /// degree-of-reduction residual sum_j gamma_j q_j last. NaN where a rate is NaN.
    /// </summary>
    public void Closure(ReadOnlySpan<double> exchange, Span<double> residual)
    {
        int ne = BalancedElements.Count;
        for (int e = 0; e <= ne; e++)
        {
            double s = 0;
            for (int j = 0; j < exchange.Length; j++)
            {
                double a = e < ne ? ElementMatrix[e, j] : DegreeOfReduction[j];
                if (a != 0)
                {
                    s += a * exchange[j];
                }
            }

            residual[e] = s;
        }
    }

    /// <summary>Labels of the <see cref="Closure"/> residuals: element symbols, then "gamma".</summary>
    public IReadOnlyList<string> ClosureLabels => [.. BalancedElements.Select(e => e.ToString()), "gamma"];

    private static int IndexOfMetabolite(FluxModel model, string id)
    {
        for (int i = 0; i < model.Metabolites.Count; i++)
        {
            if (model.Metabolites[i].Id == id)
            {
                return i;
            }
        }

        throw new InvalidOperationException($"species '{id}' is neither a compound nor a metabolite of model '{model.Name}'");
    }
}
