namespace SoftSensor.LoadTest;

/// <summary>What one load step measured.</summary>
internal sealed record StepResult(
    int Reactors,
    double WindowS,
    long TagsPublished,
    long TagsMapped,
    long SamplesAccepted,
    long SamplesRejected,
    long EstimatesExpected,
    long EstimatesReceived,
    double P50Ms,
    double P95Ms,
    double P99Ms,
    double MaxMs,
    double PublisherLagP99Ms,
    double DaemonCpuPercent,
    double DaemonPeakRssMiB,
    double BrokerCpuPercent,
    string LoadAverage)
{
    /// <summary>The daemon's histogram (arrival of the newest input → frame through every sink): % within 50 ms.</summary>
    public double DaemonWithin50MsPercent { get; init; } = double.NaN;

    /// <summary>The daemon's histogram: upper bound of the bucket holding its p99, ms.</summary>
    public double DaemonP99BucketMs { get; init; } = double.NaN;

    /// <summary>MQTT reconnections of the daemon during the step (from its softsensor_mqtt_reconnects_total).</summary>
    public long Reconnects { get; init; }

    /// <summary>Per sink: its write time over the window as % of the window (the dispatcher runs the sinks one after the other, so their sum near 100 % means it is saturated).</summary>
    public IReadOnlyDictionary<string, double> SinkBusyPercent { get; init; } = new Dictionary<string, double>();

    /// <summary>Tag samples that did not reach the signal store, and estimates that never arrived (a 1 % allowance for the window's edges).</summary>
    public bool Lost => SamplesAccepted < TagsMapped || EstimatesReceived < EstimatesExpected * 0.99;

    public bool Held => !Lost && P99Ms < 50;

    public static string Header =>
        "reactors  tags/s  accepted  rejected  estimates  p50 ms  p95 ms  p99 ms  max ms  gen lag p99  daemon ≤50ms  daemon p99 ≤  daemon CPU  daemon peak RSS  broker CPU  sinks busy  reconnects  load avg  held";

    public override string ToString() => string.Create(System.Globalization.CultureInfo.InvariantCulture,
        $"{Reactors,8}  {TagsPublished / WindowS,6:0}  {SamplesAccepted,8}/{TagsMapped}  {SamplesRejected,8}  {EstimatesReceived,9}/{EstimatesExpected}  {P50Ms,6:0.0}  {P95Ms,6:0.0}  {P99Ms,6:0.0}  {MaxMs,6:0.0}  {PublisherLagP99Ms,8:0.0} ms  {DaemonWithin50MsPercent,9:0.0} %  {DaemonP99BucketMs,9:0} ms  {DaemonCpuPercent,8:0} %  {DaemonPeakRssMiB,11:0} MiB  {BrokerCpuPercent,8:0} %  {string.Join(" ", SinkBusyPercent.OrderBy(kv => kv.Key, StringComparer.Ordinal).Select(kv => string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{kv.Key} {kv.Value:0}%")))}  {Reconnects,3}  {LoadAverage}  {(Held ? "yes" : Lost ? "no (lost)" : "no (p99)")}");
}
