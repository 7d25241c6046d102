namespace SoftSensor.Core.Flux;

/// <summary>
/// A flux model (network file) that cannot be used as written: a configuration error. The message
/// names the field (e.g. <c>reactions.pdh</c>), the value and what was expected.
/// </summary>
public sealed class FluxModelException : FormatException
{
    /// <summary>Creates the exception for <paramref name="field"/>.</summary>
    public FluxModelException(string field, string reason)
        : base($"{field}: {reason}")
    {
        Field = field;
    }

    /// <summary>Creates the exception (no field).</summary>
    public FluxModelException()
        : this("model", "invalid flux model")
    {
    }

    /// <summary>Creates the exception with a message.</summary>
    public FluxModelException(string message)
        : base(message)
    {
        Field = "model";
    }

    /// <summary>Creates the exception with a message and an inner exception.</summary>
    public FluxModelException(string message, Exception innerException)
        : base(message, innerException)
    {
        Field = "model";
    }

    /// <summary>The field at fault, as a dotted path into the model file.</summary>
    public string Field { get; }
}
