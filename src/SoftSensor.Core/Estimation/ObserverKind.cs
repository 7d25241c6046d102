namespace SoftSensor.Core.Estimation;

/// <summary>Which observer gives the published biomass (both run every cycle; the other is reported beside it).</summary>
public enum ObserverKind
{
    /// <summary>Integration of the reconciled biomass rate with a Kalman update from offline samples (docs/methods.md §4).</summary>
    BalanceIntegrator = 0,

    /// <summary>Extended Kalman filter on [X·V, mu] with Pirt's law for OUR as measurement model (Jenzsch et al. 2006, J. Biotechnol.; from memory).</summary>
    PirtEkf = 1,
}
