namespace SoftSensor.Core.Gas;

/// <summary>
/// The 2x2 covariance of (OTR, CTR) in (mmol/(L·h))². Not diagonal: both rates share the
/// inert-balance outlet flow and the inlet flows (docs/methods.md §2.4), so the stoichiometric
/// reconciliation needs the off-diagonal term.
/// </summary>
/// <param name="OurOur">Variance of OTR.</param>
/// <param name="OurCer">Covariance of OTR and CTR.</param>
/// <param name="CerCer">Variance of CTR.</param>
public readonly record struct RateCovariance(double OurOur, double OurCer, double CerCer)
{
    /// <summary>All NaN (no balance was computed).</summary>
    public static RateCovariance Undefined { get; } = new(double.NaN, double.NaN, double.NaN);

    /// <summary>Correlation coefficient of OTR and CTR (NaN when a variance is zero).</summary>
    public double Correlation => OurOur > 0 && CerCer > 0 ? OurCer / Math.Sqrt(OurOur * CerCer) : double.NaN;
}
