using System.Diagnostics;
using System.Globalization;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.LoadTest;

/// <summary>
/// One load step: a fresh mosquitto (unless a broker was given) and a fresh daemon child process
/// with N reactors; the publisher runs until every reactor published an estimate, then a warm-up,
/// then the measured window; then the publisher stops and the totals are compared.
/// </summary>
internal sealed class LoadStep(LoadOptions options, string demoConfig, string scenarioFile)
{
    public async Task<StepResult> RunAsync(int reactors, TextWriter log)
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-load-").FullName;
        try
        {
            return await RunInAsync(dir, reactors, log);
        }
        finally
        {
            if (!options.KeepFiles)
            {
                try
                {
                    Directory.Delete(dir, recursive: true);
                }
                catch (IOException)
                {
                    // A leftover temp folder is harmless.
                }
            }
        }
    }

    private async Task<StepResult> RunInAsync(string dir, int reactors, TextWriter log)
    {
        ChildProcess? broker = null;
        try
        {
            int port = options.BrokerPort;
            if (port == 0)
            {
                port = FreePort.Next();
                File.WriteAllText(Path.Combine(dir, "mosquitto.conf"), $"listener {port} 127.0.0.1\nallow_anonymous true\npersistence false\nlog_dest none\nmax_queued_messages 100000\n");
                broker = ChildProcess.Start("/usr/sbin/mosquitto", ["-c", Path.Combine(dir, "mosquitto.conf")], Path.Combine(dir, "mosquitto.log"));
                await FreePort.WaitListeningAsync(port, TimeSpan.FromSeconds(10));
            }

            return await MeasureAsync(dir, reactors, port, broker, log);
        }
        finally
        {
            if (broker is not null)
            {
                await broker.DisposeAsync();
            }
        }
    }

    private async Task<StepResult> MeasureAsync(string dir, int reactors, int port, ChildProcess? broker, TextWriter log)
    {

        int statusPort = FreePort.Next();
        string config = Path.Combine(dir, "load.json");
        var tags = LoadConfig.Write(config, demoConfig, reactors, port, statusPort, Path.Combine(dir, "store.db"));
        string daemonDll = options.DaemonDll ?? Path.Combine(AppContext.BaseDirectory, "softsensor.dll");
        await using var daemon = ChildProcess.Start("dotnet", [daemonDll, "run", "--config", config], Path.Combine(dir, "daemon.log"));
        await using var metrics = new DaemonMetricsReader(statusPort);
        await using var probe = new LatencyProbe(port);
        await probe.StartAsync();
        await FreePort.WaitListeningAsync(statusPort, TimeSpan.FromSeconds(300));

        var scenario = ScenarioLoader.Load(scenarioFile);
        await using var publisher = new LoadPublisher(port, reactors, tags, VirtualReactor.Create(scenario, scenario.Seed));
        await publisher.ConnectAsync();

        // Warm-up: publish until every reactor published an estimate (the daemon subscribed its topics),
        // then a while longer; stop, and let the daemon take in what is in flight.
        var warmUp = Publish(publisher);
        var ready = Stopwatch.StartNew();
        while (probe.ReactorsSeen < reactors)
        {
            if (ready.Elapsed > TimeSpan.FromSeconds(300) || daemon.HasExited || warmUp.Task.IsCompleted)
            {
                throw new InvalidOperationException($"{reactors} reactors: only {probe.ReactorsSeen} published an estimate within {ready.Elapsed.TotalSeconds:0} s (daemon exited: {daemon.HasExited}; log in {dir}/daemon.log)");
            }

            await Task.Delay(100);
            if (ready.Elapsed.TotalSeconds % 10 < 0.1)
            {
                log.WriteLine($"  {reactors} reactors: {probe.ReactorsSeen} publishing estimates after {ready.Elapsed.TotalSeconds:0} s");
            }
        }

        log.WriteLine($"  {reactors} reactors: all publishing after {ready.Elapsed.TotalSeconds:0.0} s; warm-up {options.WarmUp.TotalSeconds:0} s, window {options.Window.TotalSeconds:0} s");
        await Task.Delay(options.WarmUp);
        await StopAsync(warmUp);
        long accepted0 = await QuiescentAsync(metrics, long.MaxValue);
        long mapped0 = publisher.PublishedMapped;
        long published0 = publisher.Published;
        publisher.ClearLag();

        // The measured window: counters from here on; CPU of the daemon (and of our mosquitto) over the window.
        var hist0 = await metrics.BucketsAsync("softsensor_tag_to_estimate_seconds");
        var sinks0 = await metrics.SumsByLabelAsync("softsensor_sink_write_seconds_sum", "sink");
        var cpu0 = daemon.CpuTime();
        var brokerCpu0 = broker?.CpuTime() ?? TimeSpan.Zero;
        var wall = Stopwatch.StartNew();
        probe.Record(true);
        var measured = Publish(publisher);
        await Task.Delay(options.Window);
        probe.Record(false);
        double windowS = wall.Elapsed.TotalSeconds;
        var cpu = daemon.CpuTime() - cpu0;
        var brokerCpu = (broker?.CpuTime() ?? TimeSpan.Zero) - brokerCpu0;
        double rss = daemon.PeakRssMiB();
        string loadAverage = string.Join(' ', File.ReadAllText("/proc/loadavg").Split(' ')[..3]);
        var hist1 = await metrics.BucketsAsync("softsensor_tag_to_estimate_seconds");
        var sinks1 = await metrics.SumsByLabelAsync("softsensor_sink_write_seconds_sum", "sink");
        var (within50, p99Bound) = Histogram(hist0, hist1);
        await StopAsync(measured);
        long publishedInWindow = publisher.Published - published0;
        long mapped = publisher.PublishedMapped - mapped0;
        long accepted = await QuiescentAsync(metrics, accepted0 + mapped) - accepted0;

        long rejected = await metrics.SumAsync("softsensor_samples_rejected_total");
        long reconnects = await metrics.SumAsync("softsensor_mqtt_reconnects_total");
        var latencies = probe.Latencies();
        Array.Sort(latencies);
        var lag = publisher.LagMs.ToArray();
        Array.Sort(lag);
        return new StepResult(
            reactors, windowS, publishedInWindow, mapped, accepted, rejected,
            (long)Math.Round(reactors * windowS), probe.Received,
            Percentile(latencies, 0.50), Percentile(latencies, 0.95), Percentile(latencies, 0.99), latencies.Length == 0 ? double.NaN : latencies[^1],
            Percentile(lag, 0.99), 100 * cpu.TotalSeconds / windowS, rss, 100 * brokerCpu.TotalSeconds / windowS, loadAverage)
        {
            DaemonWithin50MsPercent = within50,
            DaemonP99BucketMs = p99Bound,
            Reconnects = reconnects,
            SinkBusyPercent = sinks1.ToDictionary(kv => kv.Key, kv => 100 * (kv.Value - sinks0.GetValueOrDefault(kv.Key)) / windowS),
        };
    }

    private static (Task Task, CancellationTokenSource Stop) Publish(LoadPublisher publisher)
    {
        var stop = new CancellationTokenSource();
        return (Task.Run(() => publisher.RunAsync(stop.Token)), stop);
    }

    private static async Task StopAsync((Task Task, CancellationTokenSource Stop) run)
    {
        await run.Stop.CancelAsync();
        try
        {
            await run.Task;
        }
        catch (OperationCanceledException)
        {
            // Stopped.
        }

        run.Stop.Dispose();
    }

    /// <summary>The daemon's accepted-sample total once it stopped moving (or reached <paramref name="expected"/>), at most 10 s.</summary>
    private static async Task<long> QuiescentAsync(DaemonMetricsReader metrics, long expected)
    {
        long last = -1;
        for (int i = 0; i < 50; i++)
        {
            await Task.Delay(200);
            long now = await metrics.SumAsync("softsensor_samples_in_total");
            if (now >= expected || now == last)
            {
                return now;
            }

            last = now;
        }

        return last;
    }

    /// <summary>From the daemon's own histogram over the window: % of frames dispatched within 50 ms of their newest input's arrival, and the bucket bound holding the p99.</summary>
    private static (double Within50Percent, double P99BoundMs) Histogram(SortedDictionary<double, long> before, SortedDictionary<double, long> after)
    {
        var delta = after.ToDictionary(kv => kv.Key, kv => kv.Value - before.GetValueOrDefault(kv.Key));
        long total = delta.GetValueOrDefault(double.PositiveInfinity);
        if (total <= 0)
        {
            return (double.NaN, double.NaN);
        }

        double within = 100.0 * delta.GetValueOrDefault(0.05) / total;
        double p99 = delta.Where(kv => kv.Value >= 0.99 * total).Select(kv => kv.Key).DefaultIfEmpty(double.PositiveInfinity).Min();
        return (within, p99 * 1000);
    }

    private static double Percentile(double[] sorted, double p) =>
        sorted.Length == 0 ? double.NaN : sorted[Math.Min(sorted.Length - 1, (int)Math.Ceiling(p * sorted.Length) - 1)];
}

/// <summary>Sums a counter over all its series from the daemon's Prometheus text at /metrics.</summary>
internal sealed class DaemonMetricsReader(int port) : IAsyncDisposable
{
    private readonly HttpClient _http = new() { BaseAddress = new Uri($"http://127.0.0.1:{port}"), Timeout = TimeSpan.FromSeconds(10) };

    public async Task<long> SumAsync(string name)
    {
        string text = await _http.GetStringAsync(new Uri("/metrics", UriKind.Relative));
        double sum = 0;
        foreach (var line in text.AsSpan().EnumerateLines())
        {
            if (line.StartsWith(name) && (line.Length > name.Length && (line[name.Length] == '{' || line[name.Length] == ' ')))
            {
                int space = line.LastIndexOf(' ');
                sum += double.Parse(line[(space + 1)..], CultureInfo.InvariantCulture);
            }
        }

        return (long)sum;
    }

    /// <summary>A metric's value per value of one label, e.g. each sink's <c>_sum</c>.</summary>
    public async Task<Dictionary<string, double>> SumsByLabelAsync(string name, string label)
    {
        string text = await _http.GetStringAsync(new Uri("/metrics", UriKind.Relative));
        var sums = new Dictionary<string, double>(StringComparer.Ordinal);
        string open = label + "=\"";
        foreach (var line in text.AsSpan().EnumerateLines())
        {
            if (!line.StartsWith(name + "{", StringComparison.Ordinal))
            {
                continue;
            }

            int at = line.IndexOf(open, StringComparison.Ordinal);
            if (at < 0)
            {
                continue;
            }

            var rest = line[(at + open.Length)..];
            string key = rest[..rest.IndexOf('"')].ToString();
            sums[key] = sums.GetValueOrDefault(key) + double.Parse(line[(line.LastIndexOf(' ') + 1)..], CultureInfo.InvariantCulture);
        }

        return sums;
    }

    /// <summary>The cumulative buckets of a histogram summed over all its series: upper bound (s) → count.</summary>
    public async Task<SortedDictionary<double, long>> BucketsAsync(string name)
    {
        string text = await _http.GetStringAsync(new Uri("/metrics", UriKind.Relative));
        var sums = new SortedDictionary<double, long>();
        string prefix = name + "_bucket{";
        foreach (var line in text.AsSpan().EnumerateLines())
        {
            if (!line.StartsWith(prefix))
            {
                continue;
            }

            int le = line.IndexOf("le=\"");
            int close = line[(le + 4)..].IndexOf('"') + le + 4;
            var bound = line[(le + 4)..close];
            double b = bound.SequenceEqual("+Inf") ? double.PositiveInfinity : double.Parse(bound, CultureInfo.InvariantCulture);
            long count = long.Parse(line[(line.LastIndexOf(' ') + 1)..], CultureInfo.InvariantCulture);
            sums[b] = sums.GetValueOrDefault(b) + count;
        }

        return sums;
    }

    public ValueTask DisposeAsync()
    {
        _http.Dispose();
        return ValueTask.CompletedTask;
    }
}
