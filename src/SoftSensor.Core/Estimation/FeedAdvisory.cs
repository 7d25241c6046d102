namespace SoftSensor.Core.Estimation;

/// <summary>
/// Feed advisory for a fed-batch (docs/methods.md §4). To hold mu at a setpoint,
/// F = (mu_set / Y_XS + m_S)·X·V / c_S,feed (Pirt 1965 substrate balance). The oxygen the vessel
/// can transfer, OTR_max = kLa·(C* - C_min) (docs/methods.md §1.6), caps the growth rate through Pirt's
/// law for oxygen, mu_max = (OTR_max / X - m_O)·Y_XO, and so the feed; the critical specific
/// uptake of overflow metabolism caps q_S = F·c_S / (X·V). Advisory only: an operator decides.
/// </summary>
public static class FeedAdvisory
{
    /// <summary>
    /// Computes the advice. <paramref name="ourMmolPerLh"/> and <paramref name="dissolvedOxygenPercent"/>
    /// give a kLa estimate, kLa = OTR / (C* - C), when both are known and the driving force is at
    /// least 5 % of saturation; otherwise the configured kLa serves.
    /// </summary>
    public static FeedAdvice Compute(double biomassG, double volumeL, double ourMmolPerLh, double dissolvedOxygenPercent,
        EstimatorSettings settings)
    {
        var f = settings.Feed;
        if (!(biomassG > 0 && volumeL > 0))
        {
            return new FeedAdvice(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, FeedLimit.None);
        }

        double cs = settings.FeedSubstrateGPerL;
        double x = biomassG / volumeL;
        double setpoint = ((f.MuSetpointPerH / f.YieldXSGPerG) + f.MaintenanceSGPerGh) * biomassG / cs;

        double cStar = f.OxygenSaturationMmolPerL;
        double kla = f.KlaPerH;
        if (double.IsFinite(ourMmolPerLh) && ourMmolPerLh > 0 && double.IsFinite(dissolvedOxygenPercent))
        {
            double drivingFraction = 1.0 - (dissolvedOxygenPercent / 100.0);
            if (drivingFraction >= 0.05)
            {
                kla = ourMmolPerLh / (cStar * drivingFraction);
            }
        }

        double otrMax = kla * cStar * (1.0 - f.MinimumDissolvedOxygenFraction);
        double muCap = ((otrMax / x) - settings.MaintenanceOMmolPerGh) * settings.YieldXOGPerMmol;
        double oxygenCap = Math.Max(((muCap / f.YieldXSGPerG) + f.MaintenanceSGPerGh) * biomassG / cs, 0.0);
        double overflowCap = f.CriticalSubstrateUptakeGPerGh * biomassG / cs;

        double advised = setpoint;
        var limit = FeedLimit.Setpoint;
        if (oxygenCap < advised)
        {
            advised = oxygenCap;
            limit = FeedLimit.OxygenTransfer;
        }

        if (overflowCap < advised)
        {
            advised = overflowCap;
            limit = FeedLimit.Overflow;
        }

        return new FeedAdvice(setpoint, oxygenCap, overflowCap, advised, otrMax, kla, limit);
    }
}
