using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Gas;

public class GasBalanceAllocationTests
{
    [Fact]
    public void Compute_after_warm_up_allocates_nothing()
    {
        // The cycle calls the balance every time; it must not touch the heap (speed is measured
        // with BenchmarkDotNet, not here).
        var flows = new GasLineFlows(8, 1, 0.5, 0.1);
        var inlet = InletComposition.FromGasLines();
        var outlet = AnalyserReading.Saturated(0.19, 0.015, 30, 101.325);
        var settings = GasBalanceSettings.Default.WithAccuracy(new MeasurementAccuracy(0.02, 0.02, 1));
        var aligned = new AlignedInputs { Time = DateTimeOffset.UnixEpoch };
        aligned.Set(SignalRole.AirFlowNlPerMin, 10, SampleQuality.Good, DateTimeOffset.UnixEpoch);
        aligned.Set(SignalRole.OutletO2Percent, 19.5, SampleQuality.Good, DateTimeOffset.UnixEpoch);
        aligned.Set(SignalRole.OutletCo2Percent, 1.5, SampleQuality.Good, DateTimeOffset.UnixEpoch);
        aligned.Set(SignalRole.LiquidVolumeL, 10, SampleQuality.Good, DateTimeOffset.UnixEpoch);
        var alignedSettings = AlignedGasBalanceSettings.Default;
        double sink = GasBalance.Compute(flows, inlet, outlet, 10, settings).OurMmolPerLh + GasBalance.Compute(aligned, alignedSettings).OurMmolPerLh;

        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 1000; i++)
        {
            sink += GasBalance.Compute(flows, inlet, outlet, 10, settings).OurMmolPerLh;
            sink += GasBalance.Compute(aligned, alignedSettings).OurMmolPerLh;
        }

        long allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        Assert.Equal(0, allocated);
        Assert.True(double.IsFinite(sink));
    }
}
