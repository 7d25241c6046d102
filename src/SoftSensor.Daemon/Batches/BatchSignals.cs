using System.Globalization;
using Microsoft.Extensions.Logging;
using SoftSensor.Core.Batches;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Batches;

/// <summary>
/// The batch lifecycle from the plant for one reactor: the batch-id tag (a change ends the open batch
/// and starts the new one, with the initial conditions of <see cref="ReactorBatchOptions"/>), the phase
/// tag (a numeric code mapped by <c>batches:phaseCodes</c>) and the fed-batch start detected from the
/// feed (<see cref="FeedStartDetector"/>). Threading: <see cref="Accept"/> from the sources' threads,
/// <see cref="Apply"/> from the cycle task; a lock keeps the latest readings.
/// </summary>
internal sealed class BatchSignals
{
    private readonly ReactorOptions _reactor;
    private readonly string? _idTag;
    private readonly string? _phaseTag;
    private readonly FeedStartDetector? _feed;
    private readonly Lock _gate = new();
    private string? _latestId;
    private string? _latestCode;
    private string? _appliedId;
    private string? _appliedCode;
    private string? _batch;

    public BatchSignals(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings)
    {
        _reactor = reactor;
        _idTag = bindings.FirstOrDefault(b => b.Role == SignalRole.BatchId)?.Tag;
        _phaseTag = bindings.FirstOrDefault(b => b.Role == SignalRole.BatchPhaseCode)?.Tag;
        if (!double.IsNaN(reactor.Batches.FedBatchFeedAboveLPerH))
        {
            _feed = new FeedStartDetector(reactor.Batches.FedBatchFeedAboveLPerH, reactor.Batches.FedBatchHold);
        }
    }

    /// <summary>True for a sample of the batch-id or phase tag (it does not enter the cycle).</summary>
    public bool Handles(string tag) => tag == _idTag || tag == _phaseTag;

    /// <summary>Keeps the latest good reading of a batch tag; false for a bad or empty one.</summary>
    public bool Accept(in Sample sample)
    {
        if (sample.Quality == SampleQuality.Bad)
        {
            return false;
        }

        string? text = sample.Text ?? (double.IsFinite(sample.Value) ? Integer(sample.Value) : null);
        if (string.IsNullOrWhiteSpace(text))
        {
            return false;
        }

        lock (_gate)
        {
            if (sample.Tag == _idTag)
            {
                _latestId = text.Trim();
            }
            else
            {
                _latestCode = text.Trim();
            }
        }

        return true;
    }

    /// <summary>Applies the latest readings and the feed to the book at cycle time <paramref name="now"/> (after alignment).</summary>
    public void Apply(DateTimeOffset now, AlignedInputs inputs, BatchBook book, ILogger log)
    {
        string? id, code;
        lock (_gate)
        {
            (id, code) = (_latestId, _latestCode);
        }

        if (id is not null && id != _appliedId)
        {
            _appliedId = id;
            FollowBatchTag(id, inputs, book, log);
        }

        var open = book.Current(_reactor.Id);
        if (open?.BatchId != _batch)
        {
            // Another batch: its phase comes from the phase tag afresh, and the feed hold starts over.
            _batch = open?.BatchId;
            _appliedCode = null;
            _feed?.Reset();
        }

        if (open is null)
        {
            return;
        }

        if (code is not null && code != _appliedCode)
        {
            _appliedCode = code;
            if (!_reactor.Batches.PhaseCodes.TryGetValue(code, out var phase))
            {
                BatchLog.UnknownPhaseCode(log, _reactor.Id, _phaseTag!, code, string.Join(", ", _reactor.Batches.PhaseCodes.Keys));
            }
            else if (phase != open.Phase)
            {
                Set(book, phase, "tag", log);
                open = book.Current(_reactor.Id)!;
            }
        }

        if (_feed is not null && open.Phase == BatchPhases.Id(BatchPhase.Batch)
            && _feed.Update(now, inputs[SignalRole.FeedRateLPerH], inputs.Has(SignalRole.FeedRateLPerH) ? inputs.QualityOf(SignalRole.FeedRateLPerH) : SampleQuality.Bad))
        {
            Set(book, BatchPhases.Id(BatchPhase.FedBatch), "feed", log);
        }
    }

    private void Set(BatchBook book, string phase, string source, ILogger log)
    {
        var (run, _) = book.SetPhase(_reactor.Id, phase, source);
        if (run is not null)
        {
            BatchLog.PhaseChanged(log, _reactor.Id, run.BatchId, run.Phase, source);
        }
    }

    private void FollowBatchTag(string id, AlignedInputs inputs, BatchBook book, ILogger log)
    {
        var open = book.Current(_reactor.Id);
        if (open?.BatchId == id)
        {
            return; // a restart, or the operator started the same id first
        }

        if (open is not null)
        {
            book.End(_reactor.Id);
            BatchLog.BatchFromTag(log, _reactor.Id, _idTag!, id, $"{open.BatchId} ended");
        }

        var e = _reactor.Estimator;
        var start = new BatchStart(id, InitialVolume(inputs), e.InitialBiomassGPerL, e.InitialBiomassSigmaGPerL, e.InitialSubstrateGPerL) { Source = "tag" };
        var (run, problems) = book.Start(_reactor.Id, start);
        if (run is null)
        {
            BatchLog.BatchFromTagRefused(log, _reactor.Id, _idTag!, id, string.Join("; ", problems));
        }
        else
        {
            BatchLog.BatchFromTag(log, _reactor.Id, _idTag!, id, string.Create(CultureInfo.InvariantCulture, $"{id} started with {start.InitialVolumeL:G6} L"));
        }
    }

    /// <summary>The volume or weight reading at this cycle when configured and usable, else the estimator's initial volume.</summary>
    private double InitialVolume(AlignedInputs inputs)
    {
        if (_reactor.Batches.InitialVolumeFromTag)
        {
            if (Usable(inputs, SignalRole.LiquidVolumeL, out double v))
            {
                return v;
            }

            if (Usable(inputs, SignalRole.WeightKg, out double w))
            {
                return w / _reactor.Estimator.BrothDensityKgPerL;
            }
        }

        return _reactor.Estimator.InitialVolumeL;
    }

    private static bool Usable(AlignedInputs inputs, SignalRole role, out double value)
    {
        value = inputs[role];
        return inputs.Has(role) && inputs.QualityOf(role) != SampleQuality.Bad && double.IsFinite(value) && value > 0;
    }

    private static string Integer(double v) =>
        Math.Abs(v - Math.Round(v)) < 1e-9 && Math.Abs(v) < 1e15 ? Math.Round(v).ToString("F0", CultureInfo.InvariantCulture) : v.ToString("R", CultureInfo.InvariantCulture);
}
