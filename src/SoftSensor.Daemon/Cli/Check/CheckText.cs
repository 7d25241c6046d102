using System.Globalization;

namespace SoftSensor.Daemon.Cli.Check;

/// <summary>The text form of a <see cref="CheckReport"/>: one block per reactor, then the problems.</summary>
internal static class CheckText
{
    private static void WriteBatches(TextWriter o, BatchLifecycleLine? b)
    {
        if (b is null)
        {
            return;
        }

        string fed = b.FedBatchFeedAboveLPerH is { } f ? string.Create(CultureInfo.InvariantCulture, $"feed above {f:G4} L/h for {b.FedBatchHold}") : "off (operator only)";
        o.WriteLine($"  batches: batch-id tag {b.BatchIdTag ?? "(none: operator commands)"}, phase tag {b.PhaseTag ?? "(none)"}, fed-batch detection {fed}");
        if (b.PhaseCodes.Count > 0)
        {
            o.WriteLine($"  phase codes: {string.Join(", ", b.PhaseCodes.OrderBy(c => c.Key, StringComparer.Ordinal).Select(c => $"{c.Key} = {c.Value}"))}");
        }

        if (b.BatchIdTag is not null)
        {
            o.WriteLine($"  a tag-started batch takes its volume {(b.InitialVolumeFromTag ? "from the volume or weight tag" : "from estimator:initialVolumeL")}, inoculum and substrate from the estimator section");
        }
    }

    public static void Write(TextWriter o, CheckReport report)
    {
        o.WriteLine($"configuration  {report.File}");
        foreach (var r in report.Reactors)
        {
            o.WriteLine();
            o.WriteLine($"reactor {r.Id}  batch '{r.BatchId}'  cycle {r.CyclePeriod}");
            o.WriteLine($"  {"tag",-22} {"role",-26} {"unit",-10} {"role unit",-10} {"scale",8} {"offset",8}  dead time  topic");
            foreach (var t in r.Tags)
            {
                string unit = t.Unit.Length == 0 ? "(none)" : t.Unit;
                string mark = t.UnitConverts ? "" : "  << unit";
                o.WriteLine($"  {t.Tag,-22} {t.Role,-26} {unit,-10} {t.RoleUnit,-10} {N(t.Scale),8} {N(t.Offset),8}  {t.DeadTime,-9}  {t.Topic}{mark}");
            }

            WriteBatches(o, r.Batches);
            WriteModel(o, r.Model);
            WriteAlarms(o, report.AlarmRules);
        }

        o.WriteLine();
        if (report.Usable)
        {
            o.WriteLine("verdict  usable: no problem found");
            return;
        }

        o.WriteLine($"verdict  NOT usable: {report.Problems.Count} problem(s)");
        foreach (var p in report.Problems)
        {
            o.WriteLine("  - " + p);
        }
    }

    private static void WriteModel(TextWriter o, ModelCheck? m)
    {
        if (m is null)
        {
            o.WriteLine("  model      none (off-gas rates only)");
            return;
        }

        o.WriteLine($"  model      {m.Name} ({m.File})");
        o.WriteLine($"  element matrix (rows: balances; rates per C-mol for organic compounds, per mol otherwise)");
        o.WriteLine("    " + new string(' ', 8) + string.Concat(m.Compounds.Select(c => $"{c,10}")));
        for (int i = 0; i < m.Balances.Count; i++)
        {
            o.WriteLine($"    {m.Balances[i],-8}" + string.Concat(m.ElementMatrix[i].Select(v => $"{N(v),10}")));
        }

        o.WriteLine($"  structure  {m.Compounds.Count} compounds, rank {m.Rank}, {m.DegreesOfFreedom} degrees of freedom");
        o.WriteLine($"  measured   {(m.Measured.Count == 0 ? "none" : string.Join(", ", m.Measured.Select(x => $"{x.Compound} (from {x.From})")))}");
        o.WriteLine($"  calculable {(m.Calculable.Count == 0 ? "none" : string.Join(", ", m.Calculable))}");
        o.WriteLine($"  open       {(m.NotCalculable.Count == 0 ? "none" : string.Join(", ", m.NotCalculable))}");
        o.WriteLine($"  redundancy {m.Redundancy}; redundant measurements: {(m.RedundantMeasurements.Count == 0 ? "none" : string.Join(", ", m.RedundantMeasurements))}");
    }

    private static void WriteAlarms(TextWriter o, IReadOnlyList<AlarmRuleLine> rules)
    {
        if (rules.Count == 0)
        {
            o.WriteLine("  alarms     none configured");
            return;
        }

        o.WriteLine($"  alarms     {rules.Count} rule(s)");
        foreach (var a in rules)
        {
            string reference = a.Reference is null ? "" : $" vs {a.Reference}";
            o.WriteLine($"    {a.Id,-28} {a.Kind,-16} {a.Source}{reference}  {a.Thresholds}  [{a.Priority}, {a.Category}]");
        }
    }

    private static string N(double v) => v.ToString("G6", CultureInfo.InvariantCulture);
}
