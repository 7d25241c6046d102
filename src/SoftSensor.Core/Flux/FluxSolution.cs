namespace SoftSensor.Core.Flux;

/// <summary>
/// The result of one solve, preallocated by <see cref="FluxSolver.CreateSolution"/> and overwritten by
/// every <see cref="FluxSolver.Solve(ReadOnlySpan{double}, double, FluxSolution)"/> (no allocation per cycle).
/// Undetermined values are NaN.
/// </summary>
public sealed class FluxSolution
{
    internal FluxSolution(int reactions, int compounds, int closure)
    {
        Fluxes = new double[reactions];
        Exchange = new double[compounds];
        Closure = new double[closure];
    }

    /// <summary>Outcome of the solve.</summary>
    public FluxSolveStatus Status { get; internal set; }

    /// <summary>Flux of each reaction in model order, mmol/(L·h) of reaction events (formula units as written).</summary>
    public double[] Fluxes { get; }

    /// <summary>Exchange rate of each compound in model order: C-mmol/(L·h) for organics, mmol/(L·h) otherwise; production &gt; 0.</summary>
    public double[] Exchange { get; }

    /// <summary>Elemental closure of <see cref="Exchange"/> per <see cref="FluxNetwork.ClosureLabels"/> (elements, then gamma).</summary>
    public double[] Closure { get; }

    /// <summary>Largest absolute residual of the constraints (S_int v, splits, basis) after the solve.</summary>
    public double ConstraintResidual { get; internal set; }

    /// <summary>Number of irreversible reactions that came out with a negative flux (a sign the basis or the network is wrong).</summary>
    public int DirectionViolations { get; internal set; }
}
