using Microsoft.Data.Sqlite;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Store;

/// <summary>
/// Writes something of its own for each frame inside the store's frame transaction, so that the
/// frame and the companion's rows are committed together or not at all (the time-series outbox:
/// a SIGKILL between two separate commits would otherwise lose a cycle on its way to the database).
/// Several frames may share one transaction (frames dispatched together); the returned actions run
/// after its commit, so a bound checked against committed state may be passed by up to one batch.
/// Threading contract: called under the store's write gate, one frame at a time.
/// </summary>
internal interface IFrameCompanion
{
    /// <summary>
    /// Adds rows for <paramref name="frame"/> through <paramref name="connection"/> in
    /// <paramref name="transaction"/>; returns what to do once the transaction committed (or null).
    /// </summary>
    Action? Write(EstimateFrame frame, SqliteConnection connection, SqliteTransaction transaction);
}
