using System.Globalization;

namespace SoftSensor.Daemon.Cli.Flux;

/// <summary>Human-readable tables of a <see cref="FluxReport"/>.</summary>
internal static class FluxText
{
    public static void Write(TextWriter o, FluxReport r)
    {
        o.WriteLine($"model: {r.Model}");
        o.WriteLine($"basis: {string.Join(", ", r.Basis.Select(b => $"{b.Key} = {N(b.Value)}"))}" + (r.BiomassGPerL is { } g ? $"; biomass {N(g)} g/L" : string.Empty));
        o.WriteLine($"status: {r.Status}; extra equations over the black-box balance: {r.ExtraEquations}");
        o.WriteLine();
        o.WriteLine("exchange rates (production > 0)");
        int w = Math.Max(8, r.Exchange.Keys.Max(k => k.Length));
        int wf = Math.Max(7, r.Formulas.Values.Max(f => f.Length));
        o.WriteLine($"  {"compound".PadRight(w)}  {"formula".PadRight(wf)}  {"rate",14}  unit");
        foreach (var (id, rate) in r.Exchange)
        {
            o.WriteLine($"  {id.PadRight(w)}  {r.Formulas[id].PadRight(wf)}  {N(rate),14}  {r.Units[id]}");
        }

        if (r.Rq is { } rq)
        {
            o.WriteLine($"  RQ = {rq.ToString("0.0000", CultureInfo.InvariantCulture)}");
        }

        o.WriteLine();
        o.WriteLine("fluxes, mmol/(L·h)");
        int wr = Math.Max(8, r.Fluxes.Keys.Max(k => k.Length));
        foreach (var (id, v) in r.Fluxes)
        {
            o.WriteLine($"  {id.PadRight(wr)}  {N(v),14}");
        }

        o.WriteLine();
        o.WriteLine("undetermined: " + (r.Undetermined.Count == 0 ? "none" : string.Join(", ", r.Undetermined)));
        o.WriteLine("elemental closure: " + string.Join("  ", r.Consistency.Select(c => $"{c.Key} {N(c.Value)}")));
        var t = r.BalanceTest;
        o.WriteLine($"elemental-balance test ({string.Join(", ", t.Balances)}): h = {N(t.H)}, {t.Dof} dof, critical {N(t.Critical)}: " + (t.Consistent ? "consistent" : $"NOT consistent ({t.Status})"));
        if (r.DirectionViolations > 0)
        {
            o.WriteLine($"warning: {r.DirectionViolations} irreversible reaction(s) came out negative");
        }

        foreach (var i in r.Imbalances)
        {
            o.WriteLine($"unbalanced: reaction '{i.Reaction}' makes {N(i.Excess)} {i.Element} per unit flux");
        }

        if (r.Status == "inconsistent")
        {
            o.WriteLine($"inconsistent: the basis values contradict the network (constraint residual {N(r.ConstraintResidual)})");
        }
    }

    private static string N(double? v) => v is { } d ? d.ToString("G6", CultureInfo.InvariantCulture) : "-";
}
