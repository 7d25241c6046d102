using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Store;

namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// Gives the alarm rules the free space on the store's disk above <c>store:minFreeDiskMegabytes</c> as
/// <c>tag:softsensor.disk_free_margin_mb</c> (rule <c>disk_low</c>: below 0 the daemon is deleting its
/// oldest data to keep the newest). Before the first maintenance pass it adds nothing.
/// </summary>
internal sealed class DiskSpaceSignal(StoreHealth health) : IAlarmSignalSource
{
    public static readonly SignalRef Signal = SignalRef.Tag("softsensor.disk_free_margin_mb");

    public void AddSignals(EstimateFrame frame, AlarmSnapshot snapshot)
    {
        var r = health.Current;
        if (r.MeasuredAt is not null && double.IsFinite(r.FreeMarginMegabytes))
        {
            snapshot.Set(Signal, r.FreeMarginMegabytes, SampleQuality.Good);
        }
    }
}
