using System.Diagnostics;
using System.Net;
using System.Net.Sockets;

namespace SoftSensor.OpcUa.Tests.Peers;

/// <summary>
/// A real node-opcua server (tests/peers/opcua-server.js) on a free loopback port: started,
/// waited for until it prints "listening", stopped (and restartable on the same port). The first
/// start on a machine creates node-opcua's PKI under the home folder, which takes a few seconds.
/// </summary>
public sealed class OpcUaPeerServer : IAsyncDisposable
{
    private static readonly TimeSpan StartTimeout = TimeSpan.FromSeconds(90);
    private readonly Dictionary<string, string> environment;
    private Process? process;

    public OpcUaPeerServer(IDictionary<string, string>? environment = null)
    {
        this.environment = new Dictionary<string, string>(environment ?? new Dictionary<string, string>(), StringComparer.Ordinal);
        Port = FreePort();
    }

    public int Port { get; }

    public string EndpointUrl => $"opc.tcp://127.0.0.1:{Port}/softsensor";

    /// <summary>The namespace URI of the peer's reactor nodes.</summary>
    public const string NamespaceUri = "urn:softsensor:peer:reactor";

    public async Task StartAsync(CancellationToken cancellationToken)
    {
        string root = RepositoryRoot();
        string script = Path.Combine(root, "tests", "peers", "opcua-server.js");
        if (!Directory.Exists(Path.Combine(root, "tests", "peers", "node_modules", "node-opcua")))
        {
            throw new InvalidOperationException($"node-opcua is not installed in {Path.Combine(root, "tests", "peers")}; run 'npm ci' there (tests/run.sh does).");
        }

        var info = new ProcessStartInfo("node", [script, Port.ToString(System.Globalization.CultureInfo.InvariantCulture)])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            WorkingDirectory = Path.Combine(root, "tests", "peers"),
        };
        foreach (var (key, value) in environment)
        {
            info.Environment[key] = value;
        }

        var started = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        var errors = new System.Text.StringBuilder();
        process = new Process { StartInfo = info, EnableRaisingEvents = true };
        process.OutputDataReceived += (_, e) =>
        {
            if (e.Data?.StartsWith("listening", StringComparison.Ordinal) == true)
            {
                started.TrySetResult();
            }
        };
        process.ErrorDataReceived += (_, e) =>
        {
            lock (errors)
            {
                errors.AppendLine(e.Data);
            }
        };
        process.Exited += (_, _) => started.TrySetException(new InvalidOperationException($"opcua-server.js exited early: {errors}"));
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        await started.Task.WaitAsync(StartTimeout, cancellationToken);
    }

    /// <summary>Stops the server process (and its children) and waits for it to end.</summary>
    public async Task StopAsync()
    {
        if (process is null)
        {
            return;
        }

        if (!process.HasExited)
        {
            process.Kill(entireProcessTree: true);
            await process.WaitForExitAsync();
        }

        process.Dispose();
        process = null;
    }

    /// <summary>SIGSTOP: the server process freezes with its sockets open (a hung server, not a closed one).</summary>
    public Task PauseAsync() => SignalAsync("-STOP");

    /// <summary>SIGCONT after <see cref="PauseAsync"/>.</summary>
    public Task ResumeAsync() => SignalAsync("-CONT");

    private async Task SignalAsync(string signal)
    {
        if (process is null || process.HasExited)
        {
            throw new InvalidOperationException("the peer is not running");
        }

        using var kill = Process.Start("kill", [signal, process.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)])
            ?? throw new InvalidOperationException("kill did not start");
        await kill.WaitForExitAsync();
        if (kill.ExitCode != 0)
        {
            throw new InvalidOperationException($"kill {signal} {process.Id} exited {kill.ExitCode}");
        }
    }

    public async ValueTask DisposeAsync() => await StopAsync();

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    private static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "tests", "peers", "opcua-server.js")))
            {
                return dir.FullName;
            }
        }

        throw new InvalidOperationException($"No tests/peers/opcua-server.js above {AppContext.BaseDirectory}.");
    }
}
