namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// A message could not be decoded: it is truncated, a length or a nesting level exceeds the
/// configured limits, or a field holds a value the encoding does not allow. The only exception the
/// decoder throws for bad input (the fuzz test holds it to that).
/// </summary>
public sealed class UaDecodeException : Exception
{
    public UaDecodeException(string message)
        : base(message)
    {
    }

    public UaDecodeException(string message, Exception innerException)
        : base(message, innerException)
    {
    }

    public UaDecodeException()
        : base("The message could not be decoded.")
    {
    }
}
