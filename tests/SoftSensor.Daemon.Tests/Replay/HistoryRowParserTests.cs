using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Tests.Replay;

public class HistoryRowParserTests
{
    private static readonly CsvLayout Layout = new()
    {
        Timestamp = new TimestampSpec { Column = "ts", Format = "iso8601", TimeZone = "UTC" },
        Columns =
        [
            new ColumnMap { Column = "air", Role = "AirFlowNlPerMin", Unit = "Nm3/h" },
            new ColumnMap { Column = "o2", Role = "OutletO2Percent", Unit = "fraction" },
            new ColumnMap { Column = "p", Role = "PressureKPa", Unit = "bar", Offset = 1.01325 },
            new ColumnMap { Column = "t", Role = "TemperatureC", Unit = "K" },
            new ColumnMap { Column = "feed", Role = "FeedRateLPerH", Unit = "mL/h", Scale = 2 },
        ],
    };

    private static HistoryRowParser Parser(CsvLayout? layout = null)
    {
        Assert.True(HistoryRowParser.TryCreate(layout ?? Layout, "ts,air,o2,extra,p,t,feed", out var p, out var e), e);
        return p!;
    }

    [Fact]
    public void Parse_good_row_converts_plant_units_to_role_units()
    {
        // Unit definitions (SI brochure 9th ed.; NIST SP 811): 1 Nm3/h = 1000/60 NL/min, 1 bar = 100 kPa,
        // T[°C] = T[K] - 273.15; gauge offset 1.01325 bar = 1 atm; scale 2 applied before the unit.
        var p = Parser();
        var a = new AlignedInputs();
        Assert.Equal(RowOutcome.Ok, p.Parse("2026-03-02T06:00:10Z,1.8,0.2031,zzz,0.5,310.15,250", a));
        Assert.Equal(new DateTimeOffset(2026, 3, 2, 6, 0, 10, TimeSpan.Zero), a.Time);
        Assert.Equal(30.0, a[SignalRole.AirFlowNlPerMin], 12);
        Assert.Equal(20.31, a[SignalRole.OutletO2Percent], 12);
        Assert.Equal(151.325, a[SignalRole.PressureKPa], 10);
        Assert.Equal(37.0, a[SignalRole.TemperatureC], 10);
        Assert.Equal(0.5, a[SignalRole.FeedRateLPerH], 12);
    }

    [Theory]
    [InlineData("2026-03-02T06:00:10Z,1.8,0.2031", "MissingCell", "p")]
    [InlineData("2026-03-02T06:00:10Z,1.8,,x,1,300,2", "MissingCell", "o2")]
    [InlineData("2026-03-02T06:00:10Z,1.8,abc,x,1,300,2", "NotANumber", "o2")]
    [InlineData("2026-03-02T06:00:10Z,1.8,0.2,x,1,NaN,2", "NotANumber", "t")]
    [InlineData("yesterday,1.8,0.2,x,1,300,2", "BadTimestamp", "timestamp")]
    [InlineData("2026-03-02T25:00:10Z,1.8,0.2,x,1,300,2", "BadTimestamp", "timestamp")]
    [InlineData("  ", "Blank", "")]
    public void Parse_malformed_row_names_the_reason_and_the_column(string line, string expected, string column)
    {
        var p = Parser();
        Assert.Equal(Enum.Parse<RowOutcome>(expected), p.Parse(line, new AlignedInputs()));
        Assert.Equal(column, p.FaultColumn);
    }

    [Fact]
    public void Parse_timestamp_going_backwards_or_repeating_is_rejected_and_later_rows_still_parse()
    {
        var p = Parser();
        var a = new AlignedInputs();
        Assert.Equal(RowOutcome.Ok, p.Parse("2026-03-02T06:00:10Z,1.8,0.2,x,1,300,2", a));
        Assert.Equal(RowOutcome.TimeNotIncreasing, p.Parse("2026-03-02T06:00:00Z,1.8,0.2,x,1,300,2", a));
        Assert.Equal(RowOutcome.TimeNotIncreasing, p.Parse("2026-03-02T06:00:10Z,1.8,0.2,x,1,300,2", a));
        Assert.Equal(RowOutcome.Ok, p.Parse("2026-03-02T06:00:20Z,1.8,0.2,x,1,300,2", a));
        Assert.Equal(new DateTimeOffset(2026, 3, 2, 6, 0, 20, TimeSpan.Zero), p.LastTime);
    }

    [Fact]
    public void Parse_local_times_in_a_configured_zone_become_utc()
    {
        // IANA tz database: Europe/Berlin is UTC+1 (CET) in winter, UTC+2 (CEST) from the last Sunday of
        // March 2026 (29 March, 01:00 UTC).
        var layout = Layout with { Timestamp = new TimestampSpec { Column = "ts", Format = "dd.MM.yyyy HH:mm:ss", TimeZone = "Europe/Berlin" } };
        var p = Parser(layout);
        var a = new AlignedInputs();
        Assert.Equal(RowOutcome.Ok, p.Parse("02.03.2026 07:00:00,1,0.2,x,1,300,2", a));
        Assert.Equal(new DateTimeOffset(2026, 3, 2, 6, 0, 0, TimeSpan.Zero), a.Time);
        Assert.Equal(RowOutcome.Ok, p.Parse("30.03.2026 08:00:00,1,0.2,x,1,300,2", a));
        Assert.Equal(new DateTimeOffset(2026, 3, 30, 6, 0, 0, TimeSpan.Zero), a.Time);
    }

    [Fact]
    public void TryCreate_with_a_bad_mapping_lists_every_fault_with_its_key()
    {
        var layout = Layout with
        {
            Timestamp = new TimestampSpec { Column = "when", TimeZone = "Mars/Olympus" },
            Columns = [new ColumnMap { Column = "air", Role = "AirFlow", Unit = "NL/min" }, new ColumnMap { Column = "o2", Role = "OutletO2Percent", Unit = "furlong" }],
        };
        Assert.False(HistoryRowParser.TryCreate(layout, "ts,air,o2", out _, out var error));
        Assert.Contains("history.timestamp.column 'when' is not in the header", error, StringComparison.Ordinal);
        Assert.Contains("history.timestamp.timeZone is 'Mars/Olympus'", error, StringComparison.Ordinal);
        Assert.Contains("history.columns[0].role is 'AirFlow'", error, StringComparison.Ordinal);
        Assert.Contains("history.columns[1].unit is 'furlong' for role OutletO2Percent; expected one of %", error, StringComparison.Ordinal);
    }
}
