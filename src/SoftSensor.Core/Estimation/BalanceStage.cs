using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// One factored elemental balance of the cycle for one measured set (docs/methods.md §2.4): the solver,
/// preallocated vectors, the positions of the compounds the cycle reads, and the diagnosis texts.
/// Solve and Diagnose allocate nothing.
/// </summary>
internal sealed class BalanceStage
{
    private readonly BalanceSolver _solver;
    private readonly HypothesisOutcome[] _outcomes;
    private readonly string[] _suspects;
    private BalanceOutcome _last;

    public BalanceStage(StoichiometricModel model, IReadOnlyList<string> measured, double alpha)
    {
        if (!BalanceSolver.TryCreate(model, measured, [], new BalanceSolverOptions { Alpha = alpha }, out var solver, out var error))
        {
            throw new ArgumentException($"balance over measured ({string.Join(", ", measured)}): {error}", nameof(measured));
        }

        _solver = solver!;
        Measured = new double[measured.Count];
        Covariance = new double[measured.Count * measured.Count];
        Rates = new double[_solver.CompoundIds.Count];
        Sigmas = new double[_solver.CompoundIds.Count];
        _outcomes = new HypothesisOutcome[_solver.Hypotheses.Count];
        _suspects = _solver.Hypotheses.Select(h => h.Kind == HypothesisKind.MeasurementInError ? h.CompoundId : h.CompoundId + " missing").ToArray();
    }

    /// <summary>Measured rates, in the order given at construction.</summary>
    public double[] Measured { get; }

    /// <summary>Their covariance, row-major.</summary>
    public double[] Covariance { get; }

    /// <summary>Reconciled and calculated rates in the solver's compound order.</summary>
    public double[] Rates { get; }

    /// <summary>Their standard deviations.</summary>
    public double[] Sigmas { get; }

    /// <summary>Redundancy of the measured set.</summary>
    public int Redundancy => _solver.Analysis.Redundancy;

    /// <summary>Index of a compound in <see cref="Rates"/> (-1 when absent).</summary>
    public int IndexOf(string id)
    {
        for (int i = 0; i < _solver.CompoundIds.Count; i++)
        {
            if (_solver.CompoundIds[i] == id)
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>Reconciles and tests.</summary>
    public BalanceOutcome Solve() => _last = _solver.Solve(Measured, Covariance, Rates, Sigmas);

    /// <summary>The hypothesis the diagnosis isolates (a measurement id, or "product missing"), or null when none is isolated; after <see cref="Solve"/> on the same inputs.</summary>
    public string? Diagnose(out DiagnosisVerdict verdict)
    {
        var summary = _solver.DiagnoseAfterSolve(Measured, Covariance, _outcomes, _last);
        verdict = summary.Verdict;
        return summary.IsolatedIndex >= 0 ? _suspects[summary.IsolatedIndex] : null;
    }
}
