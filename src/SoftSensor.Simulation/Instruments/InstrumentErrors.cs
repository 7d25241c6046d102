using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Simulation.Instruments;

/// <summary>
/// The fixed inaccuracies of this run's instruments, drawn once from the seed: analyser offsets
/// and gains, MFC and pump gains. They stay constant over the run, as a calibration error does.
/// </summary>
internal sealed record InstrumentErrors(
    double AnalyserO2OffsetPercent,
    double AnalyserCo2OffsetPercent,
    double AnalyserO2Gain,
    double AnalyserCo2Gain,
    double AirMfcGain,
    double OxygenMfcGain,
    double FeedPumpGain,
    double BasePumpGain)
{
    /// <summary>Draws the errors in a fixed order so that a seed always gives the same instruments.</summary>
    public static InstrumentErrors Draw(InstrumentSpec spec, GaussianSource g) => new(
        g.Next(spec.AnalyserO2OffsetSdPercent),
        g.Next(spec.AnalyserCo2OffsetSdPercent),
        1 + g.Next(spec.AnalyserGainSd),
        1 + g.Next(spec.AnalyserGainSd),
        1 + g.Next(spec.MfcGainSd),
        1 + g.Next(spec.MfcGainSd),
        1 + g.Next(spec.PumpGainSd),
        1 + g.Next(spec.PumpGainSd));
}
