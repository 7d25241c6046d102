using Microsoft.Data.Sqlite;

namespace SoftSensor.Daemon.Samples;

/// <summary>Reads of the operator inputs and the corrected trajectories.</summary>
internal sealed partial class SampleBook
{
    /// <summary>The inputs of a reactor (of one batch when given), newest first.</summary>
    public IReadOnlyList<SampleRecord> List(string reactor, string? batch = null, int limit = 200)
    {
        using var c = Open();
        return Query(c, $"SELECT {Columns} FROM offline_samples WHERE reactor = $r AND ($b IS NULL OR batch = $b) ORDER BY id DESC LIMIT $n", cmd =>
        {
            cmd.Parameters.AddWithValue("$r", reactor);
            cmd.Parameters.AddWithValue("$b", (object?)batch ?? DBNull.Value);
            cmd.Parameters.AddWithValue("$n", Math.Clamp(limit, 1, 10_000));
        });
    }

    /// <summary>One input by id, or null.</summary>
    public SampleRecord? Get(long id)
    {
        using var c = Open();
        return Query(c, $"SELECT {Columns} FROM offline_samples WHERE id = $id", cmd => cmd.Parameters.AddWithValue("$id", id)).FirstOrDefault();
    }

    /// <summary>The corrected trajectory stored after input <paramref name="sampleId"/>, oldest first.</summary>
    public IReadOnlyList<CorrectedPoint> Trajectory(string reactor, long sampleId)
    {
        using var c = Open();
        return Points(c, "SELECT reactor, batch, sample_id, time_ms, biomass_g_per_l, biomass_sigma_g_per_l, integrator_g_per_l, ekf_g_per_l, volume_l FROM corrected_estimates WHERE reactor = $r AND sample_id = $s ORDER BY time_ms", cmd =>
        {
            cmd.Parameters.AddWithValue("$r", reactor);
            cmd.Parameters.AddWithValue("$s", sampleId);
        });
    }

    /// <summary>The newest correction of each cycle in [from, to] (the trajectory after the latest input that reached it), oldest first.</summary>
    public IReadOnlyList<CorrectedPoint> Latest(string reactor, DateTimeOffset from, DateTimeOffset to)
    {
        using var c = Open();
        return Points(c, """
            SELECT reactor, batch, max(sample_id), time_ms, biomass_g_per_l, biomass_sigma_g_per_l, integrator_g_per_l, ekf_g_per_l, volume_l
            FROM corrected_estimates WHERE reactor = $r AND time_ms BETWEEN $f AND $t GROUP BY time_ms ORDER BY time_ms
            """, cmd =>
        {
            cmd.Parameters.AddWithValue("$r", reactor);
            cmd.Parameters.AddWithValue("$f", from.ToUnixTimeMilliseconds());
            cmd.Parameters.AddWithValue("$t", to.ToUnixTimeMilliseconds());
        });
    }

    private SqliteConnection Open()
    {
        var c = new SqliteConnection(_connectionString);
        c.Open();
        return c;
    }

    private static void Run(SqliteConnection c, string sql)
    {
        using var cmd = c.CreateCommand();
        cmd.CommandText = sql;
        cmd.ExecuteNonQuery();
    }

    private static List<SampleRecord> Query(SqliteConnection c, string sql, Action<SqliteCommand> bind)
    {
        using var cmd = c.CreateCommand();
        cmd.CommandText = sql;
        bind(cmd);
        using var r = cmd.ExecuteReader();
        var list = new List<SampleRecord>();
        while (r.Read())
        {
            list.Add(new SampleRecord(
                r.GetInt64(0), r.GetString(1), r.GetString(2), Time(r, 3)!.Value, Time(r, 4)!.Value, r.GetString(5),
                Real(r, 6), Real(r, 7), r.GetDouble(8), Text(r, 9), Text(r, 10), r.GetString(11), Text(r, 12), Time(r, 13), Time(r, 14),
                Real(r, 15), Real(r, 16), Real(r, 17), Real(r, 18), r.GetString(19)));
        }

        return list;
    }

    private static List<CorrectedPoint> Points(SqliteConnection c, string sql, Action<SqliteCommand> bind)
    {
        using var cmd = c.CreateCommand();
        cmd.CommandText = sql;
        bind(cmd);
        using var r = cmd.ExecuteReader();
        var list = new List<CorrectedPoint>();
        while (r.Read())
        {
            list.Add(new CorrectedPoint(r.GetString(0), r.GetString(1), r.GetInt64(2), Time(r, 3)!.Value,
                Real(r, 4) ?? double.NaN, Real(r, 5) ?? double.NaN, Real(r, 6) ?? double.NaN, Real(r, 7) ?? double.NaN, Real(r, 8) ?? double.NaN));
        }

        return list;
    }

    private static double? Real(SqliteDataReader r, int i) => r.IsDBNull(i) ? null : r.GetDouble(i);

    private static string? Text(SqliteDataReader r, int i) => r.IsDBNull(i) ? null : r.GetString(i);

    private static DateTimeOffset? Time(SqliteDataReader r, int i) => r.IsDBNull(i) ? null : DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(i));
}
