using System.Threading.Channels;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sources;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>The tasks of a pipeline: the cycle loop (on the period, or on the trigger tag) and the sources.</summary>
internal sealed partial class ReactorPipeline
{
    private async Task CycleLoopAsync(CancellationToken cancellationToken)
    {
        _frameClock.StartGrid(_services.Time.GetUtcNow());
        using var timer = new PeriodicTimer(_options.CyclePeriod, _services.Time);
        while (true)
        {
            _waitingForTick = true;
            bool ticked = await timer.WaitForNextTickAsync(cancellationToken);
            _waitingForTick = false;
            if (!ticked)
            {
                return;
            }

            await RunCycleAsync(cancellationToken);
        }
    }

    private async Task TriggeredLoopAsync(ChannelReader<bool> trigger, CancellationToken cancellationToken)
    {
        while (true)
        {
            using (var wait = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken))
            {
                var arrived = trigger.WaitToReadAsync(wait.Token).AsTask();
                var fallback = Task.Delay(_options.CyclePeriod, _services.Time, wait.Token);
                _waitingForTick = true;
                await Task.WhenAny(arrived, fallback);
                _waitingForTick = false;
                await wait.CancelAsync();
            }

            cancellationToken.ThrowIfCancellationRequested();
            trigger.TryRead(out _);
            await RunCycleAsync(cancellationToken);
        }
    }

    private async Task RunSourceAsync(ISampleSource source, CancellationToken cancellationToken)
    {
        try
        {
            await source.RunAsync(this, cancellationToken);
        }
        catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
        {
            // Normal stop.
        }
        catch (Exception e)
        {
            // A source owns its reconnect loop; one that still fails is logged, and its inputs go stale
            // (the estimates turn Bad) instead of the whole daemon stopping.
            PipelineLog.SourceFailed(_services.Logger, e, Reactor, source.Name);
        }
    }
}
