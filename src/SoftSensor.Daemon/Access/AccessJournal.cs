using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Access;

/// <summary>One journaled state change: who (the authenticated user, never a name from the body), how, what, the answer.</summary>
internal sealed record AccessEntry(long Id, DateTimeOffset Time, string User, string Role, string Method, string HttpMethod, string Path, int Status);

/// <summary>
/// Table <c>access_journal</c> of the daemon's SQLite file: every write that passed access control,
/// with the authenticated user and role, how they authenticated, the request and the status answered.
/// Thread-safe.
/// </summary>
internal sealed class AccessJournal
{
    private readonly string _connectionString;
    private readonly TimeProvider _time;

    public AccessJournal(IOptions<SoftSensorOptions> options, TimeProvider time)
    {
        _time = time;
        string full = Path.GetFullPath(options.Value.Store.Path);
        Directory.CreateDirectory(Path.GetDirectoryName(full)!);
        _connectionString = new SqliteConnectionStringBuilder { DataSource = full, Pooling = true, DefaultTimeout = 5 }.ToString();
        using var c = Open();
        using var cmd = c.CreateCommand();
        cmd.CommandText = """
            CREATE TABLE IF NOT EXISTS access_journal (id INTEGER PRIMARY KEY AUTOINCREMENT, time_ms INTEGER NOT NULL, user TEXT NOT NULL,
                role TEXT NOT NULL, method TEXT NOT NULL, http_method TEXT NOT NULL, path TEXT NOT NULL, status INTEGER NOT NULL);
            """;
        cmd.ExecuteNonQuery();
    }

    public void Append(Principal who, string httpMethod, string path, int status)
    {
        using var c = Open();
        using var cmd = c.CreateCommand();
        cmd.CommandText = "INSERT INTO access_journal (time_ms, user, role, method, http_method, path, status) VALUES ($t, $u, $r, $m, $h, $p, $s)";
        cmd.Parameters.AddWithValue("$t", _time.GetUtcNow().ToUnixTimeMilliseconds());
        cmd.Parameters.AddWithValue("$u", who.Name);
        cmd.Parameters.AddWithValue("$r", Roles.Id(who.Role));
        cmd.Parameters.AddWithValue("$m", who.Method);
        cmd.Parameters.AddWithValue("$h", httpMethod);
        cmd.Parameters.AddWithValue("$p", path.Length <= 256 ? path : path[..256]);
        cmd.Parameters.AddWithValue("$s", status);
        cmd.ExecuteNonQuery();
    }

    /// <summary>The newest entries first.</summary>
    public IReadOnlyList<AccessEntry> Recent(int limit)
    {
        using var c = Open();
        using var cmd = c.CreateCommand();
        cmd.CommandText = "SELECT id, time_ms, user, role, method, http_method, path, status FROM access_journal ORDER BY id DESC LIMIT $n";
        cmd.Parameters.AddWithValue("$n", limit);
        using var r = cmd.ExecuteReader();
        var list = new List<AccessEntry>();
        while (r.Read())
        {
            list.Add(new AccessEntry(r.GetInt64(0), DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(1)), r.GetString(2), r.GetString(3), r.GetString(4), r.GetString(5), r.GetString(6), r.GetInt32(7)));
        }

        return list;
    }

    private SqliteConnection Open()
    {
        var c = new SqliteConnection(_connectionString);
        c.Open();
        return c;
    }
}
