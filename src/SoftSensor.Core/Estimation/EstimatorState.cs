namespace SoftSensor.Core.Estimation;

/// <summary>
/// Everything the estimator carries from one cycle to the next: integrated biomass, volume,
/// filters, substrate, and the ring buffer of past cycles for late offline samples. It must
/// survive a restart (<see cref="EstimatorStateCodec"/>); the cycle mutates it in place.
/// </summary>
public sealed class EstimatorState
{
    /// <summary>Creates the state of a batch that has not run a cycle yet.</summary>
    public EstimatorState(int historyCapacity)
    {
        History = new CycleHistory(historyCapacity);
        MuSmoothedPerH = double.NaN;
        RemovedTotalL = double.NaN;
        TicMmolPerL = double.NaN;
    }

    /// <summary>The batch's stated initial culture, used at the first cycle; null for the configured defaults.</summary>
    public BatchInitialConditions? Initial { get; set; }

    /// <summary>False until the first cycle set the initial culture.</summary>
    public bool Initialised { get; set; }

    /// <summary>Time of the last cycle, UTC ticks.</summary>
    public long TimeTicks { get; set; }

    /// <summary>Cycles run.</summary>
    public long Cycles { get; set; }

    /// <summary>Liquid volume after the last cycle, L.</summary>
    public double VolumeL { get; set; }

    /// <summary>Last reading of the removed-volume totaliser, L (NaN before the first).</summary>
    public double RemovedTotalL { get; set; }

    /// <summary>Broth removed since the last cycle and announced by the caller (a harvest), L.</summary>
    public double PendingRemovalL { get; set; }

    /// <summary>Both observers' states after the last cycle.</summary>
    public ObserverStates Observers { get; set; }

    /// <summary>Smoothed specific growth rate, 1/h (NaN before the first rate).</summary>
    public double MuSmoothedPerH { get; set; }

    /// <summary>Residual substrate in the vessel, g.</summary>
    public double SubstrateG { get; set; }

    /// <summary>Substrate fed since the start, g.</summary>
    public double SubstrateFedG { get; set; }

    /// <summary>Filtered total inorganic carbon of the broth after the last cycle, mmol/L (NaN when the CER correction is off or has no inputs).</summary>
    public double TicMmolPerL { get; set; }

    /// <summary>Offline samples applied.</summary>
    public long OfflineSamplesApplied { get; set; }

    /// <summary>The pathway stage's energy parameters (docs/pathway.md §2).</summary>
    public Flux.PathwayState Pathway { get; } = new();

    /// <summary>The last cycles (for late offline samples).</summary>
    public CycleHistory History { get; }

    /// <summary>Announces broth removed outside the removed-volume totaliser (a harvest), L; taken out at the next cycle.</summary>
    public void RegisterRemoval(double volumeL)
    {
        if (double.IsFinite(volumeL) && volumeL > 0)
        {
            PendingRemovalL += volumeL;
        }
    }
}
