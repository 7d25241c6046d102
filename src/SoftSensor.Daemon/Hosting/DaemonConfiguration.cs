using Microsoft.Extensions.Configuration;

namespace SoftSensor.Daemon.Hosting;

/// <summary>
/// The configuration layers of the daemon, lowest priority first (docs/daemon.md):
/// <c>appsettings.json</c> beside the executable, the <c>--config</c> file, every
/// <c>/etc/softsensor/*.json</c> in name order, in-memory overrides (the demo's broker port),
/// environment variables <c>SOFTSENSOR_*</c> with <c>__</c> between sections, and the command line
/// (<c>--mqtt:port=1884</c>).
/// </summary>
internal static class DaemonConfiguration
{
    /// <summary>Prefix of the environment variables read.</summary>
    public const string EnvironmentPrefix = "SOFTSENSOR_";

    /// <summary>The system-wide folder of configuration fragments.</summary>
    public const string SystemFolder = "/etc/softsensor";

    /// <summary>The definition files read, lowest priority first (those that exist).</summary>
    public static IReadOnlyList<string> Files(DaemonHostSettings settings)
    {
        var files = new List<string> { Path.Combine(AppContext.BaseDirectory, "appsettings.json") };
        if (settings.ConfigFile is { } file)
        {
            files.Add(Path.GetFullPath(file));
        }

        string folder = settings.SystemFolder ?? SystemFolder;
        if (Directory.Exists(folder))
        {
            files.AddRange(Directory.GetFiles(folder, "*.json").OrderBy(f => f, StringComparer.Ordinal).Select(Path.GetFullPath));
        }

        return files.Where(File.Exists).ToList();
    }

    /// <summary>Adds the layers to <paramref name="configuration"/> after removing the defaults.</summary>
    public static void Apply(IConfigurationManager configuration, DaemonHostSettings settings)
    {
        configuration.Sources.Clear();
        IndexedJsonConfigurationSource.Add(configuration, Path.Combine(AppContext.BaseDirectory, "appsettings.json"), optional: true);
        if (settings.ConfigFile is { } file)
        {
            IndexedJsonConfigurationSource.Add(configuration, Path.GetFullPath(file), optional: false);
        }

        string folder = settings.SystemFolder ?? SystemFolder;
        if (Directory.Exists(folder))
        {
            foreach (var f in Directory.GetFiles(folder, "*.json").OrderBy(f => f, StringComparer.Ordinal))
            {
                IndexedJsonConfigurationSource.Add(configuration, Path.GetFullPath(f), optional: true);
            }
        }

        if (settings.Overrides.Count > 0)
        {
            configuration.AddInMemoryCollection(settings.Overrides);
        }

        configuration.AddInMemoryCollection(EnvironmentSettings());
        if (settings.CommandLine.Count > 0)
        {
            configuration.AddCommandLine([.. settings.CommandLine]);
        }

        var defaults = Configuration.DefaultsOverlay.Keys(configuration);
        if (defaults.Count > 0)
        {
            configuration.AddInMemoryCollection(defaults);
        }
    }

    /// <summary>
    /// The environment's settings: <c>SOFTSENSOR_section__key</c> (and the top-level scalars <c>SOFTSENSOR_site</c>,
    /// <c>SOFTSENSOR_area</c>). The program's own variables that are not settings (<c>SOFTSENSOR_TOKEN</c>,
    /// <c>SOFTSENSOR_TOKEN_FILE</c>, <c>SOFTSENSOR_OPCUA_PASSWORD</c>, <c>SOFTSENSOR_INFLUX_TOKEN</c>: names
    /// without a section) are left out, so the strict definition does not refuse them as unknown keys.
    /// </summary>
    internal static Dictionary<string, string?> EnvironmentSettings()
    {
        var settings = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
        foreach (System.Collections.DictionaryEntry e in Environment.GetEnvironmentVariables())
        {
            string name = (string)e.Key;
            if (!name.StartsWith(EnvironmentPrefix, StringComparison.OrdinalIgnoreCase))
            {
                continue;
            }

            string key = name[EnvironmentPrefix.Length..];
            bool topScalar = key.Equals("site", StringComparison.OrdinalIgnoreCase) || key.Equals("area", StringComparison.OrdinalIgnoreCase);
            if (key.Contains("__", StringComparison.Ordinal) || topScalar)
            {
                settings[key.Replace("__", ":", StringComparison.Ordinal)] = (string?)e.Value;
            }
        }

        return settings;
    }
}

/// <summary>How a daemon host is built: the config file, overrides, and hooks for the demo and tests.</summary>
internal sealed class DaemonHostSettings
{
    /// <summary>The <c>--config</c> file, or null.</summary>
    public string? ConfigFile { get; init; }

    /// <summary>Replaces <see cref="DaemonConfiguration.SystemFolder"/> (tests); null for the default.</summary>
    public string? SystemFolder { get; init; }

    /// <summary>Configuration keys set above the files (e.g. the demo broker's port).</summary>
    public Dictionary<string, string?> Overrides { get; init; } = new(StringComparer.OrdinalIgnoreCase);

    /// <summary>Command-line overrides (<c>--key=value</c>), highest priority.</summary>
    public IReadOnlyList<string> CommandLine { get; init; } = [];

    /// <summary>Extra registrations after the daemon's own (a clock for the demo, extra sinks).</summary>
    public Action<Microsoft.Extensions.DependencyInjection.IServiceCollection>? ConfigureServices { get; init; }

    /// <summary>Minimum log level of the console (Information by default; the demo uses Warning).</summary>
    public Microsoft.Extensions.Logging.LogLevel ConsoleLevel { get; init; } = Microsoft.Extensions.Logging.LogLevel.Information;
}
