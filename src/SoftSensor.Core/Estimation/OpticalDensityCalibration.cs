namespace SoftSensor.Core.Estimation;

/// <summary>
/// Dry cell weight from an optical density through a linear calibration X = k·OD, with the standard
/// uncertainty by the law of propagation of uncertainty for uncorrelated inputs (JCGM 100:2008, GUM,
/// section 5.1.2, eq. (10)): u²(X) = (∂X/∂OD)²·u²(OD) + (∂X/∂k)²·u²(k) = (k·u(OD))² + (OD·u(k))².
/// First order: the term u²(OD)·u²(k) of a product is left out (GUM 5.1.2, note to eq. (10)).
/// </summary>
public static class OpticalDensityCalibration
{
    /// <summary>Dry cell weight, g/L, and its standard uncertainty, g/L.</summary>
    /// <param name="od">Optical density of the broth (dilution already accounted for), OD units.</param>
    /// <param name="odSigma">Standard uncertainty of the OD reading, OD units.</param>
    /// <param name="factorGPerLPerOd">Calibration factor k, g/L per OD unit.</param>
    /// <param name="factorSigmaGPerLPerOd">Standard uncertainty of k, g/L per OD unit.</param>
    public static (double DryWeightGPerL, double SigmaGPerL) DryWeight(double od, double odSigma, double factorGPerLPerOd, double factorSigmaGPerLPerOd)
    {
        double x = factorGPerLPerOd * od;
        double a = factorGPerLPerOd * odSigma;
        double b = od * factorSigmaGPerLPerOd;
        return (x, Math.Sqrt((a * a) + (b * b)));
    }
}
