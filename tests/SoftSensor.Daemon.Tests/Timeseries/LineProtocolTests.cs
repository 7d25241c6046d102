using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>
/// Line-protocol encoding, checked against the syntax of the InfluxDB v2 documentation ("Line
/// protocol" reference: measurement, comma-separated tag set, space, field set, space, timestamp;
/// escape commas and spaces in measurements, commas, equals signs and spaces in tag keys, tag
/// values and field keys; integers carry the suffix i).
/// </summary>
public class LineProtocolTests
{
    private static readonly DateTimeOffset T = new(2026, 3, 1, 8, 0, 0, 123, TimeSpan.Zero);

    [Fact]
    public void Lines_Frame_OneMeasurementPerKindWithTagsQualityAndMilliseconds()
    {
        var frame = new EstimateFrame("r1", "b-042", T, SampleQuality.Good,
        [
            new EstimateValue(EstimateNames.Rq, 1.0105, "1", double.NaN, SampleQuality.Good, 0),
            new EstimateValue(EstimateNames.Our, 38.629, "mmol/(L·h)", 0.5, SampleQuality.Good, 0),
            new EstimateValue(EstimateNames.MuPerH, 0.15, "1/h", 0.01, SampleQuality.Uncertain, 0x40950000),
        ]);
        var lines = LineProtocol.Lines(frame, "pilot", "softsensor_");
        Assert.Equal(
        [
            "softsensor_gas,site=pilot,unit=r1,batch=b-042 our=38.629,our_quality=0i,our_sigma=0.5,rq=1.0105,rq_quality=0i 1772352000123",
            "softsensor_growth,site=pilot,unit=r1,batch=b-042 mu_per_h=0.15,mu_per_h_quality=1i,mu_per_h_sigma=0.01 1772352000123",
        ], lines);
    }

    [Fact]
    public void Lines_BadValue_KeepsOnlyItsQualityField()
    {
        var frame = new EstimateFrame("r1", "b1", T, SampleQuality.Bad,
            [new EstimateValue(EstimateNames.Our, double.NaN, "mmol/(L·h)", double.NaN, SampleQuality.Bad, 0x80310000)]);
        Assert.Equal("softsensor_gas,site=pilot,unit=r1,batch=b1 our_quality=2i 1772352000123", Assert.Single(LineProtocol.Lines(frame, "pilot", "softsensor_")));
    }

    [Fact]
    public void Lines_TagsWithSpacesCommasAndEquals_AreEscaped()
    {
        var frame = new EstimateFrame("reactor 1,a", "b=2", T, SampleQuality.Good,
            [new EstimateValue(EstimateNames.Rq, 1, "1", double.NaN, SampleQuality.Good, 0)]);
        Assert.Equal(@"softsensor_gas,site=north\ hall,unit=reactor\ 1\,a,batch=b\=2 rq=1,rq_quality=0i 1772352000123",
            Assert.Single(LineProtocol.Lines(frame, "north hall", "softsensor_")));
        Assert.Equal(@"m\ gas\,x", LineProtocol.Escape("m gas,x", measurement: true));
        Assert.Equal(@"a\=b", LineProtocol.Escape("a=b", measurement: false));
        Assert.Equal("a=b", LineProtocol.Escape("a=b", measurement: true));
    }

    [Fact]
    public void Lines_EmptyBatchTag_IsLeftOut()
    {
        var frame = new EstimateFrame("r1", "", T, SampleQuality.Good, [new EstimateValue(EstimateNames.Rq, 1, "1", double.NaN, SampleQuality.Good, 0)]);
        Assert.Equal("softsensor_gas,site=pilot,unit=r1 rq=1,rq_quality=0i 1772352000123", Assert.Single(LineProtocol.Lines(frame, "pilot", "softsensor_")));
    }

    [Fact]
    public void Lines_SameFrameTwice_GiveIdenticalPoints()
    {
        var frame = TimeseriesRig.Frame(3, T);
        Assert.Equal(LineProtocol.Lines(frame, "pilot", "softsensor_"), LineProtocol.Lines(frame, "pilot", "softsensor_"));
    }

    [Theory]
    [InlineData(EstimateNames.Our, EstimateKinds.Gas)]
    [InlineData(EstimateNames.Kla, EstimateKinds.Gas)]
    [InlineData(EstimateNames.BiomassGPerL, EstimateKinds.Growth)]
    [InlineData(EstimateNames.ConsistencyH, EstimateKinds.Balance)]
    [InlineData(EstimateNames.FeedCapLPerH, EstimateKinds.Feed)]
    [InlineData("something_new", EstimateKinds.Other)]
    public void EstimateKindsOf_KnownNames_GoToTheirMeasurement(string name, string kind) => Assert.Equal(kind, EstimateKinds.Of(name));
}
