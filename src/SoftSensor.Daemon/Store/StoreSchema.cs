namespace SoftSensor.Daemon.Store;

/// <summary>
/// The embedded store's tables (SQLite, WAL). Times are Unix milliseconds UTC; a value that could not
/// be computed is NULL; quality is 0 good, 1 uncertain, 2 bad (<see cref="Core.Signals.SampleQuality"/>).
/// <list type="bullet">
/// <item><c>frames</c>: one row per cycle and reactor (its id orders the outbox), with its batch and the batch's phase (version 2).</item>
/// <item><c>estimates</c>: one row per value of a frame, indexed by frame only (a query by reactor and time goes through <c>frames</c>: one index entry per value that lands at the end of its index, not thirteen spread over a reactor-and-name index, which at a thousand reactors was two thirds of the store's write time, StoreWriteBenchmarks).</item>
/// <item><c>alarms</c>: every alarm state change (the active ones are the newest row per alarm with active = 1).</item>
/// <item><c>checkpoints</c>: estimator state per reactor, newest last, with the batch it belongs to (version 2).</item>
/// </list>
/// </summary>
internal static class StoreSchema
{
    /// <summary>Schema version in <c>PRAGMA user_version</c>.</summary>
    public const int Version = 2;

    public const string Create = """
        CREATE TABLE IF NOT EXISTS frames (
            id        INTEGER PRIMARY KEY,
            reactor   TEXT    NOT NULL,
            batch     TEXT    NOT NULL,
            time_ms   INTEGER NOT NULL,
            quality   INTEGER NOT NULL,
            phase     TEXT    NOT NULL DEFAULT ''
        );
        CREATE INDEX IF NOT EXISTS frames_by_reactor_time ON frames (reactor, time_ms);
        CREATE TABLE IF NOT EXISTS estimates (
            frame_id    INTEGER NOT NULL REFERENCES frames (id),
            reactor     TEXT    NOT NULL,
            name        TEXT    NOT NULL,
            time_ms     INTEGER NOT NULL,
            value       REAL,
            sigma       REAL,
            unit        TEXT    NOT NULL,
            quality     INTEGER NOT NULL,
            status_code INTEGER NOT NULL
        );
        DROP INDEX IF EXISTS estimates_by_reactor_name_time;
        CREATE INDEX IF NOT EXISTS estimates_by_frame ON estimates (frame_id);
        CREATE TABLE IF NOT EXISTS alarms (
            id        INTEGER PRIMARY KEY,
            reactor   TEXT    NOT NULL,
            alarm_id  TEXT    NOT NULL,
            time_ms   INTEGER NOT NULL,
            state     TEXT    NOT NULL,
            priority  TEXT    NOT NULL,
            active    INTEGER NOT NULL,
            value     REAL,
            message   TEXT    NOT NULL
        );
        CREATE INDEX IF NOT EXISTS alarms_by_reactor_time ON alarms (reactor, time_ms);
        CREATE INDEX IF NOT EXISTS alarms_by_alarm ON alarms (reactor, alarm_id, id);
        CREATE TABLE IF NOT EXISTS checkpoints (
            id        INTEGER PRIMARY KEY,
            reactor   TEXT    NOT NULL,
            cycle     INTEGER NOT NULL,
            time_ms   INTEGER NOT NULL,
            state     TEXT    NOT NULL,
            batch     TEXT,
            inputs    TEXT
        );
        CREATE INDEX IF NOT EXISTS checkpoints_by_reactor ON checkpoints (reactor, id);
        """;

    /// <summary>Brings a version 1 file up to date (SQLite's CREATE IF NOT EXISTS keeps old tables as they were).</summary>
    public static readonly (string Table, string Column, string Sql)[] AddedColumns =
    [
        ("checkpoints", "batch", "ALTER TABLE checkpoints ADD COLUMN batch TEXT"),
        ("frames", "phase", "ALTER TABLE frames ADD COLUMN phase TEXT NOT NULL DEFAULT ''"),
        ("checkpoints", "inputs", "ALTER TABLE checkpoints ADD COLUMN inputs TEXT"),
    ];
}
