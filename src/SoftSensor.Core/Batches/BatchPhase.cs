namespace SoftSensor.Core.Batches;

/// <summary>
/// The phases of a microbial batch, in their usual order (trade terms): the batch phase on the
/// initial substrate, the fed-batch phase once the feed runs, induction of product formation, and
/// harvest. The end of a batch is not a phase: the batch is closed.
/// </summary>
public enum BatchPhase
{
    /// <summary>Growth on the substrate of the initial medium, no feed (id <c>batch</c>).</summary>
    Batch = 1,

    /// <summary>Substrate fed (id <c>fed-batch</c>).</summary>
    FedBatch = 2,

    /// <summary>Product formation induced (id <c>induced</c>).</summary>
    Induced = 3,

    /// <summary>Broth being harvested (id <c>harvest</c>).</summary>
    Harvest = 4,
}

/// <summary>The ids of <see cref="BatchPhase"/> as written in configuration, commands, frames and the store.</summary>
public static class BatchPhases
{
    /// <summary>Every phase, in order.</summary>
    public static IReadOnlyList<BatchPhase> All { get; } = [BatchPhase.Batch, BatchPhase.FedBatch, BatchPhase.Induced, BatchPhase.Harvest];

    /// <summary>The ids, comma separated (for messages).</summary>
    public static string Ids => string.Join(", ", All.Select(Id));

    /// <summary>The id of a phase.</summary>
    public static string Id(BatchPhase phase) => phase switch
    {
        BatchPhase.Batch => "batch",
        BatchPhase.FedBatch => "fed-batch",
        BatchPhase.Induced => "induced",
        BatchPhase.Harvest => "harvest",
        _ => throw new ArgumentOutOfRangeException(nameof(phase), phase, "unknown batch phase"),
    };

    /// <summary>Parses an id (case-insensitive); false for anything else.</summary>
    public static bool TryParse(string? id, out BatchPhase phase)
    {
        foreach (var p in All)
        {
            if (string.Equals(Id(p), id?.Trim(), StringComparison.OrdinalIgnoreCase))
            {
                phase = p;
                return true;
            }
        }

        phase = default;
        return false;
    }
}
