using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>Which measurement (kind of estimate) each estimate goes to in the time-series database.</summary>
internal static class EstimateKinds
{
    public const string Gas = "gas";
    public const string Growth = "growth";
    public const string Balance = "balance";
    public const string Feed = "feed";
    public const string Other = "estimate";

    /// <summary>The kind of an estimate by its id; ids not listed go to <see cref="Other"/>.</summary>
    public static string Of(string estimateName) => estimateName switch
    {
        EstimateNames.Our or EstimateNames.Cer or EstimateNames.Rq or EstimateNames.OutletFlow or EstimateNames.Kla => Gas,
        EstimateNames.MuPerH or EstimateNames.MuRawPerH or EstimateNames.BiomassGPerL or EstimateNames.BiomassG
            or EstimateNames.LiquidVolumeL => Growth,
        EstimateNames.ConsistencyH or EstimateNames.ConsistencyCritical => Balance,
        EstimateNames.FeedAdvisoryLPerH or EstimateNames.FeedCapLPerH => Feed,
        _ when estimateName.StartsWith("feed_", StringComparison.Ordinal) => Feed,
        _ => Other,
    };
}
