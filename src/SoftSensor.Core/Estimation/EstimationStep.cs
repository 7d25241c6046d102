using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Estimation;

/// <summary>
/// From rates to states (docs/methods.md §4), the last part of the cycle: volume and removals,
/// both biomass observers, mu raw and smoothed, specific rates, substrate accumulation and the
/// feed advisory. Mutates the state, overwrites the outputs, allocates nothing.
/// </summary>
public static class EstimationStep
{
    private const uint UncertainStatus = 0x40000000;
    private const uint UncertainLastUsableValue = 0x40900000; // OPC UA Part 8 §7.3.2
    private const uint BadWaitingForInitialData = 0x80320000;

    /// <summary>Runs the step for one cycle at <see cref="AlignedInputs.Time"/> (volume found here).</summary>
    public static void Run(AlignedInputs inputs, in BalanceRates rates, EstimatorState state, EstimatorSettings settings, CycleOutputs o) =>
        Run(inputs, VolumeStep.Begin(inputs, state, settings), rates, state, settings, o);

    /// <summary>Runs the step for one cycle whose volume step the caller already took.</summary>
    public static void Run(AlignedInputs inputs, in VolumeStep volume, in BalanceRates rates, EstimatorState state, EstimatorSettings settings, CycleOutputs o)
    {
        long t = inputs.Time.UtcTicks;
        double dtH = volume.DtH;
        double removed = volume.RemovedL;
        double v = volume.VolumeL;
        var volumeSource = volume.Source;
        double removedFraction = removed > 0 ? Math.Min(removed / (v + removed), 0.999) : 0.0;

        // Growth in g/(L·h): C-mmol/(L·h) × g/C-mol (ash included) / 1000.
        double gramsPerCmmol = settings.BiomassWithAshGPerCMol / 1000.0;
        bool coasting = rates.GrowthSource == GrowthSource.None || !double.IsFinite(rates.GrowthCmmolPerLh);
        double growth, growthSigma;
        var prev = state.Observers;
        if (!coasting)
        {
            growth = rates.GrowthCmmolPerLh * gramsPerCmmol;
            growthSigma = double.IsFinite(rates.GrowthSigmaCmmolPerLh) ? rates.GrowthSigmaCmmolPerLh * gramsPerCmmol : 0.0;
        }
        else
        {
            double mu = double.IsFinite(state.MuSmoothedPerH) ? state.MuSmoothedPerH : 0.0;
            growth = mu * Selected(prev, settings) / state.VolumeL;
            growthSigma = Math.Abs(growth);
        }

        double our = rates.OurMmolPerLh;
        var u = new ObserverInputs
        {
            DtH = dtH,
            GrowthGPerLh = growth,
            GrowthSigmaGPerLh = growthSigma,
            VolumeL = v,
            RemovedFraction = removedFraction,
            OurMmolPerLh = rates.GasQuality == SampleQuality.Bad ? double.NaN : our,
            OurSigmaMmolPerLh = Math.Max(double.IsFinite(rates.OurSigmaMmolPerLh) ? rates.OurSigmaMmolPerLh : 0.0, settings.EkfOurSigmaFloorMmolPerLh),
        };

        var s = prev;
        BiomassIntegrator.Advance(ref s, u, settings);
        PirtEkf.Advance(ref s, u, settings);
        state.Observers = s;
        state.History.Push(new HistoryEntry { TimeTicks = t, Inputs = u, States = s });

        double xv = Selected(s, settings);
        double x = xv / v;
        double muRaw = GrowthRateSmoother.RawMuPerH(coasting ? double.NaN : growth, x);
        state.MuSmoothedPerH = GrowthRateSmoother.Smooth(state.MuSmoothedPerH, muRaw, dtH, settings.MuSmoothingTimeConstantH);

        state.SubstrateG = SubstrateAccumulation.Advance(state.SubstrateG, removedFraction, inputs[SignalRole.FeedRateLPerH],
            settings.FeedSubstrateGPerL, rates.SubstrateCmmolPerLh, v, settings.SubstrateGPerCMol, dtH);
        state.SubstrateFedG += VolumeTracker.PositiveOrZero(inputs, SignalRole.FeedRateLPerH) * settings.FeedSubstrateGPerL * dtH;
        state.VolumeL = v;
        state.TimeTicks = t;
        state.Cycles++;

        o.Time = inputs.Time;
        o.Rates = rates;
        o.VolumeL = v;
        o.VolumeSource = volumeSource;
        o.IntegratorBiomassGPerL = s.BiomassG / v;
        o.EkfBiomassGPerL = s.EkfBiomassG / v;
        o.BiomassGPerL = x;
        double variance = settings.Observer == ObserverKind.PirtEkf ? s.EkfP00 : s.BiomassVarG2;
        o.BiomassSigmaGPerL = Math.Sqrt(Math.Max(variance, 0.0)) / v;
        o.MuRawPerH = muRaw;
        o.EkfMuPerH = s.EkfMuPerH;
        o.MuPerH = settings.Observer == ObserverKind.PirtEkf ? s.EkfMuPerH : state.MuSmoothedPerH;
        o.QO2MmolPerGh = x > 0 ? our / x : double.NaN;
        o.QCo2MmolPerGh = x > 0 ? rates.CerMmolPerLh / x : double.NaN;
        o.QSubstrateGPerGh = x > 0 ? -rates.SubstrateCmmolPerLh * settings.SubstrateGPerCMol / 1000.0 / x : double.NaN;
        o.SubstrateGPerL = state.SubstrateG / v;
        o.Feed = FeedAdvisory.Compute(xv, v, u.OurMmolPerLh, inputs[SignalRole.DissolvedOxygenPercent], settings);

        var quality = coasting ? SampleQuality.Uncertain : rates.GrowthQuality;
        o.BiomassQuality = quality;
        o.BiomassStatusCode = quality switch
        {
            SampleQuality.Good => 0u,
            SampleQuality.Uncertain => coasting ? UncertainLastUsableValue : UncertainStatus,
            _ => BadWaitingForInitialData,
        };
        o.Quality = SampleQualities.Worst(SampleQualities.Worst(quality, rates.GasQuality), rates.GrowthQuality);
    }

    private static double Selected(in ObserverStates s, EstimatorSettings settings) =>
        settings.Observer == ObserverKind.PirtEkf ? s.EkfBiomassG : s.BiomassG;

    internal static void Initialise(AlignedInputs inputs, long t, EstimatorState state, EstimatorSettings settings)
    {
        var initial = state.Initial ?? BatchInitialConditions.From(settings);
        double v = VolumeTracker.Current(inputs, initial.VolumeL, 0, 0, settings, out _);
        double xv = initial.BiomassGPerL * v;
        double sigma = initial.BiomassSigmaGPerL * v;
        state.VolumeL = v;
        state.TimeTicks = t;
        state.SubstrateG = initial.SubstrateGPerL * v;
        state.Observers = new ObserverStates
        {
            BiomassG = xv,
            BiomassVarG2 = sigma * sigma,
            EkfBiomassG = xv,
            EkfMuPerH = settings.EkfInitialMuPerH,
            EkfP00 = sigma * sigma,
            EkfP01 = 0,
            EkfP11 = settings.EkfInitialMuSigmaPerH * settings.EkfInitialMuSigmaPerH,
        };
        state.Initialised = true;
    }
}
