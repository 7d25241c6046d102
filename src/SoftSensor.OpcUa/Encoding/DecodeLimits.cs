namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// Bounds the decoder applies to every length it reads, so that a hostile or corrupt frame cannot
/// make it allocate without limit or recurse without end (Part 6 §5.2.2: lengths are Int32 and -1
/// means null; the limits themselves are the client's choice).
/// </summary>
public sealed record DecodeLimits
{
    /// <summary>Longest String or ByteString, in bytes.</summary>
    public int MaxStringLengthBytes { get; init; } = 16 * 1024 * 1024;

    /// <summary>Most elements of one array.</summary>
    public int MaxArrayLength { get; init; } = 1_000_000;

    /// <summary>Deepest nesting of Variant, DiagnosticInfo and ExtensionObject bodies.</summary>
    public int MaxNestingDepth { get; init; } = 64;

    /// <summary>The defaults used for every message unless a caller says otherwise.</summary>
    public static DecodeLimits Default { get; } = new();
}
