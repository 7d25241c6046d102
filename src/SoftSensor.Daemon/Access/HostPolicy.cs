using System.Net;

namespace SoftSensor.Daemon.Access;

/// <summary>
/// The host names a request may name in its Host header: the status URL's host (with localhost,
/// 127.0.0.1 and ::1 for a loopback URL) and <see cref="AccessOptions.AllowedHosts"/>. Anything else
/// (DNS rebinding, a foreign name) answers 421. Also whether the URL is loopback.
/// </summary>
internal sealed class HostPolicy
{
    private readonly HashSet<string> _names = new(StringComparer.OrdinalIgnoreCase);

    public HostPolicy(string statusUrl, IEnumerable<string> allowed)
    {
        if (Uri.TryCreate(statusUrl, UriKind.Absolute, out var url))
        {
            string host = url.Host.Trim('[', ']');
            IsLoopback = host == "localhost" || (IPAddress.TryParse(host, out var ip) && IPAddress.IsLoopback(ip));
            IsWildcard = host is "0.0.0.0" or "::" or "*" or "+";
            if (IsLoopback)
            {
                _names.UnionWith(["localhost", "127.0.0.1", "::1"]);
            }
            else if (!IsWildcard)
            {
                _names.Add(host);
            }
        }

        foreach (var a in allowed)
        {
            _names.Add(a.Trim().Trim('[', ']'));
        }
    }

    /// <summary>The status URL is a loopback address.</summary>
    public bool IsLoopback { get; }

    /// <summary>The status URL listens on every address.</summary>
    public bool IsWildcard { get; }

    /// <summary>Whether a Host header value (name, optional port) names this server.</summary>
    public bool Allows(string? hostHeader)
    {
        if (string.IsNullOrEmpty(hostHeader))
        {
            return false;
        }

        var h = Microsoft.AspNetCore.Http.HostString.FromUriComponent(hostHeader);
        return _names.Contains(h.Host.Trim('[', ']'));
    }
}
