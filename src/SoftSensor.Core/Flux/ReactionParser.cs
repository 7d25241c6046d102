using System.Globalization;

namespace SoftSensor.Core.Flux;

/// <summary>
/// Reads reaction equations: <c>side arrow side</c>, arrow <c>-&gt;</c> (irreversible) or <c>&lt;=&gt;</c>
/// (reversible); a side is empty or terms joined by <c>+</c>; a term is <c>[coefficient] species</c>,
/// the coefficient a decimal (<c>0.5</c>), a fraction (<c>1/3</c>) or a parameter in braces
/// (<c>{PO}</c>), separated from the species by white space. Errors name the side, the term and the
/// column (1-based) at fault.
/// </summary>
public static class ReactionParser
{
    /// <summary>Parses <paramref name="equation"/> of reaction <paramref name="id"/>.</summary>
    /// <param name="id">Reaction id (for messages).</param>
    /// <param name="equation">The equation text.</param>
    /// <param name="isSpecies">True for a known compound or metabolite id.</param>
    /// <param name="parameter">Looks up a parameter value; false when unknown.</param>
    /// <exception cref="FluxModelException">The equation cannot be read; the message names side, term and column.</exception>
    public static Reaction Parse(string id, string equation, Func<string, bool> isSpecies, TryGetParameter parameter)
    {
        string field = "reactions." + id;
        int arrowAt = equation.IndexOf("<=>", StringComparison.Ordinal);
        bool reversible = arrowAt >= 0;
        int arrowLength = 3;
        if (!reversible)
        {
            arrowAt = equation.IndexOf("->", StringComparison.Ordinal);
            arrowLength = 2;
        }

        if (arrowAt < 0)
        {
            throw new FluxModelException(field, $"'{equation}' has no arrow: write '->' (irreversible) or '<=>' (reversible) between the sides");
        }

        int second = equation.IndexOf(reversible ? "<=>" : "->", arrowAt + arrowLength, StringComparison.Ordinal);
        if (second >= 0 || (!reversible && equation.IndexOf("<=>", StringComparison.Ordinal) >= 0))
        {
            throw new FluxModelException(field, $"'{equation}' has a second arrow at column {second + 1}: one arrow per reaction");
        }

        var net = new List<ReactionTerm>();
        ReadSide(field, equation, 0, arrowAt, -1, "left side", isSpecies, parameter, net);
        ReadSide(field, equation, arrowAt + arrowLength, equation.Length, +1, "right side", isSpecies, parameter, net);
        net.RemoveAll(t => t.Coefficient == 0);
        if (net.Count == 0)
        {
            throw new FluxModelException(field, $"'{equation}' has no species (or every species cancels)");
        }

        return new Reaction(id, equation, net, reversible);
    }

    /// <summary>Looks up a parameter by name.</summary>
    public delegate bool TryGetParameter(string name, out double value);

    private static void ReadSide(string field, string text, int start, int end, int sign, string side,
        Func<string, bool> isSpecies, TryGetParameter parameter, List<ReactionTerm> net)
    {
        if (text.AsSpan(start, end - start).Trim().Length == 0)
        {
            return;
        }

        int termNo = 0;
        int pos = start;
        while (pos <= end)
        {
            int plus = text.IndexOf('+', pos, end - pos);
            int termEnd = plus < 0 ? end : plus;
            termNo++;
            ReadTerm(field, text, pos, termEnd, sign, $"{side}, term {termNo}", isSpecies, parameter, net);
            if (plus < 0)
            {
                break;
            }

            pos = plus + 1;
        }
    }

    private static void ReadTerm(string field, string text, int start, int end, int sign, string where,
        Func<string, bool> isSpecies, TryGetParameter parameter, List<ReactionTerm> net)
    {
        int i = start;
        while (i < end && char.IsWhiteSpace(text[i]))
        {
            i++;
        }

        int last = end;
        while (last > i && char.IsWhiteSpace(text[last - 1]))
        {
            last--;
        }

        if (i >= last)
        {
            throw new FluxModelException(field, $"{where} at column {start + 1} is empty (a '+' with nothing beside it)");
        }

        double coefficient = 1;
        int speciesAt = i;
        int gap = text.IndexOfAny([' ', '\t'], i, last - i);
        if (gap >= 0)
        {
            string token = text[i..gap];
            coefficient = ReadCoefficient(field, token, i, where, parameter);
            speciesAt = gap;
            while (speciesAt < last && char.IsWhiteSpace(text[speciesAt]))
            {
                speciesAt++;
            }
        }

        string species = text[speciesAt..last];
        int bad = species.IndexOfAny([' ', '\t']);
        if (bad >= 0)
        {
            throw new FluxModelException(field, $"{where} at column {speciesAt + bad + 1}: '{text[i..last]}' is not 'coefficient species'");
        }

        if (!IsIdentifier(species))
        {
            throw new FluxModelException(field, $"{where} at column {speciesAt + 1}: '{species}' is not a species id (a letter, then letters, digits or '_')");
        }

        if (!isSpecies(species))
        {
            throw new FluxModelException(field, $"{where} at column {speciesAt + 1}: unknown species '{species}' (declare it under \"compounds\" or \"metabolites\")");
        }

        if (!(coefficient > 0))
        {
            throw new FluxModelException(field, $"{where} at column {i + 1}: coefficient of '{species}' must be positive, found {coefficient.ToString(CultureInfo.InvariantCulture)}");
        }

        int idx = net.FindIndex(t => t.Species == species);
        double c = sign * coefficient;
        if (idx >= 0)
        {
            net[idx] = net[idx] with { Coefficient = net[idx].Coefficient + c };
        }
        else
        {
            net.Add(new ReactionTerm(species, c));
        }
    }

    private static double ReadCoefficient(string field, string token, int at, string where, TryGetParameter parameter)
    {
        if (token.Length > 2 && token[0] == '{' && token[^1] == '}')
        {
            string name = token[1..^1];
            return parameter(name, out double p)
                ? p
                : throw new FluxModelException(field, $"{where} at column {at + 1}: unknown parameter '{name}' (declare it under \"parameters\")");
        }

        int slash = token.IndexOf('/', StringComparison.Ordinal);
        if (slash > 0 && TryDecimal(token[..slash], out double num) && TryDecimal(token[(slash + 1)..], out double den) && den != 0)
        {
            return num / den;
        }

        if (slash < 0 && TryDecimal(token, out double value))
        {
            return value;
        }

        throw new FluxModelException(field, $"{where} at column {at + 1}: '{token}' is not a coefficient (a decimal such as 0.5, a fraction such as 1/3, or a parameter such as {{PO}})");
    }

    private static bool TryDecimal(string s, out double value) =>
        double.TryParse(s, NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out value) && double.IsFinite(value);

    internal static bool IsIdentifier(string s) =>
        s.Length > 0 && char.IsAsciiLetter(s[0]) && s.All(c => char.IsAsciiLetterOrDigit(c) || c == '_');
}
