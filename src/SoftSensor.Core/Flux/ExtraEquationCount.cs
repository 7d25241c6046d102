namespace SoftSensor.Core.Flux;

/// <summary>
/// How many independent equations a network imposes on its exchange rates beyond the black-box
/// elemental balance (docs/methods.md §3): with the homogeneous constraints A_h = [S_int; fixed splits;
/// maintenance flux] and N a basis of their null space, the exchange rates that the network allows
/// span T N. The constraints on them number n_exchange - rank(T N); the elemental balances account
/// for rank(E) of these; the rest are extra. The maintenance flux counts as known (it is fixed by
/// m_ATP * X), so the ATP balance is one of the constraints.
/// </summary>
internal static class ExtraEquationCount
{
    public static int Of(FluxNetwork network)
    {
        var model = network.Model;
        int nr = model.Reactions.Count;
        int rows = network.Internal.GetLength(0) + network.Splits.GetLength(0) + (network.MaintenanceReaction >= 0 ? 1 : 0);
        var a = new double[rows, nr];
        int r = 0;
        r = Copy(network.Internal, a, r);
        r = Copy(network.Splits, a, r);
        if (network.MaintenanceReaction >= 0)
        {
            a[r, network.MaintenanceReaction] = 1;
        }

        var used = Enumerable.Range(0, model.Compounds.Count).Where(j => network.InNetwork[j]).ToArray();
        var t = new double[used.Length, nr];
        var e = new double[network.BalancedElements.Count, used.Length];
        for (int u = 0; u < used.Length; u++)
        {
            for (int k = 0; k < nr; k++)
            {
                t[u, k] = network.Exchange[used[u], k];
            }

            for (int el = 0; el < e.GetLength(0); el++)
            {
                e[el, u] = network.ElementMatrix[el, used[u]];
            }
        }

        var nullSpace = RankRevealing.Of(a).NullSpace;
        int dimension = nullSpace.GetLength(1) == 0 ? 0 : RankRevealing.RankOf(RankRevealing.Multiply(t, nullSpace));
        return used.Length - dimension - RankRevealing.RankOf(e);
    }

    private static int Copy(double[,] from, double[,] to, int row)
    {
        for (int i = 0; i < from.GetLength(0); i++, row++)
        {
            for (int k = 0; k < from.GetLength(1); k++)
            {
                to[row, k] = from[i, k];
            }
        }

        return row;
    }
}
