using SoftSensor.Core.Estimation;
using SoftSensor.Core.Gas;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Replay;

/// <summary>
/// Writes DIR/estimates.csv, one row per cycle: time, rates, consistency, growth rate, biomass
/// (both observers), specific rates, substrate, feed advisory, quality. Header names are the
/// estimate ids (<see cref="EstimateNames"/>) with their unit in the README's replay section.
/// </summary>
internal sealed class EstimatesCsvWriter : IDisposable
{
    /// <summary>The header, in column order.</summary>
    public static readonly string[] Columns =
    [
        "time", EstimateNames.Our, "our_sigma", EstimateNames.Cer, "cer_sigma", EstimateNames.Rq, "rq_sigma",
        EstimateNames.ConsistencyH, EstimateNames.ConsistencyCritical, "inconsistent", "suspect",
        EstimateNames.MuPerH, EstimateNames.MuRawPerH, EstimateNames.MuEkfPerH,
        EstimateNames.BiomassGPerL, EstimateNames.BiomassSigmaGPerL, EstimateNames.BiomassIntegratorGPerL, EstimateNames.BiomassEkfGPerL,
        EstimateNames.BiomassG, EstimateNames.LiquidVolumeL, "volume_source",
        EstimateNames.QO2, EstimateNames.QCo2, EstimateNames.QSubstrate, EstimateNames.SubstrateGPerL,
        EstimateNames.FeedAdvisoryLPerH, EstimateNames.FeedSetpointLPerH, EstimateNames.FeedCapLPerH, EstimateNames.FeedOverflowCapLPerH,
        "feed_limit", EstimateNames.OtrMax, EstimateNames.Kla, "growth_source", "quality", "status_code",
        "ctr", "cer_correction",
    ];

    private readonly TextWriter _writer;
    private readonly CsvRowBuilder _row = new();

    public EstimatesCsvWriter(TextWriter writer)
    {
        _writer = writer;
        _writer.Write(string.Join(',', Columns));
        _writer.Write('\n');
    }

    /// <summary>Appends the row of one cycle.</summary>
    public void Write(CycleOutputs o)
    {
        var r = o.Rates;
        var f = o.Feed;
        var b = _row;
        b.Clear();
        b.Time(o.Time);
        b.Next().Number(r.OurMmolPerLh, 4).Next().Number(r.OurSigmaMmolPerLh, 4);
        b.Next().Number(r.CerMmolPerLh, 4).Next().Number(r.CerSigmaMmolPerLh, 4);
        b.Next().Number(r.Rq, 5).Next().Number(r.RqSigma, 5);
        b.Next().Number(r.H, 4).Next().Number(r.HCritical, 4).Next().Text(r.Inconsistent ? "1" : "0").Next().Text(r.Suspect ?? string.Empty);
        b.Next().Number(o.MuPerH, 6).Next().Number(o.MuRawPerH, 6).Next().Number(o.EkfMuPerH, 6);
        b.Next().Number(o.BiomassGPerL, 6).Next().Number(o.BiomassSigmaGPerL, 6).Next().Number(o.IntegratorBiomassGPerL, 6).Next().Number(o.EkfBiomassGPerL, 6);
        b.Next().Number(o.BiomassGPerL * o.VolumeL, 4).Next().Number(o.VolumeL, 5).Next().Text(VolumeSourceText(o.VolumeSource));
        b.Next().Number(o.QO2MmolPerGh, 5).Next().Number(o.QCo2MmolPerGh, 5).Next().Number(o.QSubstrateGPerGh, 6).Next().Number(o.SubstrateGPerL, 5);
        b.Next().Number(f.AdvisedLPerH, 5).Next().Number(f.SetpointLPerH, 5).Next().Number(f.OxygenCapLPerH, 5).Next().Number(f.OverflowCapLPerH, 5);
        b.Next().Text(FeedLimitText(f.Limit)).Next().Number(f.OxygenTransferCapacityMmolPerLh, 3).Next().Number(f.KlaPerH, 3);
        b.Next().Text(GrowthSourceText(r.GrowthSource)).Next().Text(QualityText(o.Quality)).Next().Number(o.BiomassStatusCode, 0);
        b.Next().Number(r.CtrMmolPerLh, 4).Next().Text(r.CerCorrection == CerCorrection.DissolvedInorganicCarbon ? "dissolved-inorganic-carbon" : "none");
        _writer.Write(b.Row);
        _writer.Write('\n');
    }

    public void Dispose() => _writer.Flush();

    internal static string QualityText(SampleQuality q) => q switch
    {
        SampleQuality.Good => "good",
        SampleQuality.Uncertain => "uncertain",
        _ => "bad",
    };

    private static string VolumeSourceText(VolumeSource s) => s switch
    {
        VolumeSource.Measured => "measured",
        VolumeSource.Weight => "weight",
        _ => "integrated",
    };

    private static string FeedLimitText(FeedLimit l) => l switch
    {
        FeedLimit.Setpoint => "setpoint",
        FeedLimit.OxygenTransfer => "oxygen-transfer",
        FeedLimit.Overflow => "overflow",
        _ => "none",
    };

    private static string GrowthSourceText(GrowthSource g) => g switch
    {
        GrowthSource.ElementalBalance => "elemental-balance",
        GrowthSource.FluxModel => "flux-model",
        _ => "coasting",
    };
}
