using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Gas;

/// <summary>Reads one cycle's <see cref="AlignedInputs"/> into a gas balance, adding input-quality flags.</summary>
internal static class AlignedGasBalance
{
    public static GasBalanceResult Compute(AlignedInputs inputs, in AlignedGasBalanceSettings settings)
    {
        var flags = GasBalanceFlags.None;
        var lines = settings.Lines;
        double air = Line(inputs, settings, InstalledGasLines.Air, SignalRole.AirFlowNlPerMin, ref flags);
        double o2 = Line(inputs, settings, InstalledGasLines.Oxygen, SignalRole.OxygenFlowNlPerMin, ref flags);
        double n2 = Line(inputs, settings, InstalledGasLines.Nitrogen, SignalRole.NitrogenFlowNlPerMin, ref flags);
        double co2 = Line(inputs, settings, InstalledGasLines.CarbonDioxide, SignalRole.CarbonDioxideFlowNlPerMin, ref flags);
        if (lines == InstalledGasLines.None)
        {
            flags |= GasBalanceFlags.InputMissing;
        }

        var inlet = settings.Inlet == InletSource.Measured
            ? InletComposition.Measured(
                Required(inputs, settings, SignalRole.InletO2Percent, ref flags) / 100.0,
                Required(inputs, settings, SignalRole.InletCo2Percent, ref flags) / 100.0)
            : InletComposition.FromGasLines(settings.AirCo2Fraction);

        double yo = Required(inputs, settings, SignalRole.OutletO2Percent, ref flags) / 100.0;
        double yc = Required(inputs, settings, SignalRole.OutletCo2Percent, ref flags) / 100.0;
        double volume = Required(inputs, settings, SignalRole.LiquidVolumeL, ref flags);

        var reading = AnalyserReading.Dry(yo, yc);
        if (settings.AnalyserBasis == AnalyserBasis.Saturated)
        {
            double cellT = Required(inputs, settings, SignalRole.AnalyserTemperatureC, ref flags);
            double cellP = double.IsNaN(settings.AnalyserPressureKPa)
                ? Required(inputs, settings, SignalRole.PressureKPa, ref flags)
                : settings.AnalyserPressureKPa;
            reading = AnalyserReading.Saturated(yo, yc, cellT, cellP);
        }
        else if (settings.AnalyserBasis != AnalyserBasis.Dry)
        {
            flags |= GasBalanceFlags.ConditionsOutOfRange;
        }

        if (inputs.Has(SignalRole.AnalyserCalibrating) && !(inputs[SignalRole.AnalyserCalibrating] < 0.5))
        {
            flags |= GasBalanceFlags.AnalyserCalibrating;
        }

        if ((flags & (GasBalanceFlags.InputMissing | GasBalanceFlags.ConditionsOutOfRange)) != 0)
        {
            return GasBalanceResult.Failed(flags);
        }

        var result = GasBalance.Compute(new GasLineFlows(air, o2, n2, co2), inlet, reading, volume, settings.Balance);
        var all = result.Flags | flags;
        return result with { Flags = all, Quality = all.ToQuality() };
    }

    private static double Line(AlignedInputs inputs, in AlignedGasBalanceSettings settings, InstalledGasLines line, SignalRole role, ref GasBalanceFlags flags) =>
        (settings.Lines & line) != 0 ? Required(inputs, settings, role, ref flags) : 0.0;

    private static double Required(AlignedInputs inputs, in AlignedGasBalanceSettings settings, SignalRole role, ref GasBalanceFlags flags)
    {
        if (!inputs.Has(role))
        {
            flags |= GasBalanceFlags.InputMissing;
            return double.NaN;
        }

        if (inputs.Time - inputs.SourceTimeOf(role) > settings.MaxInputAge)
        {
            flags |= GasBalanceFlags.InputStale;
        }

        flags |= inputs.QualityOf(role) switch
        {
            SampleQuality.Good => GasBalanceFlags.None,
            SampleQuality.Uncertain => GasBalanceFlags.InputUncertain,
            _ => GasBalanceFlags.InputBad,
        };
        return inputs[role];
    }
}
