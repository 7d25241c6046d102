namespace SoftSensor.OpcUa.Encoding;

/// <summary>A name qualified by a namespace index (Part 3 §8.3; Part 6 §5.2.2.13: UInt16 index then String).</summary>
public sealed record QualifiedName(ushort NamespaceIndex, string? Name)
{
    public static QualifiedName Null { get; } = new(0, null);

    public override string ToString() => NamespaceIndex == 0 ? Name ?? string.Empty : $"{NamespaceIndex}:{Name}";
}
