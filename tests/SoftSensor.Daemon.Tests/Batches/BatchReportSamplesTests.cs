using SoftSensor.Daemon.Batches;

namespace SoftSensor.Daemon.Tests.Batches;

/// <summary>The batch report lists the batch's biomass samples with their σ and outcome, timed in batch hours (invented values).</summary>
public sealed class BatchReportSamplesTests
{
    private static readonly DateTimeOffset Start = new(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Sections_list_each_sample_in_batch_hours_with_value_sigma_outcome_and_the_update()
    {
        var run = new BatchRun("r1", "gly-042", Start, Start.AddHours(24), 30, 0.3, 0.05, 15);
        BatchSample[] samples =
        [
            new(7, Start.AddHours(6.5), "dcw", 4.812, 0.2, "applied", 4.6, 4.75),
            new(8, Start.AddHours(23.75), "od", 38.1, 1.1, "batchEnded", null, null),
        ];

        string html = BatchReports.Sections(run, [], [], samples);

        Assert.Contains("<h2>Offline biomass samples</h2>", html, StringComparison.Ordinal);
        Assert.Contains("<tr><td>7</td><td>6.50</td><td>dcw</td><td>4.812 ± 0.200</td><td>applied</td><td>4.600 → 4.750</td></tr>", html, StringComparison.Ordinal);
        Assert.Contains("<tr><td>8</td><td>23.75</td><td>od</td><td>38.100 ± 1.100</td><td>batchEnded</td><td>—</td></tr>", html, StringComparison.Ordinal);
        Assert.Equal(html.Split("<table").Length - 1, html.Split("</table>").Length - 1);
    }

    [Fact]
    public void Sections_say_so_when_no_sample_was_entered() =>
        Assert.Contains("<p>None entered for this batch.</p>", BatchReports.Sections(new BatchRun("r1", "b", Start, null, 30, 0.3, 0.05, 15), [], [], []), StringComparison.Ordinal);
}
