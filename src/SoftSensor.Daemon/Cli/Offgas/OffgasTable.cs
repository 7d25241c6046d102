using System.Globalization;

namespace SoftSensor.Daemon.Cli.Offgas;

/// <summary>The human-readable output of <c>softsensor offgas</c>: a short aligned table with units.</summary>
internal static class OffgasTable
{
    public static void Write(TextWriter output, OffgasRequest request, OffgasReport report)
    {
        bool sigmas = request.Settings.Accuracy.IsStated;
        string refText = string.Create(CultureInfo.InvariantCulture, $"NL/min at {report.Units.ReferenceTemperatureC:0.##} °C, {report.Units.ReferencePressureKPa:0.###} kPa");
        Row(output, "OUR", report.Our, sigmas ? report.OurSigma : null, "F3", "mmol/(L·h)");
        Row(output, "CER", report.Cer, sigmas ? report.CerSigma : null, "F3", "mmol/(L·h)  (= CTR, no dissolved-CO2 correction)");
        Row(output, "RQ", report.Rq, sigmas ? report.RqSigma : null, "F4", "mol/mol");
        Row(output, "inlet flow", report.InletFlow, null, "F4", refText);
        Row(output, "outlet flow", report.OutletFlow, null, "F4", refText + " (dry, inert balance)");
        Text(output, "inlet", string.Create(CultureInfo.InvariantCulture,
            $"O2 {Num(report.Inlet.O2Percent, "F4")} %, CO2 {Num(report.Inlet.Co2Percent, "F4")} % dry ({report.Inlet.Source})"));
        Text(output, "outlet", string.Create(CultureInfo.InvariantCulture,
            $"O2 {Num(report.Outlet.O2DryPercent, "F4")} %, CO2 {Num(report.Outlet.Co2DryPercent, "F4")} % dry (read {report.Outlet.Basis}, H2O {Num(report.Outlet.WaterPercent, "F3")} %)"));
        string reasons = report.Quality.Reasons.Count == 0 ? string.Empty : " (" + string.Join(", ", report.Quality.Reasons) + ")";
        Text(output, "quality", report.Quality.Level + reasons);
    }

    private static void Row(TextWriter output, string name, double? value, double? sigma, string format, string unit)
    {
        string sigmaText = sigma is { } s ? "± " + s.ToString(format, CultureInfo.InvariantCulture) : string.Empty;
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{name,-12} {Num(value, format),12} {sigmaText,-10} {unit}"));
    }

    private static void Text(TextWriter output, string name, string text) => output.WriteLine($"{name,-12} {text}");

    private static string Num(double? value, string format) => value is { } v ? v.ToString(format, CultureInfo.InvariantCulture) : "n/a";
}
