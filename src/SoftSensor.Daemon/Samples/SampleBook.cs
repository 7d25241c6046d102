using System.Diagnostics.Metrics;
using Microsoft.Data.Sqlite;
using SoftSensor.Core.Estimation;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Samples;

/// <summary>
/// The operator inputs of every reactor in the daemon's SQLite file: table <c>offline_samples</c> (every
/// input, stored before it is applied, with its outcome) and <c>corrected_estimates</c> (the trajectory
/// re-propagated after each applied input, keyed by reactor, batch, sample id and cycle time; the
/// published <c>estimates</c> are never rewritten). Pending inputs are kept in memory too and reloaded at
/// start, so a restart loses none. Resolving an input writes its outcome, its trajectory and the
/// estimator checkpoint that contains the correction in one transaction. Thread-safe.
/// </summary>
internal sealed partial class SampleBook
{
    private const string Schema = """
        CREATE TABLE IF NOT EXISTS offline_samples (
            id INTEGER PRIMARY KEY, reactor TEXT NOT NULL, batch TEXT NOT NULL, entered_ms INTEGER NOT NULL, sampled_ms INTEGER NOT NULL,
            kind TEXT NOT NULL, value_g_per_l REAL, sigma_g_per_l REAL, withdrawn_l REAL NOT NULL, analyte TEXT, operator TEXT,
            outcome TEXT NOT NULL, detail TEXT, resolved_ms INTEGER, applied_cycle_ms INTEGER,
            prior_g_per_l REAL, prior_sigma_g_per_l REAL, posterior_g_per_l REAL, posterior_sigma_g_per_l REAL, payload TEXT NOT NULL);
        CREATE INDEX IF NOT EXISTS offline_samples_by_reactor ON offline_samples (reactor, batch, id);
        CREATE TABLE IF NOT EXISTS corrected_estimates (
            reactor TEXT NOT NULL, batch TEXT NOT NULL, sample_id INTEGER NOT NULL, time_ms INTEGER NOT NULL,
            biomass_g_per_l REAL, biomass_sigma_g_per_l REAL, integrator_g_per_l REAL, ekf_g_per_l REAL, volume_l REAL,
            PRIMARY KEY (reactor, batch, sample_id, time_ms));
        CREATE INDEX IF NOT EXISTS corrected_by_reactor_time ON corrected_estimates (reactor, time_ms);
        """;

    private const string Columns = "id, reactor, batch, entered_ms, sampled_ms, kind, value_g_per_l, sigma_g_per_l, withdrawn_l, analyte, operator, outcome, detail, resolved_ms, applied_cycle_ms, prior_g_per_l, prior_sigma_g_per_l, posterior_g_per_l, posterior_sigma_g_per_l, payload";

    private readonly string _connectionString;
    private readonly TimeProvider _time;
    private readonly Lock _gate = new();
    private readonly Dictionary<string, List<SampleRecord>> _pending = new(StringComparer.Ordinal);
    private readonly Counter<long>? _rejected;
    private readonly Counter<long>? _resolved;

    /// <summary>Opens the book in the store's file (the store has created its tables, <c>checkpoints</c> among them).</summary>
    public SampleBook(SqliteStore store, TimeProvider time, IMeterFactory? meters = null)
    {
        _time = time;
        string full = store.Path;
        _connectionString = new SqliteConnectionStringBuilder { DataSource = full, Pooling = true, DefaultTimeout = 5 }.ToString();
        using (var c = Open())
        {
            Run(c, Schema);
            foreach (var r in Query(c, $"SELECT {Columns} FROM offline_samples WHERE outcome = '{SampleOutcomes.Pending}' ORDER BY id", _ => { }))
            {
                PendingOf(r.Reactor).Add(r);
            }
        }

        if (meters?.Create(DaemonMetrics.MeterName) is { } meter)
        {
            _rejected = meter.CreateCounter<long>("softsensor_operator_inputs_rejected_total", null, "Offline samples and removals refused (invalid payload)");
            _resolved = meter.CreateCounter<long>("softsensor_operator_inputs_resolved_total", null, "Offline samples and removals resolved (tag outcome)");
        }
    }

    /// <summary>Raised after an input was stored (entered) or resolved; handlers must not block (the cycle thread raises it).</summary>
    public event Action<SampleRecord>? Changed;

    /// <summary>Counts a refused input (its problems were answered and logged by the caller).</summary>
    public void CountRejected(string reactor) => _rejected?.Add(1, new KeyValuePair<string, object?>("reactor", reactor));

    /// <summary>Stores an input: pending for biomass samples and removals, recorded at once for substrate and product assays.</summary>
    public SampleRecord Enter(string reactor, string batch, SampleEntry e)
    {
        var now = _time.GetUtcNow();
        bool waits = e.IsBiomass || e.WithdrawnL > 0;
        string outcome = waits ? SampleOutcomes.Pending : SampleOutcomes.Recorded;
        string? detail = waits ? null : "stored and shown; the estimator keeps no substrate or product state with an uncertainty to correct";
        SampleRecord record;
        lock (_gate)
        {
            using var c = Open();
            using var cmd = c.CreateCommand();
            cmd.CommandText = """
                INSERT INTO offline_samples (reactor, batch, entered_ms, sampled_ms, kind, value_g_per_l, sigma_g_per_l, withdrawn_l, analyte, operator, outcome, detail, resolved_ms, payload)
                VALUES ($r, $b, $e, $s, $k, $v, $sg, $w, $a, $o, $out, $d, $res, $p) RETURNING id
                """;
            cmd.Parameters.AddWithValue("$r", reactor);
            cmd.Parameters.AddWithValue("$b", batch);
            cmd.Parameters.AddWithValue("$e", now.ToUnixTimeMilliseconds());
            cmd.Parameters.AddWithValue("$s", e.SampledAt.ToUnixTimeMilliseconds());
            cmd.Parameters.AddWithValue("$k", SampleEntry.Name(e.Kind));
            cmd.Parameters.AddWithValue("$v", (object?)e.ValueGPerL ?? DBNull.Value);
            cmd.Parameters.AddWithValue("$sg", (object?)e.SigmaGPerL ?? DBNull.Value);
            cmd.Parameters.AddWithValue("$w", e.WithdrawnL);
            cmd.Parameters.AddWithValue("$a", (object?)e.Analyte ?? DBNull.Value);
            cmd.Parameters.AddWithValue("$o", (object?)e.Operator ?? DBNull.Value);
            cmd.Parameters.AddWithValue("$out", outcome);
            cmd.Parameters.AddWithValue("$d", (object?)detail ?? DBNull.Value);
            cmd.Parameters.AddWithValue("$res", waits ? DBNull.Value : now.ToUnixTimeMilliseconds());
            cmd.Parameters.AddWithValue("$p", e.Payload);
            long id = (long)cmd.ExecuteScalar()!;
            record = new SampleRecord(id, reactor, batch, Ms(now), Ms(e.SampledAt), SampleEntry.Name(e.Kind), e.ValueGPerL, e.SigmaGPerL, e.WithdrawnL,
                e.Analyte, e.Operator, outcome, detail, waits ? null : Ms(now), null, null, null, null, null, e.Payload);
            if (waits)
            {
                PendingOf(reactor).Add(record);
            }
            else
            {
                _resolved?.Add(1, new("reactor", reactor), new("outcome", outcome));
            }
        }

        Changed?.Invoke(record);
        return record;
    }

    /// <summary>The pending inputs of a reactor, oldest entry first (a copy).</summary>
    public IReadOnlyList<SampleRecord> Pending(string reactor)
    {
        lock (_gate)
        {
            return _pending.TryGetValue(reactor, out var list) ? [.. list] : [];
        }
    }

    /// <summary>True when the reactor has inputs waiting (cheap; called every cycle).</summary>
    public bool HasPending(string reactor)
    {
        lock (_gate)
        {
            return _pending.TryGetValue(reactor, out var list) && list.Count > 0;
        }
    }

    /// <summary>
    /// Resolves a pending input: its outcome, the update point's prior and posterior and the corrected
    /// trajectory, and the checkpoint taken after the correction, in one transaction.
    /// </summary>
    public SampleRecord Resolve(SampleRecord pending, string outcome, string? detail, OfflineCorrection? correction, Checkpoint? checkpoint)
    {
        var now = _time.GetUtcNow();
        var trajectory = correction?.Trajectory ?? [];
        var first = trajectory.Count > 0 ? trajectory[0] : default(TrajectoryPoint?);
        var prior = correction is { Outcome: OfflineSampleOutcome.Applied } ? correction.Prior : default(TrajectoryPoint?);
        bool sample = pending.ValueGPerL is not null && (pending.Kind is "dcw" or "od");
        var resolved = pending with
        {
            Outcome = outcome,
            Detail = detail,
            ResolvedAt = Ms(now),
            AppliedAtCycle = first is { } f ? Ms(new DateTimeOffset(f.TimeTicks, TimeSpan.Zero)) : null,
            PriorGPerL = sample ? prior?.BiomassGPerL : null,
            PriorSigmaGPerL = sample ? prior?.BiomassSigmaGPerL : null,
            PosteriorGPerL = sample ? first?.BiomassGPerL : null,
            PosteriorSigmaGPerL = sample ? first?.BiomassSigmaGPerL : null,
        };
        lock (_gate)
        {
            using var c = Open();
            using var tx = c.BeginTransaction();
            Update(c, tx, resolved);
            Insert(c, tx, resolved, trajectory);
            if (checkpoint is not null)
            {
                using var cp = c.CreateCommand();
                cp.Transaction = tx;
                cp.CommandText = "INSERT INTO checkpoints (reactor, cycle, time_ms, state, batch) VALUES ($r, $c, $t, $s, $b)";
                cp.Parameters.AddWithValue("$r", checkpoint.Reactor);
                cp.Parameters.AddWithValue("$c", checkpoint.Cycle);
                cp.Parameters.AddWithValue("$t", checkpoint.Time.ToUnixTimeMilliseconds());
                cp.Parameters.AddWithValue("$s", checkpoint.State);
                cp.Parameters.AddWithValue("$b", (object?)checkpoint.Batch ?? DBNull.Value);
                cp.ExecuteNonQuery();
            }

            tx.Commit();
            if (_pending.TryGetValue(pending.Reactor, out var list))
            {
                list.RemoveAll(r => r.Id == pending.Id);
            }
        }

        _resolved?.Add(1, new("reactor", pending.Reactor), new("outcome", outcome));
        Changed?.Invoke(resolved);
        return resolved;
    }

    private static void Update(SqliteConnection c, SqliteTransaction tx, SampleRecord r)
    {
        using var u = c.CreateCommand();
        u.Transaction = tx;
        u.CommandText = """
            UPDATE offline_samples SET outcome = $o, detail = $d, resolved_ms = $res, applied_cycle_ms = $a,
                prior_g_per_l = $p, prior_sigma_g_per_l = $ps, posterior_g_per_l = $q, posterior_sigma_g_per_l = $qs WHERE id = $id
            """;
        u.Parameters.AddWithValue("$o", r.Outcome);
        u.Parameters.AddWithValue("$d", (object?)r.Detail ?? DBNull.Value);
        u.Parameters.AddWithValue("$res", r.ResolvedAt!.Value.ToUnixTimeMilliseconds());
        u.Parameters.AddWithValue("$a", (object?)r.AppliedAtCycle?.ToUnixTimeMilliseconds() ?? DBNull.Value);
        u.Parameters.AddWithValue("$p", Db(r.PriorGPerL));
        u.Parameters.AddWithValue("$ps", Db(r.PriorSigmaGPerL));
        u.Parameters.AddWithValue("$q", Db(r.PosteriorGPerL));
        u.Parameters.AddWithValue("$qs", Db(r.PosteriorSigmaGPerL));
        u.Parameters.AddWithValue("$id", r.Id);
        u.ExecuteNonQuery();
    }

    private static void Insert(SqliteConnection c, SqliteTransaction tx, SampleRecord r, IReadOnlyList<TrajectoryPoint> points)
    {
        if (points.Count == 0)
        {
            return;
        }

        using var i = c.CreateCommand();
        i.Transaction = tx;
        i.CommandText = "INSERT OR REPLACE INTO corrected_estimates VALUES ($r, $b, $s, $t, $x, $sx, $xi, $xe, $v)";
        i.Parameters.AddWithValue("$r", r.Reactor);
        i.Parameters.AddWithValue("$b", r.Batch);
        i.Parameters.AddWithValue("$s", r.Id);
        var t = i.Parameters.Add("$t", SqliteType.Integer);
        var x = i.Parameters.Add("$x", SqliteType.Real);
        var sx = i.Parameters.Add("$sx", SqliteType.Real);
        var xi = i.Parameters.Add("$xi", SqliteType.Real);
        var xe = i.Parameters.Add("$xe", SqliteType.Real);
        var v = i.Parameters.Add("$v", SqliteType.Real);
        i.Prepare();
        foreach (var p in points)
        {
            t.Value = new DateTimeOffset(p.TimeTicks, TimeSpan.Zero).ToUnixTimeMilliseconds();
            x.Value = Db(p.BiomassGPerL);
            sx.Value = Db(p.BiomassSigmaGPerL);
            xi.Value = Db(p.IntegratorGPerL);
            xe.Value = Db(p.EkfGPerL);
            v.Value = Db(p.VolumeL);
            i.ExecuteNonQuery();
        }
    }

    private List<SampleRecord> PendingOf(string reactor)
    {
        if (!_pending.TryGetValue(reactor, out var list))
        {
            list = [];
            _pending[reactor] = list;
        }

        return list;
    }

    private static object Db(double? v) => v is { } d && double.IsFinite(d) ? d : DBNull.Value;

    private static DateTimeOffset Ms(DateTimeOffset t) => DateTimeOffset.FromUnixTimeMilliseconds(t.ToUnixTimeMilliseconds());
}
