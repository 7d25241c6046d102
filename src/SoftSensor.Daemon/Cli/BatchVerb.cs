using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using SoftSensor.Daemon.Batches;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor batch start|phase|end|status --reactor R ...</c>: batch commands to a running daemon
/// through its status API (<see cref="BatchEndpoints"/>), found as <see cref="DaemonLocator"/> says.
/// Prints the batch as text (<c>--json</c>: the daemon's answer); exit 2 with the daemon's problems on
/// one stderr line when it refuses, 1 when it cannot be reached.
/// </summary>
internal sealed class BatchVerb : IVerb
{
    public Command Build()
    {
        var client = new DaemonClient();
        var reactor = new Option<string>("--reactor") { Description = "reactor id", Required = true };
        var id = new Option<string>("--id") { Description = "batch id", Required = true };
        var volume = new Option<double>("--volume-l") { Description = "initial liquid volume, L", Required = true };
        var biomass = new Option<double>("--biomass-g-per-l") { Description = "inoculum biomass (dry cell weight), g/L", Required = true };
        var sigma = new Option<double>("--biomass-sigma-g-per-l") { Description = "standard uncertainty of the inoculum biomass, g/L", Required = true };
        var substrate = new Option<double>("--substrate-g-per-l") { Description = "initial substrate, g/L", DefaultValueFactory = _ => 0 };

        var start = client.On(new Command("start", "Start a batch with its initial conditions") { reactor, id, volume, biomass, sigma, substrate });
        start.SetAction((p, ct) => client.SendAsync(p, $"/api/batches/{Esc(p.GetValue(reactor)!)}/start",
            new BatchStart(p.GetValue(id)!, p.GetValue(volume), p.GetValue(biomass), p.GetValue(sigma), p.GetValue(substrate)), ct, e => Describe(e, "started")));
        var end = client.On(new Command("end", "End the open batch of a reactor") { reactor });
        end.SetAction((p, ct) => client.SendAsync(p, $"/api/batches/{Esc(p.GetValue(reactor)!)}/end", new { }, ct, e => Describe(e, "ended")));
        var phaseId = new Option<string>("--phase") { Description = $"phase: {Core.Batches.BatchPhases.Ids}", Required = true };
        var phase = client.On(new Command("phase", "Move the open batch of a reactor to a phase") { reactor, phaseId });
        phase.SetAction((p, ct) => client.SendAsync(p, $"/api/batches/{Esc(p.GetValue(reactor)!)}/phase", new PhaseCommand(p.GetValue(phaseId)), ct, e => Describe(e, "moved")));
        var status = client.On(new Command("status", "Show the open batch of a reactor with its phase") { reactor });
        status.SetAction((p, ct) => client.SendAsync(p, $"/api/batches/{Esc(p.GetValue(reactor)!)}", null, ct, e => Describe(e, null),
            e => NoOpenBatch(p.GetValue(reactor)!, e)));
        return new Command("batch", "Batch commands to a running daemon: start, phase, end, status") { start, phase, end, status };
    }

    /// <summary>One request to the daemon at <paramref name="baseUrl"/>, its answer printed as JSON (for programs and tests).</summary>
    public static Task<int> SendAsync(string baseUrl, string path, object? body, TextWriter output, TextWriter error, CancellationToken ct) =>
        Uri.TryCreate(baseUrl, UriKind.Absolute, out var url)
            ? DaemonClient.ExchangeAsync(new DaemonTarget(url, "--url"), path, body, json: true, null, null, output, error, ct)
            : Task.FromResult(CliOutput.BadInput(error, $"--url is '{baseUrl}' (expected an http:// URL such as http://127.0.0.1:8470)"));

    private static string Esc(string reactor) => Uri.EscapeDataString(reactor);

    /// <summary>A batch as text: id, state and phase, then its initial conditions.</summary>
    internal static string Describe(JsonElement b, string? verb)
    {
        string S(string name)
        {
            string text = b.TryGetProperty(name, out var v) && v.ValueKind == JsonValueKind.String ? v.GetString() ?? "" : "";
            bool time = name.EndsWith("At", StringComparison.Ordinal) || name == "phaseSince";
            return time && DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.None, out var t)
                ? t.UtcDateTime.ToString("yyyy-MM-dd HH:mm:ss 'UTC'", CultureInfo.InvariantCulture)
                : text;
        }

        string N(string name, string format) => b.TryGetProperty(name, out var v) && v.ValueKind == JsonValueKind.Number ? v.GetDouble().ToString(format, CultureInfo.InvariantCulture) : "-";
        bool open = string.IsNullOrEmpty(S("endedAt"));
        string state = open ? $"open, phase {S("phase")} since {S("phaseSince")}" : $"ended {S("endedAt")}";
        return $"reactor {S("reactor")}: batch {S("batchId")} {(verb is null ? "" : verb + "; ")}{state}\n"
            + $"  started {S("startedAt")}; initial volume {N("initialVolumeL", "G4")} L, inoculum {N("inoculumBiomassGPerL", "F3")} ± {N("inoculumBiomassSigmaGPerL", "F3")} g/L, substrate {N("initialSubstrateGPerL", "G4")} g/L";
    }

    /// <summary>The daemon's 404 for a known reactor without an open batch, as an answer; null for an unknown reactor.</summary>
    private static string? NoOpenBatch(string reactor, JsonElement e)
    {
        if (!e.TryGetProperty("configuredBatchId", out var configured))
        {
            return null;
        }

        string id = configured.GetString() ?? "";
        return $"reactor {reactor}: no open batch"
            + (id.Length > 0 ? $"; its estimates carry the configured batch id '{id}'" : "")
            + " (start one with: softsensor batch start --reactor " + reactor + " --id ...)";
    }
}
