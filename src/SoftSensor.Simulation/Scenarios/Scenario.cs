using System.Text.Json.Serialization;

namespace SoftSensor.Simulation.Scenarios;

// The scenario file format of this project (snake_case keys; docs/simulator.md).
// Every record is plain data; ScenarioLoader reads and validates it, naming the key at fault.

/// <summary>One virtual fed-batch run: vessel, culture, feed, gas, instruments, faults, samples.</summary>
public sealed record Scenario
{
    public string Name { get; init; } = "scenario";
    public string Description { get; init; } = string.Empty;
    /// <summary>UTC time of the first history row.</summary>
    public DateTimeOffset StartTime { get; init; } = new(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);
    public double DurationH { get; init; } = 24;
    /// <summary>Fixed integration step of the RK4 integrator, whole seconds.</summary>
    public int IntegrationStepS { get; init; } = 1;
    /// <summary>Spacing of the history and truth rows, a whole multiple of the step.</summary>
    public int OutputIntervalS { get; init; } = 10;
    /// <summary>Default seed when the command line gives none.</summary>
    public int Seed { get; init; } = 1;
    /// <summary>Prefix of every tag name, e.g. R1 gives R1.AIR.FLOW.</summary>
    public string TagPrefix { get; init; } = "R1";
    public VesselSpec Vessel { get; init; } = new();
    public InitialSpec Initial { get; init; } = new();
    public CultureSpec Culture { get; init; } = new();
    public FeedSpec Feed { get; init; } = new();
    public BaseSpec Base { get; init; } = new();
    public GasSpec Gas { get; init; } = new();
    public TransferSpec Transfer { get; init; } = new();
    public InstrumentSpec Instruments { get; init; } = new();
    public IReadOnlyList<FaultSpec> Faults { get; init; } = [];
    public SamplingSpec Samples { get; init; } = new();
}

/// <summary>The vessel and its controlled conditions.</summary>
public sealed record VesselSpec
{
    public double TotalVolumeL { get; init; } = 75;
    public double InitialVolumeL { get; init; } = 30;
    public double BrothDensityKgPerL { get; init; } = 1.03;
    public double TemperatureC { get; init; } = 37;
    /// <summary>Head pressure, absolute.</summary>
    [JsonPropertyName("pressure_kpa")]
    public double PressureKPa { get; init; } = 150;
    public double Ph { get; init; } = 6.9;
    /// <summary>Off-gas condenser temperature; null: the off-gas leaves saturated at broth temperature.</summary>
    public double? CondenserTemperatureC { get; init; }
}

/// <summary>Concentrations at time zero.</summary>
public sealed record InitialSpec
{
    public double BiomassGPerL { get; init; } = 0.3;
    public double SubstrateGPerL { get; init; } = 15;
    public double ProductGPerL { get; init; }
    /// <summary>Dissolved O2 at start, % of saturation with the inlet gas.</summary>
    public double DissolvedOxygenPercent { get; init; } = 100;
}

/// <summary>The simulated culture: its own composition, kinetics and by-products.</summary>
public sealed record CultureSpec
{
    public string Organism { get; init; } = "bacterium";
    public CompoundSpec Substrate { get; init; } = new() { Name = "glycerol", Formula = "C3H8O3" };
    public BiomassSpec Biomass { get; init; } = new();
    public double MuMaxPerH { get; init; } = 0.45;
    public double KsGPerL { get; init; } = 0.05;
    /// <summary>True yield of dry biomass (ash included) on substrate, g/g (Pirt 1965).</summary>
    public double YieldGPerG { get; init; } = 0.5;
    /// <summary>Pirt maintenance coefficient, g substrate/(g biomass·h).</summary>
    [JsonPropertyName("maintenance_g_per_g_h")]
    public double MaintenanceGPerGH { get; init; } = 0.02;
    /// <summary>Monod constant for dissolved O2, mmol/L.</summary>
    public double OxygenKsMmolPerL { get; init; } = 0.01;
    public ByproductSpec? Byproduct { get; init; }
    public OverflowSpec? Overflow { get; init; }
}

/// <summary>A named compound with its elemental formula.</summary>
public sealed record CompoundSpec
{
    public string Name { get; init; } = string.Empty;
    public string Formula { get; init; } = string.Empty;
}

/// <summary>Biomass composition per C-mol and ash content of the dry weight.</summary>
public sealed record BiomassSpec
{
    public string Formula { get; init; } = "CH1.77O0.49N0.24";
    public double AshFraction { get; init; } = 0.06;
}

/// <summary>A small by-product made at a fixed share of the respired substrate carbon.</summary>
public sealed record ByproductSpec
{
    public string Name { get; init; } = "acetate";
    public string Formula { get; init; } = "C2H4O2";
    /// <summary>C-mol by-product per C-mol substrate taken up by the respiratory route.</summary>
    public double CarbonFraction { get; init; } = 0.015;
    /// <summary>True when the product is an acid neutralised by the base (one mol base per mol).</summary>
    public bool IsAcid { get; init; }
}

/// <summary>Overflow metabolism above a critical specific uptake rate (bottleneck model).</summary>
public sealed record OverflowSpec
{
    public string Name { get; init; } = "ethanol";
    public string Formula { get; init; } = "C2H6O";
    /// <summary>Largest specific substrate uptake the respiratory route takes, g/(g·h).</summary>
    [JsonPropertyName("critical_qs_g_per_g_h")]
    public double CriticalQsGPerGH { get; init; } = 0.8;
    /// <summary>Biomass yield of the fermentative route on substrate, g/g.</summary>
    public double FermentativeYieldGPerG { get; init; } = 0.05;
    /// <summary>Largest specific uptake of the product when respiratory capacity is spare, g/(g·h); 0 disables re-uptake.</summary>
    [JsonPropertyName("reuptake_max_g_per_g_h")]
    public double ReuptakeMaxGPerGH { get; init; }
    public double ReuptakeKsGPerL { get; init; } = 0.1;
    /// <summary>Biomass yield on the product when it is taken up again, g/g.</summary>
    public double ReuptakeYieldGPerG { get; init; } = 0.6;
}

/// <summary>The substrate feed: concentration, cap and profile segments.</summary>
public sealed record FeedSpec
{
    public double SubstrateGPerL { get; init; } = 600;
    public double MaxRateLPerH { get; init; } = 2;
    public IReadOnlyList<FeedSegment> Segments { get; init; } = [];
}

/// <summary>From <see cref="FromH"/> on: rate = RateLPerH · exp(GrowthPerH · (t - FromH)).</summary>
public sealed record FeedSegment
{
    public double FromH { get; init; }
    public double RateLPerH { get; init; }
    public double GrowthPerH { get; init; }
}

/// <summary>The pH-control base, which is also the nitrogen source.</summary>
public sealed record BaseSpec
{
    public string Formula { get; init; } = "NH3";
    /// <summary>Base concentration; 25 % w/w ammonia water is about 13.4 mol/L (from memory).</summary>
    public double ConcentrationMolPerL { get; init; } = 13.4;
}

/// <summary>Gas lines and the mass flow controllers' reference conditions.</summary>
public sealed record GasSpec
{
    public double ReferenceTemperatureC { get; init; }
    [JsonPropertyName("reference_pressure_kpa")]
    public double ReferencePressureKPa { get; init; } = 101.325;
    /// <summary>Dry-air O2 mole fraction (U.S. Standard Atmosphere 1976: 0.209476).</summary>
    public double AirO2Fraction { get; init; } = 0.209476;
    /// <summary>Dry-air CO2 mole fraction (about 0.00042, NOAA global mean 2024, from memory).</summary>
    public double AirCo2Fraction { get; init; } = 0.00042;
    public IReadOnlyList<FlowSegment> Air { get; init; } = [new() { FromH = 0, NlPerMin = 30 }];
    public IReadOnlyList<FlowSegment> Oxygen { get; init; } = [];
}

/// <summary>A gas flow set point from <see cref="FromH"/> on, NL/min at the reference conditions.</summary>
public sealed record FlowSegment
{
    public double FromH { get; init; }
    public double NlPerMin { get; init; }
}

/// <summary>Gas-liquid transfer and solubility.</summary>
public sealed record TransferSpec
{
    public double KlaPerH { get; init; } = 600;
    public double KlaReferenceFlowNlPerMin { get; init; } = 50;
    public double KlaFlowExponent { get; init; } = 0.5;
    public double KlaMinimumPerH { get; init; } = 2;
    /// <summary>kLa(CO2)/kLa(O2), about sqrt(D_CO2/D_O2) = 0.89 (common practice, penetration theory).</summary>
    public double Co2KlaRatio { get; init; } = 0.89;
    /// <summary>O2 solubility of the broth relative to fresh water (salting out).</summary>
    public double OxygenSolubilityFactor { get; init; } = 0.9;
    /// <summary>Shift of pK1 of carbonic acid in the medium relative to pure water.</summary>
    public double Pk1MediumShift { get; init; } = -0.15;
}

/// <summary>Instrument errors: fixed offsets drawn from the seed with these spreads, and noise.</summary>
public sealed record InstrumentSpec
{
    public double AnalyserDeadTimeS { get; init; } = 45;
    public double AnalyserO2NoisePercent { get; init; } = 0.004;
    public double AnalyserCo2NoisePercent { get; init; } = 0.003;
    public double AnalyserO2OffsetSdPercent { get; init; } = 0.004;
    public double AnalyserCo2OffsetSdPercent { get; init; } = 0.003;
    /// <summary>Relative gain error spread of the analyser (1 = 100 %).</summary>
    public double AnalyserGainSd { get; init; } = 0.002;
    public double MfcGainSd { get; init; } = 0.005;
    public double MfcNoiseNlPerMin { get; init; } = 0.05;
    public double PumpGainSd { get; init; } = 0.01;
    public double PumpNoiseLPerH { get; init; } = 0.002;
    [JsonPropertyName("pressure_noise_kpa")]
    public double PressureNoiseKPa { get; init; } = 0.1;
    public double TemperatureNoiseC { get; init; } = 0.02;
    public double WeightNoiseKg { get; init; } = 0.02;
    public double DoNoisePercent { get; init; } = 0.3;
    public double PhNoise { get; init; } = 0.01;
}

/// <summary>An injected fault active from <see cref="FromH"/> until <see cref="ToH"/>.</summary>
public sealed record FaultSpec
{
    /// <summary>analyser_offset, analyser_drift, feed_signal_frozen or aeration_trip.</summary>
    public string Kind { get; init; } = string.Empty;
    public double FromH { get; init; }
    public double ToH { get; init; }
    /// <summary>o2 or co2 for analyser faults.</summary>
    public string? Gas { get; init; }
    /// <summary>Offset as percent of the reading (analyser_offset).</summary>
    public double RelativePercent { get; init; }
    /// <summary>Offset in %-abs (analyser_offset).</summary>
    public double AbsolutePercent { get; init; }
    /// <summary>Drift in %-abs per hour from the start of the window (analyser_drift).</summary>
    public double RatePercentPerH { get; init; }
}

/// <summary>The offline sampling plan and the assay's uncertainty.</summary>
public sealed record SamplingSpec
{
    public double DcwRelativeSd { get; init; } = 0.03;
    public double DcwAbsoluteSdGPerL { get; init; } = 0.1;
    public IReadOnlyList<SampleSpec> Plan { get; init; } = [];
}

/// <summary>One broth sample: its time and the volume withdrawn.</summary>
public sealed record SampleSpec
{
    public double AtH { get; init; }
    public double VolumeMl { get; init; } = 20;
}
