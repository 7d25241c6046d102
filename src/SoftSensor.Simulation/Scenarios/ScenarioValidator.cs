using SoftSensor.Core.Chemistry;

namespace SoftSensor.Simulation.Scenarios;

/// <summary>Checks a scenario's values; each failure names the key, the value and what was expected.</summary>
internal static class ScenarioValidator
{
    private static readonly string[] FaultKinds = ["analyser_offset", "analyser_drift", "feed_signal_frozen", "aeration_trip"];

    public static List<string> Validate(Scenario s)
    {
        var e = new List<string>();
        Positive(e, "duration_h", s.DurationH);
        if (s.IntegrationStepS is < 1 or > 10)
        {
            e.Add($"key 'integration_step_s' is {s.IntegrationStepS}: expected a whole number of seconds from 1 to 10");
        }
        else if (s.OutputIntervalS < s.IntegrationStepS || s.OutputIntervalS % s.IntegrationStepS != 0)
        {
            e.Add($"key 'output_interval_s' is {s.OutputIntervalS}: expected a whole multiple of integration_step_s ({s.IntegrationStepS})");
        }

        if (string.IsNullOrWhiteSpace(s.TagPrefix))
        {
            e.Add("key 'tag_prefix' is empty: expected a tag prefix such as R1");
        }

        var v = s.Vessel;
        Positive(e, "vessel.total_volume_l", v.TotalVolumeL);
        Positive(e, "vessel.initial_volume_l", v.InitialVolumeL);
        if (v.InitialVolumeL >= 0.95 * v.TotalVolumeL)
        {
            e.Add($"key 'vessel.initial_volume_l' is {v.InitialVolumeL}: expected below 95 % of vessel.total_volume_l ({v.TotalVolumeL}) to leave a headspace");
        }

        Range(e, "vessel.broth_density_kg_per_l", v.BrothDensityKgPerL, 0.9, 1.3);
        Range(e, "vessel.temperature_c", v.TemperatureC, 5, 70);
        Range(e, "vessel.pressure_kpa", v.PressureKPa, 50, 500);
        Range(e, "vessel.ph", v.Ph, 2, 10);
        if (v.CondenserTemperatureC is { } tc)
        {
            Range(e, "vessel.condenser_temperature_c", tc, 0, v.TemperatureC);
        }

        NonNegative(e, "initial.biomass_g_per_l", s.Initial.BiomassGPerL);
        NonNegative(e, "initial.substrate_g_per_l", s.Initial.SubstrateGPerL);
        NonNegative(e, "initial.product_g_per_l", s.Initial.ProductGPerL);
        Range(e, "initial.dissolved_oxygen_percent", s.Initial.DissolvedOxygenPercent, 0, 200);
        ValidateCulture(e, s.Culture);
        ValidateFeed(e, s.Feed);
        Positive(e, "base.concentration_mol_per_l", s.Base.ConcentrationMolPerL);
        ValidateGas(e, s.Gas);
        ValidateTransfer(e, s.Transfer);
        ValidateInstruments(e, s.Instruments);
        ValidateFaults(e, s);
        ValidateSamples(e, s);
        if (s.Jacket is { } j)
        {
            Positive(e, "jacket.coolant_flow_l_per_h", j.CoolantFlowLPerH);
            Range(e, "jacket.coolant_inlet_c", j.CoolantInletC, 0, s.Vessel.TemperatureC);
            NonNegative(e, "jacket.stirrer_power_w", j.StirrerPowerW);
            NonNegative(e, "jacket.loss_w_per_k", j.LossWPerK);
            Positive(e, "jacket.biomass_kj_per_electron_mol", j.BiomassKjPerElectronMol);
            NonNegative(e, "jacket.temperature_noise_c", j.TemperatureNoiseC);
            NonNegative(e, "jacket.flow_gain_sd", j.FlowGainSd);
            NonNegative(e, "jacket.flow_noise_l_per_h", j.FlowNoiseLPerH);
            NonNegative(e, "jacket.power_noise_w", j.PowerNoiseW);
        }

        return e;
    }

    private static void ValidateCulture(List<string> e, CultureSpec c)
    {
        Organic(e, "culture.substrate.formula", c.Substrate.Formula);
        var x = Organic(e, "culture.biomass.formula", c.Biomass.Formula);
        if (x is not null && x[Element.N] <= 0)
        {
            e.Add($"key 'culture.biomass.formula' is '{c.Biomass.Formula}': expected nitrogen in the biomass");
        }

        Range(e, "culture.biomass.ash_fraction", c.Biomass.AshFraction, 0, 0.3);
        Positive(e, "culture.mu_max_per_h", c.MuMaxPerH);
        Positive(e, "culture.ks_g_per_l", c.KsGPerL);
        Range(e, "culture.yield_g_per_g", c.YieldGPerG, 0.01, 1.2);
        NonNegative(e, "culture.maintenance_g_per_g_h", c.MaintenanceGPerGH);
        Positive(e, "culture.oxygen_ks_mmol_per_l", c.OxygenKsMmolPerL);
        if (c.Byproduct is { } b)
        {
            Organic(e, "culture.byproduct.formula", b.Formula);
            Range(e, "culture.byproduct.carbon_fraction", b.CarbonFraction, 0, 0.5);
            Name(e, "culture.byproduct.name", b.Name);
        }

        if (c.Overflow is { } o)
        {
            Organic(e, "culture.overflow.formula", o.Formula);
            Name(e, "culture.overflow.name", o.Name);
            Positive(e, "culture.overflow.critical_qs_g_per_g_h", o.CriticalQsGPerGH);
            Range(e, "culture.overflow.fermentative_yield_g_per_g", o.FermentativeYieldGPerG, 0, 0.5);
            NonNegative(e, "culture.overflow.reuptake_max_g_per_g_h", o.ReuptakeMaxGPerGH);
            Positive(e, "culture.overflow.reuptake_ks_g_per_l", o.ReuptakeKsGPerL);
            Range(e, "culture.overflow.reuptake_yield_g_per_g", o.ReuptakeYieldGPerG, 0, 1.2);
            if (c.Byproduct is { } b2 && string.Equals(b2.Name, o.Name, StringComparison.Ordinal))
            {
                e.Add($"key 'culture.overflow.name' is '{o.Name}': expected a name different from culture.byproduct.name");
            }
        }

        if (c.Energetics is { } en)
        {
            Range(e, "culture.energetics.po_ratio", en.PoRatio, 0.3, 3.5);
            Range(e, "culture.energetics.atp_per_biomass_cmol", en.AtpPerBiomassCmol, 0.5, 10);
            NonNegative(e, "culture.energetics.maintenance_atp_mmol_per_g_h", en.MaintenanceAtpMmolPerGH);
            Range(e, "culture.energetics.substrate_level_atp_per_cmol", en.SubstrateLevelAtpPerCmol, 0, 2);
            Range(e, "culture.energetics.anabolic_co2_per_biomass_cmol", en.AnabolicCo2PerBiomassCmol, 0, 1);
            for (int i = 0; i < en.PoSteps.Count; i++)
            {
                NonNegative(e, $"culture.energetics.po_steps[{i}].at_h", en.PoSteps[i].AtH);
                Range(e, $"culture.energetics.po_steps[{i}].po_ratio", en.PoSteps[i].PoRatio, 0.3, 3.5);
            }
        }

        if (e.Count == 0)
        {
            e.AddRange(Kinetics.CultureModel.CheckStoichiometry(c));
        }
    }

    private static void ValidateFeed(List<string> e, FeedSpec f)
    {
        Positive(e, "feed.substrate_g_per_l", f.SubstrateGPerL);
        Positive(e, "feed.max_rate_l_per_h", f.MaxRateLPerH);
        for (int i = 0; i < f.Segments.Count; i++)
        {
            var seg = f.Segments[i];
            NonNegative(e, $"feed.segments[{i}].from_h", seg.FromH);
            NonNegative(e, $"feed.segments[{i}].rate_l_per_h", seg.RateLPerH);
            Range(e, $"feed.segments[{i}].growth_per_h", seg.GrowthPerH, -1, 1);
            if (i > 0 && seg.FromH <= f.Segments[i - 1].FromH)
            {
                e.Add($"key 'feed.segments[{i}].from_h' is {seg.FromH}: expected later than the segment before ({f.Segments[i - 1].FromH})");
            }
        }
    }

    private static void ValidateGas(List<string> e, GasSpec g)
    {
        Range(e, "gas.reference_temperature_c", g.ReferenceTemperatureC, -10, 40);
        Range(e, "gas.reference_pressure_kpa", g.ReferencePressureKPa, 90, 110);
        Range(e, "gas.air_o2_fraction", g.AirO2Fraction, 0.15, 0.25);
        Range(e, "gas.air_co2_fraction", g.AirCo2Fraction, 0, 0.01);
        Flows(e, "gas.air", g.Air);
        Flows(e, "gas.oxygen", g.Oxygen);
        if (g.Air.Count == 0 || g.Air[0].FromH > 0)
        {
            e.Add("key 'gas.air' : expected a first segment with from_h 0 (the vessel is aerated from the start)");
        }
    }

    private static void Flows(List<string> e, string key, IReadOnlyList<FlowSegment> list)
    {
        for (int i = 0; i < list.Count; i++)
        {
            NonNegative(e, $"{key}[{i}].nl_per_min", list[i].NlPerMin);
            if (i > 0 && list[i].FromH <= list[i - 1].FromH)
            {
                e.Add($"key '{key}[{i}].from_h' is {list[i].FromH}: expected later than the segment before ({list[i - 1].FromH})");
            }
        }
    }

    private static void ValidateTransfer(List<string> e, TransferSpec t)
    {
        Positive(e, "transfer.kla_per_h", t.KlaPerH);
        Positive(e, "transfer.kla_reference_flow_nl_per_min", t.KlaReferenceFlowNlPerMin);
        Range(e, "transfer.kla_flow_exponent", t.KlaFlowExponent, 0, 1.5);
        NonNegative(e, "transfer.kla_minimum_per_h", t.KlaMinimumPerH);
        Range(e, "transfer.co2_kla_ratio", t.Co2KlaRatio, 0.1, 2);
        Range(e, "transfer.oxygen_solubility_factor", t.OxygenSolubilityFactor, 0.3, 1.2);
        Range(e, "transfer.pk1_medium_shift", t.Pk1MediumShift, -1, 1);
    }

    private static void ValidateInstruments(List<string> e, InstrumentSpec i)
    {
        Range(e, "instruments.analyser_dead_time_s", i.AnalyserDeadTimeS, 0, 3600);
        foreach (var (key, value) in new[]
                 {
                     ("analyser_o2_noise_percent", i.AnalyserO2NoisePercent), ("analyser_co2_noise_percent", i.AnalyserCo2NoisePercent),
                     ("analyser_o2_offset_sd_percent", i.AnalyserO2OffsetSdPercent), ("analyser_co2_offset_sd_percent", i.AnalyserCo2OffsetSdPercent),
                     ("analyser_gain_sd", i.AnalyserGainSd), ("mfc_gain_sd", i.MfcGainSd), ("mfc_noise_nl_per_min", i.MfcNoiseNlPerMin),
                     ("pump_gain_sd", i.PumpGainSd), ("pump_noise_l_per_h", i.PumpNoiseLPerH), ("pressure_noise_kpa", i.PressureNoiseKPa),
                     ("temperature_noise_c", i.TemperatureNoiseC), ("weight_noise_kg", i.WeightNoiseKg), ("do_noise_percent", i.DoNoisePercent),
                     ("ph_noise", i.PhNoise),
                 })
        {
            NonNegative(e, "instruments." + key, value);
        }
    }

    private static void ValidateFaults(List<string> e, Scenario s)
    {
        for (int i = 0; i < s.Faults.Count; i++)
        {
            var f = s.Faults[i];
            string k = $"faults[{i}]";
            if (Array.IndexOf(FaultKinds, f.Kind) < 0)
            {
                e.Add($"key '{k}.kind' is '{f.Kind}': expected one of {string.Join(", ", FaultKinds)}");
                continue;
            }

            NonNegative(e, k + ".from_h", f.FromH);
            if (!(f.ToH > f.FromH))
            {
                e.Add($"key '{k}.to_h' is {f.ToH}: expected later than from_h ({f.FromH})");
            }

            if (f.Kind.StartsWith("analyser_", StringComparison.Ordinal) && f.Gas is not ("o2" or "co2"))
            {
                e.Add($"key '{k}.gas' is '{f.Gas}': expected o2 or co2");
            }
        }
    }

    private static void ValidateSamples(List<string> e, Scenario s)
    {
        NonNegative(e, "samples.dcw_relative_sd", s.Samples.DcwRelativeSd);
        NonNegative(e, "samples.dcw_absolute_sd_g_per_l", s.Samples.DcwAbsoluteSdGPerL);
        for (int i = 0; i < s.Samples.Plan.Count; i++)
        {
            var p = s.Samples.Plan[i];
            NonNegative(e, $"samples.plan[{i}].at_h", p.AtH);
            Range(e, $"samples.plan[{i}].volume_ml", p.VolumeMl, 0, 0.05 * s.Vessel.InitialVolumeL * 1000);
            if (i > 0 && p.AtH <= s.Samples.Plan[i - 1].AtH)
            {
                e.Add($"key 'samples.plan[{i}].at_h' is {p.AtH}: expected later than the sample before ({s.Samples.Plan[i - 1].AtH})");
            }
        }
    }

    private static Formula? Organic(List<string> e, string key, string text)
    {
        if (!Formula.TryParse(text, out var f, out string? error))
        {
            e.Add($"key '{key}': {error!.Split('\n')[0]}");
            return null;
        }

        if (!f!.IsOrganic)
        {
            e.Add($"key '{key}' is '{text}': expected an organic compound (with carbon)");
            return null;
        }

        return f.PerCMol();
    }

    private static void Name(List<string> e, string key, string value)
    {
        if (string.IsNullOrWhiteSpace(value) || !value.All(ch => char.IsAsciiLetterLower(ch) || char.IsAsciiDigit(ch) || ch == '_'))
        {
            e.Add($"key '{key}' is '{value}': expected a lowercase name of letters, digits and '_' (it becomes a column name)");
        }
    }

    private static void Positive(List<string> e, string key, double v)
    {
        if (!(v > 0) || !double.IsFinite(v))
        {
            e.Add($"key '{key}' is {v}: expected a positive number");
        }
    }

    private static void NonNegative(List<string> e, string key, double v)
    {
        if (!(v >= 0) || !double.IsFinite(v))
        {
            e.Add($"key '{key}' is {v}: expected zero or a positive number");
        }
    }

    private static void Range(List<string> e, string key, double v, double lo, double hi)
    {
        if (!(v >= lo && v <= hi))
        {
            e.Add($"key '{key}' is {v}: expected a number from {lo} to {hi}");
        }
    }
}
