namespace SoftSensor.Core.Signals;

/// <summary>
/// Severity of a sample or an estimate, ordered so that the worst of several is their maximum
/// (OPC UA Part 4 §7.39: the two top bits of a StatusCode, 00 Good, 01 Uncertain, 10 Bad).
/// </summary>
public enum SampleQuality
{
    Good = 0,
    Uncertain = 1,
    Bad = 2,
}

/// <summary>Helpers on <see cref="SampleQuality"/> and OPC UA status codes.</summary>
public static class SampleQualities
{
    /// <summary>The worse of two qualities.</summary>
    public static SampleQuality Worst(SampleQuality a, SampleQuality b) => a > b ? a : b;

    /// <summary>Severity of an OPC UA status code from its two top bits (Part 4 §7.39).</summary>
    public static SampleQuality FromStatusCode(uint statusCode) => (statusCode >> 30) switch
    {
        0 => SampleQuality.Good,
        1 => SampleQuality.Uncertain,
        _ => SampleQuality.Bad,
    };
}
