using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Alarming;

/// <summary>Gives the alarm rules the fill level of the time-series outbox as <c>tag:softsensor.outbox_fill_percent</c> (rule <c>outbox_filling</c>).</summary>
/// <remarks>Without a time-series sink (none configured) it adds nothing, and that rule holds its state.</remarks>
internal sealed class OutboxFillSignal(IServiceProvider services) : IAlarmSignalSource
{
    public static readonly SignalRef Signal = SignalRef.Tag("softsensor.outbox_fill_percent");

    private readonly TimeseriesSink? _sink = (TimeseriesSink?)services.GetService(typeof(TimeseriesSink));

    public void AddSignals(EstimateFrame frame, AlarmSnapshot snapshot)
    {
        if (_sink is not null)
        {
            snapshot.Set(Signal, _sink.FillPercent, SampleQuality.Good);
        }
    }
}
