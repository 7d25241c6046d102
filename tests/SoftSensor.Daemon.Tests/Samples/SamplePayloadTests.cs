using System.Text;
using SoftSensor.Daemon.Samples;

namespace SoftSensor.Daemon.Tests.Samples;

/// <summary>The operator-input payload: every problem names the field, the value and the expectation.</summary>
public class SamplePayloadTests
{
    private static readonly DateTimeOffset Now = new(2026, 3, 1, 12, 0, 0, TimeSpan.Zero);

    private static (SampleEntry? Entry, IReadOnlyList<string> Problems) Parse(string json) => SamplePayload.Parse(Encoding.UTF8.GetBytes(json), Now);

    [Fact]
    public void Parse_dcw_with_offset_time_and_withdrawal_gives_utc_entry_in_litres()
    {
        var (e, p) = Parse("""{"kind":"dcw","sampledAt":"2026-03-01T10:30:00+01:00","valueGPerL":4.2,"sigmaGPerL":0.15,"withdrawnMl":50,"operator":"anna"}""");
        Assert.Empty(p);
        Assert.Equal(SampleKind.Dcw, e!.Kind);
        Assert.Equal(new DateTimeOffset(2026, 3, 1, 9, 30, 0, TimeSpan.Zero), e.SampledAt);
        Assert.Equal(TimeSpan.Zero, e.SampledAt.Offset);
        Assert.Equal(4.2, e.ValueGPerL);
        Assert.Equal(0.15, e.SigmaGPerL);
        Assert.Equal(0.050, e.WithdrawnL, 12);
        Assert.True(e.IsBiomass);
    }

    [Fact]
    public void Parse_od_converts_with_the_calibration_and_its_uncertainty()
    {
        // JCGM 100:2008 eq. (10): u(X) = sqrt((k·u(OD))² + (OD·u(k))²) = sqrt(0.076² + 0.2²) (invented values).
        var (e, p) = Parse("""{"kind":"od","sampledAt":"2026-03-01T10:00:00Z","od":10.0,"odSigma":0.2,"factorGPerLPerOd":0.38,"factorSigmaGPerLPerOd":0.02}""");
        Assert.Empty(p);
        Assert.Equal(3.8, e!.ValueGPerL!.Value, 12);
        Assert.Equal(Math.Sqrt((0.076 * 0.076) + 0.04), e.SigmaGPerL!.Value, 12);
    }

    [Fact]
    public void Parse_every_problem_names_field_value_and_expectation()
    {
        var (e, p) = Parse("""{"kind":"dcw","sampledAt":"2026-03-01T10:00:00","valueGPerL":-1,"sigmaGPerL":0,"od":3,"colour":"red","withdrawnMl":"50"}""");
        Assert.Null(e);
        Assert.Contains(p, x => x.StartsWith("field 'colour' is not known (expected one of kind, sampledAt", StringComparison.Ordinal));
        Assert.Contains("sampledAt is '2026-03-01T10:00:00' (expected ISO 8601 with Z or an offset, e.g. 2026-03-01T10:00:00Z)", p);
        Assert.Contains("valueGPerL is -1 (expected 0 or more g/L)", p);
        Assert.Contains("sigmaGPerL is 0 (expected a positive standard uncertainty in g/L)", p);
        Assert.Contains("od is 3 (expected no od for kind dcw)", p);
        Assert.Contains("withdrawnMl is \"50\" (expected a number)", p);
        Assert.Equal(6, p.Count);
    }

    [Fact]
    public void Parse_refuses_missing_fields_unknown_kind_future_time_and_non_objects()
    {
        Assert.Contains("kind is 'hplc' (expected dcw, od, substrate, product or removal)", Parse("""{"kind":"hplc","sampledAt":"2026-03-01T10:00:00Z"}""").Problems);
        var od = Parse("""{"kind":"od","sampledAt":"2026-03-01T10:00:00Z","od":10}""").Problems;
        Assert.Contains("odSigma is missing (expected a positive standard uncertainty in OD units)", od);
        Assert.Contains("factorGPerLPerOd is missing (expected a positive calibration factor in g/L per OD unit)", od);
        Assert.Contains("withdrawnMl is missing (expected the volume withdrawn in mL for a removal)", Parse("""{"kind":"removal","sampledAt":"2026-03-01T10:00:00Z"}""").Problems);
        Assert.Contains("sampledAt is missing (expected the sampling time, ISO 8601 with Z or an offset, e.g. 2026-03-01T10:00:00Z)", Parse("""{"kind":"dcw","valueGPerL":1,"sigmaGPerL":0.1}""").Problems);
        var future = Parse("""{"kind":"dcw","sampledAt":"2026-03-01T13:00:00Z","valueGPerL":1,"sigmaGPerL":0.1}""").Problems;
        Assert.Equal("sampledAt is 2026-03-01T13:00:00.0000000Z (expected not after the daemon's time 2026-03-01T12:00:00.0000000Z plus 5 min)", Assert.Single(future));
        Assert.Equal("payload is a JSON array (expected an object)", Assert.Single(Parse("[1]").Problems));
        Assert.StartsWith("payload is not JSON", Assert.Single(Parse("{kind:").Problems), StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_substrate_and_product_assays_are_not_biomass_and_keep_their_analyte()
    {
        var (e, p) = Parse("""{"kind":"substrate","sampledAt":"2026-03-01T10:00:00Z","valueGPerL":2.1,"sigmaGPerL":0.1,"analyte":"glycerol"}""");
        Assert.Empty(p);
        Assert.False(e!.IsBiomass);
        Assert.Equal("glycerol", e.Analyte);
        var (r, q) = Parse("""{"kind":"removal","sampledAt":"2026-03-01T10:00:00Z","withdrawnMl":250}""");
        Assert.Empty(q);
        Assert.Equal(0.25, r!.WithdrawnL, 12);
        Assert.Null(r.ValueGPerL);
    }
}
