using SoftSensor.Core.Chemistry;

namespace SoftSensor.Core.Flux;

/// <summary>
/// Checks every reaction for conservation of each element: sum over species of coefficient times
/// atoms must be zero (common practice: every reaction of a stoichiometric model is elementally
/// balanced; Villadsen, Nielsen &amp; Lidén 2011, ch. 5). A network whose reactions all balance makes
/// exchange rates that close the black-box balance to rounding; one that does not names the culprit.
/// </summary>
public static class ReactionBalanceCheck
{
    /// <summary>Absolute tolerance on atoms per unit flux below which a reaction counts as balanced.</summary>
    public const double Tolerance = 1e-9;

    /// <summary>All imbalances of <paramref name="model"/>, in reaction order then element order.</summary>
    public static IReadOnlyList<ReactionImbalance> Check(FluxModel model)
    {
        var formulas = new Dictionary<string, Formula?>(StringComparer.Ordinal);
        foreach (var c in model.Compounds)
        {
            formulas[c.Id] = c.Formula;
        }

        foreach (var m in model.Metabolites)
        {
            formulas[m.Id] = m.Formula;
        }

        var list = new List<ReactionImbalance>();
        Span<double> atoms = stackalloc double[Elements.Count];
        foreach (var r in model.Reactions)
        {
            atoms.Clear();
            double charge = 0;
            foreach (var t in r.Terms)
            {
                if (formulas[t.Species] is not { } f)
                {
                    continue;
                }

                for (int e = 0; e < Elements.Count; e++)
                {
                    atoms[e] += t.Coefficient * f[(Element)e];
                }

                charge += t.Coefficient * f.Charge;
            }

            for (int e = 0; e < Elements.Count; e++)
            {
                if (Math.Abs(atoms[e]) > Tolerance)
                {
                    list.Add(new ReactionImbalance(r.Id, ((Element)e).ToString(), atoms[e]));
                }
            }

            if (Math.Abs(charge) > Tolerance)
            {
                list.Add(new ReactionImbalance(r.Id, "charge", charge));
            }
        }

        return list;
    }
}
