using System.Globalization;
using Microsoft.Data.Sqlite;
using SoftSensor.Core.Alarms;

namespace SoftSensor.Daemon.Alarming;

/// <summary>One journaled transition with the reactor and the rule's text.</summary>
internal sealed record JournalEntry(long Id, string Reactor, AlarmTransition Transition, string Category, string Message);

/// <summary>
/// The alarm journal in the daemon's SQLite file: table <c>alarm_journal</c> (every transition,
/// append-only) and <c>alarm_status</c> (the latest state per reactor and rule, so that states
/// survive a restart). Both are written in one transaction before the transition is published.
/// <c>alarm_batches</c> keeps, per reactor, the batch the alarm states belong to (a new batch resets them).
/// Threading: every method may be called from any thread (one connection behind a lock).
/// </summary>
internal sealed class AlarmJournal : IDisposable
{
    private readonly Lock _gate = new();
    private readonly SqliteConnection _db;

    public AlarmJournal(string path)
    {
        string? dir = Path.GetDirectoryName(Path.GetFullPath(path));
        if (!string.IsNullOrEmpty(dir))
        {
            Directory.CreateDirectory(dir);
        }

        _db = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = path, Pooling = false, DefaultTimeout = 30 }.ToString());
        _db.Open();
        Execute("PRAGMA journal_mode=WAL; PRAGMA synchronous=FULL; PRAGMA busy_timeout=30000;");
        Execute("""
            CREATE TABLE IF NOT EXISTS alarm_journal(
              id INTEGER PRIMARY KEY AUTOINCREMENT,
              reactor TEXT NOT NULL,
              rule_id TEXT NOT NULL,
              time_ms INTEGER NOT NULL,
              from_state TEXT NOT NULL,
              to_state TEXT NOT NULL,
              cause TEXT NOT NULL,
              value REAL,
              priority TEXT NOT NULL,
              operator TEXT,
              shelved_until_ms INTEGER,
              category TEXT NOT NULL,
              message TEXT NOT NULL);
            CREATE INDEX IF NOT EXISTS alarm_journal_by_reactor_time ON alarm_journal(reactor, time_ms);
            CREATE TABLE IF NOT EXISTS alarm_status(
              reactor TEXT NOT NULL,
              rule_id TEXT NOT NULL,
              state TEXT NOT NULL,
              unmasked_state TEXT NOT NULL,
              condition_present INTEGER NOT NULL,
              suppressed INTEGER NOT NULL,
              out_of_service INTEGER NOT NULL,
              since_ms INTEGER NOT NULL,
              shelved_until_ms INTEGER,
              value REAL,
              PRIMARY KEY(reactor, rule_id));
            CREATE TABLE IF NOT EXISTS alarm_batches(
              reactor TEXT PRIMARY KEY,
              batch TEXT NOT NULL,
              since_ms INTEGER NOT NULL);
            """);
    }

    /// <summary>Appends transitions and the resulting statuses in one transaction.</summary>
    public void Append(string reactor, IReadOnlyList<(AlarmTransition Transition, AlarmRule Rule, AlarmStatus Status)> changes)
    {
        if (changes.Count == 0)
        {
            return;
        }

        lock (_gate)
        {
            using var tx = _db.BeginTransaction();
            foreach (var (t, rule, status) in changes)
            {
                using var c = _db.CreateCommand();
                c.Transaction = tx;
                c.CommandText = """
                    INSERT INTO alarm_journal(reactor, rule_id, time_ms, from_state, to_state, cause, value, priority, operator, shelved_until_ms, category, message)
                    VALUES ($r, $id, $t, $f, $to, $c, $v, $p, $o, $su, $cat, $m);
                    INSERT INTO alarm_status(reactor, rule_id, state, unmasked_state, condition_present, suppressed, out_of_service, since_ms, shelved_until_ms, value)
                    VALUES ($r, $id, $s, $u, $cp, $sp, $oos, $since, $ssu, $sv)
                    ON CONFLICT(reactor, rule_id) DO UPDATE SET state = excluded.state, unmasked_state = excluded.unmasked_state,
                      condition_present = excluded.condition_present, suppressed = excluded.suppressed, out_of_service = excluded.out_of_service,
                      since_ms = excluded.since_ms, shelved_until_ms = excluded.shelved_until_ms, value = excluded.value;
                    """;
                c.Parameters.AddWithValue("$r", reactor);
                c.Parameters.AddWithValue("$id", t.RuleId);
                c.Parameters.AddWithValue("$t", t.Time.ToUnixTimeMilliseconds());
                c.Parameters.AddWithValue("$f", AlarmStates.Id(t.From));
                c.Parameters.AddWithValue("$to", AlarmStates.Id(t.To));
                c.Parameters.AddWithValue("$c", AlarmPayloads.CauseId(t.Cause));
                c.Parameters.AddWithValue("$v", Db(t.Value));
                c.Parameters.AddWithValue("$p", AlarmPayloads.PriorityId(t.Priority));
                c.Parameters.AddWithValue("$o", (object?)t.Operator ?? DBNull.Value);
                c.Parameters.AddWithValue("$su", t.ShelvedUntil is { } su ? su.ToUnixTimeMilliseconds() : DBNull.Value);
                c.Parameters.AddWithValue("$cat", rule.Category);
                c.Parameters.AddWithValue("$m", rule.Message);
                c.Parameters.AddWithValue("$s", AlarmStates.Id(status.State));
                c.Parameters.AddWithValue("$u", AlarmStates.Id(status.UnmaskedState));
                c.Parameters.AddWithValue("$cp", status.ConditionPresent ? 1 : 0);
                c.Parameters.AddWithValue("$sp", status.Suppressed ? 1 : 0);
                c.Parameters.AddWithValue("$oos", status.OutOfService ? 1 : 0);
                c.Parameters.AddWithValue("$since", status.Since.ToUnixTimeMilliseconds());
                c.Parameters.AddWithValue("$ssu", status.ShelvedUntil is { } ss ? ss.ToUnixTimeMilliseconds() : DBNull.Value);
                c.Parameters.AddWithValue("$sv", Db(status.LastValue));
                c.ExecuteNonQuery();
            }

            tx.Commit();
        }
    }

    /// <summary>The saved statuses of one reactor (for <see cref="AlarmEvaluator.Restore"/>).</summary>
    public IReadOnlyList<AlarmStatus> Statuses(string reactor)
    {
        lock (_gate)
        {
            using var c = _db.CreateCommand();
            c.CommandText = "SELECT rule_id, state, unmasked_state, condition_present, suppressed, out_of_service, since_ms, shelved_until_ms, value FROM alarm_status WHERE reactor = $r ORDER BY rule_id;";
            c.Parameters.AddWithValue("$r", reactor);
            using var r = c.ExecuteReader();
            var list = new List<AlarmStatus>();
            while (r.Read())
            {
                if (!AlarmStates.TryParse(r.GetString(1), out var state) || !AlarmStates.TryParse(r.GetString(2), out var unmasked))
                {
                    continue; // written by a newer version: start that alarm fresh
                }

                list.Add(new AlarmStatus(r.GetString(0), state, r.GetInt64(3) != 0, FromMs(r.GetInt64(6)),
                    r.IsDBNull(7) ? null : FromMs(r.GetInt64(7)), r.GetInt64(4) != 0, r.GetInt64(5) != 0, unmasked,
                    r.IsDBNull(8) ? double.NaN : r.GetDouble(8)));
            }

            return list;
        }
    }

    /// <summary>Records the batch a reactor's alarm states now belong to.</summary>
    public void RecordBatch(string reactor, string batch, DateTimeOffset since)
    {
        lock (_gate)
        {
            using var c = _db.CreateCommand();
            c.CommandText = "INSERT INTO alarm_batches(reactor, batch, since_ms) VALUES ($r, $b, $t) ON CONFLICT(reactor) DO UPDATE SET batch = excluded.batch, since_ms = excluded.since_ms;";
            c.Parameters.AddWithValue("$r", reactor);
            c.Parameters.AddWithValue("$b", batch);
            c.Parameters.AddWithValue("$t", since.ToUnixTimeMilliseconds());
            c.ExecuteNonQuery();
        }
    }

    /// <summary>The batch a reactor's alarm states belong to, or null when none was recorded.</summary>
    public string? BatchOf(string reactor)
    {
        lock (_gate)
        {
            using var c = _db.CreateCommand();
            c.CommandText = "SELECT batch FROM alarm_batches WHERE reactor = $r;";
            c.Parameters.AddWithValue("$r", reactor);
            return c.ExecuteScalar() as string;
        }
    }

    /// <summary>The newest journal entries, newest first.</summary>
    public IReadOnlyList<JournalEntry> Recent(string? reactor, int limit)
    {
        lock (_gate)
        {
            using var c = _db.CreateCommand();
            c.CommandText = """
                SELECT id, reactor, rule_id, time_ms, from_state, to_state, cause, value, priority, operator, shelved_until_ms, category, message
                FROM alarm_journal WHERE ($r IS NULL OR reactor = $r) ORDER BY id DESC LIMIT $n;
                """;
            c.Parameters.AddWithValue("$r", (object?)reactor ?? DBNull.Value);
            c.Parameters.AddWithValue("$n", limit);
            using var r = c.ExecuteReader();
            var list = new List<JournalEntry>();
            while (r.Read())
            {
                AlarmStates.TryParse(r.GetString(4), out var from);
                AlarmStates.TryParse(r.GetString(5), out var to);
                var t = new AlarmTransition(r.GetString(2), from, to, AlarmPayloads.ParseCause(r.GetString(6)), FromMs(r.GetInt64(3)),
                    r.IsDBNull(7) ? double.NaN : r.GetDouble(7), AlarmPayloads.ParsePriority(r.GetString(8)),
                    r.IsDBNull(9) ? null : r.GetString(9), r.IsDBNull(10) ? null : FromMs(r.GetInt64(10)));
                list.Add(new JournalEntry(r.GetInt64(0), r.GetString(1), t, r.GetString(11), r.GetString(12)));
            }

            return list;
        }
    }

    public void Dispose()
    {
        lock (_gate)
        {
            _db.Dispose();
        }
    }

    private static object Db(double v) => double.IsFinite(v) ? v : DBNull.Value;

    private static DateTimeOffset FromMs(long ms) => DateTimeOffset.FromUnixTimeMilliseconds(ms);

    private void Execute(string sql)
    {
        using var c = _db.CreateCommand();
        c.CommandText = sql;
        c.ExecuteNonQuery();
    }

    /// <summary>For diagnostics in tests: number of journal rows.</summary>
    public long Count()
    {
        lock (_gate)
        {
            using var c = _db.CreateCommand();
            c.CommandText = "SELECT COUNT(*) FROM alarm_journal;";
            return Convert.ToInt64(c.ExecuteScalar(), CultureInfo.InvariantCulture);
        }
    }
}
