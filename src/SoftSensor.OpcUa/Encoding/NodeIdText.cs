using System.Globalization;
using System.Numerics;

namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// The text forms of NodeId and ExpandedNodeId (Part 6 §5.3.1.10 and §5.3.1.11):
/// <c>[svr=N;][ns=N;|nsu=URI;](i=UInt32|s=String|g=Guid|b=Base64)</c>. Errors name the text and
/// what was expected.
/// </summary>
public static class NodeIdText
{
    /// <summary>Parses a NodeId; an <c>nsu=</c> prefix is refused (use <see cref="ParseExpanded"/>).</summary>
    public static NodeId ParseNodeId(string text)
    {
        var expanded = ParseExpanded(text);
        if (expanded.HasNamespaceUri || expanded.ServerIndex != 0)
        {
            throw new FormatException($"NodeId '{text}' has an nsu= or svr= part; expected ns=N;(i|s|g|b)=value.");
        }

        return expanded.NodeId;
    }

    /// <summary>Parses an ExpandedNodeId text.</summary>
    public static ExpandedNodeId ParseExpanded(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        string rest = text.Trim();
        uint server = 0;
        ushort ns = 0;
        string? uri = null;
        if (rest.StartsWith("svr=", StringComparison.Ordinal))
        {
            var (value, tail) = SplitPart(rest, 4, text);
            server = ParseNumber<uint>(value, "svr", text);
            rest = tail;
        }

        if (rest.StartsWith("nsu=", StringComparison.Ordinal))
        {
            // The URI runs to the last ';' before the identifier (URIs may hold ';' only escaped, Part 6 §5.3.1.11).
            int cut = rest.LastIndexOf(';');
            if (cut < 4)
            {
                throw new FormatException($"NodeId '{text}': nsu= needs ';' then the identifier (i=, s=, g= or b=).");
            }

            uri = Uri.UnescapeDataString(rest[4..cut]);
            rest = rest[(cut + 1)..];
        }
        else if (rest.StartsWith("ns=", StringComparison.Ordinal))
        {
            var (value, tail) = SplitPart(rest, 3, text);
            ns = ParseNumber<ushort>(value, "ns", text);
            rest = tail;
        }

        return new ExpandedNodeId(ParseIdentifier(ns, rest, text), uri, server);
    }

    private static NodeId ParseIdentifier(ushort ns, string part, string text)
    {
        if (part.Length < 2 || part[1] != '=')
        {
            throw new FormatException($"NodeId '{text}': expected the identifier as i=, s=, g= or b=, got '{part}'.");
        }

        string value = part[2..];
        switch (part[0])
        {
            case 'i':
                return NodeId.Numeric(ns, ParseNumber<uint>(value, "i", text));
            case 's':
                return NodeId.String(ns, value);
            case 'g':
                if (!Guid.TryParse(value, out var g))
                {
                    throw new FormatException($"NodeId '{text}': g= needs a Guid, got '{value}'.");
                }

                return NodeId.FromGuid(ns, g);
            case 'b':
                try
                {
                    return NodeId.Opaque(ns, Convert.FromBase64String(value));
                }
                catch (FormatException e)
                {
                    throw new FormatException($"NodeId '{text}': b= needs Base64, got '{value}'.", e);
                }

            default:
                throw new FormatException($"NodeId '{text}': unknown identifier type '{part[0]}'; expected i, s, g or b.");
        }
    }

    private static (string Value, string Tail) SplitPart(string rest, int skip, string text)
    {
        int semi = rest.IndexOf(';', StringComparison.Ordinal);
        if (semi < 0)
        {
            throw new FormatException($"NodeId '{text}': '{rest[..skip]}' must be followed by a value and ';'.");
        }

        return (rest[skip..semi], rest[(semi + 1)..]);
    }

    private static T ParseNumber<T>(string value, string field, string text)
        where T : IBinaryInteger<T>
    {
        if (!T.TryParse(value, NumberStyles.None, CultureInfo.InvariantCulture, out var n))
        {
            throw new FormatException($"NodeId '{text}': {field}= needs an unsigned integer in range, got '{value}'.");
        }

        return n;
    }
}
