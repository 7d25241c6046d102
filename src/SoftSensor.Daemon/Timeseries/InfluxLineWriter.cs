using InfluxDB.Client;
using InfluxDB.Client.Api.Domain;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>
/// The InfluxDB v2 write API through InfluxDB.Client 5.1.0: one awaited <c>WriteApiAsync</c> call
/// per batch, millisecond precision. WriteApiAsync throws on failure; that becomes a
/// <see cref="WriteOutcome"/> here (the client's own batching <c>WriteApi</c> is not used: it keeps
/// nothing on disk, docs/daemon.md). The token goes to the client only, never to a log.
/// </summary>
internal sealed class InfluxLineWriter : ITimeseriesWriter, IDisposable
{
    private readonly InfluxDBClient _client;
    private readonly WriteApiAsync _write;
    private readonly string _org;
    private readonly string _bucket;

    public InfluxLineWriter(TimeseriesOptions options, string token)
    {
        var builder = InfluxDBClientOptions.Builder.CreateNew()
            .Url(options.Url)
            .Org(options.Org)
            .Bucket(options.Bucket)
            .TimeOut(TimeSpan.FromSeconds(options.TimeoutSeconds))
            .LogLevel(InfluxDB.Client.Core.LogLevel.None);
        if (!string.IsNullOrEmpty(token))
        {
            builder = builder.AuthenticateToken(token);
        }

        _client = new InfluxDBClient(builder.Build());
        _write = _client.GetWriteApiAsync();
        _org = options.Org;
        _bucket = options.Bucket;
    }

    public async ValueTask<WriteOutcome> WriteAsync(IReadOnlyList<string> lines, CancellationToken cancellationToken)
    {
        try
        {
            await _write.WriteRecordsAsync(lines, WritePrecision.Ms, _bucket, _org, cancellationToken);
            return WriteOutcome.Ok;
        }
        catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
        {
            throw;
        }
#pragma warning disable CA1031 // every failure of the network or the database is an everyday outcome for the outbox
        catch (Exception e)
#pragma warning restore CA1031
        {
            return WriteOutcome.Failed(e.GetType().Name + ": " + e.Message);
        }
    }

    public void Dispose() => _client.Dispose();
}
