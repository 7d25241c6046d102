using System.Globalization;

namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// A NodeId (Part 3 §8.2): a namespace index and an identifier that is numeric, a string, a Guid or
/// an opaque byte string. Immutable, compared by value. Text form as Part 6 §5.3.1.10:
/// <c>ns=2;s=Reactor1</c>, <c>i=85</c>, <c>g=...</c>, <c>b=base64</c> (ns omitted when 0).
/// </summary>
public sealed class NodeId : IEquatable<NodeId>
{
    private readonly object identifier;

    private NodeId(ushort namespaceIndex, NodeIdType type, object identifier)
    {
        NamespaceIndex = namespaceIndex;
        IdType = type;
        this.identifier = identifier;
    }

    /// <summary>The null NodeId (ns=0;i=0).</summary>
    public static NodeId Null { get; } = new(0, NodeIdType.Numeric, 0u);

    public ushort NamespaceIndex { get; }

    public NodeIdType IdType { get; }

    /// <summary>True for ns=0;i=0 (and the other null forms of Part 3 §8.2.4).</summary>
    public bool IsNull => NamespaceIndex == 0 && IdType switch
    {
        NodeIdType.Numeric => NumericId == 0,
        NodeIdType.String => string.IsNullOrEmpty(StringId),
        NodeIdType.Guid => GuidId == Guid.Empty,
        _ => OpaqueId.Length == 0,
    };

    public uint NumericId => identifier is uint u ? u : 0;

    public string? StringId => identifier as string;

    public Guid GuidId => identifier is Guid g ? g : Guid.Empty;

    public byte[] OpaqueId => identifier is byte[] b ? (byte[])b.Clone() : [];

    public static NodeId Numeric(ushort namespaceIndex, uint id) => new(namespaceIndex, NodeIdType.Numeric, id);

    public static NodeId Numeric(uint id) => new(0, NodeIdType.Numeric, id);

    public static NodeId String(ushort namespaceIndex, string id) => new(namespaceIndex, NodeIdType.String, id);

    public static NodeId FromGuid(ushort namespaceIndex, Guid id) => new(namespaceIndex, NodeIdType.Guid, id);

    public static NodeId Opaque(ushort namespaceIndex, byte[] id) => new(namespaceIndex, NodeIdType.Opaque, (byte[])id.Clone());

    /// <summary>Parses <c>[ns=N;](i|s|g|b)=value</c>; see <see cref="NodeIdText"/>.</summary>
    public static NodeId Parse(string text) => NodeIdText.ParseNodeId(text);

    public bool Equals(NodeId? other)
    {
        if (other is null || other.NamespaceIndex != NamespaceIndex || other.IdType != IdType)
        {
            return false;
        }

        return IdType switch
        {
            NodeIdType.Opaque => ((byte[])identifier).AsSpan().SequenceEqual((byte[])other.identifier),
            NodeIdType.String => string.Equals((string)identifier, (string)other.identifier, StringComparison.Ordinal),
            _ => identifier.Equals(other.identifier),
        };
    }

    public override bool Equals(object? obj) => Equals(obj as NodeId);

    public override int GetHashCode()
    {
        var h = new HashCode();
        h.Add(NamespaceIndex);
        h.Add(IdType);
        if (identifier is byte[] b)
        {
            h.AddBytes(b);
        }
        else
        {
            h.Add(identifier);
        }

        return h.ToHashCode();
    }

    /// <summary>The identifier part alone: <c>i=85</c>, <c>s=Reactor1</c>...</summary>
    public string IdentifierText => IdType switch
    {
        NodeIdType.Numeric => "i=" + NumericId.ToString(CultureInfo.InvariantCulture),
        NodeIdType.String => "s=" + StringId,
        NodeIdType.Guid => "g=" + GuidId.ToString("D"),
        _ => "b=" + Convert.ToBase64String((byte[])identifier),
    };

    public override string ToString() =>
        NamespaceIndex == 0 ? IdentifierText : $"ns={NamespaceIndex.ToString(CultureInfo.InvariantCulture)};{IdentifierText}";

    public static bool operator ==(NodeId? a, NodeId? b) => a is null ? b is null : a.Equals(b);

    public static bool operator !=(NodeId? a, NodeId? b) => !(a == b);
}
