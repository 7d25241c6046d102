using System.Buffers;
using System.Text.Json;
using System.Text.Json.Serialization;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Batches;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Mqtt;

namespace SoftSensor.Daemon.Samples;

/// <summary>
/// Operator inputs from MQTT: one topic per reactor, <c>{prefix}/{site}/{area}/{reactor}/command/sample</c>,
/// with the JSON of <see cref="SamplePayload"/>. Every answer goes to <c>.../command/sample/result</c> (not
/// retained): at entry the stored input (outcome <c>pending</c> or <c>recorded</c>) or every problem, and
/// later the same input again once the estimator resolved it (<c>applied</c>, <c>tooOld</c>, ...).
/// </summary>
internal sealed class SampleCommandListener(MqttLink link, SampleBook book, SampleIntake intake, IOptions<SoftSensorOptions> options, ILogger<SampleCommandListener> logger) : IHostedService
{
    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web) { DefaultIgnoreCondition = JsonIgnoreCondition.Never };

    public static string CommandTopic(SoftSensorOptions o, string reactor) => $"{o.Mqtt.TopicPrefix}/{o.Site}/{o.Area}/{reactor}/command/sample";

    public Task StartAsync(CancellationToken cancellationToken)
    {
        foreach (var reactor in options.Value.Reactors)
        {
            link.Subscribe(CommandTopic(options.Value, reactor.Id), (_, payload) => HandleAsync(reactor.Id, payload));
        }

        book.Changed += OnChanged;
        return Task.CompletedTask;
    }

    public Task StopAsync(CancellationToken cancellationToken)
    {
        book.Changed -= OnChanged;
        foreach (var reactor in options.Value.Reactors)
        {
            link.Unsubscribe(CommandTopic(options.Value, reactor.Id));
        }

        return Task.CompletedTask;
    }

    private async ValueTask HandleAsync(string reactor, ReadOnlySequence<byte> payload)
    {
        if (!CommandPayloadLimit.Allows(logger, CommandTopic(options.Value, reactor), payload.Length))
        {
            return;
        }

        var (record, problems) = intake.Enter(reactor, payload.ToArray(), "mqtt");
        if (record is null)
        {
            await PublishAsync(reactor, new SampleReply(false, null, problems));
        }

        // An accepted input is answered by OnChanged (entered, then resolved).
    }

    private void OnChanged(SampleRecord r)
    {
        // Raised on the cycle task when resolved: publish without waiting for the broker.
        _ = PublishAsync(r.Reactor, new SampleReply(true, r, [])).AsTask().ContinueWith(
            t => logger.LogWarning(t.Exception, "sample result for reactor {Reactor} not published", r.Reactor),
            CancellationToken.None, TaskContinuationOptions.OnlyOnFaulted, TaskScheduler.Default);
    }

    private async ValueTask PublishAsync(string reactor, SampleReply reply) =>
        await link.PublishAsync(CommandTopic(options.Value, reactor) + "/result", JsonSerializer.SerializeToUtf8Bytes(reply, Json), retain: false, CancellationToken.None);
}

/// <summary>The answer on the result topic and the status API.</summary>
internal sealed record SampleReply(bool Accepted, SampleRecord? Sample, IReadOnlyList<string> Problems);

/// <summary>
/// The one way in for operator inputs (MQTT, status API, form, CLI): validates the payload against the
/// daemon's clock and the open batch, stores it, or logs and counts the refusal. Thread-safe.
/// </summary>
internal sealed class SampleIntake(SampleBook book, BatchBook batches, IOptions<SoftSensorOptions> options, TimeProvider time, ILogger<SampleIntake> logger)
{
    /// <summary>The stored input, or every problem (reactor unknown, payload invalid, sampled before the open batch started).</summary>
    /// <remarks><paramref name="user"/>, the authenticated user of the status server, replaces any operator named in the payload.</remarks>
    public (SampleRecord? Record, IReadOnlyList<string> Problems) Enter(string reactor, ReadOnlySpan<byte> payload, string path, string? user = null)
    {
        var reactorOptions = options.Value.Reactors.FirstOrDefault(r => r.Id == reactor);
        if (reactorOptions is null)
        {
            return Refuse(reactor, path, [$"reactor is '{reactor}' (expected one of {string.Join(", ", options.Value.Reactors.Select(r => r.Id))})"]);
        }

        var (entry, problems) = SamplePayload.Parse(payload, time.GetUtcNow());
        var open = batches.Current(reactor);
        if (entry is not null && open is not null && entry.SampledAt < open.StartedAt)
        {
            problems = [$"sampledAt is {entry.SampledAt.UtcDateTime:O} (expected not before the start of batch '{open.BatchId}' at {open.StartedAt.UtcDateTime:O})"];
        }

        if (problems.Count > 0)
        {
            return Refuse(reactor, path, problems);
        }

        var record = book.Enter(reactor, open?.BatchId ?? reactorOptions.BatchId, user is null ? entry! : entry! with { Operator = user });
        SampleLog.Entered(logger, reactor, record.Id, record.Kind, record.SampledAt, record.Outcome);
        return (record, []);
    }

    private (SampleRecord?, IReadOnlyList<string>) Refuse(string reactor, string path, IReadOnlyList<string> problems)
    {
        book.CountRejected(reactor);
        SampleLog.Refused(logger, reactor, path, string.Join(" | ", problems));
        return (null, problems);
    }
}
