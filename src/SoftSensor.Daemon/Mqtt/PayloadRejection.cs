namespace SoftSensor.Daemon.Mqtt;

/// <summary>Why a tag payload was refused: the <c>reason</c> label of <c>softsensor_payloads_rejected_total</c>.</summary>
internal enum PayloadRejection
{
    /// <summary>Accepted.</summary>
    None,
    Empty,
    TooLarge,
    NotJson,
    TrailingData,
    DuplicateKey,
    NoValue,
    Boolean,
    NotANumber,
    NotFinite,
    BadTimestamp,
    TimestampOutsideWindow,
    BadStatusCode,
    BadQuality,
    BadText,
}

/// <summary>Label values of <see cref="PayloadRejection"/>.</summary>
internal static class PayloadRejections
{
    public static string Id(PayloadRejection r) => r switch
    {
        PayloadRejection.None => "none",
        PayloadRejection.Empty => "empty",
        PayloadRejection.TooLarge => "too_large",
        PayloadRejection.NotJson => "not_json",
        PayloadRejection.TrailingData => "trailing_data",
        PayloadRejection.DuplicateKey => "duplicate_key",
        PayloadRejection.NoValue => "no_value",
        PayloadRejection.Boolean => "boolean",
        PayloadRejection.NotANumber => "not_a_number",
        PayloadRejection.NotFinite => "not_finite",
        PayloadRejection.BadTimestamp => "bad_timestamp",
        PayloadRejection.TimestampOutsideWindow => "timestamp_outside_window",
        PayloadRejection.BadStatusCode => "bad_status_code",
        PayloadRejection.BadQuality => "bad_quality",
        PayloadRejection.BadText => "bad_text",
        _ => throw new ArgumentOutOfRangeException(nameof(r), r, "unknown payload rejection"),
    };
}

/// <summary>
/// The source timestamps a payload may carry: from <see cref="Past"/> before the daemon's clock to
/// <see cref="Future"/> after it (keys <c>mqtt:timestampWindowPast</c>, <c>mqtt:timestampWindowFuture</c>).
/// A stamp outside (year 1, 1971, 2100) is refused and counted rather than stored as history or future.
/// </summary>
internal readonly record struct TimestampWindow(DateTimeOffset Now, TimeSpan Past, TimeSpan Future)
{
    /// <summary>No window (every parseable stamp passes).</summary>
    public static TimestampWindow Open => new(DateTimeOffset.UnixEpoch, TimeSpan.MaxValue, TimeSpan.MaxValue);

    public bool Contains(DateTimeOffset t) =>
        (Past == TimeSpan.MaxValue || t >= Now - Past) && (Future == TimeSpan.MaxValue || t <= Now + Future);
}
