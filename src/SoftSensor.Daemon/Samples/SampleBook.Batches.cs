using SoftSensor.Daemon.Batches;

namespace SoftSensor.Daemon.Samples;

/// <summary>The sample book as the batch report's source of a batch's biomass samples.</summary>
internal sealed partial class SampleBook : IBatchSamples
{
    /// <inheritdoc/>
    public IReadOnlyList<BatchSample> BiomassSamples(string reactor, string batch) =>
        [.. List(reactor, batch, 10_000)
            .Where(s => (s.Kind == "dcw" || s.Kind == "od") && s.ValueGPerL is not null && s.SigmaGPerL is not null)
            .OrderBy(s => s.SampledAt)
            .Select(s => new BatchSample(s.Id, s.SampledAt, s.Kind, s.ValueGPerL!.Value, s.SigmaGPerL!.Value, s.Outcome, s.PriorGPerL, s.PosteriorGPerL))];
}
