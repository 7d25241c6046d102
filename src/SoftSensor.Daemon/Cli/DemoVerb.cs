using System.CommandLine;
using System.Globalization;
using Microsoft.Extensions.DependencyInjection;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Hosting;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor demo [--speed N] [--for DURATION] [--data DIR]</c>: an embedded MQTT broker on
/// loopback, the virtual pilot reactor (glycerol scenario) publishing its tags in accelerated time,
/// and the daemon reading them through the real MQTT path, storing, printing one line per cycle
/// and serving the status page.
/// </summary>
internal sealed class DemoVerb : IVerb
{
    public Command Build()
    {
        var speed = new Option<double>("--speed") { Description = "Simulated seconds per real second (1 to 3600)", DefaultValueFactory = _ => 60 };
        var duration = new Option<string?>("--for") { Description = "Stop after this much simulated time, e.g. 2h, 30m, 90s (default: the scenario's duration)" };
        var data = new Option<string>("--data") { Description = "Folder of the demo's store (demo.db, recreated each run)", DefaultValueFactory = _ => "data" };
        var command = new Command("demo", "Run the demo: embedded broker, virtual reactor in accelerated time, the daemon and its status page") { speed, duration, data };
        var influx = new InfluxShortcutOptions();
        influx.AddTo(command);
        command.SetAction((parse, ct) =>
        {
            var influxOverrides = new List<string>();
            return influx.AppendTo(parse, influxOverrides, Console.Error) is { } bad
                ? Task.FromResult(bad)
                : RunAsync(parse.GetValue(speed), parse.GetValue(duration), parse.GetValue(data)!, influxOverrides, ct);
        });
        return command;
    }

    private static async Task<int> RunAsync(double speed, string? forText, string dataDir, List<string> influxOverrides, CancellationToken cancellationToken)
    {
        if (!(speed is >= 1 and <= 3600))
        {
            return CliOutput.BadInput(Console.Error, $"--speed is {speed.ToString(CultureInfo.InvariantCulture)} (expected 1 to 3600 simulated seconds per second)");
        }

        TimeSpan? simFor = null;
        if (forText is not null)
        {
            if (!DurationText.TryParse(forText, out var d))
            {
                return CliOutput.BadInput(Console.Error, $"--for is '{forText}' (expected a duration such as 2h, 30m, 90s or 01:30:00)");
            }

            simFor = d;
        }

        string? config = DemoFiles.Find(DemoFiles.Config);
        string? scenarioPath = DemoFiles.Find(DemoFiles.Scenario);
        if (config is null || scenarioPath is null)
        {
            await Console.Error.WriteLineAsync($"error: {DemoFiles.Config} or {DemoFiles.Scenario} not found above {Directory.GetCurrentDirectory()} (run from the repository)");
            return ExitCodes.Failure;
        }

        var scenario = ScenarioLoader.Load(scenarioPath);
        var runFor = simFor ?? TimeSpan.FromHours(scenario.DurationH);
        string store = Path.GetFullPath(Path.Combine(dataDir, "demo.db"));
        Directory.CreateDirectory(Path.GetDirectoryName(store)!);
        foreach (var f in new[] { store, store + "-wal", store + "-shm" })
        {
            File.Delete(f);
        }

        await using var broker = await DemoBroker.StartAsync();
        var clock = new ScaledTimeProvider(scenario.StartTime, speed);
        var reactor = VirtualReactor.Create(scenario, scenario.Seed);
        var settings = new DaemonHostSettings
        {
            ConfigFile = config,
            CommandLine = influxOverrides,
            Overrides = new(StringComparer.OrdinalIgnoreCase)
            {
                ["mqtt:host"] = broker.Host,
                ["mqtt:port"] = broker.Port.ToString(CultureInfo.InvariantCulture),
                ["store:path"] = store,
                ["access:credentialsFile"] = Path.Combine(Path.GetDirectoryName(store)!, "credentials"),
            },
            ConfigureServices = s => s.AddSingleton<TimeProvider>(clock),
            ConsoleLevel = Microsoft.Extensions.Logging.LogLevel.Warning,
        };

        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        return await DaemonRunner.RunAsync(settings, Console.Error, async (app, ct) =>
        {
            Console.WriteLine($"SoftSensor demo: scenario {scenario.Name} ({Path.GetFileName(scenarioPath)}, invented data), {speed.ToString(CultureInfo.InvariantCulture)}x, {runFor} of simulated time");
            // One command stays enough: a one-time operator login link (the token opens one session, then is void).
            string login = app.Services.GetRequiredService<Access.CredentialStore>().AddOneTimeToken(Access.Role.Operator);
            Console.WriteLine($"status page: {DaemonHost.StatusAddress(app)}/login?token={login} (one-time operator login; reading needs none)");
            Console.WriteLine($"broker: {broker.Address}");
            Console.WriteLine($"store: {store}");
            Console.WriteLine("Advisory only: not a safety instrumented system. Ctrl+C stops.");
            var board = app.Services.GetRequiredService<StatusBoard>();
            board.Updated += s => Console.WriteLine(Line(s));
            var publisher = new DemoPublisher(reactor, clock, "r1");
            _ = publisher.RunAsync(broker.Host, broker.Port, stop.Token).ContinueWith(
                t => Console.Error.WriteLine("error: the simulator stopped: " + t.Exception?.GetBaseException().Message),
                CancellationToken.None, TaskContinuationOptions.OnlyOnFaulted, TaskScheduler.Default);
            stop.CancelAfter(runFor / speed);
            await Task.CompletedTask;
        }, stop.Token);
    }

    private static string Line(ReactorSnapshot s)
    {
        var f = s.Frame;
        string V(string name)
        {
            foreach (var v in f?.Values ?? [])
            {
                if (v.Name == name && double.IsFinite(v.Value))
                {
                    return v.Value.ToString(Math.Abs(v.Value) >= 100 ? "F1" : "F3", CultureInfo.InvariantCulture);
                }
            }

            return "-";
        }

        string quality = (f?.Quality ?? SampleQuality.Bad).ToString().ToLowerInvariant();
        return string.Create(CultureInfo.InvariantCulture,
            $"{s.CycleTime.UtcDateTime:yyyy-MM-ddTHH:mm:ssZ} {s.Reactor} #{s.Cycle} OUR {V(EstimateNames.Our)} CER {V(EstimateNames.Cer)} RQ {V(EstimateNames.Rq)} mu {V(EstimateNames.MuPerH)} X {V(EstimateNames.BiomassGPerL)} [{quality}]");
    }
}
