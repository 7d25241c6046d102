namespace SoftSensor.Core.Estimation;

/// <summary>
/// Biomass by integrating the reconciled growth rate with volume tracking and removals
/// (docs/methods.md §4): d(X·V)/dt = r_X·V - (biomass removed by samples and harvest), with the
/// variance propagated for the Kalman update of offline samples.
/// </summary>
public static class BiomassIntegrator
{
    /// <summary>Advances X·V over one step (removal first, then growth over the step).</summary>
    public static void Advance(ref ObserverStates s, in ObserverInputs u, EstimatorSettings settings)
    {
        double keep = 1.0 - u.RemovedFraction;
        double xv = s.BiomassG * keep;
        double p = s.BiomassVarG2 * keep * keep;
        if (u.DtH > 0 && double.IsFinite(u.GrowthGPerLh))
        {
            double gain = u.GrowthGPerLh * u.VolumeL * u.DtH;
            double sigma = u.GrowthSigmaGPerLh * u.VolumeL * u.DtH;
            xv += gain;
            double drift = settings.BiomassDriftRelPerSqrtH * xv;
            p += (sigma * sigma) + (drift * drift * u.DtH);
        }

        s.BiomassG = Math.Max(xv, 0.0);
        s.BiomassVarG2 = p;
    }

    /// <summary>
    /// Kalman update of X·V with an offline measurement of X (g/L) whose assay variance is
    /// <paramref name="assayVarG2PerL2"/>; the volume is that of the sampling time.
    /// </summary>
    public static void Correct(ref ObserverStates s, double volumeL, double measuredGPerL, double assayVarG2PerL2)
    {
        double x = s.BiomassG / volumeL;
        double px = s.BiomassVarG2 / (volumeL * volumeL);
        double k = px / (px + assayVarG2PerL2);
        s.BiomassG = Math.Max((x + (k * (measuredGPerL - x))) * volumeL, 0.0);
        s.BiomassVarG2 *= 1.0 - k;
    }
}
