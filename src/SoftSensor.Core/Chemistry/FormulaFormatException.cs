namespace SoftSensor.Core.Chemistry;

/// <summary>A formula that cannot be read; the message shows the formula and the position of the fault.</summary>
public sealed class FormulaFormatException : FormatException
{
    /// <summary>Creates the exception.</summary>
    public FormulaFormatException(string formula, int position, string reason)
        : base($"formula '{formula}': {reason} at position {position + 1}\n  {formula}\n  {new string(' ', Math.Max(0, position))}^")
    {
        Formula = formula;
        Position = position;
        Reason = reason;
    }

    /// <summary>Creates the exception (serialisation-free default).</summary>
    public FormulaFormatException()
        : this(string.Empty, 0, "empty formula")
    {
    }

    /// <summary>Creates the exception with a message.</summary>
    public FormulaFormatException(string message)
        : base(message)
    {
        Formula = string.Empty;
        Reason = message;
    }

    /// <summary>Creates the exception with a message and an inner exception.</summary>
    public FormulaFormatException(string message, Exception innerException)
        : base(message, innerException)
    {
        Formula = string.Empty;
        Reason = message;
    }

    /// <summary>The formula text.</summary>
    public string Formula { get; }

    /// <summary>Zero-based position of the fault.</summary>
    public int Position { get; }

    /// <summary>What is wrong there.</summary>
    public string Reason { get; }
}
