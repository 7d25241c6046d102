using System.Globalization;
using System.Text;

namespace SoftSensor.Core.Chemistry;

/// <summary>
/// An elemental formula with decimal subscripts and an optional charge, e.g. CH1.8O0.5N0.2,
/// C6H12O6, NH4+. Immutable; equality is by content.
/// </summary>
public sealed class Formula : IEquatable<Formula>
{
    private readonly double[] _counts;

    internal Formula(double[] counts, double charge, string text)
    {
        _counts = counts;
        Charge = charge;
        Text = text;
    }

    /// <summary>The text the formula was parsed from (or a canonical rendering).</summary>
    public string Text { get; }

    /// <summary>Net charge in elementary charges (NH4+ is +1).</summary>
    public double Charge { get; }

    /// <summary>Atoms of <paramref name="e"/> per formula unit.</summary>
    public double this[Element e] => _counts[(int)e];

    /// <summary>Atoms of carbon per formula unit.</summary>
    public double Carbon => _counts[(int)Element.C];

    /// <summary>True when the compound contains carbon (and is therefore handled per C-mol).</summary>
    public bool IsOrganic => Carbon > 0;

    /// <summary>Parses a formula; throws <see cref="FormulaFormatException"/> naming the position of the fault.</summary>
    public static Formula Parse(string text) => FormulaParser.Parse(text);

    /// <summary>Parses a formula without throwing.</summary>
    public static bool TryParse(string text, out Formula? formula, out string? error) =>
        FormulaParser.TryParse(text, out formula, out error);

    /// <summary>Molar mass in g per mol of formula units, from IUPAC standard atomic weights.</summary>
    public double MolarMassGPerMol
    {
        get
        {
            double m = 0;
            for (int i = 0; i < Elements.Count; i++)
            {
                m += _counts[i] * Elements.AtomicWeightGPerMol((Element)i);
            }

            return m;
        }
    }

    /// <summary>Standard uncertainty of <see cref="MolarMassGPerMol"/> from the atomic-weight uncertainties (treated as independent).</summary>
    public double MolarMassUncertaintyGPerMol
    {
        get
        {
            double v = 0;
            for (int i = 0; i < Elements.Count; i++)
            {
                double u = _counts[i] * Elements.AtomicWeightUncertaintyGPerMol((Element)i);
                v += u * u;
            }

            return Math.Sqrt(v);
        }
    }

    /// <summary>
    /// Degree of reduction per formula unit with NH3, H2O, CO2 (H2SO4, H3PO4) as references:
    /// gamma = 4 nC + nH - 2 nO - 3 nN + 6 nS + 5 nP - charge (Roels 1983).
    /// </summary>
    public double DegreeOfReduction
    {
        get
        {
            double g = -Charge;
            for (int i = 0; i < Elements.Count; i++)
            {
                g += _counts[i] * Elements.ReductionValenceOf((Element)i);
            }

            return g;
        }
    }

    /// <summary>The formula per C-mol (glucose C6H12O6 becomes CH2O); inorganic formulas are returned unchanged.</summary>
    public Formula PerCMol()
    {
        if (!IsOrganic || Carbon == 1)
        {
            return this;
        }

        double c = Carbon;
        var counts = new double[Elements.Count];
        for (int i = 0; i < counts.Length; i++)
        {
            counts[i] = _counts[i] / c;
        }

        var f = new Formula(counts, Charge / c, string.Empty);
        return new Formula(counts, Charge / c, f.Render());
    }

    /// <summary>The unit in which rates of this compound are counted: carbon atoms per formula unit for organics, else 1.</summary>
    public double FormulaUnitsPerRateUnit => IsOrganic ? 1.0 / Carbon : 1.0;

    /// <summary>Canonical text (C, H, O, N, S, P order, up to 4 decimals).</summary>
    public string Render()
    {
        var sb = new StringBuilder();
        for (int i = 0; i < Elements.Count; i++)
        {
            double n = _counts[i];
            if (n == 0)
            {
                continue;
            }

            sb.Append(((Element)i).ToString());
            if (Math.Abs(n - 1) > 1e-12)
            {
                sb.Append(Math.Round(n, 4).ToString("0.####", CultureInfo.InvariantCulture));
            }
        }

        if (Charge != 0)
        {
            sb.Append(Charge > 0 ? '+' : '-');
            double a = Math.Abs(Charge);
            if (Math.Abs(a - 1) > 1e-12)
            {
                sb.Append(Math.Round(a, 4).ToString("0.####", CultureInfo.InvariantCulture));
            }
        }

        return sb.ToString();
    }

    /// <inheritdoc />
    public override string ToString() => Text;

    /// <inheritdoc />
    public bool Equals(Formula? other) =>
        other is not null && Charge == other.Charge && _counts.AsSpan().SequenceEqual(other._counts);

    /// <inheritdoc />
    public override bool Equals(object? obj) => Equals(obj as Formula);

    /// <inheritdoc />
    public override int GetHashCode()
    {
        var h = default(HashCode);
        foreach (double c in _counts)
        {
            h.Add(c);
        }

        h.Add(Charge);
        return h.ToHashCode();
    }
}
