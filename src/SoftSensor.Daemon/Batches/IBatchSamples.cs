namespace SoftSensor.Daemon.Batches;

/// <summary>One biomass sample of a batch (dry weight, or OD as the dry weight it implies), as the batch report lists it.</summary>
/// <param name="Id">The input's id.</param>
/// <param name="SampledAt">When the broth was taken.</param>
/// <param name="Kind"><c>dcw</c> or <c>od</c>.</param>
/// <param name="ValueGPerL">Dry weight, g/L.</param>
/// <param name="SigmaGPerL">Its standard uncertainty, g/L.</param>
/// <param name="Outcome">What became of it (<c>applied</c>, <c>pending</c>, <c>tooOld</c> ...).</param>
/// <param name="PriorGPerL">The estimate at the sampling time before the update, when applied.</param>
/// <param name="PosteriorGPerL">The estimate after it, when applied.</param>
internal sealed record BatchSample(long Id, DateTimeOffset SampledAt, string Kind, double ValueGPerL, double SigmaGPerL, string Outcome, double? PriorGPerL, double? PosteriorGPerL)
{
    /// <summary>True when the Kalman update was applied.</summary>
    public bool Applied => Outcome == "applied";
}

/// <summary>The biomass samples of a batch, for its report (implemented above this layer, by the sample book).</summary>
internal interface IBatchSamples
{
    /// <summary>The dry-weight and OD samples entered for one batch, oldest first.</summary>
    IReadOnlyList<BatchSample> BiomassSamples(string reactor, string batch);
}
