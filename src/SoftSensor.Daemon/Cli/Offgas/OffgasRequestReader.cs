using System.CommandLine;
using System.Globalization;
using SoftSensor.Core.Gas;

namespace SoftSensor.Daemon.Cli.Offgas;

/// <summary>Turns the parsed flags into an <see cref="OffgasRequest"/>, or one error line naming the flag, value and expectation.</summary>
internal sealed class OffgasRequestReader(OffgasOptions options, ParseResult parse)
{
    private const double AbsoluteZeroC = -ReferenceConditions.ZeroCelsiusK;

    // The first fault found; later reads see NaN and add nothing (one line on stderr).
    private string? _error;

    /// <summary>Reads every flag; false with the first fault's message when one is malformed.</summary>
    public bool TryRead(out OffgasRequest request, out string error)
    {
        request = Read();
        error = _error ?? string.Empty;
        return _error is null;
    }

    private OffgasRequest Read()
    {
        var flows = new GasLineFlows(Flow(options.Air), Flow(options.Oxygen), Flow(options.Nitrogen), Flow(options.CarbonDioxide));
        if (!(flows.TotalNlPerMin > 0))
        {
            Fail("--air/--o2/--n2/--co2: no gas flow given; expected at least one gas-line flow above 0 NL/min");
        }

        double refTemp = Number(options.RefTemp, 0, v => v > AbsoluteZeroC, "a temperature in °C above -273.15");
        double refPressure = Number(options.RefPressure, 101.325, v => v > 0, "an absolute pressure in kPa above 0");

        var inlet = Given(options.InletO2)
            ? InletComposition.Measured(Percent(options.InletO2, double.NaN, false), Percent(options.InletCo2, DryAir.DefaultCo2Fraction * 100, false))
            : InletComposition.FromGasLines(Percent(options.InletCo2, DryAir.DefaultCo2Fraction * 100, false));
        if (inlet.Source == InletSource.Measured && !(inlet.O2Fraction + inlet.Co2Fraction < 1))
        {
            Fail($"--inlet-o2 {Text(options.InletO2)} with --inlet-co2 {Text(options.InletCo2)}: expected O2 + CO2 below 100 %");
        }

        double o2 = Percent(options.OutletO2, double.NaN, true);
        double co2 = Percent(options.OutletCo2, double.NaN, true);
        var outlet = ReadAnalyser(o2, co2);
        if (_error is null && !((o2 + co2) / (1 - outlet.WaterMoleFraction) < 1))
        {
            Fail($"--outlet-o2 {Text(options.OutletO2)} with --outlet-co2 {Text(options.OutletCo2)}: expected O2 + CO2 below 100 % on a dry basis");
        }

        double volume = Number(options.Volume, double.NaN, v => v > 0, "a liquid volume in L above 0", required: true);

        var accuracy = new MeasurementAccuracy(
            Number(options.O2Accuracy, 0, v => v >= 0, "a standard uncertainty in %-abs, 0 or more"),
            Number(options.Co2Accuracy, 0, v => v >= 0, "a standard uncertainty in %-abs, 0 or more"),
            Number(options.FlowAccuracy, 0, v => v >= 0, "a standard uncertainty in % of reading, 0 or more"));
        double minAeration = Number(options.MinAeration, 0, v => v >= 0, "a flow in NL/min, 0 or more");
        var settings = GasBalanceSettings.Default with
        {
            Reference = ReferenceConditions.FromCelsius(refTemp, refPressure),
            Accuracy = accuracy,
            MinAerationNlPerMin = minAeration,
        };
        return new OffgasRequest(flows, inlet, outlet, volume, settings, parse.GetValue(options.Json));
    }

    private AnalyserReading ReadAnalyser(double o2, double co2)
    {
        string? basis = parse.GetValue(options.AnalyserBasis);
        if (Given(options.AnalyserBasis) && basis is not ("dry" or "saturated"))
        {
            Fail($"--analyser-basis {Quote(basis)}: expected dry or saturated");
            return AnalyserReading.Dry(o2, co2);
        }

        if (basis != "saturated")
        {
            foreach (var cellFlag in new[] { options.AnalyserTemp, options.AnalyserPressure })
            {
                if (Given(cellFlag))
                {
                    Fail($"{cellFlag.Name} {Text(cellFlag)}: only used with --analyser-basis saturated");
                    return AnalyserReading.Dry(o2, co2);
                }
            }
        }

        if (Given(options.Humidity))
        {
            if (Given(options.AnalyserBasis))
            {
                Fail($"--humidity {Text(options.Humidity)}: expected either --humidity or --analyser-basis {basis}, not both");
                return AnalyserReading.Dry(o2, co2);
            }

            return AnalyserReading.WithHumidity(o2, co2, Percent(options.Humidity, double.NaN, false));
        }

        if (basis != "saturated")
        {
            return AnalyserReading.Dry(o2, co2);
        }

        double cellT = Number(options.AnalyserTemp, double.NaN, v => v >= 0 && v <= WaterVapour.CriticalTemperatureK - ReferenceConditions.ZeroCelsiusK,
            "a cell temperature in °C from 0 to 373.946 (IAPWS-IF97 saturation line)", required: true);
        double cellP = Number(options.AnalyserPressure, 101.325, v => v > 0, "an absolute pressure in kPa above 0");
        double water = WaterVapour.SaturationPressureKPa(cellT + ReferenceConditions.ZeroCelsiusK) / cellP;
        if (!(water < 1))
        {
            Fail($"--analyser-temp {Text(options.AnalyserTemp)}: water boils at --analyser-pressure {cellP.ToString(CultureInfo.InvariantCulture)} kPa; expected a saturated gas (p_sat(T) below the cell pressure)");
            return AnalyserReading.Dry(o2, co2);
        }

        return AnalyserReading.Saturated(o2, co2, cellT, cellP);
    }

    private double Flow(Option<string?> option) => Number(option, 0, v => v >= 0, "a flow in NL/min, 0 or more");

    private double Percent(Option<string?> option, double fallbackPercent, bool required)
    {
        double percent = Number(option, fallbackPercent, v => v >= 0 && v < 100, "a percentage from 0 to below 100", required);
        return percent / 100.0;
    }

    private double Number(Option<string?> option, double fallback, Func<double, bool> valid, string expectation, bool required = false)
    {
        if (!Given(option))
        {
            if (required || double.IsNaN(fallback))
            {
                return Fail($"{option.Name}: missing; expected {expectation}");
            }

            return fallback;
        }

        string? text = parse.GetValue(option);
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double value) || !double.IsFinite(value) || !valid(value))
        {
            return Fail($"{option.Name} {Quote(text)}: expected {expectation}");
        }

        return value;
    }

    private bool Given(Option option) => parse.GetResult(option) is not null;

    private string Text(Option<string?> option) => Quote(parse.GetValue(option));

    private static string Quote(string? text) => text is null ? "(none)" : "'" + text + "'";

    private double Fail(string message)
    {
        _error ??= message;
        return double.NaN;
    }
}
