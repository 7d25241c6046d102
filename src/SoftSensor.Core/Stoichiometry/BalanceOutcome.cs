namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// The result of one solve: status and the χ² consistency test (docs/methods.md §2.4). Without redundancy
/// (<see cref="Dof"/> = 0) there is no test and <see cref="Consistent"/> is true by default.
/// </summary>
/// <param name="Status">How the solve ended.</param>
/// <param name="H">The test statistic h = eps^T Phi^-1 eps (0 without redundancy, NaN when not computed).</param>
/// <param name="Dof">Redundancy rho: degrees of freedom of the χ² test.</param>
/// <param name="Critical">χ² (1 - alpha) quantile with <see cref="Dof"/> degrees of freedom (NaN without redundancy).</param>
public readonly record struct BalanceOutcome(BalanceStatus Status, double H, int Dof, double Critical)
{
    /// <summary>True when rates were computed.</summary>
    public bool HasRates => Status is BalanceStatus.Solved or BalanceStatus.PartlyDetermined;

    /// <summary>True when the measurements are redundant and the test was computed.</summary>
    public bool HasTest => HasRates && Dof > 0;

    /// <summary>False only when the test ran and h exceeded the critical value.</summary>
    public bool Consistent => !HasTest || H <= Critical;
}
