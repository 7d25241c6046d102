namespace SoftSensor.Simulation.Gas;

/// <summary>Saturation pressure of water (IAPWS-IF97, region 4, the saturation-pressure equation).</summary>
public static class WaterVapour
{
    // IAPWS R7-97(2012), "Revised Release on the IAPWS Industrial Formulation 1997", Eq. 30 and
    // Table 34 (coefficients n1..n10); check value p_s(300 K) = 3.53658941e-3 MPa (Table 35).
    private const double N1 = 0.11670521452767e4;
    private const double N2 = -0.72421316598739e6;
    private const double N3 = -0.17073846940092e2;
    private const double N4 = 0.12020824702470e5;
    private const double N5 = -0.32325550322333e7;
    private const double N6 = 0.14915108613530e2;
    private const double N7 = -0.48232657361591e4;
    private const double N8 = 0.40511340542057e6;
    private const double N9 = -0.23855557567849;
    private const double N10 = 0.65017534844798e3;

    /// <summary>Saturation pressure in kPa at <paramref name="temperatureK"/> (273.15 K to 647.096 K).</summary>
    public static double SaturationPressureKPa(double temperatureK)
    {
        double theta = temperatureK + N9 / (temperatureK - N10);
        double a = (theta * theta) + (N1 * theta) + N2;
        double b = (N3 * theta * theta) + (N4 * theta) + N5;
        double c = (N6 * theta * theta) + (N7 * theta) + N8;
        double root = 2 * c / (-b + Math.Sqrt((b * b) - (4 * a * c)));
        double pMPa = root * root * root * root;
        return pMPa * 1000.0;
    }
}
