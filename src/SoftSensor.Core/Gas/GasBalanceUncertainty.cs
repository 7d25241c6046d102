namespace SoftSensor.Core.Gas;

/// <summary>
/// First-order propagation of independent standard uncertainties through the inert balance
/// (GUM, JCGM 100:2008, section 5.1 and eq. 13 for the covariance): cov = J diag(u²) Jᵀ, with the
/// Jacobian J of (OTR·V, CTR·V) written out analytically. With d = 1 - yO2_out - yCO2_out,
/// I = inert inlet molar flow and n_out = I / d:
///   outlet O2 (dry):  ∂OTR·V = -n_out (1 - yCO2_out) / d,  ∂CTR·V =  n_out yCO2_out / d
///   outlet CO2 (dry): ∂OTR·V = -n_out yO2_out / d,         ∂CTR·V =  n_out (1 - yO2_out) / d
///   line flow N_i (O2 a_i, CO2 c_i): ∂OTR·V = a_i - (1 - a_i - c_i) yO2_out / d,
///                                    ∂CTR·V = (1 - a_i - c_i) yCO2_out / d - c_i
///   measured inlet O2:  ∂OTR·V = n_in (1 - yCO2_out) / d,  ∂CTR·V = -n_in yCO2_out / d
///   measured inlet CO2: ∂OTR·V = n_in yO2_out / d,         ∂CTR·V = -n_in (1 - yO2_out) / d
/// The analyser's uncertainty applies to the value as read; on a wet basis the dry value's
/// uncertainty is u / (1 - y_H2O) (y_H2O itself taken as exact).
/// </summary>
internal static class GasBalanceUncertainty
{
    public static RateCovariance Propagate(in BalanceState s, in MeasurementAccuracy accuracy, double toMmolPerLh)
    {
        double d = s.OutletInertFraction;
        double yo = s.OutletO2Fraction;
        double yc = s.OutletCo2Fraction;
        double nOut = s.OutletMolPerH;
        double dryScale = 1.0 / (1.0 - s.WaterFraction);
        double uO2 = accuracy.O2PercentAbs / 100.0;
        double uCo2 = accuracy.Co2PercentAbs / 100.0;
        double uFlow = accuracy.FlowPercentOfReading / 100.0;

        var acc = default(Accumulator);
        acc.Add(-nOut * (1 - yc) / d, nOut * yc / d, uO2 * dryScale);
        acc.Add(-nOut * yo / d, nOut * (1 - yo) / d, uCo2 * dryScale);

        if (s.IsMeasuredInlet)
        {
            double nIn = s.InletMolPerH;
            acc.Add(nIn * (1 - yc) / d, -nIn * yc / d, uO2);
            acc.Add(nIn * yo / d, -nIn * (1 - yo) / d, uCo2);
            AddLine(ref acc, s.AirMolPerH, s.MeasuredO2, s.MeasuredCo2, yo, yc, d, uFlow);
            AddLine(ref acc, s.OxygenMolPerH, s.MeasuredO2, s.MeasuredCo2, yo, yc, d, uFlow);
            AddLine(ref acc, s.NitrogenMolPerH, s.MeasuredO2, s.MeasuredCo2, yo, yc, d, uFlow);
            AddLine(ref acc, s.CarbonDioxideMolPerH, s.MeasuredO2, s.MeasuredCo2, yo, yc, d, uFlow);
        }
        else
        {
            AddLine(ref acc, s.AirMolPerH, DryAir.O2Fraction, s.AirCo2, yo, yc, d, uFlow);
            AddLine(ref acc, s.OxygenMolPerH, 1, 0, yo, yc, d, uFlow);
            AddLine(ref acc, s.NitrogenMolPerH, 0, 0, yo, yc, d, uFlow);
            AddLine(ref acc, s.CarbonDioxideMolPerH, 0, 1, yo, yc, d, uFlow);
        }

        double k2 = toMmolPerLh * toMmolPerLh;
        return new RateCovariance(acc.OO * k2, acc.OC * k2, acc.CC * k2);
    }

    private static void AddLine(ref Accumulator acc, double molPerH, double a, double c, double yo, double yc, double d, double uRelative)
    {
        double inert = 1 - a - c;
        acc.Add(a - (inert * yo / d), (inert * yc / d) - c, molPerH * uRelative);
    }

    private struct Accumulator
    {
        public double OO;
        public double OC;
        public double CC;

        public void Add(double dOtr, double dCtr, double u)
        {
            double u2 = u * u;
            OO += dOtr * dOtr * u2;
            OC += dOtr * dCtr * u2;
            CC += dCtr * dCtr * u2;
        }
    }
}
