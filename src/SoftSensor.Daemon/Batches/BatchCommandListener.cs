using System.Buffers;
using System.Text.Json;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Mqtt;

namespace SoftSensor.Daemon.Batches;

/// <summary>
/// Batch commands from MQTT: one topic per reactor, <c>{prefix}/{site}/{area}/{reactor}/command/batch</c>,
/// JSON <c>{"command": "start", "batchId": ..., "initialVolumeL": ..., "inoculumBiomassGPerL": ...,
/// "inoculumBiomassSigmaGPerL": ..., "initialSubstrateGPerL": ...}</c>, <c>{"command": "phase", "phase": "induced"}</c>
/// or <c>{"command": "end"}</c>.
/// The outcome goes to <c>.../command/batch/result</c> (not retained): the batch, or every problem.
/// </summary>
internal sealed class BatchCommandListener(MqttLink link, BatchBook book, IOptions<SoftSensorOptions> options, Microsoft.Extensions.Logging.ILogger<BatchCommandListener> logger) : IHostedService
{
    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);

    public static string CommandTopic(SoftSensorOptions o, string reactor) => $"{o.Mqtt.TopicPrefix}/{o.Site}/{o.Area}/{reactor}/command/batch";

    public Task StartAsync(CancellationToken cancellationToken)
    {
        foreach (var reactor in options.Value.Reactors)
        {
            link.Subscribe(CommandTopic(options.Value, reactor.Id), (t, payload) => HandleAsync(reactor.Id, t, payload));
        }

        return Task.CompletedTask;
    }

    public Task StopAsync(CancellationToken cancellationToken)
    {
        foreach (var reactor in options.Value.Reactors)
        {
            link.Unsubscribe(CommandTopic(options.Value, reactor.Id));
        }

        return Task.CompletedTask;
    }

    private async ValueTask HandleAsync(string reactor, string topic, ReadOnlySequence<byte> payload)
    {
        if (!CommandPayloadLimit.Allows(logger, topic, payload.Length))
        {
            return;
        }

        var reply = Apply(reactor, payload.ToArray());
        await link.PublishAsync(topic + "/result", JsonSerializer.SerializeToUtf8Bytes(reply, Json), retain: false, CancellationToken.None);
    }

    /// <summary>The command in a payload, or why it is none (pure; never throws).</summary>
    public static (BatchCommand? Command, string? Problem) Parse(ReadOnlySpan<byte> payload)
    {
        try
        {
            var command = JsonSerializer.Deserialize<BatchCommand>(payload, Json);
            return command?.Command is "start" or "end" or "phase" ? (command, null)
                : (null, $"command is '{command?.Command}' (expected start, phase or end)");
        }
        catch (JsonException e)
        {
            return (null, $"payload is not a batch command: {e.Message}");
        }
    }

    private BatchCommandReply Apply(string reactor, byte[] payload)
    {
        var (command, parseProblem) = Parse(payload);
        if (command is null)
        {
            return new BatchCommandReply(false, null, [parseProblem!]);
        }

        switch (command?.Command)
        {
            case "start":
                var (run, problems) = book.Start(reactor, new BatchStart(command.BatchId ?? "", command.InitialVolumeL, command.InoculumBiomassGPerL,
                    command.InoculumBiomassSigmaGPerL, command.InitialSubstrateGPerL));
                return new BatchCommandReply(run is not null, run, problems);
            case "end":
                var (ended, problem) = book.End(reactor);
                return new BatchCommandReply(ended is not null, ended, problem is null ? [] : [problem]);
            case "phase":
                var (changed, refusal) = book.SetPhase(reactor, command.Phase, "operator");
                return new BatchCommandReply(changed is not null, changed, refusal is null ? [] : [refusal]);
            default:
                return new BatchCommandReply(false, null, [$"command is '{command?.Command}' (expected start, phase or end)"]);
        }
    }
}

/// <summary>A batch command as sent on the command topic.</summary>
internal sealed record BatchCommand(string? Command, string? BatchId, double InitialVolumeL, double InoculumBiomassGPerL, double InoculumBiomassSigmaGPerL, double InitialSubstrateGPerL, string? Phase = null);

/// <summary>The answer on the result topic.</summary>
internal sealed record BatchCommandReply(bool Applied, BatchRun? Batch, IReadOnlyList<string> Problems);
