namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// Recovery of a conserved quantity over a set of rates: what leaves in products over what enters in
/// substrates, Σ max(0, a_j q_j) / Σ max(0, -a_j q_j). For carbon it is the carbon recovery; for the
/// degree of reduction it is the electron recovery, in which O2 (gamma -4, consumed) counts on the
/// product side (Villadsen, Nielsen &amp; Lidén 2011, ch. 3; common practice in chemostat reports).
/// 1.0 means the balance closes.
/// </summary>
public static class Recovery
{
    /// <summary>The recovery of <paramref name="balance"/>; NaN values are skipped; NaN when nothing enters or nothing leaves (one side unmeasured says nothing).</summary>
    public static double Of(Balance balance, IReadOnlyList<Compound> compounds, ReadOnlySpan<double> rates)
    {
        ArgumentNullException.ThrowIfNull(compounds);
        if (compounds.Count != rates.Length)
        {
            throw new ArgumentException($"{compounds.Count} compounds but {rates.Length} rates", nameof(rates));
        }

        double outgoing = 0, incoming = 0;
        for (int j = 0; j < rates.Length; j++)
        {
            if (!double.IsFinite(rates[j]))
            {
                continue;
            }

            double flow = balance.CoefficientOf(compounds[j]) * rates[j];
            if (flow > 0)
            {
                outgoing += flow;
            }
            else
            {
                incoming -= flow;
            }
        }

        return incoming > 0 && outgoing > 0 ? outgoing / incoming : double.NaN;
    }
}
