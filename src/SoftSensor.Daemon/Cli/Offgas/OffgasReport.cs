using System.Text.Json.Serialization;
using SoftSensor.Core.Gas;

namespace SoftSensor.Daemon.Cli.Offgas;

/// <summary>The JSON document of <c>softsensor offgas --json</c> (rates in mmol/(L·h), flows in NL/min at the reference conditions, fractions in %).</summary>
internal sealed record OffgasReport(
    double? Our,
    double? Cer,
    double? Rq,
    [property: JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)] double? OurSigma,
    [property: JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)] double? CerSigma,
    [property: JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)] double? RqSigma,
    [property: JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)] OffgasCovariance? Covariance,
    double? OutletFlow,
    double? InletFlow,
    OffgasInlet Inlet,
    OffgasOutlet Outlet,
    string CerCorrection,
    OffgasUnits Units,
    OffgasQuality Quality)
{
    public static OffgasReport From(OffgasRequest request, in GasBalanceResult r)
    {
        bool sigmas = request.Settings.Accuracy.IsStated;
        var reference = request.Settings.Reference;
        return new OffgasReport(
            CliOutput.Finite(r.OurMmolPerLh),
            CliOutput.Finite(r.CerMmolPerLh),
            CliOutput.Finite(r.Rq),
            sigmas ? CliOutput.Finite(r.OurSigmaMmolPerLh) : null,
            sigmas ? CliOutput.Finite(r.CerSigmaMmolPerLh) : null,
            sigmas ? CliOutput.Finite(r.RqSigma) : null,
            sigmas ? new OffgasCovariance(CliOutput.Finite(r.Covariance.OurOur), CliOutput.Finite(r.Covariance.OurCer), CliOutput.Finite(r.Covariance.CerCer)) : null,
            CliOutput.Finite(r.OutletFlowNlPerMin),
            CliOutput.Finite(r.InletFlowNlPerMin),
            new OffgasInlet(
                request.Inlet.Source == InletSource.Measured ? "measured" : "gas-lines",
                CliOutput.Finite(r.InletO2Fraction * 100),
                CliOutput.Finite(r.InletCo2Fraction * 100)),
            new OffgasOutlet(
                request.Outlet.Basis switch { AnalyserBasis.Dry => "dry", AnalyserBasis.Saturated => "saturated", _ => "measured-humidity" },
                CliOutput.Finite(r.OutletWaterFraction * 100),
                CliOutput.Finite(r.OutletO2DryFraction * 100),
                CliOutput.Finite(r.OutletCo2DryFraction * 100)),
            "none",
            new OffgasUnits("mmol/(L·h)", "NL/min", reference.TemperatureK - ReferenceConditions.ZeroCelsiusK, reference.PressureKPa),
            new OffgasQuality(r.Quality.ToString().ToLowerInvariant(), r.Flags.ReasonIds()));
    }
}

/// <summary>Covariance of (OUR, CER), (mmol/(L·h))².</summary>
internal sealed record OffgasCovariance(double? OurOur, double? OurCer, double? CerCer);

/// <summary>Inlet composition used: source and dry %.</summary>
internal sealed record OffgasInlet(string Source, double? O2Percent, double? Co2Percent);

/// <summary>Analyser basis and the dry outlet composition used, %.</summary>
internal sealed record OffgasOutlet(string Basis, double? WaterPercent, double? O2DryPercent, double? Co2DryPercent);

/// <summary>Units of the document and the reference conditions of the flows.</summary>
internal sealed record OffgasUnits(string Rate, string Flow, double ReferenceTemperatureC, double ReferencePressureKPa);

/// <summary>Overall quality and the stable ids of its reasons.</summary>
internal sealed record OffgasQuality(string Level, IReadOnlyList<string> Reasons);
