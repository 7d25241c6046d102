using System.CommandLine;
using SoftSensor.Daemon.Cli.Flux;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor flux --model FILE --basis ID=VALUE [--basis ...] [--biomass-g-per-l X] [--json]</c>:
/// solves a pathway flux model (docs/methods.md §3) from basis rates and prints every flux, every
/// exchange rate, the extra equations over the black-box balance, the undetermined fluxes and the
/// elemental closure.
/// </summary>
internal sealed class FluxVerb : IVerb
{
    public Command Build()
    {
        var model = new Option<string>("--model")
        {
            Description = "Model file (JSON): compounds as for 'balance', plus metabolites, reactions, parameters, splits, maintenance",
            Required = true,
        };
        var basis = new Option<string[]>("--basis")
        {
            Description = "A known rate ID=VALUE: a compound id (C-mmol/(L·h) for organics, mmol/(L·h) otherwise, production > 0) or a reaction id (mmol/(L·h)); repeat for more",
            Required = true,
            Arity = ArgumentArity.OneOrMore,
        };
        var biomass = new Option<double?>("--biomass-g-per-l")
        {
            Description = "Biomass dry weight in g/L (ash included); needed when the model has a maintenance demand",
        };
        var json = new Option<bool>("--json") { Description = "Print exactly one JSON document" };
        var command = new Command("flux", "Solve a pathway flux model (NADH and ATP balances) from basis rates: fluxes, exchange rates, extra equations, elemental closure")
        {
            model, basis, biomass, json,
        };
        command.SetAction(parse => FluxCommand.Run(
            new FluxArguments(parse.GetValue(model)!, parse.GetValue(basis) ?? [], parse.GetValue(biomass), parse.GetValue(json)),
            Console.Out,
            Console.Error));
        return command;
    }
}
