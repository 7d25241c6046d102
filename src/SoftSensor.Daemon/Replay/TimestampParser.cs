using System.Globalization;

namespace SoftSensor.Daemon.Replay;

/// <summary>
/// Parses the timestamp column per configuration: ISO 8601 (with or without an offset), Unix
/// seconds or milliseconds, or a custom .NET format; times without an offset are read in the
/// configured IANA time zone and converted to UTC.
/// </summary>
internal sealed class TimestampParser
{
    private readonly string _format;
    private readonly TimeZoneInfo _zone;
    private readonly bool _utc;

    private TimestampParser(string format, TimeZoneInfo zone)
    {
        _format = format;
        _zone = zone;
        _utc = zone == TimeZoneInfo.Utc || zone.Id is "UTC" or "Etc/UTC";
    }

    /// <summary>Builds a parser; false with a message naming the field when the format or zone is unknown.</summary>
    public static bool TryCreate(TimestampSpec spec, out TimestampParser? parser, out string? error)
    {
        parser = null;
        if (string.IsNullOrWhiteSpace(spec.Format))
        {
            error = "history.timestamp.format is empty; expected iso8601, unix-seconds, unix-milliseconds or a .NET custom date format";
            return false;
        }

        TimeZoneInfo zone;
        try
        {
            zone = spec.TimeZone is "UTC" or "utc" or "Z" ? TimeZoneInfo.Utc : TimeZoneInfo.FindSystemTimeZoneById(spec.TimeZone);
        }
        catch (Exception e) when (e is TimeZoneNotFoundException or InvalidTimeZoneException)
        {
            error = $"history.timestamp.timeZone is '{spec.TimeZone}'; expected an IANA time zone id such as UTC or Europe/Berlin";
            return false;
        }

        parser = new TimestampParser(spec.Format, zone);
        error = null;
        return true;
    }

    /// <summary>Parses one cell; false when it is not a time of the configured format.</summary>
    public bool TryParse(ReadOnlySpan<char> cell, out DateTimeOffset time)
    {
        cell = cell.Trim().Trim('"');
        switch (_format)
        {
            case "iso8601":
                if (TryFastUtc(cell, out time))
                {
                    return true;
                }

                if (cell.Length > 0 && (cell[^1] == 'Z' || HasOffset(cell)))
                {
                    return DateTimeOffset.TryParse(cell, CultureInfo.InvariantCulture, DateTimeStyles.AdjustToUniversal, out time);
                }

                if (DateTime.TryParse(cell, CultureInfo.InvariantCulture, DateTimeStyles.None, out var local))
                {
                    return FromZone(local, out time);
                }

                break;
            case "unix-seconds":
            case "unix-milliseconds":
                if (double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out double n) && double.IsFinite(n))
                {
                    double ms = _format == "unix-seconds" ? n * 1000 : n;
                    if (Math.Abs(ms) < 2.5e14)
                    {
                        time = DateTimeOffset.UnixEpoch.AddTicks((long)Math.Round(ms * TimeSpan.TicksPerMillisecond));
                        return true;
                    }
                }

                break;
            default:
                if (DateTime.TryParseExact(cell, _format, CultureInfo.InvariantCulture, DateTimeStyles.None, out var custom))
                {
                    return custom.Kind == DateTimeKind.Utc ? Utc(custom, out time) : FromZone(custom, out time);
                }

                break;
        }

        time = default;
        return false;
    }

    /// <summary>Fast path for yyyy-MM-ddTHH:mm:ss[.f...]Z, the form most historians and the simulator write.</summary>
    private static bool TryFastUtc(ReadOnlySpan<char> c, out DateTimeOffset time)
    {
        time = default;
        if (c.Length < 20 || c[^1] != 'Z' || c[4] != '-' || c[7] != '-' || (c[10] != 'T' && c[10] != ' ') || c[13] != ':' || c[16] != ':')
        {
            return false;
        }

        if (!(Digits(c, 0, 4, out int y) && Digits(c, 5, 2, out int mo) && Digits(c, 8, 2, out int d)
              && Digits(c, 11, 2, out int h) && Digits(c, 14, 2, out int mi) && Digits(c, 17, 2, out int sec)))
        {
            return false;
        }

        long fractionTicks = 0;
        if (c.Length > 20)
        {
            if (c[19] != '.' || c.Length > 28)
            {
                return false;
            }

            long scale = TimeSpan.TicksPerSecond;
            for (int i = 20; i < c.Length - 1; i++)
            {
                int digit = c[i] - '0';
                if ((uint)digit > 9)
                {
                    return false;
                }

                scale /= 10;
                fractionTicks += digit * scale;
            }
        }

        if (mo is < 1 or > 12 || d < 1 || d > DateTime.DaysInMonth(y, mo) || h > 23 || mi > 59 || sec > 59)
        {
            return false;
        }

        time = new DateTimeOffset(y, mo, d, h, mi, sec, TimeSpan.Zero).AddTicks(fractionTicks);
        return true;
    }

    private static bool Digits(ReadOnlySpan<char> c, int at, int count, out int value)
    {
        value = 0;
        for (int i = at; i < at + count; i++)
        {
            int digit = c[i] - '0';
            if ((uint)digit > 9)
            {
                return false;
            }

            value = (value * 10) + digit;
        }

        return value >= 0 && (count != 4 || value >= 1);
    }

    private static bool HasOffset(ReadOnlySpan<char> cell)
    {
        // An offset is a sign after the time part, e.g. 2026-03-02T06:00:00+01:00.
        int t = cell.IndexOfAny('T', ' ');
        return t > 0 && cell[t..].IndexOfAny('+', '-') > 0;
    }

    private static bool Utc(DateTime value, out DateTimeOffset time)
    {
        time = new DateTimeOffset(DateTime.SpecifyKind(value, DateTimeKind.Utc));
        return true;
    }

    private bool FromZone(DateTime local, out DateTimeOffset time)
    {
        if (_utc)
        {
            return Utc(local, out time);
        }

        var unspecified = DateTime.SpecifyKind(local, DateTimeKind.Unspecified);
        if (_zone.IsInvalidTime(unspecified))
        {
            time = default;
            return false;
        }

        time = new DateTimeOffset(TimeZoneInfo.ConvertTimeToUtc(unspecified, _zone));
        return true;
    }
}
