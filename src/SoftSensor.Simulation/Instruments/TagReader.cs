using SoftSensor.Simulation.Faults;
using SoftSensor.Simulation.Vessel;
using S = SoftSensor.Simulation.Vessel.StateIndex;
using T = SoftSensor.Simulation.ReactorTags;

namespace SoftSensor.Simulation.Instruments;

/// <summary>Turns the true state into what the plant's instruments show: gains, offsets, noise, dead time and faults.</summary>
internal static class TagReader
{
    public static void Read(
        Span<double> values, VirtualReactor reactor, ReactorModel model, InstrumentErrors err, GaussianSource noise,
        FaultSchedule faults, AnalyserDelay delay, ref double lastFeedReading)
    {
        var spec = reactor.Scenario;
        var inst = spec.Instruments;
        var y = reactor.State;
        double t = reactor.ElapsedH;
        var schedule = model.Schedule;
        bool trip = faults.AerationTripped(t);
        double air = trip ? 0 : schedule.AirNlPerMin(t);
        double o2Line = trip ? 0 : schedule.OxygenNlPerMin(t);
        var (_, yO2In, yCo2In, _) = model.Inlet(t);

        values[T.AirFlow] = Flow(air * err.AirMfcGain, inst.MfcNoiseNlPerMin, noise);
        values[T.OxygenFlow] = Flow(o2Line * err.OxygenMfcGain, inst.MfcNoiseNlPerMin, noise);
        values[T.InletO2] = Analyser(yO2In, err.AnalyserO2Gain, err.AnalyserO2OffsetPercent, inst.AnalyserO2NoisePercent, noise);
        values[T.InletCo2] = Analyser(yCo2In, err.AnalyserCo2Gain, err.AnalyserCo2OffsetPercent, inst.AnalyserCo2NoisePercent, noise);
        var (cellO2, cellCo2) = delay.AtCell;
        double o2 = Analyser(cellO2, err.AnalyserO2Gain, err.AnalyserO2OffsetPercent, inst.AnalyserO2NoisePercent, noise);
        double co2 = Analyser(cellCo2, err.AnalyserCo2Gain, err.AnalyserCo2OffsetPercent, inst.AnalyserCo2NoisePercent, noise);
        values[T.OffgasO2] = Math.Clamp(faults.ApplyToAnalyser("o2", o2, t), 0, 100);
        values[T.OffgasCo2] = Math.Clamp(faults.ApplyToAnalyser("co2", co2, t), 0, 100);
        values[T.Pressure] = spec.Vessel.PressureKPa + noise.Next(inst.PressureNoiseKPa);
        values[T.Temperature] = spec.Vessel.TemperatureC + noise.Next(inst.TemperatureNoiseC);
        values[T.Weight] = (y[S.VolumeL] * spec.Vessel.BrothDensityKgPerL) + noise.Next(inst.WeightNoiseKg);

        double feed = Flow(schedule.FeedLPerH(t) * err.FeedPumpGain, inst.PumpNoiseLPerH, noise);
        if (faults.FeedSignalFrozen(t))
        {
            feed = lastFeedReading;
        }

        lastFeedReading = feed;
        values[T.FeedRate] = feed;
        values[T.BaseRate] = Flow(reactor.TrueBaseLPerH() * err.BasePumpGain, inst.PumpNoiseLPerH, noise);
        values[T.DissolvedOxygen] = Math.Max(0, (y[S.OxygenMmolPerL] / reactor.DoCalibrationMmolPerL * 100.0) + noise.Next(inst.DoNoisePercent));
        values[T.Ph] = spec.Vessel.Ph + noise.Next(inst.PhNoise);
    }

    /// <summary>A flow reading: zero when the line is closed, never negative.</summary>
    private static double Flow(double trueValue, double sd, GaussianSource noise) =>
        trueValue <= 0 ? 0 : Math.Max(0, trueValue + noise.Next(sd));

    /// <summary>An analyser reading in % by volume from a true mole fraction.</summary>
    private static double Analyser(double fraction, double gain, double offsetPercent, double sd, GaussianSource noise) =>
        Math.Clamp((fraction * 100.0 * gain) + offsetPercent + noise.Next(sd), 0, 100);
}
