namespace SoftSensor.Core.Chemistry;

/// <summary>The elements a compound formula may contain (docs/methods.md §2.1).</summary>
public enum Element
{
    C = 0,
    H = 1,
    O = 2,
    N = 3,
    S = 4,
    P = 5,
}

/// <summary>Per-element constants: standard atomic weight and the valence used for the degree of reduction.</summary>
public static class Elements
{
    /// <summary>Number of elements in <see cref="Element"/>.</summary>
    public const int Count = 6;

    /// <summary>All elements in matrix-row order.</summary>
    public static IReadOnlyList<Element> All { get; } = [Element.C, Element.H, Element.O, Element.N, Element.S, Element.P];

    // IUPAC standard atomic weights, conventional values (IUPAC CIAAW 2021, "Standard atomic
    // weights of the elements 2021", Pure Appl. Chem. 94 (2022) 573-600; conventional values of
    // Table 3). The uncertainty stated is half the width of the interval the conventional value
    // stands for (H [1.00784, 1.00811], C [12.0096, 12.0116], N [14.00643, 14.00728],
    // O [15.99903, 15.99977], S [32.059, 32.076]); P is a single value, 30.973761998(5).
    private static readonly double[] AtomicWeight = [12.011, 1.008, 15.999, 14.007, 32.06, 30.973761998];
    private static readonly double[] AtomicWeightUncertainty = [0.001, 0.0002, 0.0004, 0.0005, 0.009, 5e-9];

    // Valence for the degree of reduction with NH3, H2O, CO2 (and H2SO4, H3PO4) as references
    // (Roels 1983, Energetics and Kinetics in Biotechnology; Villadsen, Nielsen & Liden 2011,
    // Bioreaction Engineering Principles, ch. 3): C +4, H +1, O -2, N -3, S +6, P +5.
    private static readonly double[] ReductionValence = [4, 1, -2, -3, 6, 5];

    /// <summary>Standard atomic weight in g/mol.</summary>
    public static double AtomicWeightGPerMol(Element e) => AtomicWeight[(int)e];

    /// <summary>Standard uncertainty of <see cref="AtomicWeightGPerMol"/> in g/mol.</summary>
    public static double AtomicWeightUncertaintyGPerMol(Element e) => AtomicWeightUncertainty[(int)e];

    /// <summary>Contribution of one atom to the degree of reduction.</summary>
    public static double ReductionValenceOf(Element e) => ReductionValence[(int)e];

    /// <summary>Parses an element symbol; returns false when it is not one of C H O N S P.</summary>
    public static bool TryParse(string symbol, out Element element)
    {
        switch (symbol)
        {
            case "C": element = Element.C; return true;
            case "H": element = Element.H; return true;
            case "O": element = Element.O; return true;
            case "N": element = Element.N; return true;
            case "S": element = Element.S; return true;
            case "P": element = Element.P; return true;
            default: element = default; return false;
        }
    }
}
