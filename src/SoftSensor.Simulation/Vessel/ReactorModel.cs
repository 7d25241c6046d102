using SoftSensor.Simulation.Faults;
using SoftSensor.Simulation.Gas;
using SoftSensor.Simulation.Kinetics;
using SoftSensor.Simulation.Scenarios;
using S = SoftSensor.Simulation.Vessel.StateIndex;

namespace SoftSensor.Simulation.Vessel;

/// <summary>
/// Right-hand side of the fed-batch model: culture, liquid volume (feed, base, evaporation),
/// gas-liquid transfer of O2 and CO2 (kLa, Benson–Krause and Henry solubilities, carbonate
/// equilibrium at the controlled pH) and a well-mixed headspace at constant pressure whose outlet
/// flow follows from the mole balance, so that N2 + Ar are conserved (docs/methods.md §1.3). Time in h.
/// </summary>
internal sealed class ReactorModel
{
    private readonly Scenario _s;
    private readonly Schedule _schedule;
    private readonly FaultSchedule _faults;
    private readonly double _tK;
    private readonly double _pKPa;
    private readonly double _pwKPa;
    private readonly double _pwOutKPa;
    private readonly double _henryO2;
    private readonly double _henryCo2;
    private readonly double _ticPerCo2;
    private readonly double _refMolarVolume;
    private readonly double _molPerLGas;
    private double _klaFlowNl = double.NaN;
    private double _kla;

    public ReactorModel(Scenario s, CultureModel culture, Schedule schedule, FaultSchedule faults)
    {
        _s = s;
        Culture = culture;
        _schedule = schedule;
        _faults = faults;
        _tK = s.Vessel.TemperatureC + GasConstants.ZeroCelsiusK;
        _pKPa = s.Vessel.PressureKPa;
        _pwKPa = WaterVapour.SaturationPressureKPa(_tK);
        _pwOutKPa = s.Vessel.CondenserTemperatureC is { } tc ? WaterVapour.SaturationPressureKPa(tc + GasConstants.ZeroCelsiusK) : _pwKPa;
        _henryO2 = OxygenSolubility.HenryMmolPerLkPa(_tK) * s.Transfer.OxygenSolubilityFactor;
        _henryCo2 = CarbonateEquilibrium.HenryMmolPerLkPa(_tK);
        _ticPerCo2 = CarbonateEquilibrium.TicPerDissolvedCo2(_tK, s.Vessel.Ph, s.Transfer.Pk1MediumShift);
        _refMolarVolume = GasConstants.MolarVolumeLPerMol(s.Gas.ReferenceTemperatureC, s.Gas.ReferencePressureKPa);
        _molPerLGas = _pKPa / (GasConstants.R * _tK); // mol per L of dry headspace gas (kPa·L = J)
    }

    public CultureModel Culture { get; }

    /// <summary>The set points over time.</summary>
    public Schedule Schedule => _schedule;

    /// <summary>Dry headspace gas per litre, mol/L, at vessel pressure and temperature.</summary>
    public double MolPerLitreGas => _molPerLGas;

    /// <summary>Water vapour partial pressure at the liquid surface, kPa.</summary>
    public double WaterPressureKPa => _pwKPa;

    /// <summary>Total inorganic carbon per dissolved CO2 at the controlled pH.</summary>
    public double TicPerDissolvedCo2 => _ticPerCo2;

    /// <summary>O2 saturation (mmol/L) under a dry-basis headspace O2 fraction.</summary>
    public double OxygenSaturation(double yO2) => _henryO2 * yO2 * (_pKPa - _pwKPa);

    /// <summary>Dissolved CO2 (mmol/L) in equilibrium with a dry-basis headspace CO2 fraction.</summary>
    public double Co2Equilibrium(double yCo2) => _henryCo2 * yCo2 * (_pKPa - _pwKPa);

    /// <summary>Inlet dry molar flow (mol/h) and its O2 and CO2 fractions at hour <paramref name="tH"/>.</summary>
    public (double MolPerH, double YO2, double YCo2, double TotalNlPerMin) Inlet(double tH)
    {
        bool trip = _faults.AerationTripped(tH);
        double air = trip ? 0 : _schedule.AirNlPerMin(tH);
        double o2 = trip ? 0 : _schedule.OxygenNlPerMin(tH);
        double total = air + o2;
        double n = total * 60.0 / _refMolarVolume;
        if (total <= 0)
        {
            return (0, _s.Gas.AirO2Fraction, _s.Gas.AirCo2Fraction, 0);
        }

        return (n, ((air * _s.Gas.AirO2Fraction) + o2) / total, air * _s.Gas.AirCo2Fraction / total, total);
    }

    /// <summary>
    /// Backward-Euler step of dissolved O2 over <paramref name="h"/> hours from <paramref name="c0"/>:
    /// c = c0 + h (kLa (C* - c) - OUR(c) - c (dV/dt) / V), solved by safeguarded Newton on [0, max(c0, C*)]. The O2
    /// equation is stiff near zero DO (dOUR/dc ~ OUR_max/K_O2), where an explicit step of a second
    /// would oscillate; the implicit step is stable for any step (common practice for stiff ODEs).
    /// </summary>
    public double SolveOxygen(double tH, double h, ReadOnlySpan<double> y, double c0, Span<double> scratch)
    {
        var snap = Evaluate(tH, y, scratch);
        double v = y[S.VolumeL];
        double x = y[S.BiomassG] / v;
        double sub = y[S.SubstrateG] / v;
        double prod = y[S.OverflowG] / v;
        double kla = snap.KlaPerH;
        double cStar = snap.OxygenSaturationMmolPerL;
        double dilution = scratch[S.VolumeL] / v;
        // g(c) is increasing in c (OUR rises with c), so safeguarded Newton inside a shrinking bracket converges.
        double lo = 0;
        double hi = Math.Max(c0, cStar) + 1e-9;
        double cNow = Math.Clamp(c0, lo, hi);
        for (int i = 0; i < 60; i++)
        {
            double g = G(cNow);
            if (Math.Abs(g) < 1e-13)
            {
                break;
            }

            if (g > 0)
            {
                hi = cNow;
            }
            else
            {
                lo = cNow;
            }

            double d = Math.Max(1e-9, 1e-6 * cNow);
            double slope = (G(cNow + d) - g) / d;
            double next = cNow - (g / slope);
            cNow = next > lo && next < hi && double.IsFinite(next) ? next : 0.5 * (lo + hi);
            if (hi - lo < 1e-12)
            {
                break;
            }
        }

        return cNow;

        double G(double c) =>
            c - c0 - (h * ((kla * (cStar - c)) - Culture.Evaluate(x, sub, prod, c).OurMmolPerLh - (c * dilution)));
    }

    /// <summary>Writes dy/dt (per hour) for state <paramref name="y"/> at hour <paramref name="tH"/>; returns the instant's truth.</summary>
    public ReactorSnapshot Evaluate(double tH, ReadOnlySpan<double> y, Span<double> dy)
    {
        double v = y[S.VolumeL];
        double x = y[S.BiomassG] / v;
        double sub = y[S.SubstrateG] / v;
        double prod = y[S.OverflowG] / v;
        double c = y[S.OxygenMmolPerL];
        double tic = y[S.TicMmolPerL];
        double yO2 = y[S.HeadspaceO2];
        double yCo2 = y[S.HeadspaceCo2];

        Culture.At(tH);
        var r = Culture.Evaluate(x, sub, prod, c);
        double feed = _schedule.FeedLPerH(tH);
        double baseMolPerH = Math.Max(0, r.AmmoniaUptakeMmolPerLh + r.AcidMmolPerLh) * v / 1000.0;
        double baseL = baseMolPerH / _s.Base.ConcentrationMolPerL;

        var (nIn, yO2In, yCo2In, totalNl) = Inlet(tH);
        var tr = _s.Transfer;
        if (totalNl != _klaFlowNl)
        {
            _klaFlowNl = totalNl;
            _kla = Math.Max(tr.KlaMinimumPerH, tr.KlaPerH * Math.Pow(totalNl / tr.KlaReferenceFlowNlPerMin, tr.KlaFlowExponent));
        }

        double kla = _kla;
        double cStar = OxygenSaturation(yO2);
        double otr = kla * (cStar - c);
        double co2Aq = tic / _ticPerCo2;
        double ctr = kla * tr.Co2KlaRatio * (co2Aq - Co2Equilibrium(yCo2));

        // Outlet flow from the mole balance of the headspace at constant pressure; evaporation from
        // the water that the outlet gas carries, saturated at the broth (or condenser) temperature.
        double transferMolPerH = (ctr - otr) * v / 1000.0;
        double nOut0 = nIn + transferMolPerH;
        double evap = Math.Max(0, nOut0) * _pwOutKPa / (_pKPa - _pwOutKPa) * GasConstants.WaterGPerMol / 1000.0;
        double dv = feed + baseL - evap;
        double nHs = _molPerLGas * (_s.Vessel.TotalVolumeL - v);
        double dnHs = -_molPerLGas * dv;
        double nOut = nOut0 - dnHs;

        dy[S.VolumeL] = dv;
        dy[S.BiomassG] = r.BiomassCmmolPerLh / 1000.0 * Culture.BiomassGPerCmol * v;
        dy[S.SubstrateG] = (feed * _s.Feed.SubstrateGPerL) + (r.SubstrateCmmolPerLh / 1000.0 * Culture.SubstrateGPerCmol * v);
        dy[S.ByproductG] = double.IsNaN(Culture.ByproductGPerCmol) ? 0 : r.ByproductCmmolPerLh / 1000.0 * Culture.ByproductGPerCmol * v;
        dy[S.OverflowG] = double.IsNaN(Culture.OverflowGPerCmol) ? 0 : r.OverflowCmmolPerLh / 1000.0 * Culture.OverflowGPerCmol * v;
        // Dissolved O2 is held within a step and advanced by SolveOxygen afterwards (stiff near zero DO).
        dy[S.OxygenMmolPerL] = 0;
        dy[S.TicMmolPerL] = r.CerMmolPerLh - ctr - (tic * dv / v);
        dy[S.HeadspaceO2] = ((nIn * yO2In) - (nOut * yO2) - (otr * v / 1000.0) - (yO2 * dnHs)) / nHs;
        dy[S.HeadspaceCo2] = ((nIn * yCo2In) - (nOut * yCo2) + (ctr * v / 1000.0) - (yCo2 * dnHs)) / nHs;
        dy[S.CarbonFedCmmol] = feed * _s.Feed.SubstrateGPerL / Culture.SubstrateGPerCmol * 1000.0;
        dy[S.Co2NetOutMmol] = ((nOut * yCo2) - (nIn * yCo2In)) * 1000.0;
        dy[S.InertInMinusOutMmol] = ((nIn * (1 - yO2In - yCo2In)) - (nOut * (1 - yO2 - yCo2))) * 1000.0;
        dy[S.InertInMmol] = nIn * (1 - yO2In - yCo2In) * 1000.0;
        dy[S.FeedL] = feed;
        dy[S.BaseL] = baseL;
        dy[S.EvaporatedL] = evap;

        return new ReactorSnapshot(r, otr, ctr, kla, feed, baseL, evap, nIn, nOut, yO2In, yCo2In, nHs, cStar, co2Aq);
    }
}
