namespace SoftSensor.Daemon.Replay;

/// <summary>
/// Builds CSV rows into a reused character buffer: numbers with a fixed number of decimals
/// (integer arithmetic, invariant, no exponent; empty when not finite), text cells as given.
/// Allocation-free per row.
/// </summary>
internal sealed class CsvRowBuilder
{
    private static readonly double[] Powers = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12];
    private char[] _buffer = new char[1024];
    private int _length;

    /// <summary>The row built so far.</summary>
    public ReadOnlySpan<char> Row => _buffer.AsSpan(0, _length);

    /// <summary>Starts a new row.</summary>
    public void Clear() => _length = 0;

    /// <summary>Appends a separator unless the row is empty.</summary>
    public CsvRowBuilder Next()
    {
        if (_length > 0)
        {
            Put(',');
        }

        return this;
    }

    /// <summary>Appends text.</summary>
    public CsvRowBuilder Text(ReadOnlySpan<char> text)
    {
        Ensure(text.Length);
        text.CopyTo(_buffer.AsSpan(_length));
        _length += text.Length;
        return this;
    }

    /// <summary>Appends a number with <paramref name="decimals"/> decimals (0-12); nothing when it is NaN or infinite.</summary>
    public CsvRowBuilder Number(double value, int decimals)
    {
        if (!double.IsFinite(value))
        {
            return this;
        }

        double scaled = Math.Round(Math.Abs(value) * Powers[decimals], MidpointRounding.AwayFromZero);
        if (scaled >= 9e18)
        {
            // Beyond the integer path: round-trip text (rare; values this large are faults upstream).
            Ensure(32);
            value.TryFormat(_buffer.AsSpan(_length), out int w, "R", System.Globalization.CultureInfo.InvariantCulture);
            _length += w;
            return this;
        }

        ulong digits = (ulong)scaled;
        if (value < 0 && digits != 0)
        {
            Put('-');
        }

        ulong divisor = (ulong)Powers[decimals];
        ulong whole = digits / divisor;
        ulong fraction = digits % divisor;
        Ensure(24 + decimals);
        whole.TryFormat(_buffer.AsSpan(_length), out int written);
        _length += written;
        if (decimals > 0)
        {
            Put('.');
            for (int i = decimals - 1; i >= 0; i--)
            {
                _buffer[_length + i] = (char)('0' + (int)(fraction % 10));
                fraction /= 10;
            }

            _length += decimals;
        }

        return this;
    }

    /// <summary>Appends an ISO 8601 UTC time with milliseconds, e.g. 2026-03-02T06:00:10.000Z.</summary>
    public CsvRowBuilder Time(DateTimeOffset t)
    {
        Ensure(32);
        t.UtcDateTime.TryFormat(_buffer.AsSpan(_length), out int written, "yyyy-MM-dd'T'HH:mm:ss.fff'Z'", System.Globalization.CultureInfo.InvariantCulture);
        _length += written;
        return this;
    }

    private void Put(char c)
    {
        Ensure(1);
        _buffer[_length++] = c;
    }

    private void Ensure(int more)
    {
        if (_length + more > _buffer.Length)
        {
            Array.Resize(ref _buffer, Math.Max(_buffer.Length * 2, _length + more));
        }
    }
}
