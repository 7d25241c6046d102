using SoftSensor.Core.Signals;
using Xunit;

namespace SoftSensor.Daemon.Tests.OpcUa;

/// <summary>
/// The parity tests' comparison of two estimate frames of one cycle (MQTT against OPC UA, run against
/// replay): same time, quality, names, status codes, and values and sigmas equal to 1e-12 relative.
/// </summary>
internal static class ParityAssert
{
    /// <summary>Relative tolerance of the parity tests (the same arithmetic on the same inputs).</summary>
    public const double RelativeTolerance = 1e-12;

    /// <summary>Asserts that frames <paramref name="x"/> (from <paramref name="left"/>) and <paramref name="y"/> (from <paramref name="right"/>) agree.</summary>
    public static void SameFrame(EstimateFrame x, EstimateFrame y, int cycle, string left, string right)
    {
        Assert.Equal(x.Time, y.Time);
        Assert.Equal(x.Quality, y.Quality);
        Assert.Equal(x.Values.Select(v => v.Name), y.Values.Select(v => v.Name));
        for (int i = 0; i < x.Values.Count; i++)
        {
            var (u, v) = (x.Values[i], y.Values[i]);
            Assert.True(u.Quality == v.Quality && u.StatusCode == v.StatusCode, $"cycle {cycle} {u.Name}: quality {u.Quality}/0x{u.StatusCode:X8} ({left}) vs {v.Quality}/0x{v.StatusCode:X8} ({right})");
            Assert.True(Close(u.Value, v.Value), $"cycle {cycle} {u.Name}: {u.Value:R} ({left}) vs {v.Value:R} ({right})");
            Assert.True(Close(u.Sigma, v.Sigma), $"cycle {cycle} {u.Name} sigma: {u.Sigma:R} ({left}) vs {v.Sigma:R} ({right})");
        }
    }

    /// <summary>Equal within <see cref="RelativeTolerance"/>, or both NaN.</summary>
    public static bool Close(double a, double b) =>
        (double.IsNaN(a) && double.IsNaN(b)) || a == b || Math.Abs(a - b) <= RelativeTolerance * Math.Max(Math.Abs(a), Math.Abs(b));
}
