using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Gas;

/// <summary>
/// The inert-gas balance over the vessel (docs/methods.md §1.1-1.3): molar flows from the gas lines at
/// their MFC reference conditions, the inlet composition, the dry outlet composition, and
///   n_out = n_in (1 - yO2_in - yCO2_in) / (1 - yO2_out - yCO2_out)
///   OTR = (n_in yO2_in - n_out yO2_out) / V_L,   CTR = (n_out yCO2_out - n_in yCO2_in) / V_L,
///   RQ = CTR / OTR.
/// Allocation-free; every everyday failure is a flag in the result.
/// </summary>
public static class GasBalance
{
    /// <summary>Computes one balance.</summary>
    /// <param name="flows">Gas-line flows, NL/min at <see cref="GasBalanceSettings.Reference"/>.</param>
    /// <param name="inlet">Inlet composition (gas-line mix or measured reference).</param>
    /// <param name="outlet">Off-gas analyser reading.</param>
    /// <param name="liquidVolumeL">Liquid volume, L.</param>
    /// <param name="settings">Reference conditions, accuracies and plausibility limits.</param>
    public static GasBalanceResult Compute(
        in GasLineFlows flows, in InletComposition inlet, in AnalyserReading outlet, double liquidVolumeL, in GasBalanceSettings settings)
    {
        var flags = GasBalanceFlags.None;
        if (!flows.IsValid)
        {
            flags |= GasBalanceFlags.FlowOutOfRange;
        }

        double totalNlPerMin = flows.TotalNlPerMin;
        if (flows.IsValid && (totalNlPerMin <= 0 || totalNlPerMin < settings.MinAerationNlPerMin))
        {
            flags |= GasBalanceFlags.AerationBelowMinimum;
        }

        if (!(double.IsFinite(liquidVolumeL) && liquidVolumeL > 0))
        {
            flags |= GasBalanceFlags.VolumeOutOfRange;
        }

        if (!settings.Reference.IsValid || !settings.Accuracy.IsValid)
        {
            flags |= GasBalanceFlags.ConditionsOutOfRange;
        }

        flags |= CheckInlet(inlet);
        double water = outlet.WaterMoleFraction;
        bool waterKnown = true;
        if (outlet.Basis == AnalyserBasis.Saturated && !double.IsFinite(water))
        {
            flags |= GasBalanceFlags.ConditionsOutOfRange;
            waterKnown = false;
        }
        else if (!(IsFraction(water) && water < 1))
        {
            flags |= GasBalanceFlags.FractionOutOfRange;
            waterKnown = false;
        }

        // Dry basis: y_dry = y_read / (1 - y_H2O) (docs/methods.md §1.3).
        double yo = outlet.O2Fraction / (1 - water);
        double yc = outlet.Co2Fraction / (1 - water);
        if (!IsFraction(outlet.O2Fraction) || !IsFraction(outlet.Co2Fraction) || (waterKnown && !(yo + yc < 1)))
        {
            flags |= GasBalanceFlags.FractionOutOfRange;
        }

        if ((flags & ~GasBalanceFlags.AerationBelowMinimum) != 0 || totalNlPerMin <= 0)
        {
            return GasBalanceResult.Failed(flags);
        }

        var state = new BalanceState(flows, inlet, yo, yc, water, settings.Reference.MolarVolumeLPerMol);
        return Finish(state, totalNlPerMin, liquidVolumeL, settings, flags);
    }

    /// <summary>Computes one balance from a cycle's aligned inputs (see <see cref="AlignedGasBalanceSettings"/>).</summary>
    public static GasBalanceResult Compute(AlignedInputs inputs, in AlignedGasBalanceSettings settings) =>
        AlignedGasBalance.Compute(inputs, settings);

    private static GasBalanceResult Finish(in BalanceState s, double inletNlPerMin, double liquidVolumeL, in GasBalanceSettings settings, GasBalanceFlags flags)
    {
        double toMmolPerLh = 1000.0 / liquidVolumeL;
        double otr = s.OtrMolPerH * toMmolPerLh;
        double ctr = s.CtrMolPerH * toMmolPerLh;

        double inertIn = s.InertInMolPerH / s.InletMolPerH;
        double inertOut = s.OutletInertFraction;
        if (inertIn < settings.MinInertFraction || Math.Abs(inertOut - inertIn) > settings.MaxInertFractionChange * inertIn)
        {
            flags |= GasBalanceFlags.InertFractionImplausible;
        }

        // Round-off tolerance: a part in 1e9 of the O2 carried in (zero uptake then gives OTR = 0 unflagged).
        double tolerance = 1e-9 * s.O2InMolPerH * toMmolPerLh;
        if (otr < -tolerance)
        {
            flags |= GasBalanceFlags.NegativeOtr;
        }

        double rq = double.NaN;
        if (otr > tolerance)
        {
            rq = ctr / otr;
        }
        else
        {
            flags |= GasBalanceFlags.RqUndefined;
        }

        var cov = GasBalanceUncertainty.Propagate(s, settings.Accuracy, toMmolPerLh);
        double rqSigma = double.NaN;
        if (double.IsFinite(rq))
        {
            // RQ = C/O: var = var_C/O^2 + C^2 var_O/O^4 - 2 C cov/O^3 (GUM, JCGM 100:2008, eq. 13).
            double varRq = (cov.CerCer / (otr * otr)) + (ctr * ctr * cov.OurOur / (otr * otr * otr * otr)) - (2 * ctr * cov.OurCer / (otr * otr * otr));
            rqSigma = Math.Sqrt(Math.Max(varRq, 0));
        }

        double vm = s.MolarVolumeLPerMol;
        return new GasBalanceResult(
            otr, ctr, rq, Math.Sqrt(cov.OurOur), Math.Sqrt(cov.CerCer), rqSigma, cov,
            inletNlPerMin, s.OutletMolPerH * vm / 60.0,
            s.O2InMolPerH / s.InletMolPerH, s.Co2InMolPerH / s.InletMolPerH, s.OutletO2Fraction, s.OutletCo2Fraction, s.WaterFraction,
            flags, flags.ToQuality());
    }

    private static GasBalanceFlags CheckInlet(in InletComposition inlet)
    {
        bool ok = inlet.Source switch
        {
            InletSource.GasLines => IsFraction(inlet.AirCo2Fraction) && DryAir.O2Fraction + inlet.AirCo2Fraction < 1,
            InletSource.Measured => IsFraction(inlet.O2Fraction) && IsFraction(inlet.Co2Fraction) && inlet.O2Fraction + inlet.Co2Fraction < 1,
            _ => false,
        };
        return ok ? GasBalanceFlags.None : GasBalanceFlags.FractionOutOfRange;
    }

    private static bool IsFraction(double y) => y >= 0 && y <= 1;
}
