using System.Globalization;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Hosting;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Cli;

/// <summary>What <c>softsensor demo</c> was asked for, checked (full paths).</summary>
internal sealed record DemoRequest(double Speed, TimeSpan? For, string DataDir, string? Config, string? Scenario)
{
    /// <summary>The <c>--influx</c> shortcuts as configuration overrides.</summary>
    public IReadOnlyList<string> InfluxOverrides { get; init; } = [];
}

/// <summary>
/// One run of the demo: the embedded broker, one virtual reactor per reactor of the definition on an
/// accelerated clock, and the daemon (the same host as <c>run</c>) reading them over MQTT.
/// </summary>
internal static class DemoSession
{
    public static async Task<int> RunAsync(DemoRequest request, TextWriter output, TextWriter error, CancellationToken cancellationToken)
    {
        string definitionDir = Path.Combine(request.DataDir, "definition");
        DemoFiles.WriteTo(definitionDir);
        string config = request.Config ?? DemoFiles.DefinitionIn(definitionDir);
        string scenarioPath = request.Scenario ?? DemoFiles.ScenarioIn(definitionDir);
        Scenario scenario;
        try
        {
            scenario = ScenarioLoader.Load(scenarioPath);
        }
        catch (ScenarioException e)
        {
            return CliOutput.BadInput(error, "--scenario: " + e.Message);
        }

        var runFor = request.For ?? TimeSpan.FromHours(scenario.DurationH);
        if (runFor > TimeSpan.FromHours(scenario.DurationH))
        {
            return CliOutput.BadInput(error, string.Create(CultureInfo.InvariantCulture,
                $"--for is {runFor}: past the scenario's duration_h {scenario.DurationH} h ({Path.GetFileName(scenarioPath)}); the virtual culture is not defined beyond it"));
        }

        string store = Path.Combine(request.DataDir, "demo.db");
        foreach (var f in new[] { store, store + "-wal", store + "-shm" })
        {
            File.Delete(f);
        }

        await using var broker = await DemoBroker.StartAsync();
        var clock = new ScaledTimeProvider(scenario.StartTime, request.Speed);
        var settings = new DaemonHostSettings
        {
            ConfigFile = config,
            // The demo reads no /etc/softsensor layer: a plant PC's own definition must not mix into it.
            SystemFolder = string.Empty,
            CommandLine = request.InfluxOverrides,
            Overrides = new(StringComparer.OrdinalIgnoreCase)
            {
                ["mqtt:host"] = broker.Host,
                ["mqtt:port"] = broker.Port.ToString(CultureInfo.InvariantCulture),
                ["store:path"] = store,
                ["access:credentialsFile"] = Path.Combine(request.DataDir, "credentials"),
            },
            ConfigureServices = s => s.AddSingleton<TimeProvider>(clock),
            ConsoleLevel = Microsoft.Extensions.Logging.LogLevel.Warning,
        };

        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);

        // The virtual reactors start with the clock, before the daemon's host is built, so the first
        // cycles wait only for the analyser's dead time, not for the host's start-up as well.
        var reactors = Definition(settings)?.Reactors ?? [];
        for (int i = 0; i < reactors.Count; i++)
        {
            StartReactor(reactors[i], scenario, i, clock, broker, output, error, stop.Token);
        }

        return await DaemonRunner.RunAsync(settings, error, async (app, ct) =>
        {
            string speed = request.Speed.ToString(CultureInfo.InvariantCulture);
            await output.WriteLineAsync($"SoftSensor demo: scenario {scenario.Name} ({Path.GetFileName(scenarioPath)}, invented data), {speed}x, {runFor} of simulated time");
            await output.WriteLineAsync($"definition: {config}");
            // One command stays enough: a one-time operator login link (the token opens one session, then is void).
            string login = app.Services.GetRequiredService<Access.CredentialStore>().AddOneTimeToken(Access.Role.Operator);
            await output.WriteLineAsync($"status page: {DaemonHost.StatusAddress(app)}/login?token={login} (one-time operator login; reading needs none)");
            await output.WriteLineAsync($"broker: {broker.Address} (e.g. mosquitto_sub -h {broker.Host} -p {broker.Port} -t 'softsensor/#' -v)");
            await output.WriteLineAsync($"store: {store}");
            await output.WriteLineAsync("Advisory only: not a safety instrumented system. Ctrl+C stops.");
            OpenBatches(app.Services.GetRequiredService<Batches.BatchBook>(), Definition(settings)?.Reactors ?? [], output);
            await output.WriteLineAsync(CycleConsole.Header());
            var board = app.Services.GetRequiredService<StatusBoard>();
            board.Updated += s => output.WriteLine(CycleConsole.Line(s));
            stop.CancelAfter(runFor / request.Speed);
        }, stop.Token);
    }

    /// <summary>
    /// Opens each reactor's configured batch with the estimator's initial conditions, so the batch book
    /// (what the status page, <c>batch status</c> and the frames show) holds the demo's batch from its start.
    /// </summary>
    private static void OpenBatches(Batches.BatchBook book, IReadOnlyList<ReactorOptions> reactors, TextWriter output)
    {
        foreach (var r in reactors.Where(r => r.BatchId.Length > 0 && book.Current(r.Id) is null))
        {
            var e = r.Estimator;
            var (run, problems) = book.Start(r.Id, new Batches.BatchStart(r.BatchId, e.InitialVolumeL, e.InitialBiomassGPerL, e.InitialBiomassSigmaGPerL, e.InitialSubstrateGPerL));
            output.WriteLine(run is null ? $"reactor {r.Id}: batch {r.BatchId} not opened: {string.Join("; ", problems)}" : $"reactor {r.Id}: batch {run.BatchId} open, phase {run.Phase}");
        }
    }

    /// <summary>The definition bound as the host will bind it (its layers and overrides); null when it cannot be read (the host then reports why).</summary>
    private static SoftSensorOptions? Definition(DaemonHostSettings settings)
    {
        try
        {
            var configuration = new ConfigurationManager();
            DaemonConfiguration.Apply(configuration, settings);
            return configuration.Get<SoftSensorOptions>();
        }
        catch (Exception e) when (e is IOException or InvalidDataException or FormatException or InvalidOperationException)
        {
            return null;
        }
    }

    private static void StartReactor(ReactorOptions options, Scenario scenario, int index, TimeProvider clock, DemoBroker broker, TextWriter output, TextWriter error, CancellationToken ct)
    {
        var reactor = VirtualReactor.Create(scenario, scenario.Seed + index);
        var tags = options.Tags.Select(t => new VirtualTagRoutes.DefinedTag(t.Key, t.Value.Role, t.Value.Topic, t.Value.Scale, t.Value.Offset));
        var (routes, unfed) = VirtualTagRoutes.For(tags, reactor);
        if (unfed.Count > 0)
        {
            output.WriteLine($"reactor {options.Id}: the virtual reactor does not feed " + string.Join(", ", unfed));
        }

        var publisher = new DemoPublisher(reactor, clock, $"softsensor-demo-reactor-{options.Id}", routes);
        _ = publisher.RunAsync(broker.Host, broker.Port, ct).ContinueWith(
            t => error.WriteLine($"error: the virtual reactor of {options.Id} stopped: " + t.Exception?.GetBaseException().Message),
            CancellationToken.None, TaskContinuationOptions.OnlyOnFaulted, TaskScheduler.Default);
    }
}
