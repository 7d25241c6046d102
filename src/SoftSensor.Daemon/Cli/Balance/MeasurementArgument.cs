using System.Globalization;

namespace SoftSensor.Daemon.Cli.Balance;

/// <summary>
/// One <c>--measure ID=VALUE[:SIGMA]</c>: a rate in mmol/(L·h) (C-mmol for organic compounds),
/// production positive; SIGMA is an absolute standard deviation in the same unit, or with a
/// <c>%</c> suffix relative to |VALUE| (<c>o2=-38.6:2%</c>). Without SIGMA, 5 % of |VALUE| is assumed
/// and the output says so.
/// </summary>
internal readonly record struct MeasurementArgument(string Id, double Value, double Sigma, bool SigmaAssumed)
{
    /// <summary>The relative standard deviation assumed when none is given (common practice for off-gas and feed rates).</summary>
    public const double DefaultRelativeSigma = 0.05;

    public static bool TryParse(string text, out MeasurementArgument measurement, out string? error)
    {
        measurement = default;
        string where = $"--measure '{text}'";
        int eq = text.IndexOf('=', StringComparison.Ordinal);
        if (eq <= 0)
        {
            error = $"{where}: expected ID=VALUE[:SIGMA], e.g. o2=-38.6:1.2 or o2=-38.6:3%";
            return false;
        }

        string id = text[..eq].Trim();
        string rest = text[(eq + 1)..];
        int colon = rest.IndexOf(':', StringComparison.Ordinal);
        string valueText = colon < 0 ? rest : rest[..colon];
        if (!TryNumber(valueText, out double value))
        {
            error = $"{where}: value '{valueText}' is not a finite number (use '.' as the decimal point)";
            return false;
        }

        double sigma = Math.Abs(value) * DefaultRelativeSigma;
        bool assumed = colon < 0;
        if (!assumed)
        {
            string sigmaText = rest[(colon + 1)..].Trim();
            bool relative = sigmaText.EndsWith('%');
            string number = relative ? sigmaText[..^1] : sigmaText;
            if (!TryNumber(number, out double s))
            {
                error = $"{where}: sigma '{sigmaText}' is not a finite number (absolute, or with '%' relative to the value)";
                return false;
            }

            if (s < 0)
            {
                error = $"{where}: sigma {sigmaText} is negative; a standard deviation is 0 or more";
                return false;
            }

            sigma = relative ? Math.Abs(value) * s / 100.0 : s;
        }

        measurement = new MeasurementArgument(id, value, sigma, assumed);
        error = null;
        return true;
    }

    internal static bool TryNumber(string s, out double value) =>
        double.TryParse(s.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out value) && double.IsFinite(value);
}
