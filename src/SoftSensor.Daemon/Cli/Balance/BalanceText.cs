using System.Globalization;

namespace SoftSensor.Daemon.Cli.Balance;

/// <summary>Human-readable tables of a <see cref="BalanceReport"/>.</summary>
internal static class BalanceText
{
    private static readonly CultureInfo C = CultureInfo.InvariantCulture;

    public static void Write(TextWriter o, BalanceReport r)
    {
        o.WriteLine($"model        {r.Model}");
        o.WriteLine($"balances     {string.Join(", ", r.Balances)}{(r.Specifications.Count > 0 ? "; specified " + string.Join(", ", r.Specifications) : string.Empty)}");
        o.WriteLine(string.Create(C, $"structure    {r.Rates.Count} compounds, rank {r.Rank}, {r.Dof} degrees of freedom; {r.Measured.Count} measured, {r.Redundancy} redundant"));
        o.WriteLine();
        o.WriteLine("compound        measured     sigma    result      sigma   source");
        foreach (var (id, value) in r.Rates)
        {
            string source = r.Measured.TryGetValue(id, out var m) ? (r.Redundancy > 0 ? "reconciled" : "measured")
                : value is null ? "not calculable" : "calculated";
            string measured = m is null ? string.Empty : Num(m.Value);
            string sigma = m is null ? string.Empty : Num(m.Sigma) + (m.SigmaAssumed ? "*" : " ");
            o.WriteLine($"{id,-14} {measured,9} {sigma,10} {Num(value),9} {Num(r.Sigmas[id]),10}   {source}");
        }

        if (r.Measured.Values.Any(m => m.SigmaAssumed))
        {
            o.WriteLine("  * sigma not given: 5 % of the value assumed");
        }

        o.WriteLine("  rates in mmol/(L·h), C-mmol/(L·h) for organic compounds; production > 0, consumption < 0");
        o.WriteLine();
        o.WriteLine(r.Test is { } t
            ? string.Create(C, $"test         h = {t.H:0.###} with {t.Dof} dof, critical {t.Critical:0.##} (alpha {t.Alpha}): {(t.Consistent ? "passes" : "FAILS")}")
            : "test         none: no redundant measurement");
        o.WriteLine($"verdict      {r.Verdict}");
        if (r.Diagnosis.Count > 0)
        {
            o.WriteLine();
            o.WriteLine("hypothesis                                  h   dof  critical  result     implied rate");
            foreach (var h in r.Diagnosis)
            {
                string result = h.Consistent switch { true => "passes", false => "fails", null => "untestable" };
                o.WriteLine(string.Create(C, $"{h.Hypothesis,-36} {Num(h.H),9} {h.Dof,5} {Num(h.Critical),9}  {result,-10} {Num(h.SuspectRate),9}"));
            }
        }

        o.WriteLine();
        o.WriteLine($"recovery     carbon {Num(r.Recovery.Carbon)}, electrons {Num(r.Recovery.Electrons)} (of the measured rates as given; 1 = closed)");
        if (r.OutsideBalances.Count > 0)
        {
            o.WriteLine($"outside      {string.Join(", ", r.OutsideBalances)}: in none of the balances {string.Join(", ", r.Balances)}, so not calculated (balance H and O to have water)");
        }

        if (r.Advice is not null)
        {
            o.WriteLine($"undetermined {string.Join(", ", r.NotCalculable)}");
            o.WriteLine($"advice       {r.Advice}");
        }
    }

    private static string Num(double? v) => v is { } x ? x.ToString(Math.Abs(x) >= 1e4 || (x != 0 && Math.Abs(x) < 1e-3) ? "0.###E+0" : "0.####", C) : "-";
}
