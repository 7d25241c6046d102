using System.Globalization;

namespace SoftSensor.OpcUa.Transport;

/// <summary>
/// Host and port of an <c>opc.tcp://host[:port][/path]</c> endpoint URL (Part 6 §7.2; the
/// default port 4840 is the IANA registration for opc.tcp).
/// </summary>
public sealed record EndpointAddress(string Url, string Host, int Port)
{
    public const int DefaultPort = 4840;

    /// <summary>Parses an endpoint URL; the error names the text and the expected form.</summary>
    public static EndpointAddress Parse(string url)
    {
        ArgumentNullException.ThrowIfNull(url);
        if (!Uri.TryCreate(url, UriKind.Absolute, out var uri) || !string.Equals(uri.Scheme, "opc.tcp", StringComparison.OrdinalIgnoreCase) || string.IsNullOrEmpty(uri.Host))
        {
            throw new FormatException($"Endpoint URL '{url}' is not of the form opc.tcp://host[:port][/path].");
        }

        int port = uri.Port is > 0 and <= 65535 ? uri.Port : DefaultPort;
        string host = uri.Host.Trim('[', ']');
        return new EndpointAddress(url, host, port);
    }

    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Host}:{Port}");
}
