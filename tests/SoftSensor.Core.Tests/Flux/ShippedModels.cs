using SoftSensor.Core.Flux;

namespace SoftSensor.Core.Tests.Flux;

/// <summary>Reads the example networks from config/models of the repository.</summary>
internal static class ShippedModels
{
    public const string Bacterium = "glycerol-bacterium.json";
    public const string Yeast = "sucrose-yeast-anaerobic.json";

    public static string Path(string file)
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(System.IO.Path.Combine(dir.FullName, "SoftSensor.sln")))
        {
            dir = dir.Parent;
        }

        return System.IO.Path.Combine(dir?.FullName ?? throw new DirectoryNotFoundException("repository root (SoftSensor.sln) not found"), "config", "models", file);
    }

    public static string Json(string file) => File.ReadAllText(Path(file));

    public static FluxNetwork Network(string file) => FluxNetwork.Load(Json(file));

    /// <summary>Solves with biomass rate r_X as basis at biomass concentration X (C-mmol/L).</summary>
    public static FluxSolution AtGrowth(FluxNetwork network, double biomassRateCmmolPerLh, double biomassCmmolPerL) =>
        new FluxSolver(network, ["biomass"]).Solve([biomassRateCmmolPerLh], biomassCmmolPerL);

    public static double RateOf(FluxNetwork network, FluxSolution s, string compound) => s.Exchange[network.Model.CompoundIndex(compound)];

    public static double FluxOf(FluxNetwork network, FluxSolution s, string reaction) => s.Fluxes[network.Model.ReactionIndex(reaction)];
}
