using Microsoft.Data.Sqlite;
using SoftSensor.Core.Batches;

namespace SoftSensor.Daemon.Batches;

/// <summary>One phase change of a batch: the phase entered, when, and who or what set it (operator, feed, tag).</summary>
internal sealed record PhaseChange(string BatchId, string Phase, DateTimeOffset At, string Source);

/// <summary>
/// Phases: table <c>batch_phases</c> keeps every change per batch (the start enters <c>batch</c>);
/// the open batch's current phase is part of its <see cref="BatchRun"/>.
/// </summary>
internal sealed partial class BatchBook
{
    private const string PhaseSchema = """
        CREATE TABLE IF NOT EXISTS batch_phases (
            reactor TEXT NOT NULL, batch_id TEXT NOT NULL, phase TEXT NOT NULL, changed_ms INTEGER NOT NULL, source TEXT NOT NULL);
        CREATE INDEX IF NOT EXISTS batch_phases_by_batch ON batch_phases (reactor, batch_id, changed_ms);
        """;

    /// <summary>Raised after a phase change was stored (on the caller's thread).</summary>
    public event Action<BatchRun, PhaseChange>? PhaseChanged;

    /// <summary>
    /// Moves the open batch of a reactor to <paramref name="phaseId"/>; <paramref name="source"/> says who
    /// (operator, feed, tag). The problem instead when no batch is open, the id is unknown or the batch
    /// is already in that phase.
    /// </summary>
    public (BatchRun? Run, string? Problem) SetPhase(string reactor, string? phaseId, string source)
    {
        if (!BatchPhases.TryParse(phaseId, out var phase))
        {
            return (null, $"phase is '{phaseId}' (expected one of {BatchPhases.Ids})");
        }

        BatchRun changed;
        PhaseChange change;
        lock (_gate)
        {
            if (Current(reactor) is not { } open)
            {
                return (null, $"reactor '{reactor}' has no open batch (expected a started batch)");
            }

            string id = BatchPhases.Id(phase);
            if (open.Phase == id)
            {
                return (null, $"phase is '{id}' (batch '{open.BatchId}' is already in it since {open.PhaseSince:O})");
            }

            var now = _time.GetUtcNow();
            using var c = Open();
            change = new PhaseChange(open.BatchId, id, now, source);
            InsertPhase(c, reactor, change);
            changed = open with { Phase = id, PhaseSince = now };
            _open[reactor] = changed;
        }

        PhaseChanged?.Invoke(changed, change);
        return (changed, null);
    }

    /// <summary>Every phase change of a batch, oldest first.</summary>
    public IReadOnlyList<PhaseChange> Phases(string reactor, string batchId)
    {
        using var c = Open();
        using var q = c.CreateCommand();
        q.CommandText = "SELECT batch_id, phase, changed_ms, source FROM batch_phases WHERE reactor = $r AND batch_id = $b ORDER BY changed_ms, rowid";
        q.Parameters.AddWithValue("$r", reactor);
        q.Parameters.AddWithValue("$b", batchId);
        using var r = q.ExecuteReader();
        var list = new List<PhaseChange>();
        while (r.Read())
        {
            list.Add(new PhaseChange(r.GetString(0), r.GetString(1), DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(2)), r.GetString(3)));
        }

        return list;
    }

    private static void InsertPhase(SqliteConnection c, string reactor, PhaseChange change)
    {
        using var insert = c.CreateCommand();
        insert.CommandText = "INSERT INTO batch_phases VALUES ($r, $b, $p, $t, $s)";
        insert.Parameters.AddWithValue("$r", reactor);
        insert.Parameters.AddWithValue("$b", change.BatchId);
        insert.Parameters.AddWithValue("$p", change.Phase);
        insert.Parameters.AddWithValue("$t", change.At.ToUnixTimeMilliseconds());
        insert.Parameters.AddWithValue("$s", change.Source);
        insert.ExecuteNonQuery();
    }

    /// <summary>The open batch with its current phase from the phase table (a batch without changes is in <c>batch</c> since its start).</summary>
    private static BatchRun WithPhase(SqliteConnection c, BatchRun run)
    {
        using var q = c.CreateCommand();
        q.CommandText = "SELECT phase, changed_ms FROM batch_phases WHERE reactor = $r AND batch_id = $b ORDER BY changed_ms DESC, rowid DESC LIMIT 1";
        q.Parameters.AddWithValue("$r", run.Reactor);
        q.Parameters.AddWithValue("$b", run.BatchId);
        using var r = q.ExecuteReader();
        return r.Read()
            ? run with { Phase = r.GetString(0), PhaseSince = DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(1)) }
            : run with { Phase = BatchPhases.Id(BatchPhase.Batch), PhaseSince = run.StartedAt };
    }
}
