namespace SoftSensor.Daemon.Replay;

/// <summary>
/// Builds CSV rows into a reused character buffer: numbers with a fixed number of decimals
/// (integer arithmetic, invariant, no exponent; empty when not finite), text cells as given.
/// Allocation-free per row.
/// </summary>
internal sealed class CsvRowBuilder
{
    private static readonly double[] Powers = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12];
    private static readonly ulong[] PowersOfTen =
    [
        1, 10, 100, 1_000, 10_000, 100_000, 1_000_000, 10_000_000, 100_000_000, 1_000_000_000, 10_000_000_000,
        100_000_000_000, 1_000_000_000_000, 10_000_000_000_000, 100_000_000_000_000, 1_000_000_000_000_000,
        10_000_000_000_000_000, 100_000_000_000_000_000, 1_000_000_000_000_000_000, 10_000_000_000_000_000_000,
    ];

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

        // Digits from the right with constant divisions by 10 (a multiply each), the point after
        // the decimals: the text of whole.fraction with the fraction zero-padded, as before.
        ulong digits = (ulong)scaled;
        Ensure(26 + decimals);
        if (value < 0 && digits != 0)
        {
            _buffer[_length++] = '-';
        }

        int count = CountDigits(digits, decimals);
        int pos = _length + count;
        _length = pos;
        for (int i = 0; i < decimals; i++)
        {
            _buffer[--pos] = (char)('0' + (int)(digits % 10));
            digits /= 10;
        }

        if (decimals > 0)
        {
            _buffer[--pos] = '.';
        }

        do
        {
            _buffer[--pos] = (char)('0' + (int)(digits % 10));
            digits /= 10;
        }
        while (digits != 0);

        return this;
    }

    /// <summary>Appends an ISO 8601 UTC time with milliseconds, e.g. 2026-03-02T06:00:10.000Z (milliseconds truncated, as the "fff" format does).</summary>
    public CsvRowBuilder Time(DateTimeOffset t)
    {
        Ensure(24);
        t.UtcDateTime.Deconstruct(out DateOnly date, out TimeOnly time);
        date.Deconstruct(out int year, out int month, out int day);
        var b = _buffer.AsSpan(_length, 24);
        Put4(b, 0, year);
        b[4] = '-';
        Put2(b, 5, month);
        b[7] = '-';
        Put2(b, 8, day);
        b[10] = 'T';
        Put2(b, 11, time.Hour);
        b[13] = ':';
        Put2(b, 14, time.Minute);
        b[16] = ':';
        Put2(b, 17, time.Second);
        b[19] = '.';
        int ms = time.Millisecond;
        b[20] = (char)('0' + (ms / 100));
        Put2(b, 21, ms % 100);
        b[23] = 'Z';
        _length += 24;
        return this;
    }

    // Characters of whole.fraction: at least one whole digit, the point and the decimals.
    private static int CountDigits(ulong digits, int decimals)
    {
        int n = 1;
        while (n < PowersOfTen.Length && digits >= PowersOfTen[n])
        {
            n++;
        }

        return decimals > 0 ? Math.Max(n, decimals + 1) + 1 : n;
    }

    private static void Put2(Span<char> b, int at, int v)
    {
        b[at] = (char)('0' + (v / 10));
        b[at + 1] = (char)('0' + (v % 10));
    }

    private static void Put4(Span<char> b, int at, int v)
    {
        Put2(b, at, v / 100);
        Put2(b, at + 2, v % 100);
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
