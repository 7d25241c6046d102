namespace SoftSensor.Daemon.Configuration;

/// <summary>Section <c>mqtt</c>: the broker link shared by every reactor.</summary>
internal sealed class MqttOptions
{
    /// <summary>Broker host name or address.</summary>
    public string Host { get; set; } = "127.0.0.1";

    /// <summary>Broker port (1883 plain, 8883 TLS by convention).</summary>
    public int Port { get; set; } = 1883;

    /// <summary>Use TLS.</summary>
    public bool Tls { get; set; }

    /// <summary>Accept a broker certificate that fails validation (test brokers only; logged as a warning).</summary>
    public bool TlsAllowUntrusted { get; set; }

    /// <summary>User name; empty for anonymous.</summary>
    public string Username { get; set; } = "";

    /// <summary>Password: set it from the environment (<c>SOFTSENSOR_mqtt__password</c>) or <see cref="PasswordFile"/>; a JSON file that sets it is refused.</summary>
    public string Password { get; set; } = "";

    /// <summary>A file holding the password (its first line), e.g. a systemd credential; mode 0600.</summary>
    public string PasswordFile { get; set; } = "";

    /// <summary>PEM file of the CA (a plant's private CA) that signed the broker's certificate; empty for the system's trust store.</summary>
    public string TlsCaFile { get; set; } = "";

    /// <summary>PEM client certificate for brokers that authenticate clients by certificate.</summary>
    public string TlsClientCertificateFile { get; set; } = "";

    /// <summary>PEM private key of <see cref="TlsClientCertificateFile"/>.</summary>
    public string TlsClientKeyFile { get; set; } = "";

    /// <summary>Client id; also the daemon's name in the status topic.</summary>
    public string ClientId { get; set; } = "softsensor";

    /// <summary>First topic level(s) of everything the daemon publishes, e.g. <c>softsensor</c>.</summary>
    public string TopicPrefix { get; set; } = "softsensor";

    /// <summary>Interval of the supervisor's own ping.</summary>
    public TimeSpan PingInterval { get; set; } = TimeSpan.FromSeconds(5);

    /// <summary>First reconnect delay; doubles up to <see cref="ReconnectMaxDelay"/>, with ±20 % jitter.</summary>
    public TimeSpan ReconnectMinDelay { get; set; } = TimeSpan.FromSeconds(0.5);

    /// <summary>Longest reconnect delay.</summary>
    public TimeSpan ReconnectMaxDelay { get; set; } = TimeSpan.FromSeconds(30);

    /// <summary>Oldest source timestamp a tag payload may carry, before the daemon's clock (older: refused and counted).</summary>
    public TimeSpan TimestampWindowPast { get; set; } = TimeSpan.FromDays(1);

    /// <summary>Newest source timestamp a tag payload may carry, after the daemon's clock (clock skew allowance).</summary>
    public TimeSpan TimestampWindowFuture { get; set; } = TimeSpan.FromMinutes(5);
}
