using System.Globalization;
using System.Text.Json;
using SoftSensor.Core.Chemistry;

namespace SoftSensor.Core.Stoichiometry;

/// <summary>
/// Reads a model from JSON text (the daemon reads the file). Shape:
/// <c>{ "name": ..., "compounds": { id: { "formula", "role"?, "molarMass"?, "ashFraction"? } }, "balances"?: [...] }</c>.
/// Comments and trailing commas are allowed; a duplicate key anywhere in what is read is an error;
/// other top-level keys (e.g. those of a flux model) are left to their readers. Every error names the field.
/// </summary>
public static class ModelReader
{
    private static readonly JsonDocumentOptions Options = new()
    {
        CommentHandling = JsonCommentHandling.Skip,
        AllowTrailingCommas = true,
    };

    private static readonly string[] CompoundKeys = ["formula", "role", "molarMass", "ashFraction", "uncertainty"];

    private static readonly string[] UncertaintyKeys = ["degreeOfReduction", "nitrogenPerCMol", "ashFraction"];

    /// <summary>Reads a model; throws <see cref="ModelFormatException"/> naming the field at fault.</summary>
    public static StoichiometricModel Parse(string json)
    {
        JsonDocument doc;
        try
        {
            doc = JsonDocument.Parse(json, Options);
        }
        catch (JsonException ex)
        {
            throw new ModelFormatException("model", $"not valid JSON (line {ex.LineNumber + 1}, byte {ex.BytePositionInLine + 1}): {ex.Message}");
        }

        using (doc)
        {
            var root = doc.RootElement;
            if (root.ValueKind != JsonValueKind.Object)
            {
                throw new ModelFormatException("model", $"expected a JSON object, found {root.ValueKind}");
            }

            var top = UniqueProperties(root, "model");
            string name = top.TryGetValue("name", out var n)
                ? (n.ValueKind == JsonValueKind.String ? n.GetString()! : throw new ModelFormatException("name", $"expected a string, found {n.ValueKind}"))
                : "unnamed model";
            if (!top.TryGetValue("compounds", out var compoundsElement))
            {
                throw new ModelFormatException("compounds", "missing: a model needs an object of compounds keyed by id");
            }

            var compounds = ReadCompounds(compoundsElement);
            var balances = top.TryGetValue("balances", out var b) ? ReadBalances(b, compounds) : DefaultBalances(compounds);
            return new StoichiometricModel(name, compounds, balances);
        }
    }

    /// <summary>Reads a model without throwing; <paramref name="error"/> names the field at fault.</summary>
    public static bool TryParse(string json, out StoichiometricModel? model, out string? error)
    {
        try
        {
            model = Parse(json);
            error = null;
            return true;
        }
        catch (ModelFormatException ex)
        {
            model = null;
            error = ex.Message;
            return false;
        }
    }

    private static Dictionary<string, JsonElement> UniqueProperties(JsonElement obj, string path)
    {
        var d = new Dictionary<string, JsonElement>(StringComparer.Ordinal);
        foreach (var p in obj.EnumerateObject())
        {
            if (!d.TryAdd(p.Name, p.Value))
            {
                throw new ModelFormatException(path == "model" ? p.Name : $"{path}.{p.Name}", "duplicate key: each key may appear once");
            }
        }

        return d;
    }

    private static List<Compound> ReadCompounds(JsonElement element)
    {
        if (element.ValueKind != JsonValueKind.Object)
        {
            throw new ModelFormatException("compounds", $"expected an object keyed by compound id, found {element.ValueKind}");
        }

        var compounds = UniqueProperties(element, "compounds");
        var bad = compounds.Keys.Where(id => !IsValidId(id)).ToList();
        if (bad.Count > 0)
        {
            // Every bad id at once, each with the id to write instead (O2, CO2, NH3 are what a user writes first).
            string fixes = string.Join(", ", bad.Select(id => $"'{id}' → '{FixedId(id)}'"));
            throw new ModelFormatException("compounds." + bad[0], $"id '{bad[0]}' must be lower case: a letter, then letters, digits or '_' (rename {fixes}, and the same ids wherever the file names them)");
        }

        var list = new List<Compound>();
        foreach (var (id, value) in compounds)
        {
            list.Add(ReadCompound(id, value));
        }

        if (list.Count == 0)
        {
            throw new ModelFormatException("compounds", "empty: a model needs at least one compound");
        }

        return list;
    }

    private static Compound ReadCompound(string id, JsonElement value)
    {
        string path = "compounds." + id;
        if (!IsValidId(id))
        {
            throw new ModelFormatException(path, $"id '{id}' must be lower case: a letter, then letters, digits or '_'");
        }

        if (value.ValueKind != JsonValueKind.Object)
        {
            throw new ModelFormatException(path, $"expected an object with \"formula\", found {value.ValueKind}");
        }

        var props = UniqueProperties(value, path);
        foreach (string key in props.Keys)
        {
            if (Array.IndexOf(CompoundKeys, key) < 0)
            {
                throw new ModelFormatException($"{path}.{key}", $"unknown key (allowed: {string.Join(", ", CompoundKeys)})");
            }
        }

        if (!props.TryGetValue("formula", out var f) || f.ValueKind != JsonValueKind.String)
        {
            throw new ModelFormatException(path + ".formula", "missing or not a string: give the elemental formula, e.g. \"C3H8O3\"");
        }

        if (!Formula.TryParse(f.GetString()!, out var formula, out string? formulaError))
        {
            throw new ModelFormatException(path + ".formula", formulaError!.ReplaceLineEndings(" "));
        }

        var role = props.TryGetValue("role", out var r) ? ReadRole(r, path + ".role") : CompoundRole.Product;
        double molarMass = props.TryGetValue("molarMass", out var mm)
            ? ReadPositive(mm, path + ".molarMass", "a molar mass in g/mol > 0")
            : formula!.MolarMassGPerMol;
        double ash = 0;
        if (props.TryGetValue("ashFraction", out var a))
        {
            if (role != CompoundRole.Biomass)
            {
                throw new ModelFormatException(path + ".ashFraction", "only a compound with role \"biomass\" has an ash fraction");
            }

            ash = ReadNumber(a, path + ".ashFraction");
            if (!(ash >= 0 && ash < 1))
            {
                throw new ModelFormatException(path + ".ashFraction", $"{ash.ToString(CultureInfo.InvariantCulture)} is outside [0, 1): give ash as a fraction of dry weight, e.g. 0.06");
            }
        }

        var uncertainty = props.TryGetValue("uncertainty", out var un) ? ReadUncertainty(un, path + ".uncertainty", role) : FormulaUncertainty.None;
        return new Compound(id, formula!, role, molarMass, ash) { Uncertainty = uncertainty };
    }

    /// <summary>
    /// <c>"uncertainty": "publishedSpread"</c> (biomass: <see cref="FormulaUncertainty.PublishedBiomassSpread"/>) or
    /// <c>{ "degreeOfReduction": σ, "nitrogenPerCMol": σ, "ashFraction": σ }</c> (each optional, ≥ 0).
    /// </summary>
    private static FormulaUncertainty ReadUncertainty(JsonElement e, string path, CompoundRole role)
    {
        if (e.ValueKind == JsonValueKind.String)
        {
            if (e.GetString() == "publishedSpread" && role == CompoundRole.Biomass)
            {
                return FormulaUncertainty.PublishedBiomassSpread;
            }

            throw new ModelFormatException(path, $"'{e.GetString()}' is not allowed: \"publishedSpread\" (biomass only) or an object with {string.Join(", ", UncertaintyKeys)}");
        }

        if (e.ValueKind != JsonValueKind.Object)
        {
            throw new ModelFormatException(path, $"expected \"publishedSpread\" or an object with {string.Join(", ", UncertaintyKeys)}, found {e.ValueKind}");
        }

        var props = UniqueProperties(e, path);
        foreach (string key in props.Keys)
        {
            if (Array.IndexOf(UncertaintyKeys, key) < 0)
            {
                throw new ModelFormatException($"{path}.{key}", $"unknown key (allowed: {string.Join(", ", UncertaintyKeys)})");
            }
        }

        double Get(string key)
        {
            if (!props.TryGetValue(key, out var v))
            {
                return 0;
            }

            double x = ReadNumber(v, $"{path}.{key}");
            return x >= 0 ? x : throw new ModelFormatException($"{path}.{key}", $"{x.ToString(CultureInfo.InvariantCulture)} is negative: give a standard uncertainty ≥ 0");
        }

        double ash = Get("ashFraction");
        if (ash > 0 && role != CompoundRole.Biomass)
        {
            throw new ModelFormatException(path + ".ashFraction", "only a compound with role \"biomass\" has an ash fraction");
        }

        return new FormulaUncertainty(Get("degreeOfReduction"), Get("nitrogenPerCMol"), ash);
    }

    private static string FixedId(string id)
    {
        var chars = id.ToLowerInvariant().Select(c => char.IsAsciiLetterLower(c) || char.IsAsciiDigit(c) ? c : '_').ToArray();
        string s = new(chars);
        return s.Length > 0 && char.IsAsciiLetterLower(s[0]) ? s : "c_" + s;
    }

    private static bool IsValidId(string id) =>
        id.Length > 0 && char.IsAsciiLetterLower(id[0]) && id.All(c => char.IsAsciiLetterLower(c) || char.IsAsciiDigit(c) || c == '_');

    private static CompoundRole ReadRole(JsonElement r, string path)
    {
        string? s = r.ValueKind == JsonValueKind.String ? r.GetString() : null;
        foreach (var role in Enum.GetValues<CompoundRole>())
        {
            if (s == RoleName(role))
            {
                return role;
            }
        }

        throw new ModelFormatException(path, $"'{s ?? r.ValueKind.ToString()}' is not a role (allowed: {string.Join(", ", Enum.GetValues<CompoundRole>().Select(RoleName))})");
    }

    /// <summary>The role's name in model files (camelCase, e.g. <c>carbonDioxide</c>).</summary>
    public static string RoleName(CompoundRole role)
    {
        string s = role.ToString();
        return char.ToLowerInvariant(s[0]) + s[1..];
    }

    private static double ReadNumber(JsonElement e, string path) =>
        e.ValueKind == JsonValueKind.Number && e.TryGetDouble(out double v) && double.IsFinite(v)
            ? v
            : throw new ModelFormatException(path, $"expected a number, found {e.ValueKind}");

    private static double ReadPositive(JsonElement e, string path, string expectation)
    {
        double v = ReadNumber(e, path);
        return v > 0 ? v : throw new ModelFormatException(path, $"{v.ToString(CultureInfo.InvariantCulture)} is not {expectation}");
    }

    private static List<Balance> ReadBalances(JsonElement element, List<Compound> compounds)
    {
        if (element.ValueKind != JsonValueKind.Array)
        {
            throw new ModelFormatException("balances", $"expected an array such as [\"C\", \"gamma\", \"N\"], found {element.ValueKind}");
        }

        var present = PresentElements(compounds);
        var list = new List<Balance>();
        int i = 0;
        foreach (var item in element.EnumerateArray())
        {
            string path = $"balances[{i++}]";
            string? s = item.ValueKind == JsonValueKind.String ? item.GetString() : null;
            if (s is null || !Balance.TryParse(s, out var balance))
            {
                throw new ModelFormatException(path, $"'{s ?? item.ValueKind.ToString()}' is not a balance (allowed: element symbols C H O N S P, or \"gamma\" for the degree of reduction)");
            }

            if (balance.Element is { } e && !present.Contains(e))
            {
                throw new ModelFormatException(path, $"no compound contains {s}: a balance of it says nothing");
            }

            if (list.Contains(balance))
            {
                throw new ModelFormatException(path, $"'{s}' is listed twice");
            }

            list.Add(balance);
        }

        if (list.Count == 0)
        {
            throw new ModelFormatException("balances", "empty: list at least one balance, or leave the key out for every element present");
        }

        return list;
    }

    private static HashSet<Element> PresentElements(List<Compound> compounds) =>
        Elements.All.Where(e => compounds.Any(c => c.Formula[e] != 0)).ToHashSet();

    private static List<Balance> DefaultBalances(List<Compound> compounds) =>
        Elements.All.Where(PresentElements(compounds).Contains).Select(Balance.Of).ToList();
}
