namespace SoftSensor.Core.Stoichiometry;

/// <summary>Settings fixed when a solver is built.</summary>
public sealed record BalanceSolverOptions
{
    /// <summary>Significance level of the χ² test (0.05: a 5 % false-alarm rate, common practice).</summary>
    public double Alpha { get; init; } = 0.05;

    /// <summary>Singular values at or below this fraction of the largest count as zero when ranks are decided.</summary>
    public double RankTolerance { get; init; } = 1e-9;

    /// <summary>The defaults.</summary>
    public static BalanceSolverOptions Default { get; } = new();
}
