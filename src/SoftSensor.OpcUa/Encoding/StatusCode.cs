namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// A StatusCode (Part 4 §7.39; Part 6 §5.2.2.11 as a UInt32). The two top bits are the severity:
/// 00 Good, 01 Uncertain, 10 Bad (11 reserved, treated as Bad). Codes compare on
/// <c>code &amp; 0xFFFF0000</c>; the low 16 bits hold info bits such as the data-value limits.
/// </summary>
public readonly record struct StatusCode(uint Code)
{
    public static StatusCode Good => new(0);

    public StatusSeverity Severity => (Code >> 30) switch
    {
        0 => StatusSeverity.Good,
        1 => StatusSeverity.Uncertain,
        _ => StatusSeverity.Bad,
    };

    public bool IsGood => Severity == StatusSeverity.Good;

    public bool IsUncertain => Severity == StatusSeverity.Uncertain;

    public bool IsBad => Severity == StatusSeverity.Bad;

    /// <summary>The code without its info bits, for comparison with the named codes.</summary>
    public uint CodeBits => Code & 0xFFFF0000;

    /// <summary>True when the code (ignoring info bits) equals <paramref name="other"/>.</summary>
    public bool Is(uint other) => CodeBits == (other & 0xFFFF0000);

    public override string ToString() => StatusCodes.NameOf(Code) is { } name ? $"{name} (0x{Code:X8})" : $"0x{Code:X8}";
}
