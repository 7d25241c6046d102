using SoftSensor.Core.Estimation;

namespace SoftSensor.Core.Tests.Estimation;

public class EstimatorStateCodecTests
{
    [Fact]
    public void Encode_then_decode_resumes_bit_for_bit()
    {
        var s = EstimationFixtures.Settings() with { HistoryCapacity = 64 };
        var a = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        for (int k = 0; k < 100; k++)
        {
            EstimationStep.Run(EstimationFixtures.Inputs(EstimationFixtures.Start.AddMinutes(k), 100), EstimationFixtures.Rates(0.1, 1 + (k * 0.01), s), a, s, o);
        }

        Assert.True(EstimatorStateCodec.TryDecode(EstimatorStateCodec.Encode(a), out var b, out var error), error);
        for (int k = 100; k < 200; k++)
        {
            var t = EstimationFixtures.Start.AddMinutes(k);
            var r = EstimationFixtures.Rates(0.1, 1 + (k * 0.01), s);
            EstimationStep.Run(EstimationFixtures.Inputs(t, 100), r, a, s, o);
            EstimationStep.Run(EstimationFixtures.Inputs(t, 100), r, b!, s, o);
        }

        Assert.Equal(a.Observers, b!.Observers);
        Assert.Equal(a.MuSmoothedPerH, b.MuSmoothedPerH);
        Assert.Equal(a.History.Count, b.History.Count);
        Assert.Equal(EstimatorStateCodec.Encode(a), EstimatorStateCodec.Encode(b));
    }

    [Fact]
    public void TryDecode_of_foreign_bytes_names_what_is_wrong()
    {
        Assert.False(EstimatorStateCodec.TryDecode(new byte[10], out _, out var e1));
        Assert.Contains("expected at least", e1, StringComparison.Ordinal);
        var bytes = EstimatorStateCodec.Encode(new EstimatorState(4));
        bytes[0] ^= 0xFF;
        Assert.False(EstimatorStateCodec.TryDecode(bytes, out _, out var e2));
        Assert.Contains("magic", e2, StringComparison.Ordinal);
    }
}
