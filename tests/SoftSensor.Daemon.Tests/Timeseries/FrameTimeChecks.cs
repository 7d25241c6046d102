using Microsoft.Data.Sqlite;

namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>
/// The checks every frame-time test shares: in the store, a reactor's frame times are unique and each
/// after the one before (in the order the frames were written); in VictoriaMetrics, the series of one
/// estimate holds every stored frame time exactly once (a database keeps one value per series and
/// time, InfluxDB v2 documentation "Duplicate points", so distinct times = frames means none was overwritten).
/// </summary>
internal static class FrameTimeChecks
{
    /// <summary>The frame times of <paramref name="reactor"/> in write order (Unix ms).</summary>
    public static List<long> StoredFrameTimes(string storePath, string reactor = "r1")
    {
        using var c = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = storePath, Pooling = false, Mode = SqliteOpenMode.ReadOnly }.ToString());
        c.Open();
        using var cmd = c.CreateCommand();
        cmd.CommandText = "SELECT time_ms FROM frames WHERE reactor = $r ORDER BY id";
        cmd.Parameters.AddWithValue("$r", reactor);
        var list = new List<long>();
        using var r = cmd.ExecuteReader();
        while (r.Read())
        {
            list.Add(r.GetInt64(0));
        }

        return list;
    }

    /// <summary>Asserts strictly increasing (hence unique) times, naming the first that is not.</summary>
    public static void AssertStrictlyIncreasing(IReadOnlyList<long> times, string what)
    {
        Assert.NotEmpty(times);
        int notAfter = 0;
        int first = -1;
        for (int i = 1; i < times.Count; i++)
        {
            if (times[i] <= times[i - 1])
            {
                notAfter++;
                first = first < 0 ? i : first;
            }
        }

        Assert.True(notAfter == 0,
            $"{what}: {times.Count} frames, {times.Distinct().Count()} distinct times, {notAfter} not after the one before (first at #{first}: {(first > 0 ? times[first - 1] : 0)} then {(first > 0 ? times[first] : 0)})");
    }

    /// <summary>Asserts that the database holds each stored frame time once, in the series of <paramref name="metric"/> of reactor r1.</summary>
    public static async Task AssertEachFrameOnceInDatabaseAsync(VictoriaMetricsServer vm, IReadOnlyList<long> stored, string metric = "softsensor_gas_our_quality")
    {
        var got = await vm.ExportWhenCompleteAsync(metric, 1, stored.Count);
        var series = Assert.Single(got, kv => kv.Key.Contains("unit=r1", StringComparison.Ordinal)).Value;
        var missing = stored.Except(series).Count();
        var extra = series.Except(stored).Count();
        Assert.True(missing == 0 && extra == 0 && series.Count == stored.Count && series.Distinct().Count() == stored.Count,
            $"store has {stored.Count} frames; database has {series.Count} samples ({series.Distinct().Count()} distinct times), {missing} stored frames missing, {extra} times not stored");
    }

    /// <summary>Waits for <paramref name="condition"/> (polling), failing with <paramref name="what"/> after <paramref name="within"/>.</summary>
    public static async Task WaitUntilAsync(Func<bool> condition, TimeSpan within, string what)
    {
        var deadline = DateTime.UtcNow + within;
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < deadline, $"timed out after {within.TotalSeconds:F0} s waiting for {what}");
            await Task.Delay(25);
        }
    }
}
