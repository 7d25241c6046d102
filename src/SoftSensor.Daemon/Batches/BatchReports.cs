using System.Globalization;
using System.Net;
using System.Text;
using System.Threading.Channels;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Report;
using SoftSensor.Daemon.Store;

namespace SoftSensor.Daemon.Batches;

/// <summary>
/// Writes the batch report when a batch ends: the replay's report (<see cref="ReportPlots"/>,
/// <see cref="ReportWriter"/>) from the live store's frames of that batch, with its phases and alarm
/// changes, into <c>{data folder}/reports/{reactor}/{batch}/report.html</c> and its PNG figures (the data
/// folder is the store file's folder). Runs on its own task, never on a cycle; a failure is logged,
/// not fatal. Before reading, it waits (at most <see cref="FlushWait"/>) until the store holds a frame
/// after the batch, so the last cycles of the batch are in it.
/// </summary>
internal sealed class BatchReports(BatchBook book, SqliteStore store, IOptions<SoftSensorOptions> options, ILogger<BatchReports> log, IEnumerable<IBatchSamples> sampleSources) : BackgroundService
{
    private static readonly TimeSpan FlushWait = TimeSpan.FromSeconds(5);
    private readonly Channel<BatchRun> _ended = Channel.CreateUnbounded<BatchRun>(new UnboundedChannelOptions { SingleReader = true });

    /// <summary>Folder of all reports: <c>reports</c> beside the store file.</summary>
    public string Root { get; } = Path.Combine(Path.GetDirectoryName(Path.GetFullPath(options.Value.Store.Path))!, "reports");

    /// <summary>The folder name of a batch id (characters other than letters, digits, '.', '-', '_' become '_').</summary>
    public static string FolderName(string batchId) =>
        string.Concat(batchId.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.' ? c : '_')).TrimStart('.') is { Length: > 0 } s ? s : "_";

    /// <summary>The folder of one batch's report.</summary>
    public string FolderOf(string reactor, string batchId) => Path.Combine(Root, reactor, FolderName(batchId));

    /// <summary>Completes once written (tests wait on it); raised on the report task.</summary>
    public event Action<BatchRun, string>? Written;

    public override Task StartAsync(CancellationToken cancellationToken)
    {
        book.Ended += OnEnded;
        return base.StartAsync(cancellationToken);
    }

    public override async Task StopAsync(CancellationToken cancellationToken)
    {
        book.Ended -= OnEnded;
        _ended.Writer.TryComplete();
        await base.StopAsync(cancellationToken);
    }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        try
        {
            await foreach (var run in _ended.Reader.ReadAllAsync(stoppingToken))
            {
                try
                {
                    string dir = await WriteAsync(run, stoppingToken);
                    BatchLog.ReportWritten(log, run.Reactor, run.BatchId, dir);
                    Written?.Invoke(run, dir);
                }
                catch (Exception e) when (e is not OperationCanceledException)
                {
                    BatchLog.ReportFailed(log, e, run.Reactor, run.BatchId);
                }
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
            // Stopping: a report still queued is not written; the data stay in the store.
        }
    }

    /// <summary>Writes the report of an ended batch now; returns its folder.</summary>
    public async Task<string> WriteAsync(BatchRun run, CancellationToken cancellationToken)
    {
        var until = DateTime.UtcNow + FlushWait;
        while (DateTime.UtcNow < until && await store.LatestBatchAsync(run.Reactor, cancellationToken) == run.BatchId)
        {
            await Task.Delay(100, cancellationToken);
        }

        var frames = await store.BatchFramesAsync(run.Reactor, run.BatchId, cancellationToken);
        var to = run.EndedAt ?? DateTimeOffset.MaxValue;
        var alarms = await store.QueryAlarmsAsync(run.Reactor, run.StartedAt, to, 2000, cancellationToken);
        var phases = book.Phases(run.Reactor, run.BatchId);
        string dir = FolderOf(run.Reactor, run.BatchId);
        Directory.CreateDirectory(dir);
        var samples = sampleSources.SelectMany(s => s.BiomassSamples(run.Reactor, run.BatchId)).OrderBy(s => s.SampledAt).ToList();
        var scheduled = samples.Select(s => new Replay.ScheduledSample(new Core.Estimation.OfflineSample(s.SampledAt, s.ValueGPerL, s.SigmaGPerL), s.SampledAt, 0, s.Id)).ToList();
        var result = BatchReportSource.FromFrames(frames) with { Samples = scheduled, SamplesApplied = samples.Count(s => s.Applied) };
        var applied = scheduled.Where((_, i) => samples[i].Applied).ToList();
        var figures = result.Series.Cycles > 0 ? ReportPlots.Draw(dir, result.Series, applied, run.StartedAt) : [];
        ReportWriter.Write(dir, $"Batch {run.BatchId} of reactor {run.Reactor}", result, figures, Sections(run, phases, alarms, samples));
        return dir;
    }

    /// <summary>Every report written: reactor → batch folder names, newest first.</summary>
    public IReadOnlyList<(string Reactor, string Batch, DateTime WrittenUtc)> List() =>
        !Directory.Exists(Root) ? [] :
        [.. Directory.GetDirectories(Root).SelectMany(r => Directory.GetDirectories(r)
            .Where(b => File.Exists(Path.Combine(b, "report.html")))
            .Select(b => (Path.GetFileName(r), Path.GetFileName(b), File.GetLastWriteTimeUtc(Path.Combine(b, "report.html")))))
            .OrderBy(x => x.Item1, StringComparer.Ordinal).ThenByDescending(x => x.Item3)];

    private void OnEnded(BatchRun run) => _ended.Writer.TryWrite(run);

    /// <summary>The batch's own sections of its report: the batch, its biomass samples, phases and alarm changes.</summary>
    internal static string Sections(BatchRun run, IReadOnlyList<PhaseChange> phases, IReadOnlyList<StoredAlarm> alarms, IReadOnlyList<BatchSample> samples)
    {
        var ci = CultureInfo.InvariantCulture;
        var h = new StringBuilder("<h2>Batch</h2>\n<table>\n");
        Row(h, "batch id", run.BatchId);
        Row(h, "started / ended", string.Create(ci, $"{run.StartedAt:O} / {run.EndedAt:O}"));
        Row(h, "initial conditions", string.Create(ci, $"{run.InitialVolumeL:G6} L, inoculum {run.InoculumBiomassGPerL:G6} ± {run.InoculumBiomassSigmaGPerL:G6} g/L, substrate {run.InitialSubstrateGPerL:G6} g/L"));
        h.Append("</table>\n<h2>Offline biomass samples</h2>\n");
        if (samples.Count == 0)
        {
            h.Append("<p>None entered for this batch.</p>\n");
        }
        else
        {
            h.Append("<table><tr><th>input</th><th>sampled, batch h</th><th>kind</th><th>dry weight ± σ, g/L</th><th>outcome</th><th>estimate before → after the update, g/L</th></tr>\n");
            foreach (var s in samples)
            {
                string shift = s.PriorGPerL is { } a && s.PosteriorGPerL is { } b ? string.Create(ci, $"{a:F3} → {b:F3}") : "—";
                h.Append(ci, $"<tr><td>{s.Id}</td><td>{(s.SampledAt - run.StartedAt).TotalHours:F2}</td><td>{E(s.Kind)}</td><td>{s.ValueGPerL:F3} ± {s.SigmaGPerL:F3}</td><td>{E(s.Outcome)}</td><td>{shift}</td></tr>\n");
            }

            h.Append("</table>\n");
        }

        h.Append("<h2>Phases</h2>\n<table><tr><th>phase</th><th>from</th><th>set by</th></tr>\n");
        foreach (var p in phases)
        {
            h.Append("<tr><td>").Append(E(p.Phase)).Append("</td><td>").Append(E(p.At.ToString("O", ci))).Append("</td><td>").Append(E(p.Source)).Append("</td></tr>\n");
        }

        h.Append("</table>\n<h2>Alarm changes</h2>\n");
        if (alarms.Count == 0)
        {
            return h.Append("<p>None.</p>\n").ToString();
        }

        h.Append("<table><tr><th>time</th><th>alarm</th><th>state</th><th>priority</th><th>value</th><th>message</th></tr>\n");
        foreach (var a in alarms)
        {
            h.Append("<tr><td>").Append(E(a.Time.ToString("O", ci))).Append("</td><td>").Append(E(a.AlarmId)).Append("</td><td>").Append(E(a.State))
             .Append("</td><td>").Append(E(a.Priority)).Append("</td><td>").Append(double.IsFinite(a.Value) ? a.Value.ToString("G5", ci) : "—")
             .Append("</td><td>").Append(E(a.Message)).Append("</td></tr>\n");
        }

        return h.Append("</table>\n").ToString();
    }

    private static void Row(StringBuilder h, string name, string value) =>
        h.Append("<tr><th>").Append(E(name)).Append("</th><td>").Append(E(value)).Append("</td></tr>\n");

    private static string E(string s) => WebUtility.HtmlEncode(s);
}
