namespace SoftSensor.Core.Signals;

/// <summary>
/// One value of one plant tag as it arrived at an edge adapter: the value in the tag's configured
/// engineering unit, the timestamp given by the source (UTC), its quality and the numeric status
/// code (an OPC UA StatusCode where the source has one, else 0 for good or 0x80000000 for bad).
/// </summary>
public readonly record struct Sample(string Tag, double Value, DateTimeOffset SourceTime, SampleQuality Quality, uint StatusCode)
{
    /// <summary>The text of a text-valued tag (a batch id from the controller); null for a measurement.</summary>
    public string? Text { get; init; }
}
