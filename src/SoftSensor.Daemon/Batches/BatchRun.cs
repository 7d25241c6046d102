namespace SoftSensor.Daemon.Batches;

/// <summary>
/// One batch of one reactor, from inoculation to its end: the id written with every estimate and the
/// initial conditions the operator entered (volume, inoculum biomass with its standard uncertainty,
/// initial substrate), and its current phase (an id of <see cref="Core.Batches.BatchPhases"/>) since when.
/// </summary>
internal sealed record BatchRun(
    string Reactor,
    string BatchId,
    DateTimeOffset StartedAt,
    DateTimeOffset? EndedAt,
    double InitialVolumeL,
    double InoculumBiomassGPerL,
    double InoculumBiomassSigmaGPerL,
    double InitialSubstrateGPerL,
    string Phase = "batch",
    DateTimeOffset? PhaseSince = null)
{
    /// <summary>True until the batch is ended.</summary>
    public bool IsOpen => EndedAt is null;

    /// <summary>The initial conditions handed to the reactor's estimator when the batch begins.</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public Core.Estimation.BatchInitialConditions Initial =>
        new(InitialVolumeL, InoculumBiomassGPerL, InoculumBiomassSigmaGPerL, InitialSubstrateGPerL);
}

/// <summary>The body of a start command (status API, CLI).</summary>
internal sealed record BatchStart(
    string BatchId,
    double InitialVolumeL,
    double InoculumBiomassGPerL,
    double InoculumBiomassSigmaGPerL,
    double InitialSubstrateGPerL)
{
    /// <summary>Who started it (operator, or tag for a batch-id tag), stored with the first phase.</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public string Source { get; init; } = "operator";

    /// <summary>Every problem of the command, each naming the field, the value and the expectation.</summary>
    public IReadOnlyList<string> Problems()
    {
        var p = new List<string>();
        if (string.IsNullOrWhiteSpace(BatchId) || BatchId.Length > 64)
        {
            p.Add($"batchId is '{BatchId}' (expected 1 to 64 characters)");
        }

        if (!(InitialVolumeL > 0 && double.IsFinite(InitialVolumeL)))
        {
            p.Add($"initialVolumeL is {InitialVolumeL} (expected a positive volume in L)");
        }

        if (!(InoculumBiomassGPerL >= 0 && double.IsFinite(InoculumBiomassGPerL)))
        {
            p.Add($"inoculumBiomassGPerL is {InoculumBiomassGPerL} (expected 0 or more g/L)");
        }

        if (!(InoculumBiomassSigmaGPerL > 0 && double.IsFinite(InoculumBiomassSigmaGPerL)))
        {
            p.Add($"inoculumBiomassSigmaGPerL is {InoculumBiomassSigmaGPerL} (expected a positive standard uncertainty in g/L)");
        }

        if (!(InitialSubstrateGPerL >= 0 && double.IsFinite(InitialSubstrateGPerL)))
        {
            p.Add($"initialSubstrateGPerL is {InitialSubstrateGPerL} (expected 0 or more g/L)");
        }

        return p;
    }
}
