using SoftSensor.Core.Estimation;
using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Benchmarks.Cycle;

/// <summary>The glycerol model and cycle settings of the shipped replay configuration, for the benchmarks.</summary>
internal static class GlycerolCycleFixture
{
    public static string RepoRoot() => RootAbove(AppContext.BaseDirectory) ?? RootAbove(Directory.GetCurrentDirectory())
        ?? throw new InvalidOperationException("SoftSensor.sln not found above " + AppContext.BaseDirectory + " or the current folder");

    private static string? RootAbove(string start)
    {
        var dir = new DirectoryInfo(start);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SoftSensor.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName;
    }

    public static StoichiometricModel Model() =>
        ModelReader.Parse(File.ReadAllText(Path.Combine(RepoRoot(), "config", "models", "balance-bacterium-glycerol.json")));

    public static CycleSettings Settings() => new()
    {
        Gas = AlignedGasBalanceSettings.Default with
        {
            Balance = GasBalanceSettings.Default with { Accuracy = new MeasurementAccuracy(0.02, 0.02, 1.0), MinAerationNlPerMin = 0.5 },
            Lines = InstalledGasLines.Air,
        },
        Estimator = new EstimatorSettings { InitialBiomassGPerL = 0.3, InitialVolumeL = 30, FeedSubstrateGPerL = 600 },
        BaseAmmoniaMolPerL = 13.4,
    };

    /// <summary>
    /// One cycle's inputs of a respiring culture; <paramref name="co2Factor"/> scales the CO2 reading (1.05: a 5 % analyser error).
    /// With factor 1 the readings close the C, degree-of-reduction and N balances (invented demo values): the feed
    /// (0.12 L/h of 600 g/L glycerol) and the base (0.0068 L/h of 13.4 mol/L NH3) in 33 kg of broth give, with biomass
    /// CH1.8O0.5N0.2 from the N balance, OUR 69.8 and CER 58.4 mmol/(L·h), which 30 NL/min of air leave as 18.22 % O2
    /// and 2.406 % CO2 in the dry off-gas (inert balance, docs/methods.md §1.3). So the test passes and the diagnosis is skipped.
    /// </summary>
    public static void Fill(AlignedInputs a, DateTimeOffset t, double co2Factor)
    {
        a.Time = t;
        a.Set(SignalRole.AirFlowNlPerMin, 30, SampleQuality.Good, t);
        a.Set(SignalRole.OutletO2Percent, 18.22, SampleQuality.Good, t);
        a.Set(SignalRole.OutletCo2Percent, 2.406 * co2Factor, SampleQuality.Good, t);
        a.Set(SignalRole.PressureKPa, 150, SampleQuality.Good, t);
        a.Set(SignalRole.TemperatureC, 37, SampleQuality.Good, t);
        a.Set(SignalRole.WeightKg, 33, SampleQuality.Good, t);
        a.Set(SignalRole.FeedRateLPerH, 0.12, SampleQuality.Good, t);
        a.Set(SignalRole.BaseRateLPerH, 0.0068, SampleQuality.Good, t);
    }
}
