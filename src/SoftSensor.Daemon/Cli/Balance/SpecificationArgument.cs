using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Daemon.Cli.Balance;

/// <summary>
/// One <c>--specify</c>, an exact relation between two rates added to the balances:
/// <list type="bullet">
/// <item><c>yield:A/B=Y</c> — yield in rate units (C-mol/C-mol for organics): q_A = -Y q_B.</item>
/// <item><c>massyield:A/B=Y</c> — the same in g/g (biomass as dry weight with ash).</item>
/// <item><c>ratio:A/B=R</c> — ratio of signed rates: q_A = R q_B.</item>
/// <item><c>rq=R</c> — respiratory quotient CER/OUR: q_CO2 = -R q_O2 (the compounds with roles carbonDioxide and oxygen).</item>
/// </list>
/// </summary>
internal static class SpecificationArgument
{
    public const string Forms = "yield:A/B=Y, massyield:A/B=Y, ratio:A/B=R or rq=R";

    public static bool TryParse(string text, StoichiometricModel model, out Specification specification, out string? error)
    {
        specification = default;
        string where = $"--specify '{text}'";
        int eq = text.LastIndexOf('=');
        if (eq <= 0 || !MeasurementArgument.TryNumber(text[(eq + 1)..], out double value))
        {
            error = $"{where}: expected {Forms} with a finite number after '='";
            return false;
        }

        string head = text[..eq].Trim();
        if (head == "rq")
        {
            var co2 = model.Compounds.FirstOrDefault(c => c.Role == CompoundRole.CarbonDioxide);
            var o2 = model.Compounds.FirstOrDefault(c => c.Role == CompoundRole.Oxygen);
            if (co2 is null || o2 is null)
            {
                error = $"{where}: rq needs compounds with roles carbonDioxide and oxygen in model '{model.Name}'";
                return false;
            }

            specification = Specification.Ratio(co2.Id, o2.Id, -value);
            error = null;
            return true;
        }

        int colon = head.IndexOf(':', StringComparison.Ordinal);
        int slash = head.IndexOf('/', StringComparison.Ordinal);
        if (colon <= 0 || slash < colon)
        {
            error = $"{where}: expected {Forms}";
            return false;
        }

        string kind = head[..colon];
        string a = head[(colon + 1)..slash].Trim(), b = head[(slash + 1)..].Trim();
        foreach (string id in new[] { a, b })
        {
            if (!model.TryGet(id, out _))
            {
                error = $"{where}: '{id}' names no compound of model '{model.Name}' (compounds: {string.Join(", ", model.Compounds.Select(c => c.Id))})";
                return false;
            }
        }

        switch (kind)
        {
            case "yield":
                specification = Specification.Yield(a, b, value);
                break;
            case "massyield":
                specification = Specification.MassYield(model, a, b, value);
                break;
            case "ratio":
                specification = Specification.Ratio(a, b, value);
                break;
            default:
                error = $"{where}: '{kind}' is not a kind of specification (expected {Forms})";
                return false;
        }

        error = null;
        return true;
    }
}
