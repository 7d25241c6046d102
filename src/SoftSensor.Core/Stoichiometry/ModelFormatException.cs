namespace SoftSensor.Core.Stoichiometry;

/// <summary>A model file that cannot be used; the message names the field (e.g. <c>compounds.glycerol.formula</c>), the value and what was expected.</summary>
public sealed class ModelFormatException : FormatException
{
    /// <summary>Creates the exception for a field.</summary>
    public ModelFormatException(string field, string message)
        : base($"{field}: {message}")
    {
        Field = field;
    }

    /// <summary>Creates the exception.</summary>
    public ModelFormatException()
        : this("model", "invalid model")
    {
    }

    /// <summary>Creates the exception with a message.</summary>
    public ModelFormatException(string message)
        : base(message)
    {
        Field = string.Empty;
    }

    /// <summary>Creates the exception with a message and an inner exception.</summary>
    public ModelFormatException(string message, Exception innerException)
        : base(message, innerException)
    {
        Field = string.Empty;
    }

    /// <summary>Path of the offending field in the model file.</summary>
    public string Field { get; }
}
