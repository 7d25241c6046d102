namespace SoftSensor.OpcUa.Encoding;

/// <summary>Text with an optional locale (Part 3 §8.5; Part 6 §5.2.2.14: mask 0x01 locale, 0x02 text).</summary>
public sealed record LocalizedText(string? Locale, string? Text)
{
    public static LocalizedText Null { get; } = new(null, null);

    public override string ToString() => Text ?? string.Empty;
}
