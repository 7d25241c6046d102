using System.Globalization;
using System.Text.Json;
using SoftSensor.Core.Chemistry;
using SoftSensor.Core.Stoichiometry;

namespace SoftSensor.Core.Flux;

/// <summary>
/// Reads a flux model from JSON. The file is an elemental-balance model ("name", "compounds",
/// "balances", read by <see cref="ModelReader"/>, so the same file serves both) extended by the keys "metabolites", "reactions", "parameters", "splits" and
/// "maintenance" (docs/flux.md); other top-level keys are left to their readers.
/// Comments and trailing commas are allowed. Every error names the field.
/// </summary>
internal static class FluxModelReader
{
    private static readonly JsonDocumentOptions Options = new() { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true };

    public static FluxModel Parse(string json)
    {
        StoichiometricModel stoichiometry;
        try
        {
            stoichiometry = ModelReader.Parse(json);
        }
        catch (ModelFormatException ex)
        {
            throw new FluxModelException(ex.Message, ex);
        }

        JsonDocument doc;
        try
        {
            doc = JsonDocument.Parse(json, Options);
        }
        catch (JsonException ex)
        {
            throw new FluxModelException("model", $"not valid JSON (line {ex.LineNumber + 1}, byte {ex.BytePositionInLine + 1})");
        }

        using (doc)
        {
            var root = doc.RootElement;
            if (root.ValueKind != JsonValueKind.Object)
            {
                throw new FluxModelException("model", $"expected a JSON object, found {root.ValueKind}");
            }

            var top = JsonFields.Unique(root, "model");
            var compounds = stoichiometry.Compounds;
            var metabolites = top.TryGetValue("metabolites", out var m) ? ReadMetabolites(m, compounds) : [];
            var parameters = top.TryGetValue("parameters", out var p) ? ReadParameters(p) : [];
            var reactions = ReadReactions(Required(top, "reactions", "an object of reaction equations keyed by id"), compounds, metabolites, parameters);
            var splits = top.TryGetValue("splits", out var s) ? ReadSplits(s, reactions) : [];
            var model = new FluxModel(stoichiometry, metabolites, reactions, parameters, splits, null);
            return top.TryGetValue("maintenance", out var mt) ? model with { Maintenance = MaintenanceReader.Read(mt, model) } : model;
        }
    }

    private static JsonElement Required(Dictionary<string, JsonElement> top, string key, string expectation) =>
        top.TryGetValue(key, out var e) ? e : throw new FluxModelException(key, $"missing: a flux model needs {expectation}");

    private static List<Metabolite> ReadMetabolites(JsonElement element, IReadOnlyList<Compound> compounds)
    {
        var list = new List<Metabolite>();
        foreach (var (id, value) in JsonFields.Unique(JsonFields.Object(element, "metabolites"), "metabolites"))
        {
            string path = "metabolites." + id;
            if (!ReactionParser.IsIdentifier(id))
            {
                throw new FluxModelException(path, $"id '{id}' must be a letter, then letters, digits or '_'");
            }

            if (compounds.Any(c => c.Id == id))
            {
                throw new FluxModelException(path, $"'{id}' is already a compound: a species is either exchanged (compound) or balanced (metabolite)");
            }

            var props = JsonFields.Unique(JsonFields.Object(value, path), path);
            JsonFields.OnlyKeys(props, path, ["formula", "carrier", "note"]);
            bool carrier = props.TryGetValue("carrier", out var c) && JsonFields.Bool(c, path + ".carrier");
            bool hasFormula = props.TryGetValue("formula", out var f);
            if (carrier == hasFormula)
            {
                throw new FluxModelException(path, "give either \"formula\" (the elements of the moiety that moves, e.g. \"H2\" for NADH) or \"carrier\": true (no elements, e.g. ATP)");
            }

            var formula = hasFormula ? ParseFormula(JsonFields.String(f, path + ".formula"), path + ".formula") : null;
            string note = props.TryGetValue("note", out var nt) ? JsonFields.String(nt, path + ".note") : string.Empty;
            list.Add(new Metabolite(id, formula, note));
        }

        return list;
    }

    private static List<FluxParameter> ReadParameters(JsonElement element)
    {
        var list = new List<FluxParameter>();
        foreach (var (name, value) in JsonFields.Unique(JsonFields.Object(element, "parameters"), "parameters"))
        {
            string path = "parameters." + name;
            if (value.ValueKind == JsonValueKind.Number)
            {
                list.Add(new FluxParameter(name, JsonFields.Number(value, path), string.Empty, string.Empty));
                continue;
            }

            var props = JsonFields.Unique(JsonFields.Object(value, path), path);
            JsonFields.OnlyKeys(props, path, ["value", "unit", "source"]);
            double v = props.TryGetValue("value", out var ve) ? JsonFields.Number(ve, path + ".value") : throw new FluxModelException(path + ".value", "missing: give the number");
            string unit = props.TryGetValue("unit", out var u) ? JsonFields.String(u, path + ".unit") : string.Empty;
            string source = props.TryGetValue("source", out var s) ? JsonFields.String(s, path + ".source") : string.Empty;
            list.Add(new FluxParameter(name, v, unit, source));
        }

        return list;
    }

    private static List<Reaction> ReadReactions(JsonElement element, IReadOnlyList<Compound> compounds, List<Metabolite> metabolites, List<FluxParameter> parameters)
    {
        var species = new HashSet<string>(compounds.Select(c => c.Id).Concat(metabolites.Select(m => m.Id)), StringComparer.Ordinal);
        bool TryParameter(string name, out double value)
        {
            var p = parameters.FirstOrDefault(x => x.Name == name);
            value = p?.Value ?? 0;
            return p is not null;
        }

        var list = new List<Reaction>();
        foreach (var (id, value) in JsonFields.Unique(JsonFields.Object(element, "reactions"), "reactions"))
        {
            string path = "reactions." + id;
            if (!ReactionParser.IsIdentifier(id))
            {
                throw new FluxModelException(path, $"id '{id}' must be a letter, then letters, digits or '_'");
            }

            string equation;
            if (value.ValueKind == JsonValueKind.Object)
            {
                var props = JsonFields.Unique(value, path);
                JsonFields.OnlyKeys(props, path, ["equation", "note"]);
                equation = props.TryGetValue("equation", out var eq) ? JsonFields.String(eq, path + ".equation") : throw new FluxModelException(path + ".equation", "missing");
            }
            else
            {
                equation = JsonFields.String(value, path);
            }

            list.Add(ReactionParser.Parse(id, equation, species.Contains, TryParameter));
        }

        return list.Count > 0 ? list : throw new FluxModelException("reactions", "empty: a flux model needs at least one reaction");
    }

    private static List<FluxSplit> ReadSplits(JsonElement element, List<Reaction> reactions)
    {
        var list = new List<FluxSplit>();
        foreach (var (name, value) in JsonFields.Unique(JsonFields.Object(element, "splits"), "splits"))
        {
            string path = "splits." + name;
            var props = JsonFields.Unique(JsonFields.Object(value, path), path);
            JsonFields.OnlyKeys(props, path, ["flux", "per", "ratio", "source"]);
            string flux = props.TryGetValue("flux", out var f) ? JsonFields.String(f, path + ".flux") : throw new FluxModelException(path + ".flux", "missing: name the branch reaction");
            var per = props.TryGetValue("per", out var p)
                ? (p.ValueKind == JsonValueKind.Array ? p.EnumerateArray().Select((x, i) => JsonFields.String(x, $"{path}.per[{i}]")).ToList() : [JsonFields.String(p, path + ".per")])
                : throw new FluxModelException(path + ".per", "missing: name the reaction(s) the ratio refers to");
            foreach (string r in per.Append(flux))
            {
                if (!reactions.Any(x => x.Id == r))
                {
                    throw new FluxModelException(path, $"'{r}' is not a reaction of this model");
                }
            }

            double? ratio = props.TryGetValue("ratio", out var ra) && ra.ValueKind != JsonValueKind.Null ? JsonFields.Number(ra, path + ".ratio") : null;
            string source = props.TryGetValue("source", out var s) ? JsonFields.String(s, path + ".source") : string.Empty;
            list.Add(new FluxSplit(name, flux, per, ratio, source));
        }

        return list;
    }

    private static Formula ParseFormula(string text, string path) =>
        Formula.TryParse(text, out var formula, out string? error) ? formula! : throw new FluxModelException(path, error!.ReplaceLineEndings(" "));
}
