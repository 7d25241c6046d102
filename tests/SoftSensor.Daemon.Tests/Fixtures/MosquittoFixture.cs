using System.Diagnostics;

namespace SoftSensor.Daemon.Tests.Fixtures;

/// <summary>
/// A private mosquitto (the Debian package, /usr/sbin/mosquitto) on a free loopback port with a
/// generated configuration: anonymous clients on 127.0.0.1 only, no persistence. Can be stopped
/// and started again on the same port (broker restart tests).
/// </summary>
public sealed class MosquittoFixture : IAsyncLifetime
{
    private const string Binary = "/usr/sbin/mosquitto";
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-mosquitto-").FullName;
    private Process? _process;

    public int Port { get; } = FreePort.Next();

    public string Host => "127.0.0.1";

    public async Task InitializeAsync() => await StartAsync();

    public async Task DisposeAsync()
    {
        await StopAsync();
        try
        {
            Directory.Delete(_dir, recursive: true);
        }
        catch (IOException)
        {
            // A leftover temp folder is harmless.
        }
    }

    /// <summary>Starts the broker and waits until it accepts connections.</summary>
    public async Task StartAsync()
    {
        if (!File.Exists(Binary))
        {
            throw new InvalidOperationException($"{Binary} is missing: run tests/run.sh, which installs the Debian package mosquitto");
        }

        string conf = Path.Combine(_dir, "mosquitto.conf");
        await File.WriteAllTextAsync(conf, $"listener {Port} 127.0.0.1\nallow_anonymous true\npersistence false\nlog_dest none\n");
        var psi = new ProcessStartInfo(Binary, ["-c", conf])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        _process = Process.Start(psi) ?? throw new InvalidOperationException("mosquitto did not start");
        _process.OutputDataReceived += (_, _) => { };
        _process.ErrorDataReceived += (_, _) => { };
        _process.BeginOutputReadLine();
        _process.BeginErrorReadLine();
        await FreePort.WaitListeningAsync(Port, TimeSpan.FromSeconds(10));
    }

    /// <summary>Stops the broker (SIGKILL: an outage, not a clean shutdown).</summary>
    public async Task StopAsync()
    {
        if (_process is null)
        {
            return;
        }

        if (!_process.HasExited)
        {
            _process.Kill();
            await _process.WaitForExitAsync();
        }

        _process.Dispose();
        _process = null;
    }
}
