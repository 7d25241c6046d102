using System.Diagnostics;
using Microsoft.Extensions.Configuration;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Hosting;
using SoftSensor.Daemon.Status;

namespace SoftSensor.Daemon.Cli;

/// <summary>A running daemon's status API and how it was found (for messages).</summary>
internal sealed record DaemonTarget(Uri Url, string FoundBy);

/// <summary>
/// Finds the running daemon for the client verbs, so that no port needs typing: <c>--url</c> if
/// given; else the <c>daemon.json</c> the daemon wrote into its state directory (the folder of
/// <c>store:path</c>), taken from <c>--data DIR</c>, from <c>--config FILE</c> (read with the same
/// layers as <c>run</c>), or from <c>./data</c> (the demo's and the default store's folder) and
/// <c>/var/lib/softsensor</c> (the service's); else the definition's fixed <c>status:url</c>, else
/// the default <c>http://127.0.0.1:8470</c>.
/// </summary>
internal static class DaemonLocator
{
    /// <summary>The service's state directory (deploy/softsensor.service).</summary>
    public const string ServiceStateDirectory = "/var/lib/softsensor";

    public static (DaemonTarget? Target, string? Problem) Find(string? url, string? config, string? data)
    {
        if (url is not null)
        {
            return Uri.TryCreate(url, UriKind.Absolute, out var u) && (u.Scheme == Uri.UriSchemeHttp || u.Scheme == Uri.UriSchemeHttps)
                ? (new DaemonTarget(u, "--url"), null)
                : (null, $"--url is '{url}' (expected an http:// URL such as http://127.0.0.1:8470)");
        }

        if (data is not null)
        {
            return FromFile(Path.Combine(data, DaemonStatusDocument.FileName), "--data", required: true);
        }

        if (config is not null)
        {
            if (!File.Exists(config))
            {
                return (null, $"--config is '{config}': no such file (expected the definition the daemon runs)");
            }

            SoftSensorOptions o;
            try
            {
                o = Bind(config);
            }
            catch (Exception e) when (e is InvalidOperationException or FormatException or InvalidDataException or IOException)
            {
                return (null, $"--config {config}: cannot be read ({e.Message})");
            }

            var fromFile = FromFile(Path.Combine(DaemonStatusDocument.StateDirectory(o.Store.Path), DaemonStatusDocument.FileName), "--config", required: false);
            if (fromFile.Target is not null || fromFile.Problem is not null)
            {
                return fromFile;
            }

            return Uri.TryCreate(DaemonStatusDocument.Dialable(o.Status.Url), UriKind.Absolute, out var fixedUrl) && fixedUrl.Port != 0
                ? (new DaemonTarget(fixedUrl, $"status:url of {config}"), null)
                : (null, $"--config {config}: no {DaemonStatusDocument.FileName} in {DaemonStatusDocument.StateDirectory(o.Store.Path)} and status:url has no fixed port (is the daemon running?)");
        }

        foreach (var dir in new[] { Path.GetFullPath("data"), ServiceStateDirectory })
        {
            var found = FromFile(Path.Combine(dir, DaemonStatusDocument.FileName), dir, required: false);
            if (found.Target is not null || found.Problem is not null)
            {
                return found;
            }
        }

        string fallback = new StatusOptions().Url;
        return (new DaemonTarget(new Uri(fallback), $"the default (no {DaemonStatusDocument.FileName} in ./data or {ServiceStateDirectory}; give --config, --data or --url)"), null);
    }

    private static (DaemonTarget? Target, string? Problem) FromFile(string path, string via, bool required)
    {
        if (!File.Exists(path))
        {
            return required ? (null, $"{via}: no {DaemonStatusDocument.FileName} in {Path.GetDirectoryName(Path.GetFullPath(path))} (expected the state directory of a running daemon: the folder of its store)") : (null, null);
        }

        var doc = DaemonStatusFile.Read(path);
        if (doc is null || !Uri.TryCreate(doc.StatusUrl, UriKind.Absolute, out var u))
        {
            return (null, $"{path} is not a daemon status file (expected {{\"statusUrl\": ..., \"pid\": ...}})");
        }

        if (!Running(doc.Pid))
        {
            return (null, $"{path} names a daemon (pid {doc.Pid}) that is not running: start it, or give --url");
        }

        return (new DaemonTarget(u, path), null);
    }

    private static bool Running(int pid)
    {
        try
        {
            using var p = Process.GetProcessById(pid);
            return !p.HasExited;
        }
        catch (ArgumentException)
        {
            return false;
        }
        catch (InvalidOperationException)
        {
            return false;
        }
    }

    private static SoftSensorOptions Bind(string config)
    {
        var configuration = new ConfigurationManager();
        DaemonConfiguration.Apply(configuration, new DaemonHostSettings { ConfigFile = config });
        return configuration.Get<SoftSensorOptions>() ?? new SoftSensorOptions();
    }
}
