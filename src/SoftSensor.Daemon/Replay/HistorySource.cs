using System.Globalization;
using Microsoft.Extensions.Logging;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Replay;

/// <summary>One row of a historian export as samples of the reactor's tags (in the roles' units).</summary>
internal sealed record HistoryRow(long Line, DateTimeOffset Time, IReadOnlyList<Sample> Samples);

/// <summary>
/// The source of a replay: a historian export (CSV) whose header names the tags (a tag's
/// <c>column</c> alias, else its name) and one timestamp column (<see cref="HistoryOptions"/>).
/// Each cell becomes a sample of its tag, converted as the live sources convert
/// (<see cref="TagBinding.ToRoleUnit"/>); an empty cell is no sample (the pipeline holds the last
/// value up to the tag's maxAge, as live). A row whose timestamp cannot be read, goes back in time
/// or lies more than a day beyond the wall clock is skipped alone, counted and logged with its line
/// number; an unreadable cell is dropped alone, likewise.
/// </summary>
internal sealed class HistorySource : IDisposable
{
    /// <summary>How far beyond the wall clock a row's time may lie before it is taken for a wrong clock.</summary>
    public static readonly TimeSpan FarFuture = TimeSpan.FromDays(1);

    private readonly string _name;
    private readonly CsvLineReader _reader;
    private readonly TimestampParser _time;
    private readonly int _timeColumn;
    private readonly TagBinding?[] _columns;
    private readonly DateTimeOffset _latest;
    private readonly ILogger _logger;
    private readonly List<SkippedRow> _firstSkipped = [];
    private readonly int _maxLogged;

    private HistorySource(string name, CsvLineReader reader, TimestampParser time, int timeColumn, TagBinding?[] columns, DateTimeOffset latest, ILogger logger, int maxLogged)
    {
        _name = name;
        _reader = reader;
        _time = time;
        _timeColumn = timeColumn;
        _columns = columns;
        _latest = latest;
        _logger = logger;
        _maxLogged = maxLogged;
    }

    /// <summary>Rows skipped (unreadable, out-of-order or far-future timestamp).</summary>
    public long SkippedRows { get; private set; }

    /// <summary>Cells dropped (not a finite number).</summary>
    public long DroppedCells { get; private set; }

    /// <summary>Rows read (not counting blank lines).</summary>
    public long Rows { get; private set; }

    /// <summary>The first skipped rows (up to the logging limit), with their line numbers.</summary>
    public IReadOnlyList<SkippedRow> FirstSkipped => _firstSkipped;

    /// <summary>The tags that have no column in the export.</summary>
    public IReadOnlyList<string> Unmapped { get; private init; } = [];

    /// <summary>
    /// Opens <paramref name="path"/>; throws <see cref="ReplayInputException"/> naming the file and
    /// the columns when the header lacks the timestamp column or names a column twice.
    /// </summary>
    public static HistorySource Open(string path, HistoryOptions options, IReadOnlyList<TagBinding> bindings, TimeProvider wall, ILogger logger, int maxLogged = 50)
    {
        if (!TimestampParser.TryCreate(new TimestampSpec { Column = options.TimestampColumn, Format = options.TimestampFormat, TimeZone = options.TimeZone }, out var time, out var error))
        {
            throw new ReplayInputException("history: " + error);
        }

        var reader = new CsvLineReader(File.OpenRead(path));
        try
        {
            if (!reader.TryReadLine(out var headerLine))
            {
                throw new ReplayInputException($"history file '{path}' is empty (expected a header line: {options.TimestampColumn} and the tags' columns)");
            }

            var header = Split(headerLine.ToString());
            var seen = new Dictionary<string, int>(StringComparer.Ordinal);
            for (int i = 0; i < header.Length; i++)
            {
                if (!seen.TryAdd(header[i], i))
                {
                    throw new ReplayInputException($"history file '{path}': columns {seen[header[i]] + 1} and {i + 1} are both named '{header[i]}' (expected each column once)");
                }
            }

            if (!seen.TryGetValue(options.TimestampColumn, out int timeColumn))
            {
                throw new ReplayInputException($"history file '{path}' has no column '{options.TimestampColumn}' (expected the timestamp column named by history:timestampColumn; found {string.Join(", ", header)})");
            }

            var columns = new TagBinding?[header.Length];
            var unmapped = new List<string>();
            foreach (var b in bindings)
            {
                if (seen.TryGetValue(b.Column, out int c))
                {
                    columns[c] = b;
                }
                else
                {
                    unmapped.Add(b.Column == b.Tag ? b.Tag : $"{b.Tag} (column '{b.Column}')");
                }
            }

            return new HistorySource(path, reader, time!, timeColumn, columns, wall.GetUtcNow() + FarFuture, logger, maxLogged) { Unmapped = unmapped };
        }
        catch
        {
            reader.Dispose();
            throw;
        }
    }

    /// <summary>The rows in file order, each with the samples of its non-empty cells.</summary>
    public IEnumerable<HistoryRow> Read()
    {
        DateTimeOffset previous = DateTimeOffset.MinValue;
        while (_reader.TryReadLine(out var span))
        {
            string line = span.ToString();
            if (line.Trim().Length == 0)
            {
                continue;
            }

            Rows++;
            var cells = Split(line);
            if (_timeColumn >= cells.Length || !_time.TryParse(cells[_timeColumn], out var t))
            {
                Skip("timestamp unreadable");
                continue;
            }

            if (t < previous)
            {
                Skip($"timestamp {t:O} is before the previous row's {previous:O} (out of order)");
                continue;
            }

            if (t > _latest)
            {
                Skip($"timestamp {t:O} lies more than {FarFuture.TotalHours:0} h beyond the clock (far future)");
                continue;
            }

            previous = t;
            var samples = new List<Sample>(_columns.Length);
            for (int i = 0; i < _columns.Length && i < cells.Length; i++)
            {
                if (_columns[i] is not { } b || cells[i].Length == 0)
                {
                    continue;
                }

                if (!double.TryParse(cells[i], NumberStyles.Float, CultureInfo.InvariantCulture, out double raw) || !double.IsFinite(raw))
                {
                    DroppedCells++;
                    ReplayLog.CellDropped(_logger, _name, _reader.LineNumber, b.Tag, cells[i]);
                    continue;
                }

                samples.Add(new Sample(b.Tag, b.ToRoleUnit(raw), t, SampleQuality.Good, 0));
            }

            yield return new HistoryRow(_reader.LineNumber, t, samples);
        }
    }

    public void Dispose() => _reader.Dispose();

    private void Skip(string reason)
    {
        SkippedRows++;
        if (_firstSkipped.Count < _maxLogged)
        {
            var s = new SkippedRow(_name, _reader.LineNumber, reason);
            _firstSkipped.Add(s);
            ReplayLog.RowSkippedAlone(_logger, _name, s.Line, s.Reason);
        }
    }

    // Plain CSV as historians export it: comma-separated, optionally double-quoted cells.
    private static string[] Split(string line)
    {
        var cells = line.Split(',');
        for (int i = 0; i < cells.Length; i++)
        {
            cells[i] = cells[i].Trim().Trim('"').Trim();
        }

        return cells;
    }
}
