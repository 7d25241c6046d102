namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// DateTime of Part 6 §5.2.2.5: an Int64 count of 100 ns intervals since 1601-01-01 00:00 UTC.
/// Zero means "no time" (mapped to <see cref="DateTime.MinValue"/>); values at or beyond
/// 9999-12-31 23:59:59 are written as Int64.MaxValue; earlier than 1601 as 0.
/// </summary>
public static class UaDateTime
{
    /// <summary>Ticks of 1601-01-01 on the .NET calendar (which counts from year 1).</summary>
    public static readonly long EpochTicks = new DateTime(1601, 1, 1, 0, 0, 0, DateTimeKind.Utc).Ticks;

    /// <summary>The encoded value of a UTC time.</summary>
    public static long ToTicks(DateTime value)
    {
        if (value == DateTime.MinValue)
        {
            return 0;
        }

        var utc = value.Kind == DateTimeKind.Local ? value.ToUniversalTime() : value;
        if (utc.Ticks < EpochTicks)
        {
            return 0;
        }

        if (utc >= new DateTime(9999, 12, 31, 23, 59, 59, DateTimeKind.Utc))
        {
            return long.MaxValue;
        }

        return utc.Ticks - EpochTicks;
    }

    /// <summary>The UTC time of an encoded value; 0 and negatives give MinValue, Int64.MaxValue gives MaxValue.</summary>
    public static DateTime FromTicks(long ticks)
    {
        if (ticks <= 0)
        {
            return DateTime.MinValue;
        }

        if (ticks >= DateTime.MaxValue.Ticks - EpochTicks)
        {
            return DateTime.SpecifyKind(DateTime.MaxValue, DateTimeKind.Utc);
        }

        return new DateTime(ticks + EpochTicks, DateTimeKind.Utc);
    }
}
