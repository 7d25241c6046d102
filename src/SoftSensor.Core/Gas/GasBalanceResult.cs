using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Gas;

/// <summary>
/// One gas balance. Rates in mmol/(L·h) referred to the liquid volume, reported positive
/// (OUR = OTR = -r_O2, CER = CTR = r_CO2; docs/methods.md conventions). <see cref="CerMmolPerLh"/> is the
/// CO2 transfer rate: the dissolved-CO2 correction (<see cref="DissolvedCarbonDioxide"/>) is applied
/// by the caller that can difference it over time. Values are NaN when they could not be computed.
/// </summary>
/// <param name="OurMmolPerLh">Oxygen uptake (transfer) rate.</param>
/// <param name="CerMmolPerLh">CO2 evolution rate as transferred to the gas (CTR).</param>
/// <param name="Rq">Respiratory quotient CTR/OTR (NaN when undefined).</param>
/// <param name="OurSigmaMmolPerLh">Propagated standard uncertainty of OTR.</param>
/// <param name="CerSigmaMmolPerLh">Propagated standard uncertainty of CTR.</param>
/// <param name="RqSigma">Propagated standard uncertainty of RQ (with the OTR/CTR covariance).</param>
/// <param name="Covariance">Covariance of (OTR, CTR).</param>
/// <param name="InletFlowNlPerMin">Total inlet flow at the reference conditions.</param>
/// <param name="OutletFlowNlPerMin">Dry outlet flow from the inert balance, at the reference conditions.</param>
/// <param name="InletO2Fraction">Dry inlet O2 mole fraction used.</param>
/// <param name="InletCo2Fraction">Dry inlet CO2 mole fraction used.</param>
/// <param name="OutletO2DryFraction">Dry outlet O2 mole fraction used.</param>
/// <param name="OutletCo2DryFraction">Dry outlet CO2 mole fraction used.</param>
/// <param name="OutletWaterFraction">H2O mole fraction of the analysed sample (0 when dry).</param>
/// <param name="Flags">Data-quality findings.</param>
/// <param name="Quality">Overall quality implied by <paramref name="Flags"/>.</param>
public readonly record struct GasBalanceResult(
    double OurMmolPerLh,
    double CerMmolPerLh,
    double Rq,
    double OurSigmaMmolPerLh,
    double CerSigmaMmolPerLh,
    double RqSigma,
    RateCovariance Covariance,
    double InletFlowNlPerMin,
    double OutletFlowNlPerMin,
    double InletO2Fraction,
    double InletCo2Fraction,
    double OutletO2DryFraction,
    double OutletCo2DryFraction,
    double OutletWaterFraction,
    GasBalanceFlags Flags,
    SampleQuality Quality)
{
    /// <summary>A result with no numbers, only the flags that prevented the balance.</summary>
    public static GasBalanceResult Failed(GasBalanceFlags flags) => new(
        double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, RateCovariance.Undefined,
        double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN,
        flags, flags.ToQuality());
}
