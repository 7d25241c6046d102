using Microsoft.Extensions.Time.Testing;
using SoftSensor.Daemon.Batches;

namespace SoftSensor.Daemon.Tests.Batches;

/// <summary>The batch book on a real SQLite file: start, refusals listing every problem, end, resume after a restart.</summary>
public sealed class BatchBookTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-batches-").FullName;
    private readonly FakeTimeProvider _time = new(new DateTimeOffset(2026, 3, 1, 8, 0, 0, TimeSpan.Zero));

    private string StorePath => Path.Combine(_dir, "store.db");

    [Fact]
    public void Start_then_new_book_on_same_file_resumes_the_open_batch()
    {
        var book = new BatchBook(StorePath, _time);
        var (run, problems) = book.Start("r1", new BatchStart("gly-042", 30, 0.3, 0.05, 20));
        Assert.Empty(problems);
        Assert.Equal("gly-042", run!.BatchId);

        var restarted = new BatchBook(StorePath, _time);

        var resumed = restarted.Current("r1");
        Assert.NotNull(resumed);
        Assert.Equal(run, resumed);
        Assert.Null(restarted.Current("r2"));
    }

    [Fact]
    public void Start_with_invalid_fields_lists_every_problem_and_stores_nothing()
    {
        var book = new BatchBook(StorePath, _time);

        var (run, problems) = book.Start("r1", new BatchStart("", -1, double.NaN, 0, -2));

        Assert.Null(run);
        Assert.Equal(5, problems.Count);
        Assert.Contains(problems, p => p.StartsWith("batchId", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.StartsWith("initialVolumeL is -1", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.StartsWith("inoculumBiomassGPerL is NaN", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.StartsWith("inoculumBiomassSigmaGPerL is 0", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.StartsWith("initialSubstrateGPerL is -2", StringComparison.Ordinal));
        Assert.Null(new BatchBook(StorePath, _time).Current("r1"));
    }

    [Fact]
    public void Start_while_open_or_with_used_id_is_refused_end_closes_the_batch()
    {
        var book = new BatchBook(StorePath, _time);
        book.Start("r1", new BatchStart("b1", 30, 0.3, 0.05, 20));

        var (_, whileOpen) = book.Start("r1", new BatchStart("b2", 30, 0.3, 0.05, 20));
        Assert.Contains(whileOpen, p => p.Contains("has batch 'b1' open", StringComparison.Ordinal));

        _time.Advance(TimeSpan.FromHours(20));
        var (ended, problem) = book.End("r1");
        Assert.Null(problem);
        Assert.Equal(_time.GetUtcNow(), ended!.EndedAt);
        Assert.Null(book.Current("r1"));
        Assert.Null(new BatchBook(StorePath, _time).Current("r1"));

        var (_, reused) = book.Start("r1", new BatchStart("b1", 30, 0.3, 0.05, 20));
        Assert.Contains(reused, p => p.Contains("has not used before", StringComparison.Ordinal));
        Assert.NotNull(book.End("r2").Problem);
    }

    public void Dispose()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_dir, recursive: true);
    }
}
