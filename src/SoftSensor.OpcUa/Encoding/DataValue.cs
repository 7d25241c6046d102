namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// A value with its status and timestamps (Part 4 §7.11; Part 6 §5.2.2.17). An absent status
/// means Good; absent timestamps are <see cref="DateTime.MinValue"/>.
/// </summary>
public sealed record DataValue
{
    public Variant Value { get; init; } = Variant.Null;

    public StatusCode Status { get; init; }

    public DateTime SourceTimestamp { get; init; }

    public ushort SourcePicoseconds { get; init; }

    public DateTime ServerTimestamp { get; init; }

    public ushort ServerPicoseconds { get; init; }
}
