namespace SoftSensor.Simulation.Output;

/// <summary>What a finished run reports: final state, peaks, files written.</summary>
public sealed record SimulationSummary(
    string Scenario,
    int Seed,
    double HoursSimulated,
    int Rows,
    double FinalBiomassGPerL,
    double FinalVolumeL,
    double MaxOurMmolPerLh,
    double MaxCerMmolPerLh,
    double FinalCarbonRecovery,
    int OfflineSamples,
    string HistoryPath,
    string TruthPath,
    string OfflinePath);
