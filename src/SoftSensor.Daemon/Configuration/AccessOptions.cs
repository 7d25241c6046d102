namespace SoftSensor.Daemon.Configuration;

/// <summary>
/// Section <c>access</c>: who may use the status server (docs/security.md). Users and bearer tokens
/// live in <see cref="CredentialsFile"/>, managed with <c>softsensor user</c>.
/// </summary>
internal sealed class AccessOptions
{
    /// <summary>The credentials file (users with password hashes, token hashes); missing means nobody can write.</summary>
    public string CredentialsFile { get; set; } = "/etc/softsensor/credentials";

    /// <summary>
    /// Lets a client without credentials read (status, trends, estimates, never a write). Null: allowed
    /// when the status URL is a loopback address, refused otherwise.
    /// </summary>
    public bool? AnonymousRead { get; set; }

    /// <summary>Host names accepted in the Host header besides the status URL's own (e.g. the name a reverse proxy forwards).</summary>
    public List<string> AllowedHosts { get; set; } = [];

    /// <summary>PEM certificate for an https:// status URL (its chain after it).</summary>
    public string CertificateFile { get; set; } = "";

    /// <summary>PEM private key of <see cref="CertificateFile"/>.</summary>
    public string CertificateKeyFile { get; set; } = "";

    /// <summary>How long a login session lasts without use.</summary>
    public TimeSpan SessionIdleTimeout { get; set; } = TimeSpan.FromHours(8);

    /// <summary>Most simultaneous HTTP connections.</summary>
    public int MaxConnections { get; set; } = 64;
}
