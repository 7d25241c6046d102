namespace SoftSensor.Daemon.Samples;

/// <summary>
/// An operator input as stored in <c>offline_samples</c>: entry, what was measured, and what became of it.
/// For an applied biomass sample, the estimate at the update point before (prior) and after (posterior)
/// the Kalman update and the time of the cycle it was applied at.
/// </summary>
internal sealed record SampleRecord(
    long Id,
    string Reactor,
    string Batch,
    DateTimeOffset EnteredAt,
    DateTimeOffset SampledAt,
    string Kind,
    double? ValueGPerL,
    double? SigmaGPerL,
    double WithdrawnL,
    string? Analyte,
    string? Operator,
    string Outcome,
    string? Detail,
    DateTimeOffset? ResolvedAt,
    DateTimeOffset? AppliedAtCycle,
    double? PriorGPerL,
    double? PriorSigmaGPerL,
    double? PosteriorGPerL,
    double? PosteriorSigmaGPerL,
    string Payload);

/// <summary>One row of <c>corrected_estimates</c>: the re-propagated biomass at one kept cycle after sample <see cref="SampleId"/>.</summary>
internal sealed record CorrectedPoint(
    string Reactor,
    string Batch,
    long SampleId,
    DateTimeOffset Time,
    double BiomassGPerL,
    double BiomassSigmaGPerL,
    double IntegratorGPerL,
    double EkfGPerL,
    double VolumeL);
