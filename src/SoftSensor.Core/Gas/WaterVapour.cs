namespace SoftSensor.Core.Gas;

/// <summary>
/// Saturation pressure of water from the IAPWS Industrial Formulation 1997, region 4 (the
/// saturation-pressure equation, eq. 30 of the IAPWS-IF97 revised release, IAPWS R7-97(2012)),
/// valid from the triple point 273.15 K to the critical point 647.096 K. Verification values of the
/// release (table 35): 300 K 3.536 589 41e-3 MPa, 500 K 2.638 897 76 MPa, 600 K 12.344 314 6 MPa.
/// </summary>
public static class WaterVapour
{
    /// <summary>Lowest temperature of region 4, K (IAPWS-IF97).</summary>
    public const double MinTemperatureK = 273.15;

    /// <summary>Critical temperature of water, K (IAPWS-IF97).</summary>
    public const double CriticalTemperatureK = 647.096;

    // Coefficients n1..n10 of the region-4 equations (IAPWS-IF97, table 34).
    private const double N1 = 0.11670521452767e4;
    private const double N2 = -0.72421316703206e6;
    private const double N3 = -0.17073846940092e2;
    private const double N4 = 0.12020824702470e5;
    private const double N5 = -0.32325550322333e7;
    private const double N6 = 0.14915108613530e2;
    private const double N7 = -0.48232657361591e4;
    private const double N8 = 0.40511340542057e6;
    private const double N9 = -0.23855557567849;
    private const double N10 = 0.65017534844798e3;

    /// <summary>Saturation pressure in MPa at <paramref name="temperatureK"/>; NaN outside 273.15-647.096 K.</summary>
    public static double SaturationPressureMPa(double temperatureK)
    {
        if (!(temperatureK >= MinTemperatureK && temperatureK <= CriticalTemperatureK))
        {
            return double.NaN;
        }

        // theta = T/T* + n9 / (T/T* - n10) with T* = 1 K; p_sat/p* = (2C / (-B + sqrt(B^2 - 4AC)))^4, p* = 1 MPa.
        double theta = temperatureK + (N9 / (temperatureK - N10));
        double theta2 = theta * theta;
        double a = theta2 + (N1 * theta) + N2;
        double b = (N3 * theta2) + (N4 * theta) + N5;
        double c = (N6 * theta2) + (N7 * theta) + N8;
        double x = 2 * c / (-b + Math.Sqrt((b * b) - (4 * a * c)));
        double x2 = x * x;
        return x2 * x2;
    }

    /// <summary>Saturation pressure in kPa at <paramref name="temperatureK"/>; NaN outside the range.</summary>
    public static double SaturationPressureKPa(double temperatureK) => SaturationPressureMPa(temperatureK) * 1000.0;
}
