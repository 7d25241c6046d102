using System.Text.Json;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Status;

/// <summary>
/// What a running daemon leaves in its state directory (the folder of <c>store:path</c>) as
/// <c>daemon.json</c>, so that the client verbs (<c>batch</c>, <c>sample</c>) find it without a port
/// to type: the status URL to connect to, the process id and the definition it runs.
/// </summary>
/// <param name="StatusUrl">Where a client on this machine reaches the status API (a wildcard listen address becomes loopback).</param>
/// <param name="Pid">The daemon's process id (a client checks that it still runs).</param>
/// <param name="Config">The definition file, or null.</param>
/// <param name="Reactors">The reactor ids it serves.</param>
internal sealed record DaemonStatusDocument(string StatusUrl, int Pid, string? Config, IReadOnlyList<string> Reactors)
{
    /// <summary>The file's name in the state directory.</summary>
    public const string FileName = "daemon.json";

    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web) { WriteIndented = true };

    /// <summary>The state directory of a store path: the folder the store file is in.</summary>
    public static string StateDirectory(string storePath) => Path.GetDirectoryName(Path.GetFullPath(storePath))!;

    /// <summary>A listen address as a client on the same machine dials it: 0.0.0.0 → 127.0.0.1, [::] → [::1].</summary>
    public static string Dialable(string address) =>
        address.Replace("//0.0.0.0:", "//127.0.0.1:", StringComparison.Ordinal)
            .Replace("//[::]:", "//[::1]:", StringComparison.Ordinal)
            .Replace("//+:", "//127.0.0.1:", StringComparison.Ordinal)
            .Replace("//*:", "//127.0.0.1:", StringComparison.Ordinal);
}

/// <summary>The definition file the daemon was started with (null without <c>--config</c>).</summary>
internal sealed record DefinitionFile(string? Path);

/// <summary>
/// Writes <see cref="DaemonStatusDocument"/> once the status server listens (and logs the address),
/// and removes it at stop. The access-control work adds how to authenticate to the same file.
/// </summary>
internal sealed partial class DaemonStatusFile : IHostedService
{
    private readonly IServer _server;
    private readonly IHostApplicationLifetime _lifetime;
    private readonly SoftSensorOptions _options;
    private readonly DefinitionFile _config;
    private readonly ILogger<DaemonStatusFile> _logger;
    private readonly string _path;
    private CancellationTokenRegistration _registration;

    public DaemonStatusFile(IServer server, IHostApplicationLifetime lifetime, IOptions<SoftSensorOptions> options, DefinitionFile config, ILogger<DaemonStatusFile> logger)
    {
        _server = server;
        _lifetime = lifetime;
        _options = options.Value;
        _config = config;
        _logger = logger;
        _path = Path.Combine(DaemonStatusDocument.StateDirectory(_options.Store.Path), DaemonStatusDocument.FileName);
    }

    /// <summary>The status URL the daemon listens on, once started (empty before).</summary>
    public string Address { get; private set; } = "";

    public Task StartAsync(CancellationToken cancellationToken)
    {
        _registration = _lifetime.ApplicationStarted.Register(Write);
        return Task.CompletedTask;
    }

    public Task StopAsync(CancellationToken cancellationToken)
    {
        _registration.Dispose();
        try
        {
            if (File.Exists(_path) && Read(_path)?.Pid == Environment.ProcessId)
            {
                File.Delete(_path);
            }
        }
        catch (IOException e)
        {
            WriteFailed(_logger, _path, e.Message);
        }

        return Task.CompletedTask;
    }

    /// <summary>Reads a status file; null when it is not one.</summary>
    public static DaemonStatusDocument? Read(string path)
    {
        try
        {
            return JsonSerializer.Deserialize<DaemonStatusDocument>(File.ReadAllText(path), DaemonStatusDocument.Json);
        }
        catch (JsonException)
        {
            return null;
        }
    }

    private void Write()
    {
        string listen = _server.Features.Get<IServerAddressesFeature>()?.Addresses.FirstOrDefault() ?? _options.Status.Url;
        Address = DaemonStatusDocument.Dialable(listen);
        StatusListening(_logger, Address, _path);
        var doc = new DaemonStatusDocument(Address, Environment.ProcessId, _config.Path, [.. _options.Reactors.Select(r => r.Id)]);
        try
        {
            Directory.CreateDirectory(Path.GetDirectoryName(_path)!);
            string temp = _path + ".tmp";
            File.WriteAllText(temp, JsonSerializer.Serialize(doc, DaemonStatusDocument.Json));
            File.Move(temp, _path, overwrite: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            WriteFailed(_logger, _path, e.Message);
        }
    }

    [LoggerMessage(7400, LogLevel.Information, "Status page at {Url} (written to {Path} for the batch and sample verbs)")]
    private static partial void StatusListening(ILogger logger, string url, string path);

    [LoggerMessage(7401, LogLevel.Warning, "The status file {Path} could not be written or removed: {Reason} (client verbs then need --url)")]
    private static partial void WriteFailed(ILogger logger, string path, string reason);
}
