namespace SoftSensor.Core.Flux;

/// <summary>Which measured rates fix the pathway model in a cycle (docs/pathway.md §1).</summary>
public enum PathwayBasis
{
    /// <summary>Not solved (no usable basis rate).</summary>
    None = 0,

    /// <summary>The measured substrate uptake; OUR and CER are then predictions.</summary>
    Substrate,

    /// <summary>The measured OUR (no substrate uptake measured); CER is then a prediction.</summary>
    Oxygen,

    /// <summary>Overflow: substrate uptake above the respiratory capacity; the substrate uptake and the respired O2 fix growth and the overflow branch, CER is the prediction.</summary>
    SubstrateAndOxygen,
}

/// <summary>
/// The per-cycle solve of a <see cref="PathwayResponse"/>: the ATP balance plus the basis rates give
/// the free basis fluxes r_X, v_resp and v_overflow (v_maint = m_ATP X is fixed). At most three
/// unknowns, solved by Cramer's rule; allocation-free.
/// </summary>
public static class PathwaySolve
{
    /// <summary>
    /// Solves into <paramref name="u"/> (length <see cref="PathwayResponse.BasisCount"/>); false when the system is singular or a value is not finite.
    /// </summary>
    /// <param name="r">The compiled network.</param>
    /// <param name="basis">Which rates are given.</param>
    /// <param name="poRatio">P/O, ATP per O atom.</param>
    /// <param name="maintenanceAtp">m_ATP, mmol ATP/(C-mmol biomass·h).</param>
    /// <param name="biomassCmmolPerL">X, C-mmol/L.</param>
    /// <param name="substrateRate">Substrate exchange rate (negative: uptake), C-mmol/(L·h).</param>
    /// <param name="ourMmolPerLh">Respired O2, mmol/(L·h), positive.</param>
    /// <param name="u">The basis fluxes [r_X, v_resp, v_maint, v_overflow].</param>
    public static bool Solve(PathwayResponse r, PathwayBasis basis, double poRatio, double maintenanceAtp, double biomassCmmolPerL,
        double substrateRate, double ourMmolPerLh, Span<double> u)
    {
        u.Clear();
        double vm = maintenanceAtp * biomassCmmolPerL;
        u[PathwayResponse.Maintenance] = vm;
        var atp = r.Atp;
        int s = r.SubstrateIndex, o = r.OxygenIndex;
        const int G = PathwayResponse.Growth, R = PathwayResponse.Respiration, M = PathwayResponse.Maintenance, F = PathwayResponse.Overflow;

        // Row 1: the ATP balance.
        double a1 = atp[G], b1 = atp[R] + (poRatio * r.OxygenAtomsPerRespiration), c1 = atp[F], d1 = -atp[M] * vm;
        double a2, b2, c2, d2, a3, b3, c3, d3;
        switch (basis)
        {
            case PathwayBasis.Substrate:
                (a2, b2, c2, d2) = Row(r, s, substrateRate, vm);
                (a3, b3, c3, d3) = (0, 0, 1, 0);
                break;
            case PathwayBasis.Oxygen:
                (a2, b2, c2, d2) = Row(r, o, -ourMmolPerLh, vm);
                (a3, b3, c3, d3) = (0, 0, 1, 0);
                break;
            case PathwayBasis.SubstrateAndOxygen when r.HasOverflow:
                (a2, b2, c2, d2) = Row(r, s, substrateRate, vm);
                (a3, b3, c3, d3) = Row(r, o, -ourMmolPerLh, vm);
                break;
            default:
                return false;
        }

        double det = Det(a1, b1, c1, a2, b2, c2, a3, b3, c3);
        if (!double.IsFinite(det) || Math.Abs(det) < 1e-14)
        {
            return false;
        }

        u[G] = Det(d1, b1, c1, d2, b2, c2, d3, b3, c3) / det;
        u[R] = Det(a1, d1, c1, a2, d2, c2, a3, d3, c3) / det;
        u[F] = Det(a1, b1, d1, a2, b2, d2, a3, b3, d3) / det;
        return double.IsFinite(u[G]) && double.IsFinite(u[R]) && double.IsFinite(u[F]);
    }

    private static (double A, double B, double C, double D) Row(PathwayResponse r, int compound, double value, double vm) =>
        (r.Exchange(compound, PathwayResponse.Growth), r.Exchange(compound, PathwayResponse.Respiration),
            r.Exchange(compound, PathwayResponse.Overflow), value - (r.Exchange(compound, PathwayResponse.Maintenance) * vm));

    private static double Det(double a1, double b1, double c1, double a2, double b2, double c2, double a3, double b3, double c3) =>
        (a1 * ((b2 * c3) - (b3 * c2))) - (b1 * ((a2 * c3) - (a3 * c2))) + (c1 * ((a2 * b3) - (a3 * b2)));
}
