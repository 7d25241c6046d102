using System.Text.Json;

namespace SoftSensor.Core.Flux;

/// <summary>Reads the "maintenance" object: the reaction and m_ATP per C-mmol biomass or per gram dry weight.</summary>
internal static class MaintenanceReader
{
    public static MaintenanceDemand Read(JsonElement element, FluxModel model)
    {
        const string path = "maintenance";
        var props = JsonFields.Unique(JsonFields.Object(element, path), path);
        JsonFields.OnlyKeys(props, path, ["reaction", "atpMmolPerCmmolBiomassPerH", "atpMmolPerGramPerH", "source"]);
        string reaction = props.TryGetValue("reaction", out var r) ? JsonFields.String(r, path + ".reaction") : throw new FluxModelException(path + ".reaction", "missing: name the reaction that drains maintenance ATP");
        if (model.ReactionIndex(reaction) < 0)
        {
            throw new FluxModelException(path + ".reaction", $"'{reaction}' is not a reaction of this model");
        }

        bool perC = props.TryGetValue("atpMmolPerCmmolBiomassPerH", out var c);
        bool perG = props.TryGetValue("atpMmolPerGramPerH", out var g);
        if (perC == perG)
        {
            throw new FluxModelException(path, "give exactly one of \"atpMmolPerCmmolBiomassPerH\" and \"atpMmolPerGramPerH\"");
        }

        double value;
        if (perC)
        {
            value = JsonFields.NonNegative(c, path + ".atpMmolPerCmmolBiomassPerH");
        }
        else
        {
            var biomass = model.Biomass ?? throw new FluxModelException(path + ".atpMmolPerGramPerH", "a per-gram value needs a compound with role biomass to convert it");

            // mmol/(g·h) * g dry weight per C-mmol = mmol/(C-mmol·h); g per C-mmol = M / (1 - ash) / 1000.
            value = JsonFields.NonNegative(g, path + ".atpMmolPerGramPerH") * biomass.WeighedMassGPerRateUnit / 1000.0;
        }

        string source = props.TryGetValue("source", out var s) ? JsonFields.String(s, path + ".source") : string.Empty;
        return new MaintenanceDemand(reaction, value, source);
    }
}
