namespace SoftSensor.Daemon.Replay;

/// <summary>
/// Reads a text file line by line into a reused character buffer, without a string per line,
/// and counts lines (1-based, as an editor shows them) and bytes for the progress bar. Accepts
/// LF and CRLF line ends. Not thread-safe.
/// </summary>
internal sealed class CsvLineReader : IDisposable
{
    private readonly StreamReader _reader;
    private char[] _buffer = new char[1 << 16];
    private int _start;
    private int _end;
    private bool _eof;

    public CsvLineReader(Stream stream)
    {
        _reader = new StreamReader(stream, System.Text.Encoding.UTF8, detectEncodingFromByteOrderMarks: true, bufferSize: 1 << 16);
        Stream = stream;
    }

    /// <summary>The underlying stream (its position drives the progress bar).</summary>
    public Stream Stream { get; }

    /// <summary>Number of the line last returned, 1-based.</summary>
    public long LineNumber { get; private set; }

    /// <summary>The next line without its line end; false at the end of the file.</summary>
    public bool TryReadLine(out ReadOnlySpan<char> line)
    {
        while (true)
        {
            int nl = _buffer.AsSpan(_start, _end - _start).IndexOf('\n');
            if (nl >= 0)
            {
                line = Trim(_buffer.AsSpan(_start, nl));
                _start += nl + 1;
                LineNumber++;
                return true;
            }

            if (_eof)
            {
                if (_end > _start)
                {
                    line = Trim(_buffer.AsSpan(_start, _end - _start));
                    _start = _end;
                    LineNumber++;
                    return true;
                }

                line = default;
                return false;
            }

            Fill();
        }
    }

    public void Dispose() => _reader.Dispose();

    private static ReadOnlySpan<char> Trim(ReadOnlySpan<char> s) => s.Length > 0 && s[^1] == '\r' ? s[..^1] : s;

    private void Fill()
    {
        int remaining = _end - _start;
        if (_start > 0)
        {
            Array.Copy(_buffer, _start, _buffer, 0, remaining);
            _start = 0;
            _end = remaining;
        }

        if (_end == _buffer.Length)
        {
            Array.Resize(ref _buffer, _buffer.Length * 2);
        }

        int read = _reader.Read(_buffer, _end, _buffer.Length - _end);
        if (read == 0)
        {
            _eof = true;
        }
        else
        {
            _end += read;
        }
    }
}
