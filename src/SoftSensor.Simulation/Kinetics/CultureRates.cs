namespace SoftSensor.Simulation.Kinetics;

/// <summary>
/// Volumetric rates of the simulated culture at one instant, production positive (docs/methods.md
/// conventions): C-mmol/(L·h) for organics, mmol/(L·h) for O2 and CO2; OUR and CER positive.
/// </summary>
public readonly record struct CultureRates(
    double MuPerH,
    double QsGPerGH,
    double BiomassCmmolPerLh,
    double SubstrateCmmolPerLh,
    double ByproductCmmolPerLh,
    double OverflowCmmolPerLh,
    double OurMmolPerLh,
    double CerMmolPerLh,
    double AmmoniaUptakeMmolPerLh,
    double AcidMmolPerLh)
{
    /// <summary>Respiratory quotient CER/OUR (NaN when OUR is zero).</summary>
    public double Rq => OurMmolPerLh > 0 ? CerMmolPerLh / OurMmolPerLh : double.NaN;
}
