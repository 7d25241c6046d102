using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>Exponential back-off with equal jitter ("Exponential Backoff And Jitter", AWS Architecture Blog, 2015, from memory).</summary>
public class RetryBackoffTests
{
    [Fact]
    public void Next_ConsecutiveFailures_DoubleWithinJitterUpToTheMaximum()
    {
        var b = new RetryBackoff(TimeSpan.FromSeconds(1), TimeSpan.FromSeconds(10), new Random(1));
        double[] ceilings = [1, 2, 4, 8, 10, 10, 10];
        foreach (double c in ceilings)
        {
            double s = b.Next().TotalSeconds;
            Assert.InRange(s, c / 2, c);
        }

        Assert.Equal(7, b.Failures);
        b.Reset();
        Assert.InRange(b.Next().TotalSeconds, 0.5, 1);
    }

    [Fact]
    public void Next_TwoSenders_DoNotRetryInStep()
    {
        var a = new RetryBackoff(TimeSpan.FromSeconds(1), TimeSpan.FromSeconds(60), new Random(1));
        var b = new RetryBackoff(TimeSpan.FromSeconds(1), TimeSpan.FromSeconds(60), new Random(2));
        Assert.NotEqual(Enumerable.Range(0, 5).Select(_ => a.Next()), Enumerable.Range(0, 5).Select(_ => b.Next()));
    }
}
