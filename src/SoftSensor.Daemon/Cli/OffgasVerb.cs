using System.CommandLine;
using SoftSensor.Core.Gas;
using SoftSensor.Daemon.Cli.Offgas;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor offgas</c>: one inert-gas balance (OUR, CER, RQ, their uncertainty and quality)
/// from flags (docs/methods.md §1.1-1.3, 1.8). Bad input: one line on stderr, exit code 2. A balance
/// that ran exits 0 whatever its quality; the quality and its reasons are in the output.
/// </summary>
internal sealed class OffgasVerb : IVerb
{
    public Command Build()
    {
        var options = new OffgasOptions();
        var command = new Command("offgas", "One off-gas balance: OUR, CER (= CTR) and RQ from gas-line flows and analyser readings, with propagated uncertainty and quality.");
        foreach (var option in options.All)
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            var output = parse.InvocationConfiguration.Output;
            var error = parse.InvocationConfiguration.Error;
            if (!new OffgasRequestReader(options, parse).TryRead(out var request, out string message))
            {
                return CliOutput.BadInput(error, message);
            }

            var result = GasBalance.Compute(request.Flows, request.Inlet, request.Outlet, request.VolumeL, request.Settings);
            var report = OffgasReport.From(request, result);
            if (request.Json)
            {
                CliOutput.WriteJson(output, report);
            }
            else
            {
                OffgasTable.Write(output, request, report);
            }

            return ExitCodes.Ok;
        });
        return command;
    }
}
