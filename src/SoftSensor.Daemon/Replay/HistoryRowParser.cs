using System.Globalization;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Replay;

/// <summary>
/// Turns one line of a historian export into the cycle's inputs, per the column mapping: cell →
/// scale and offset → plant unit to role unit. Rejects the line (and says which cell and why)
/// when a mapped cell is missing or not a number, the timestamp does not parse, or time runs
/// backwards. Allocation-free per line.
/// </summary>
internal sealed class HistoryRowParser
{
    private readonly char _delimiter;
    private readonly TimestampParser _time;
    private readonly int _timeIndex;
    private readonly int[] _columnIndex;
    private readonly SignalRole[] _roles;
    private readonly double[] _factor;
    private readonly double[] _offset;
    private readonly string[] _names;
    private readonly int _lastIndex;
    private readonly Range[] _cells;
    private DateTimeOffset _previous = DateTimeOffset.MinValue;

    private HistoryRowParser(char delimiter, TimestampParser time, int timeIndex, int[] columnIndex, SignalRole[] roles,
        double[] factor, double[] offset, string[] names, int cellCount)
    {
        _delimiter = delimiter;
        _time = time;
        _timeIndex = timeIndex;
        _columnIndex = columnIndex;
        _roles = roles;
        _factor = factor;
        _offset = offset;
        _names = names;
        _lastIndex = Math.Max(timeIndex, columnIndex.Length == 0 ? 0 : columnIndex.Max());
        _cells = new Range[cellCount + 1];
    }

    /// <summary>Header name of the cell that made the last row fail (empty when the row was good).</summary>
    public string FaultColumn { get; private set; } = string.Empty;

    /// <summary>Timestamp of the last good row.</summary>
    public DateTimeOffset LastTime => _previous;

    /// <summary>Binds the layout to a header line; false with every fault in one message.</summary>
    public static bool TryCreate(CsvLayout layout, ReadOnlySpan<char> header, out HistoryRowParser? parser, out string? error)
    {
        parser = null;
        var errors = new List<string>();
        if (layout.Delimiter.Length != 1)
        {
            errors.Add($"history.delimiter is '{layout.Delimiter}'; expected one character");
        }

        char delimiter = layout.Delimiter.Length == 1 ? layout.Delimiter[0] : ',';
        var headers = header.ToString().Split(delimiter).Select(h => h.Trim().Trim('"')).ToList();
        int timeIndex = headers.IndexOf(layout.Timestamp.Column);
        if (timeIndex < 0)
        {
            errors.Add($"history.timestamp.column '{layout.Timestamp.Column}' is not in the header ({string.Join(", ", headers.Take(8))}...)");
        }

        if (!TimestampParser.TryCreate(layout.Timestamp, out var time, out var timeError))
        {
            errors.Add(timeError!);
        }

        int n = layout.Columns.Count;
        var index = new int[n];
        var roles = new SignalRole[n];
        var factor = new double[n];
        var offset = new double[n];
        var names = new string[n];
        var seen = new HashSet<SignalRole>();
        for (int i = 0; i < n; i++)
        {
            var c = layout.Columns[i];
            names[i] = c.Column;
            index[i] = headers.IndexOf(c.Column);
            if (index[i] < 0)
            {
                errors.Add($"history.columns[{i}].column '{c.Column}' is not in the header");
            }

            if (!Enum.TryParse(c.Role, ignoreCase: false, out roles[i]) || !Enum.IsDefined(roles[i]))
            {
                errors.Add($"history.columns[{i}].role is '{c.Role}'; expected one of {string.Join(", ", Enum.GetNames<SignalRole>())}");
                continue;
            }

            if (!seen.Add(roles[i]))
            {
                errors.Add($"history.columns[{i}].role '{c.Role}' is mapped twice; expected each role at most once");
            }

            if (PlantUnits.Problem(roles[i], c.Unit) is not null)
            {
                errors.Add($"history.columns[{i}].unit is '{c.Unit}' for role {c.Role}; expected one of {PlantUnits.AcceptedFor(roles[i])}");
            }

            if (!(double.IsFinite(c.Scale) && c.Scale != 0) || !double.IsFinite(c.Offset))
            {
                errors.Add($"history.columns[{i}] has scale {c.Scale} and offset {c.Offset}; expected a finite non-zero scale and a finite offset");
            }

            // role = f × (scale × cell + offset) + o
            var (f, o) = PlantUnits.Problem(roles[i], c.Unit) is null ? PlantUnits.Map(roles[i], c.Unit) : (double.NaN, double.NaN);
            factor[i] = f * c.Scale;
            offset[i] = (f * c.Offset) + o;
        }

        if (errors.Count > 0)
        {
            error = string.Join("; ", errors);
            return false;
        }

        parser = new HistoryRowParser(delimiter, time!, timeIndex, index, roles, factor, offset, names, headers.Count);
        error = null;
        return true;
    }

    /// <summary>Parses one data line into <paramref name="into"/> (cleared first).</summary>
    public RowOutcome Parse(ReadOnlySpan<char> line, AlignedInputs into)
    {
        FaultColumn = string.Empty;
        if (line.IsWhiteSpace())
        {
            return RowOutcome.Blank;
        }

        int count = line.Split(_cells, _delimiter);
        if (count <= _lastIndex)
        {
            FaultColumn = count <= _timeIndex ? "timestamp" : FirstMissing(count);
            return RowOutcome.MissingCell;
        }

        if (!_time.TryParse(line[_cells[_timeIndex]], out var t))
        {
            FaultColumn = "timestamp";
            return RowOutcome.BadTimestamp;
        }

        into.Clear();
        into.Time = t;
        for (int i = 0; i < _columnIndex.Length; i++)
        {
            var cell = line[_cells[_columnIndex[i]]].Trim();
            if (cell.IsEmpty)
            {
                FaultColumn = _names[i];
                return RowOutcome.MissingCell;
            }

            if (!DecimalCell.TryParse(cell, out double raw) || !double.IsFinite(raw))
            {
                FaultColumn = _names[i];
                return RowOutcome.NotANumber;
            }

            into.Set(_roles[i], (_factor[i] * raw) + _offset[i], SampleQuality.Good, t);
        }

        if (t <= _previous)
        {
            FaultColumn = "timestamp";
            return RowOutcome.TimeNotIncreasing;
        }

        _previous = t;
        return RowOutcome.Ok;
    }

    private string FirstMissing(int count)
    {
        for (int i = 0; i < _columnIndex.Length; i++)
        {
            if (_columnIndex[i] >= count)
            {
                return _names[i];
            }
        }

        return "timestamp";
    }
}
