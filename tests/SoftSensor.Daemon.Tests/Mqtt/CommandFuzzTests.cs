using System.Text;
using CsCheck;
using SoftSensor.Daemon.Alarming;
using SoftSensor.Daemon.Batches;
using SoftSensor.Daemon.Mqtt;
using SoftSensor.Daemon.Samples;

namespace SoftSensor.Daemon.Tests.Mqtt;

/// <summary>
/// The command listeners' parsers (batch, sample, alarm topics and the same bodies over HTTP) under
/// random and mangled payloads: nothing escapes, every refusal says why, the reasons are tallied.
/// 10⁵ cases each by default; SOFTSENSOR_FUZZ_CASES sets more.
/// </summary>
public sealed class CommandFuzzTests
{
    private static readonly DateTimeOffset Now = new(2026, 12, 2, 12, 0, 0, TimeSpan.Zero);
    private static readonly long Cases = long.TryParse(Environment.GetEnvironmentVariable("SOFTSENSOR_FUZZ_CASES"), out long n) && n > 100_000 ? n : 100_000;

    private static readonly string[] Pieces =
    [
        "{", "}", "[", "]", ",", ":", "\"command\":", "\"start\"", "\"end\"", "\"phase\"", "\"acknowledge\"", "\"shelve\"", "\"alarm\":", "\"*\"", "\"rq_high\"",
        "\"operator\":", "\"anna\"", "\"shelveMinutes\":", "30", "-1", "1e400", "\"kind\":", "\"dcw\"", "\"removal\"", "\"sampledAt\":", "\"2026-12-02T11:00:00Z\"",
        "\"valueGPerL\":", "\"sigmaGPerL\":", "\"withdrawnMl\":", "5", "0.2", "true", "null", "\"batchId\":", "\"b-1\"", "\"initialVolumeL\":", "\"phase\":",
        "\"induced\"", " ", "\\u0000", "\"", "/*", "*/", "\ud800",
    ];

    private static readonly Gen<byte[]> Payloads = Gen.OneOf(
        Gen.Byte.Array[0, 48],
        Gen.Int[0, Pieces.Length - 1].Array[0, 14].Select(ix => Encoding.UTF8.GetBytes(string.Concat(ix.Select(i => Pieces[i])))),
        Gen.Int[0, Pieces.Length - 1].Array[0, 10].Select(ix => Encoding.UTF8.GetBytes("{" + string.Join(",", ix.Chunk(2).Select(p => string.Concat(p.Select(i => Pieces[i])))) + "}")));

    private static void Fuzz(string what, Func<byte[], string?> refusal)
    {
        var reasons = new Dictionary<string, long>(StringComparer.Ordinal);
        long cases = 0, accepted = 0;
        Payloads.Sample(bytes =>
        {
            cases++;
            string? why = refusal(bytes);
            if (why is null)
            {
                accepted++;
                return;
            }

            Assert.False(string.IsNullOrWhiteSpace(why));
            string key = why.Split(' ', 2)[0];
            reasons[key] = reasons.GetValueOrDefault(key) + 1;
        }, iter: Cases, threads: 1);
        Assert.True(cases >= 100_000, $"{what}: only {cases} cases ran");
        Assert.Equal(cases - accepted, reasons.Values.Sum());
        Assert.True(reasons.Count >= 2, $"{what}: refusals of one kind only: {string.Join(", ", reasons)}");
    }

    [Fact]
    public void Fuzz_the_alarm_command_parser_never_throws_and_every_refusal_names_its_field() =>
        Fuzz("alarm", b => AlarmCommandPayload.TryParse(b, Now, out _, out _, out string error) ? null : error["alarm command: ".Length..]);

    [Fact]
    public void Fuzz_the_sample_parser_never_throws_and_every_refusal_names_its_field() =>
        Fuzz("sample", b => SamplePayload.Parse(b, Now) is var (entry, problems) && entry is not null ? null : string.Join(" | ", problems));

    [Fact]
    public void Fuzz_the_batch_command_parser_never_throws_and_every_refusal_says_why() =>
        Fuzz("batch", b => BatchCommandListener.Parse(b).Problem);

    [Fact]
    public void A_command_payload_above_4_KiB_is_dropped_unparsed_and_logged_by_size_only()
    {
        var log = new ListLogger();
        Assert.False(CommandPayloadLimit.Allows(log, "softsensor/p/a/r1/command/alarm", 8 * 1024 * 1024));
        Assert.True(CommandPayloadLimit.Allows(log, "softsensor/p/a/r1/command/alarm", 300));
        Assert.Equal("MQTT command on softsensor/p/a/r1/command/alarm dropped: payload of 8388608 bytes (at most 4096)", Assert.Single(log.Lines));
    }

    private sealed class ListLogger : Microsoft.Extensions.Logging.ILogger
    {
        public List<string> Lines { get; } = [];

        public IDisposable? BeginScope<TState>(TState state) where TState : notnull => null;

        public bool IsEnabled(Microsoft.Extensions.Logging.LogLevel logLevel) => true;

        public void Log<TState>(Microsoft.Extensions.Logging.LogLevel logLevel, Microsoft.Extensions.Logging.EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter) =>
            Lines.Add(formatter(state, exception));
    }
}
