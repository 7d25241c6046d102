using SoftSensor.Core.Chemistry;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// One conserved quantity of a model: an element, or the degree of reduction ("gamma"), which combines
/// the H and O balances so that water drops out (docs/methods.md §2.2; Roels 1983).
/// </summary>
public readonly record struct Balance
{
    private Balance(string name, Element? element)
    {
        Name = name;
        Element = element;
    }

    /// <summary>Name as written in a model file: an element symbol or <c>gamma</c>.</summary>
    public string Name { get; }

    /// <summary>The element balanced, or null for the degree of reduction.</summary>
    public Element? Element { get; }

    /// <summary>The degree-of-reduction balance.</summary>
    public static Balance DegreeOfReduction { get; } = new("gamma", null);

    /// <summary>The balance of one element.</summary>
    public static Balance Of(Element element) => new(element.ToString(), element);

    /// <summary>Reads <c>C</c>, <c>H</c>, <c>O</c>, <c>N</c>, <c>S</c>, <c>P</c> or <c>gamma</c>.</summary>
    public static bool TryParse(string name, out Balance balance)
    {
        if (name == "gamma")
        {
            balance = DegreeOfReduction;
            return true;
        }

        if (Elements.TryParse(name, out var e))
        {
            balance = Of(e);
            return true;
        }

        balance = default;
        return false;
    }

    /// <summary>The coefficient of <paramref name="compound"/> in this balance, per rate unit.</summary>
    public double CoefficientOf(Compound compound) =>
        Element is { } e ? compound.AtomsPerRateUnit(e) : compound.DegreeOfReductionPerRateUnit;

    /// <inheritdoc />
    public override string ToString() => Name;
}
