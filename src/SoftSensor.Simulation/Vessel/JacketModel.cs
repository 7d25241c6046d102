using SoftSensor.Simulation.Kinetics;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Simulation.Vessel;

/// <summary>
/// The jacket of the virtual vessel (docs/pathway.md §6). The culture's heat is its own enthalpy
/// balance: the heats of combustion of what it takes up minus those of what it makes (Roels 1983,
/// Energetics and Kinetics in Biotechnology, ch. 3), with tabulated values per C-mol where the
/// scenario gives them and biomass from its degree of reduction at about 111 kJ per mol of electrons
/// (Patel &amp; Erickson 1981, Biotechnol. Bioeng. 23; from memory), not the estimator's 460 kJ/mol O2.
/// The coolant takes that heat plus the stirrer's, minus the loss to the room, the evaporation
/// (latent heat of water about 2410 kJ/kg near 37 °C, steam tables; from memory) and the warming of
/// the feed (about 4 kJ/(L·K), common practice for aqueous feeds).
/// </summary>
internal sealed class JacketModel(JacketSpec spec, CultureModel culture, double brothC)
{
    private const double LatentKjPerKg = 2410;
    private const double FeedKjPerLK = 4.0;
    private const double CoolantKjPerLK = 0.997 * 4.18; // water, CRC Handbook

    public JacketSpec Spec => spec;

    /// <summary>Metabolic heat of the culture, W, from its volumetric rates and the volume.</summary>
    public double MetabolicW(in CultureRates r, double volumeL)
    {
        double hs = Heat(spec.SubstrateKjPerCmol, culture.Substrate);
        double hx = spec.BiomassKjPerElectronMol * culture.Biomass.Gamma;
        double hb = culture.Byproduct is { } b ? Heat(spec.ByproductKjPerCmol, b) : 0;
        double hp = culture.Overflow is { } p ? Heat(spec.OverflowKjPerCmol, p) : 0;
        // C-mmol/(L·h) × kJ/C-mol × L / 1000 = kJ/h; / 3.6 = W. Uptake is negative in r.
        double kjPerH = ((-r.SubstrateCmmolPerLh * hs) - (r.BiomassCmmolPerLh * hx) - (r.ByproductCmmolPerLh * hb) - (r.OverflowCmmolPerLh * hp)) * volumeL / 1000.0;
        return kjPerH / 3.6;
    }

    /// <summary>Heat the coolant takes, W.</summary>
    public double CoolantW(double metabolicW, double evaporationLPerH, double feedLPerH)
    {
        double loss = spec.LossWPerK * (brothC - spec.AmbientC);
        double evap = evaporationLPerH * LatentKjPerKg / 3.6;
        double feed = feedLPerH * FeedKjPerLK * (brothC - spec.FeedC) / 3.6;
        return metabolicW + spec.StirrerPowerW - loss - evap - feed;
    }

    /// <summary>Coolant outlet temperature for the heat it takes, °C.</summary>
    public double OutletC(double coolantW) => spec.CoolantInletC + (coolantW * 3.6 / (CoolantKjPerLK * spec.CoolantFlowLPerH));

    private double Heat(double tabulated, CompoundInfo c) => double.IsFinite(tabulated) ? tabulated : spec.BiomassKjPerElectronMol * c.Gamma;
}
