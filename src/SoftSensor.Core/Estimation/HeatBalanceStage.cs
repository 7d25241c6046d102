using SoftSensor.Core.Signals;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// The jacket heat balance of the cycle (docs/pathway.md §4): Q_met = Q_cool + Q_loss - P_stirrer with
/// Q_cool = ρ F c_p (T_out - T_in) and, when only the speed is measured, P = N_p ρ N³ D⁵ per impeller
/// (Rushton, Costich &amp; Everett 1950, Chem. Eng. Prog. 46); the sensible heat of a temperature-
/// controlled broth is not modelled; the evaporation is, from the dry outlet flow saturated with water
/// at the broth temperature (<see cref="HeatBalanceSettings.EvaporationFromGas"/>). Heat-based OUR = Q_met / ΔH_ox / V, and the heat row in
/// <see cref="HeatConsistency"/>. Allocation-free per cycle.
/// </summary>
public sealed class HeatBalanceStage
{
    private readonly HeatBalanceSettings _s;
    private readonly HeatConsistency _gasOnly;
    private readonly HeatConsistency _withSubstrate;

    /// <summary>Builds the heat rows for the cycle's two measured sets.</summary>
    public HeatBalanceStage(StoichiometricModel model, IReadOnlyList<string> gasSet, IReadOnlyList<string> withSubstrate, HeatBalanceSettings settings, double alpha)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var errors = settings.Validate();
        if (errors.Count > 0)
        {
            throw new ArgumentException("heat balance settings: " + string.Join("; ", errors), nameof(settings));
        }

        _s = settings;
        _gasOnly = new HeatConsistency(model, gasSet, alpha);
        _withSubstrate = withSubstrate.Count == gasSet.Count ? _gasOnly : new HeatConsistency(model, withSubstrate, alpha);
    }

    /// <summary>The settings.</summary>
    public HeatBalanceSettings Settings => _s;

    /// <summary>Metabolic heat, W, and its standard uncertainty from the jacket inputs; false when a jacket input is missing or Bad.</summary>
    public bool MetabolicHeat(AlignedInputs inputs, double outletDryNlPerMin, out double watts, out double sigmaW)
    {
        watts = sigmaW = double.NaN;
        if (!Usable(inputs, SignalRole.CoolantFlowLPerH) || !Usable(inputs, SignalRole.CoolantInletTemperatureC) || !Usable(inputs, SignalRole.CoolantOutletTemperatureC))
        {
            return false;
        }

        double f = inputs[SignalRole.CoolantFlowLPerH];
        double dT = inputs[SignalRole.CoolantOutletTemperatureC] - inputs[SignalRole.CoolantInletTemperatureC];
        double k = _s.CoolantDensityKgPerL * _s.CoolantHeatCapacityKjPerKgK * 1000.0 / 3600.0; // W per (L/h · K)
        double cool = k * f * dT;
        double coolVar = (k * k) * ((Math.Pow(dT * f * _s.CoolantFlowRelativeSigma, 2)) + (f * f * 2 * _s.CoolantTemperatureSigmaK * _s.CoolantTemperatureSigmaK));
        double stirrer;
        if (Usable(inputs, SignalRole.StirrerPowerW))
        {
            stirrer = inputs[SignalRole.StirrerPowerW];
        }
        else if (!double.IsNaN(_s.PowerNumber) && Usable(inputs, SignalRole.StirrerSpeedRpm))
        {
            double n = inputs[SignalRole.StirrerSpeedRpm] / 60.0;
            stirrer = _s.Impellers * _s.PowerNumber * _s.BrothDensityKgPerL * 1000.0 * n * n * n * Math.Pow(_s.ImpellerDiameterM, 5);
        }
        else
        {
            return false;
        }

        double t = inputs.Has(SignalRole.TemperatureC) ? inputs[SignalRole.TemperatureC] : _s.AmbientTemperatureC;
        double loss = _s.HeatLossW + (_s.HeatLossWPerK * (t - _s.AmbientTemperatureC));
        double evap = 0;
        if (_s.EvaporationFromGas && double.IsFinite(outletDryNlPerMin) && inputs.Has(SignalRole.PressureKPa) && inputs.Has(SignalRole.TemperatureC))
        {
            // mol/h dry gas (NL at 0 °C, 101.325 kPa: 22.414 L/mol) × p_w / (P - p_w) × kJ/mol / 3.6 = W.
            double pw = Gas.WaterVapour.SaturationPressureKPa(t + 273.15);
            double p = inputs[SignalRole.PressureKPa];
            evap = p > pw ? outletDryNlPerMin * 60.0 / 22.414 * pw / (p - pw) * _s.LatentHeatKjPerMol / 3.6 : 0;
        }

        watts = cool + loss + evap - stirrer;
        sigmaW = Math.Sqrt(coolVar + (_s.HeatLossSigmaW * _s.HeatLossSigmaW) + Math.Pow(_s.StirrerPowerRelativeSigma * stirrer, 2));
        return double.IsFinite(watts);
    }

    /// <summary>Runs the heat balance of one cycle; <paramref name="measured"/> and <paramref name="covariance"/> are the elemental stage's (null when it did not run).</summary>
    public void Run(AlignedInputs inputs, double volumeL, double outletDryNlPerMin, bool withSubstrate, ReadOnlySpan<double> measured, ReadOnlySpan<double> covariance, ref HeatOutputs o)
    {
        o = HeatOutputs.Empty;
        o.Configured = true;
        var test = withSubstrate ? _withSubstrate : _gasOnly;
        o.Redundancy = test.Redundancy;
        if (!MetabolicHeat(inputs, outletDryNlPerMin, out double w, out double sw) || !(volumeL > 0))
        {
            return;
        }

        o.MetabolicW = w;
        o.MetabolicSigmaW = sw;
        // W → kJ/h is × 3.6; / (kJ/mol O2) → mol/h; × 1000 / V → mmol/(L·h).
        double perW = 3.6 / _s.OxycaloricKjPerMolO2 * 1000.0 / volumeL;
        o.OurMmolPerLh = w * perW;
        double rel = _s.OxycaloricRelativeSigma;
        o.OurSigmaMmolPerLh = Math.Sqrt((sw * perW * sw * perW) + Math.Pow(rel * o.OurMmolPerLh, 2));
        if (measured.Length == 0 || !double.IsFinite(measured[0]))
        {
            return;
        }

        var outcome = test.Test(measured, covariance, -o.OurMmolPerLh, o.OurSigmaMmolPerLh * o.OurSigmaMmolPerLh);
        o.H = outcome.H;
        o.Critical = outcome.Critical;
        o.Redundancy = outcome.DegreesOfFreedom;
        o.Isolated = outcome.Isolated;
    }

    private static bool Usable(AlignedInputs inputs, SignalRole role) =>
        inputs.Has(role) && inputs.QualityOf(role) != SampleQuality.Bad && double.IsFinite(inputs[role]);
}
