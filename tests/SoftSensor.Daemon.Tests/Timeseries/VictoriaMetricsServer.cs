using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using System.Text.Json;

namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>
/// A private VictoriaMetrics (Debian package, /usr/bin/victoria-metrics) on a free loopback port
/// with its data in a temporary folder. It accepts the InfluxDB v2 write API (/api/v2/write) and
/// exports what it stored (/api/v1/export). Stopped gracefully with SIGTERM: an unclean stop of
/// the database itself can lose its last acknowledged seconds (docs/daemon.md).
/// </summary>
internal sealed class VictoriaMetricsServer : IAsyncDisposable
{
    private const string Binary = "/usr/bin/victoria-metrics";
    private readonly string _dataDir = Directory.CreateTempSubdirectory("softsensor-vm-").FullName;
    private readonly bool _dedup;
    private readonly HttpClient _http = new() { Timeout = TimeSpan.FromSeconds(10) };
    private Process? _process;

    public VictoriaMetricsServer(bool dedup)
    {
        _dedup = dedup;
        Port = FreePort();
    }

    public int Port { get; }

    public string Url => $"http://127.0.0.1:{Port}";

    public bool Running => _process is { HasExited: false };

    public async Task StartAsync()
    {
        if (!File.Exists(Binary))
        {
            throw new InvalidOperationException($"{Binary} is missing: install the Debian package victoria-metrics (tests/run.sh does)");
        }

        var psi = new ProcessStartInfo(Binary)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        psi.ArgumentList.Add("-storageDataPath=" + _dataDir);
        psi.ArgumentList.Add($"-httpListenAddr=127.0.0.1:{Port}");
        psi.ArgumentList.Add("-loggerLevel=ERROR");
        psi.ArgumentList.Add("-search.latencyOffset=0s");
        if (_dedup)
        {
            psi.ArgumentList.Add("-dedup.minScrapeInterval=1ms");
        }

        _process = Process.Start(psi) ?? throw new InvalidOperationException("victoria-metrics did not start");
        _process.OutputDataReceived += (_, _) => { };
        _process.ErrorDataReceived += (_, _) => { };
        _process.BeginOutputReadLine();
        _process.BeginErrorReadLine();
        var deadline = DateTime.UtcNow.AddSeconds(20);
        while (DateTime.UtcNow < deadline)
        {
            try
            {
                using var r = await _http.GetAsync(new Uri(Url + "/health"));
                if (r.IsSuccessStatusCode)
                {
                    return;
                }
            }
            catch (HttpRequestException)
            {
                // not listening yet
            }

            await Task.Delay(50);
        }

        throw new TimeoutException($"victoria-metrics did not answer on {Url}/health within 20 s");
    }

    /// <summary>SIGTERM and wait for the process to end.</summary>
    public async Task StopGracefullyAsync()
    {
        if (_process is not { HasExited: false } p)
        {
            return;
        }

        using (var kill = Process.Start("kill", ["-TERM", p.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)]))
        {
            await kill.WaitForExitAsync();
        }

        using var wait = new CancellationTokenSource(TimeSpan.FromSeconds(20));
        await p.WaitForExitAsync(wait.Token);
        p.Dispose();
        _process = null;
    }

    /// <summary>Flushes and exports every series whose name matches <paramref name="nameRegex"/>: series key → timestamps (ms) as stored.</summary>
    public async Task<Dictionary<string, List<long>>> ExportAsync(string nameRegex)
    {
        using (await _http.GetAsync(new Uri(Url + "/internal/force_flush")))
        {
        }

        using var form = new FormUrlEncodedContent([new("match[]", "{__name__=~\"" + nameRegex + "\"}"), new("start", "0")]);
        using var resp = await _http.PostAsync(new Uri(Url + "/api/v1/export"), form);
        resp.EnsureSuccessStatusCode();
        string body = await resp.Content.ReadAsStringAsync();
        var result = new Dictionary<string, List<long>>(StringComparer.Ordinal);
        foreach (var line in body.Split('\n', StringSplitOptions.RemoveEmptyEntries))
        {
            using var doc = JsonDocument.Parse(line);
            var metric = doc.RootElement.GetProperty("metric");
            string key = string.Join(",", metric.EnumerateObject().Select(p => p.Name + "=" + p.Value.GetString()).Order(StringComparer.Ordinal));
            var ts = doc.RootElement.GetProperty("timestamps").EnumerateArray().Select(e => e.GetInt64());
            if (!result.TryGetValue(key, out var list))
            {
                result[key] = list = [];
            }

            list.AddRange(ts);
        }

        return result;
    }

    /// <summary>Exports until every series matching has at least <paramref name="expected"/> distinct timestamps (new data takes a moment to be searchable), or 15 s.</summary>
    public async Task<Dictionary<string, List<long>>> ExportWhenCompleteAsync(string nameRegex, int series, int expected)
    {
        var deadline = DateTime.UtcNow.AddSeconds(15);
        while (true)
        {
            var got = await ExportAsync(nameRegex);
            if ((got.Count >= series && got.Values.All(v => v.Distinct().Count() >= expected)) || DateTime.UtcNow > deadline)
            {
                return got;
            }

            await Task.Delay(200);
        }
    }

    public async ValueTask DisposeAsync()
    {
        if (_process is { HasExited: false } p)
        {
            p.Kill();
            await p.WaitForExitAsync();
        }

        _process?.Dispose();
        _http.Dispose();
        try
        {
            Directory.Delete(_dataDir, recursive: true);
        }
        catch (IOException)
        {
            // left for the OS to clean
        }
    }

    private static int FreePort()
    {
        using var l = new TcpListener(IPAddress.Loopback, 0);
        l.Start();
        return ((IPEndPoint)l.LocalEndpoint).Port;
    }
}
