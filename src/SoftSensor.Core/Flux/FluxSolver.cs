namespace SoftSensor.Core.Flux;

/// <summary>
/// Solves a network for a chosen basis (docs/methods.md §3). The constraints are pseudo-steady state of
/// every balanced metabolite (S_int v = 0), the fixed splits, the maintenance flux
/// (v_maint = m_ATP X) and one row per basis rate (a reaction flux, or an exchange rate T_j v).
/// The constraint matrix is decomposed once here (SVD); each <see cref="Solve(ReadOnlySpan{double}, double, FluxSolution)"/>
/// is then a product with the pseudo-inverse into preallocated vectors. Fluxes whose unit vector is
/// not in the row space of the constraints are undetermined (Klamt, Schuster &amp; Gilles 2002,
/// Biotechnol. Bioeng. 77, calculability); they are listed, never an exception. Not thread-safe:
/// a solver owns its scratch vector; use one per pipeline.
/// </summary>
public sealed class FluxSolver
{
    private const double DeterminedTolerance = 1e-9;
    private readonly double[,] _a;
    private readonly double[,] _pinv;
    private readonly double[] _b;
    private readonly bool[] _fluxDetermined;
    private readonly bool[] _exchangeDetermined;
    private readonly int _maintenanceRow;
    private readonly int _basisRow0;

    /// <summary>Builds and decomposes the constraints for <paramref name="basis"/> (reaction ids or compound ids).</summary>
    /// <exception cref="ArgumentException">A basis id is neither a reaction nor a compound of the model.</exception>
    public FluxSolver(FluxNetwork network, IReadOnlyList<string> basis)
    {
        Network = network;
        Basis = basis;
        var model = network.Model;
        int nr = model.Reactions.Count, nc = model.Compounds.Count;
        int nm = network.Internal.GetLength(0), ns = network.Splits.GetLength(0);
        _maintenanceRow = network.MaintenanceReaction >= 0 ? nm + ns : -1;
        _basisRow0 = nm + ns + (_maintenanceRow >= 0 ? 1 : 0);
        _a = new double[_basisRow0 + basis.Count, nr];
        for (int k = 0; k < nr; k++)
        {
            for (int i = 0; i < nm; i++)
            {
                _a[i, k] = network.Internal[i, k];
            }

            for (int s = 0; s < ns; s++)
            {
                _a[nm + s, k] = network.Splits[s, k];
            }
        }

        if (_maintenanceRow >= 0)
        {
            _a[_maintenanceRow, network.MaintenanceReaction] = 1;
        }

        for (int b = 0; b < basis.Count; b++)
        {
            int k = model.ReactionIndex(basis[b]);
            int j = model.CompoundIndex(basis[b]);
            if (k < 0 && j < 0)
            {
                throw new ArgumentException($"basis '{basis[b]}' is neither a reaction nor a compound of model '{model.Name}'", nameof(basis));
            }

            for (int r = 0; r < nr; r++)
            {
                _a[_basisRow0 + b, r] = k >= 0 ? (r == k ? 1 : 0) : network.Exchange[j, r];
            }
        }

        var d = RankRevealing.Of(_a);
        Rank = d.Rank;
        _pinv = d.PseudoInverse;
        _b = new double[_a.GetLength(0)];
        _fluxDetermined = new bool[nr];
        var undetermined = new List<string>();
        for (int k = 0; k < nr; k++)
        {
            _fluxDetermined[k] = RankRevealing.RowNorm(d.NullSpace, k) <= DeterminedTolerance;
            if (!_fluxDetermined[k])
            {
                undetermined.Add(model.Reactions[k].Id);
            }
        }

        Undetermined = undetermined;
        _exchangeDetermined = new bool[nc];
        var tn = RankRevealing.Multiply(network.Exchange, d.NullSpace);
        for (int j = 0; j < nc; j++)
        {
            _exchangeDetermined[j] = RankRevealing.RowNorm(tn, j) <= DeterminedTolerance;
        }
    }

    /// <summary>The compiled network.</summary>
    public FluxNetwork Network { get; }

    /// <summary>Basis ids in the order their values are given.</summary>
    public IReadOnlyList<string> Basis { get; }

    /// <summary>Rank of the constraint matrix.</summary>
    public int Rank { get; }

    /// <summary>Reactions whose flux the constraints and the basis leave open (empty when all are determined).</summary>
    public IReadOnlyList<string> Undetermined { get; }

    /// <summary>How many more independent basis rates would fix every flux.</summary>
    public int MissingBasisCount => Network.Model.Reactions.Count - Rank;

    /// <summary>True when the exchange rate of compound <paramref name="index"/> is fixed by the basis.</summary>
    public bool IsExchangeDetermined(int index) => _exchangeDetermined[index];

    /// <summary>True when the flux of reaction <paramref name="index"/> is fixed by the basis.</summary>
    public bool IsFluxDetermined(int index) => _fluxDetermined[index];

    /// <summary>A solution buffer sized for this network.</summary>
    public FluxSolution CreateSolution() =>
        new(Network.Model.Reactions.Count, Network.Model.Compounds.Count, Network.BalancedElements.Count + 1);

    /// <summary>Solves into a new buffer (allocates; for tools, not for the cycle).</summary>
    public FluxSolution Solve(ReadOnlySpan<double> basisValues, double biomassCmmolPerL)
    {
        var s = CreateSolution();
        Solve(basisValues, biomassCmmolPerL, s);
        return s;
    }

    /// <summary>
    /// Solves for <paramref name="basisValues"/> (in the order of <see cref="Basis"/>: reaction fluxes in
    /// mmol/(L·h), exchange rates in their rate units) with biomass <paramref name="biomassCmmolPerL"/>
    /// (C-mmol/L; used only by the maintenance demand, may be NaN without one). Allocation-free.
    /// </summary>
    public void Solve(ReadOnlySpan<double> basisValues, double biomassCmmolPerL, FluxSolution into)
    {
        if (basisValues.Length != Basis.Count)
        {
            throw new ArgumentException($"expected {Basis.Count} basis values ({string.Join(", ", Basis)}), got {basisValues.Length}", nameof(basisValues));
        }

        Array.Fill(into.Fluxes, double.NaN);
        Array.Fill(into.Exchange, double.NaN);
        Array.Fill(into.Closure, double.NaN);
        into.ConstraintResidual = double.NaN;
        into.DirectionViolations = 0;
        Array.Clear(_b);
        if (_maintenanceRow >= 0)
        {
            if (!double.IsFinite(biomassCmmolPerL) || biomassCmmolPerL < 0)
            {
                into.Status = FluxSolveStatus.BiomassConcentrationMissing;
                return;
            }

            _b[_maintenanceRow] = Network.Model.Maintenance!.AtpMmolPerCmmolBiomassPerH * biomassCmmolPerL;
        }

        for (int i = 0; i < basisValues.Length; i++)
        {
            if (!double.IsFinite(basisValues[i]))
            {
                into.Status = FluxSolveStatus.BasisNotFinite;
                return;
            }

            _b[_basisRow0 + i] = basisValues[i];
        }

        FluxArithmetic.Apply(_pinv, _b, into.Fluxes);
        into.ConstraintResidual = FluxArithmetic.MaxResidual(_a, into.Fluxes, _b);
        double scale = 1;
        foreach (double v in _b)
        {
            scale = Math.Max(scale, Math.Abs(v));
        }

        bool consistent = into.ConstraintResidual <= 1e-9 * scale;
        FluxArithmetic.Exchange(Network.Exchange, into.Fluxes, into.Exchange);
        Network.Closure(into.Exchange, into.Closure);
        for (int j = 0; j < into.Exchange.Length; j++)
        {
            if (!_exchangeDetermined[j])
            {
                into.Exchange[j] = double.NaN;
            }
        }

        var reactions = Network.Model.Reactions;
        for (int k = 0; k < into.Fluxes.Length; k++)
        {
            if (!_fluxDetermined[k])
            {
                into.Fluxes[k] = double.NaN;
            }
            else if (!reactions[k].Reversible && into.Fluxes[k] < -1e-9 * scale)
            {
                into.DirectionViolations++;
            }
        }

        if (Undetermined.Count > 0)
        {
            // The closure of a partly determined solution mixes in the minimum-norm values of the free fluxes.
            Array.Fill(into.Closure, double.NaN);
        }

        into.Status = !consistent ? FluxSolveStatus.Inconsistent
            : Undetermined.Count > 0 ? FluxSolveStatus.PartlyDetermined
            : FluxSolveStatus.Determined;
    }
}
