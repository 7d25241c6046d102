using System.Runtime.CompilerServices;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// Elemental balances of one model with one set of measured rates and specifications, factored once
/// (the base system and every diagnosis hypothesis); <see cref="Solve(ReadOnlySpan{double}, ReadOnlySpan{double}, Span{double}, Span{double})"/>
/// and <see cref="Diagnose"/> then allocate nothing. Not thread-safe: one solver per pipeline (it owns its scratch vectors).
/// Method: Wang &amp; Stephanopoulos 1983 (Biotechnol. Bioeng. 25); van der Heijden et al. 1994 (Biotechnol. Bioeng. 43, 44); docs/methods.md §2.
/// </summary>
public sealed class BalanceSolver
{
    private readonly BalanceKernel _base;
    private readonly BalanceKernel[] _hypothesisKernels;
    private readonly double[] _subQ, _subPsi, _work;
    private readonly HypothesisKind[] _kinds;

    internal BalanceSolver(BalanceSetup setup)
    {
        Model = setup.Model;
        Options = setup.Options;
        Compounds = setup.Columns;
        CompoundIds = setup.Columns.Select(c => c.Id).ToArray();
        MeasuredIds = setup.MeasuredIds;
        Specifications = setup.Specifications;
        var a = setup.ConstraintMatrix(setup.Columns);
        var sigmas = setup.RowSigmas(setup.Columns);
        _base = new BalanceKernel(a, setup.MeasuredColumns, Options.RankTolerance, Options.Alpha, sigmas);

        var hypotheses = new List<Hypothesis>();
        var kernels = new List<BalanceKernel>();
        for (int k = 0; k < setup.MeasuredColumns.Length; k++)
        {
            hypotheses.Add(new Hypothesis(HypothesisKind.MeasurementInError, MeasuredIds[k]));
            kernels.Add(new BalanceKernel(a, setup.MeasuredColumns.Where((_, i) => i != k).ToArray(), Options.RankTolerance, Options.Alpha, sigmas));
        }

        foreach (var candidate in setup.Candidates)
        {
            hypotheses.Add(new Hypothesis(HypothesisKind.MissingProduct, candidate.Id));
            kernels.Add(new BalanceKernel(setup.ConstraintMatrix([.. setup.Columns, candidate]), setup.MeasuredColumns, Options.RankTolerance, Options.Alpha, setup.RowSigmas([.. setup.Columns, candidate])));
        }

        Hypotheses = hypotheses;
        _kinds = hypotheses.Select(h => h.Kind).ToArray();
        _hypothesisKernels = [.. kernels];
        int m = MeasuredIds.Count;
        _subQ = new double[m];
        _subPsi = new double[m * m];
        _work = new double[Compounds.Count + 1];
        var sv = SingularValues.Of(setup.Model.ElementMatrix(setup.Columns), Options.RankTolerance * Math.Max(1.0, SingularValues.Largest(setup.Model.ElementMatrix(setup.Columns))));
        Analysis = new BalanceAnalysis
        {
            CompoundCount = Compounds.Count,
            BalanceCount = Model.Balances.Count,
            ElementMatrixRank = sv.Rank,
            IndependentSpecifications = _base.RankA - sv.Rank,
            MeasuredCount = m,
            Redundancy = _base.Redundancy,
            Calculable = _base.UnknownColumns.Where((_, j) => _base.Calculable[j]).Select(c => CompoundIds[c]).ToArray(),
            NotCalculable = _base.UnknownColumns.Where((_, j) => !_base.Calculable[j]).Select(c => CompoundIds[c]).ToArray(),
            MissingInformation = _base.Nullity,
            OutsideBalances = setup.OutsideBalances.Select(c => c.Id).ToArray(),
        };
    }

    /// <summary>The model.</summary>
    public StoichiometricModel Model { get; }

    /// <summary>Settings (alpha, rank tolerance).</summary>
    public BalanceSolverOptions Options { get; }

    /// <summary>The compounds in the balance, in the order of the result vectors.</summary>
    public IReadOnlyList<Compound> Compounds { get; }

    /// <summary>Ids of <see cref="Compounds"/>.</summary>
    public IReadOnlyList<string> CompoundIds { get; }

    /// <summary>Measured compounds, in the order of the measured vector and its covariance.</summary>
    public IReadOnlyList<string> MeasuredIds { get; }

    /// <summary>The specifications added to the balances.</summary>
    public IReadOnlyList<Specification> Specifications { get; }

    /// <summary>The structural analysis.</summary>
    public BalanceAnalysis Analysis { get; }

    /// <summary>The diagnosis hypotheses, in the order of <see cref="Diagnose"/>'s outcomes: each measurement, then each candidate product.</summary>
    public IReadOnlyList<Hypothesis> Hypotheses { get; }

    /// <summary>
    /// Builds a solver; returns false with an error naming the field (<c>measured[1]</c>, <c>specifications[0]</c>)
    /// when an id names no compound, appears twice, or a specification is malformed.
    /// </summary>
    public static bool TryCreate(
        StoichiometricModel model,
        IReadOnlyList<string> measuredIds,
        IReadOnlyList<Specification> specifications,
        BalanceSolverOptions? options,
        out BalanceSolver? solver,
        out string? error)
    {
        if (!BalanceSetup.TryCreate(model, measuredIds, specifications, options ?? BalanceSolverOptions.Default, out var setup, out error))
        {
            solver = null;
            return false;
        }

        solver = new BalanceSolver(setup!);
        return true;
    }

    /// <summary>Builds a solver; throws <see cref="ArgumentException"/> with the message of <see cref="TryCreate"/>.</summary>
    public static BalanceSolver Create(StoichiometricModel model, IReadOnlyList<string> measuredIds, IReadOnlyList<Specification>? specifications = null, BalanceSolverOptions? options = null) =>
        TryCreate(model, measuredIds, specifications ?? [], options, out var s, out string? e) ? s! : throw new ArgumentException(e);

    /// <summary>
    /// Reconciles the measurements and calculates the unknown rates.
    /// </summary>
    /// <param name="measured">Measured rates in <see cref="MeasuredIds"/> order.</param>
    /// <param name="covariance">Their covariance Psi, row-major (count² values; full, not only diagonal).</param>
    /// <param name="rates">Receives reconciled and calculated rates in <see cref="CompoundIds"/> order (NaN where not calculable).</param>
    /// <param name="sigmas">Receives their standard deviations (may be empty to skip).</param>
    public BalanceOutcome Solve(ReadOnlySpan<double> measured, ReadOnlySpan<double> covariance, Span<double> rates, Span<double> sigmas) =>
        Solve(measured, covariance, rates, sigmas, []);

    /// <summary>As <see cref="Solve(ReadOnlySpan{double}, ReadOnlySpan{double}, Span{double}, Span{double})"/>, also filling the full covariance of the results (row-major, compounds²).</summary>
    public BalanceOutcome Solve(ReadOnlySpan<double> measured, ReadOnlySpan<double> covariance, Span<double> rates, Span<double> sigmas, Span<double> resultCovariance)
    {
        int m = MeasuredIds.Count, n = Compounds.Count;
        CheckLengths(measured.Length, covariance.Length);
        if (rates.Length != n || (!sigmas.IsEmpty && sigmas.Length != n) || (!resultCovariance.IsEmpty && resultCovariance.Length != n * n))
        {
            throw new ArgumentException($"result spans must hold {n} rates, {n} sigmas (or none) and {n * n} covariances (or none); got {rates.Length}, {sigmas.Length}, {resultCovariance.Length}");
        }

        var status = _base.Solve(measured, covariance[..(m * m)], rates, sigmas, resultCovariance, out double h);
        return new BalanceOutcome(status, h, _base.Redundancy, _base.Critical);
    }

    /// <summary>
    /// Tests every hypothesis (each measurement in error, each candidate product missing) and concludes
    /// (van der Heijden et al. 1994b). <paramref name="outcomes"/> must hold <see cref="Hypotheses"/>.Count entries.
    /// </summary>
    public DiagnosisSummary Diagnose(ReadOnlySpan<double> measured, ReadOnlySpan<double> covariance, Span<HypothesisOutcome> outcomes)
    {
        CheckLengths(measured.Length, covariance.Length);
        if (outcomes.Length != Hypotheses.Count)
        {
            throw new ArgumentException($"outcomes must hold {Hypotheses.Count} entries, got {outcomes.Length}", nameof(outcomes));
        }

        var baseStatus = _base.Solve(measured, covariance, _work.AsSpan(0, Compounds.Count), [], [], out double h0);
        return DiagnoseCore(measured, covariance, outcomes, new BalanceOutcome(baseStatus, h0, _base.Redundancy, _base.Critical));
    }

    /// <summary>
    /// As <see cref="Diagnose"/>, for the cycle, which has just solved the same <paramref name="measured"/> and
    /// <paramref name="covariance"/> and passes that <paramref name="baseOutcome"/> instead of having it computed again.
    /// </summary>
    internal DiagnosisSummary DiagnoseAfterSolve(ReadOnlySpan<double> measured, ReadOnlySpan<double> covariance, Span<HypothesisOutcome> outcomes, in BalanceOutcome baseOutcome)
    {
        CheckLengths(measured.Length, covariance.Length);
        if (outcomes.Length != _kinds.Length)
        {
            throw new ArgumentException($"outcomes must hold {_kinds.Length} entries, got {outcomes.Length}", nameof(outcomes));
        }

        return DiagnoseCore(measured, covariance, outcomes, baseOutcome);
    }

    private DiagnosisSummary DiagnoseCore(ReadOnlySpan<double> measured, ReadOnlySpan<double> covariance, Span<HypothesisOutcome> outcomes, in BalanceOutcome baseOutcome)
    {
        int m = MeasuredIds.Count;
        int columns = Compounds.Count;
        int passing = 0, isolated = -1;
        for (int i = 0; i < _hypothesisKernels.Length; i++)
        {
            var kernel = _hypothesisKernels[i];
            ReadOnlySpan<double> q = measured, psi = covariance;
            int suspectColumn = columns;
            if (_kinds[i] == HypothesisKind.MeasurementInError)
            {
                int k = i;
                suspectColumn = _base.MeasuredColumns[k];
                CopyWithout(measured, covariance, k, m);
                q = _subQ.AsSpan(0, m - 1);
                psi = _subPsi.AsSpan(0, (m - 1) * (m - 1));
            }

            bool ok = kernel.TestHypothesis(q, psi, suspectColumn, out double h, out double suspectRate);
            var outcome = new HypothesisOutcome(ok ? h : double.NaN, kernel.Redundancy, kernel.Critical, ok ? suspectRate : double.NaN);
            outcomes[i] = outcome;
            if (outcome.Consistent)
            {
                passing++;
                isolated = i;
            }
        }

        var verdict = !baseOutcome.HasRates ? DiagnosisVerdict.Failed
            : _base.Redundancy == 0 ? DiagnosisVerdict.NotTestable
            : baseOutcome.Consistent ? DiagnosisVerdict.NotNeeded
            : _base.Redundancy == 1 ? DiagnosisVerdict.DetectedNotIsolable
            : passing == 1 ? DiagnosisVerdict.Isolated
            : passing > 1 ? DiagnosisVerdict.Ambiguous
            : DiagnosisVerdict.Unexplained;
        return new DiagnosisSummary(verdict, baseOutcome, verdict == DiagnosisVerdict.Isolated ? isolated : -1);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void CheckLengths(int measured, int covariance)
    {
        int m = _subQ.Length;
        if (measured != m || covariance != m * m)
        {
            WrongLengths(measured, covariance);
        }
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private void WrongLengths(int measured, int covariance)
    {
        int m = MeasuredIds.Count;
        throw new ArgumentException($"expected {m} measured rates ({string.Join(", ", MeasuredIds)}) and {m * m} covariance entries; got {measured} and {covariance}");
    }

    private void CopyWithout(ReadOnlySpan<double> q, ReadOnlySpan<double> psi, int skip, int m)
    {
        int r = 0;
        for (int i = 0; i < m; i++)
        {
            if (i == skip)
            {
                continue;
            }

            _subQ[r] = q[i];
            int c = 0;
            for (int j = 0; j < m; j++)
            {
                if (j != skip)
                {
                    _subPsi[(r * (m - 1)) + c++] = psi[(i * m) + j];
                }
            }

            r++;
        }
    }
}
