namespace SoftSensor.Core.Estimation;

/// <summary>
/// Second biomass observer: an extended Kalman filter on [X·V, mu] with Pirt's law for oxygen as
/// measurement model, OUR = (mu / Y_XO + m_O)·X (Jenzsch et al. 2006, J. Biotechnol.; from memory;
/// Pirt 1965, Proc. R. Soc. B 163 for the maintenance model). Process model: d(X·V)/dt = mu·X·V,
/// mu a random walk. Offline samples enter as a measurement of X = X·V / V.
/// </summary>
public static class PirtEkf
{
    /// <summary>Removal, prediction over the step, then the OUR measurement update when OUR is known.</summary>
    public static void Advance(ref ObserverStates s, in ObserverInputs u, EstimatorSettings settings)
    {
        double keep = 1.0 - u.RemovedFraction;
        double xv = s.EkfBiomassG * keep;
        double mu = s.EkfMuPerH;
        double p00 = s.EkfP00 * keep * keep;
        double p01 = s.EkfP01 * keep;
        double p11 = s.EkfP11;

        double dt = u.DtH;
        if (dt > 0)
        {
            double e = Math.Exp(mu * dt);
            double f01 = xv * dt * e;
            xv *= e;
            // P' = F P F^T + Q with F = [[e, f01], [0, 1]].
            double n00 = (e * e * p00) + (2 * e * f01 * p01) + (f01 * f01 * p11);
            double n01 = (e * p01) + (f01 * p11);
            double drift = settings.BiomassDriftRelPerSqrtH * xv;
            double q = settings.EkfMuNoisePerHSqrtH;
            p00 = n00 + (drift * drift * dt);
            p01 = n01;
            p11 += q * q * dt;
        }

        double v = u.VolumeL;
        double sigma = u.OurSigmaMmolPerLh;
        if (double.IsFinite(u.OurMmolPerLh) && v > 0 && sigma > 0)
        {
            double yxo = settings.YieldXOGPerMmol;
            double specific = (mu / yxo) + settings.MaintenanceOMmolPerGh;
            double predicted = specific * xv / v;
            double h0 = specific / v;
            double h1 = xv / (yxo * v);
            double ph0 = (p00 * h0) + (p01 * h1);
            double ph1 = (p01 * h0) + (p11 * h1);
            double innovationVar = (h0 * ph0) + (h1 * ph1) + (sigma * sigma);
            double k0 = ph0 / innovationVar;
            double k1 = ph1 / innovationVar;
            double r = u.OurMmolPerLh - predicted;
            xv += k0 * r;
            mu += k1 * r;
            p00 -= k0 * ph0;
            p01 -= k0 * ph1;
            p11 -= k1 * ph1;
        }

        s.EkfBiomassG = Math.Max(xv, 0.0);
        s.EkfMuPerH = mu;
        s.EkfP00 = p00;
        s.EkfP01 = p01;
        s.EkfP11 = p11;
    }

    /// <summary>Measurement update with an offline X (g/L) of assay variance <paramref name="assayVarG2PerL2"/>.</summary>
    public static void Correct(ref ObserverStates s, double volumeL, double measuredGPerL, double assayVarG2PerL2)
    {
        double h0 = 1.0 / volumeL;
        double ph0 = s.EkfP00 * h0;
        double ph1 = s.EkfP01 * h0;
        double innovationVar = (h0 * ph0) + assayVarG2PerL2;
        double k0 = ph0 / innovationVar;
        double k1 = ph1 / innovationVar;
        double r = measuredGPerL - (s.EkfBiomassG * h0);
        s.EkfBiomassG = Math.Max(s.EkfBiomassG + (k0 * r), 0.0);
        s.EkfMuPerH += k1 * r;
        double p00 = s.EkfP00 - (k0 * ph0);
        double p01 = s.EkfP01 - (k0 * ph1);
        double p11 = s.EkfP11 - (k1 * ph1);
        s.EkfP00 = p00;
        s.EkfP01 = p01;
        s.EkfP11 = p11;
    }
}
