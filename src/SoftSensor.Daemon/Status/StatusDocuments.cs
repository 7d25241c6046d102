using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Contracts;
using SoftSensor.Daemon.Mqtt;
using SoftSensor.Daemon.Pipeline;

namespace SoftSensor.Daemon.Status;

/// <summary>The JSON documents of the status API (camelCase; a value that could not be computed is null).</summary>
internal static class StatusDocuments
{
    public sealed record DaemonDoc(string Broker, bool MqttOnline, int MqttConnections, DateTimeOffset Now, IReadOnlyList<ReactorDoc> Reactors)
    {
        /// <summary>The store's size and its disk's free space (null before the first maintenance pass).</summary>
        public StoreDoc? Store { get; init; }
    }

    /// <summary>The embedded store on disk: its size, the free space of its file system, the configured threshold, and whether the disk is low (alarm <c>disk_low</c>).</summary>
    public sealed record StoreDoc(long SizeBytes, long? FreeDiskBytes, long ThresholdBytes, bool DiskLow, long PrunedFrames, DateTimeOffset MeasuredAt);

    public static StoreDoc? Store(Store.StoreHealth health) => health.Current is { MeasuredAt: { } at } r
        ? new StoreDoc(r.StoreBytes, r.FreeBytes == long.MaxValue ? null : r.FreeBytes, r.ThresholdBytes, r.DiskLow, r.PrunedFrames, at)
        : null;

    public sealed record ReactorDoc(string Id, long Cycle, DateTimeOffset CycleTime, string Quality, DateTimeOffset? SourceTime, IReadOnlyList<EstimateDoc> Estimates, IReadOnlyList<InputDoc> Inputs)
    {
        /// <summary>Why the newest frame is Bad when no input was fresh (empty otherwise).</summary>
        public string Reason { get; init; } = "";

        /// <summary>The batch id of the newest frame.</summary>
        public string Batch { get; init; } = "";

        /// <summary>The batch's phase at the newest frame (empty when no batch is open).</summary>
        public string Phase { get; init; } = "";

        /// <summary>True when the batch book has a batch open (then <see cref="Batch"/> is its id); false when the frames carry the configured id.</summary>
        public bool BatchOpen { get; init; }

        /// <summary>When the open batch started (the page's batch age), or null.</summary>
        public DateTimeOffset? BatchStartedAt { get; init; }
    }

    public sealed record EstimateDoc(string Name, double? Value, string Unit, double? Sigma, string Quality, uint StatusCode);

    public sealed record InputDoc(string Tag, string Role, double? Value, string Unit, DateTimeOffset? SourceTime, double? AgeSeconds, string State, string Quality, uint StatusCode)
    {
        /// <summary>The value as the plant sends it, in the tag's own unit (raw = (value − offset) / scale).</summary>
        public double? PlantValue { get; init; }

        /// <summary>The tag's plant unit (the role's unit when the definition gives none).</summary>
        public string PlantUnit { get; init; } = "";
    }

    public sealed record TrendDoc(string Reactor, DateTimeOffset? From, DateTimeOffset? To, IReadOnlyDictionary<string, TrendSeries> Series)
    {
        /// <summary>Biomass re-propagated after offline samples (the newest correction per cycle; table corrected_estimates), or null when none.</summary>
        public TrendSeries? CorrectedBiomass { get; init; }
    }

    public sealed record TrendSeries(string Unit, IReadOnlyList<long> T, IReadOnlyList<double?> V, IReadOnlyList<int> Q);

    public sealed record AlarmDoc(string Reactor, string AlarmId, DateTimeOffset Time, string State, string Priority, double? Value, string Message);

    public static double? Finite(double v) => double.IsFinite(v) ? v : null;

    /// <summary>A reactor's document; <paramref name="tags"/> (the reactor's tag map) gives each input's plant unit, <paramref name="batch"/> the open batch.</summary>
    public static ReactorDoc Reactor(ReactorSnapshot s, IReadOnlyDictionary<string, Configuration.TagOptions>? tags = null, Batches.BatchRun? batch = null) => new(
        s.Reactor,
        s.Cycle,
        s.CycleTime,
        EstimatePayload.Name(s.Frame?.Quality ?? SampleQuality.Bad),
        s.Frame?.InputTime,
        s.Frame?.Values.Select(v => new EstimateDoc(v.Name, Finite(v.Value), v.Unit, Finite(v.Sigma), EstimatePayload.Name(v.Quality), v.StatusCode)).ToList() ?? [],
        s.Inputs.Select(i => Input(i, tags is not null && tags.TryGetValue(i.Tag, out var tag) ? tag : null)).ToList())
    {
        Reason = s.Frame?.Reason ?? "",
        Batch = s.Frame?.BatchId ?? "",
        Phase = s.Frame?.Phase ?? "",
        BatchOpen = batch is not null,
        BatchStartedAt = batch?.StartedAt,
    };

    private static InputDoc Input(InputHealth i, Configuration.TagOptions? tag) => new(
        i.Tag,
        i.Role.ToString(),
        Finite(i.Value),
        SignalRoles.UnitOf(i.Role),
        i.SourceTime == default ? null : i.SourceTime,
        Finite(i.AgeSeconds),
        i.State.ToString().ToLowerInvariant(),
        EstimatePayload.Name(i.Quality),
        i.StatusCode)
    {
        PlantValue = tag is null || tag.Scale == 0 ? Finite(i.Value) : Finite((i.Value - tag.Offset) / tag.Scale),
        PlantUnit = string.IsNullOrEmpty(tag?.Unit) ? SignalRoles.UnitOf(i.Role) : tag.Unit,
    };
}
