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

    /// <summary>Password: set it from the environment (<c>SOFTSENSOR_mqtt__password</c>), never in a file.</summary>
    public string Password { get; set; } = "";

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
}
