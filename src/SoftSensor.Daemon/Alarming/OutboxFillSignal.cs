using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Alarming;

/// <summary>Gives the alarm rules the fill level of the time-series outbox as <c>tag:softsensor.outbox_fill_percent</c> (rule <c>outbox_filling</c>).</summary>
internal sealed class OutboxFillSignal(TimeseriesSink sink) : IAlarmSignalSource
{
    public static readonly SignalRef Signal = SignalRef.Tag("softsensor.outbox_fill_percent");

    public void AddSignals(EstimateFrame frame, AlarmSnapshot snapshot) => snapshot.Set(Signal, sink.FillPercent, SampleQuality.Good);
}
