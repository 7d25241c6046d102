using System.CommandLine;
using System.Net.Http.Json;
using System.Text.Json;
using SoftSensor.Daemon.Batches;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// <c>softsensor batch start|phase|end|status --url http://127.0.0.1:PORT --reactor R ...</c>: batch commands
/// to a running daemon through its status API (<see cref="BatchEndpoints"/>). Prints the daemon's JSON answer;
/// exit 2 with the daemon's problems on one stderr line when it refuses, 1 when it cannot be reached.
/// </summary>
internal sealed class BatchVerb : IVerb
{
    public Command Build()
    {
        var url = new Option<string>("--url") { Description = "status URL of the running daemon", DefaultValueFactory = _ => "http://127.0.0.1:8470" };
        var reactor = new Option<string>("--reactor") { Description = "reactor id", Required = true };
        var id = new Option<string>("--id") { Description = "batch id", Required = true };
        var volume = new Option<double>("--volume-l") { Description = "initial liquid volume, L", Required = true };
        var biomass = new Option<double>("--biomass-g-per-l") { Description = "inoculum biomass (dry cell weight), g/L", Required = true };
        var sigma = new Option<double>("--biomass-sigma-g-per-l") { Description = "standard uncertainty of the inoculum biomass, g/L", Required = true };
        var substrate = new Option<double>("--substrate-g-per-l") { Description = "initial substrate, g/L", DefaultValueFactory = _ => 0 };

        var start = new Command("start", "Start a batch with its initial conditions") { url, reactor, id, volume, biomass, sigma, substrate };
        start.SetAction((p, ct) => SendAsync(p.GetValue(url)!, $"/api/batches/{p.GetValue(reactor)}/start",
            new BatchStart(p.GetValue(id)!, p.GetValue(volume), p.GetValue(biomass), p.GetValue(sigma), p.GetValue(substrate)), Console.Out, Console.Error, ct));
        var end = new Command("end", "End the open batch of a reactor") { url, reactor };
        end.SetAction((p, ct) => SendAsync(p.GetValue(url)!, $"/api/batches/{p.GetValue(reactor)}/end", new { }, Console.Out, Console.Error, ct));
        var phaseId = new Option<string>("--phase") { Description = $"phase: {Core.Batches.BatchPhases.Ids}", Required = true };
        var phase = new Command("phase", "Move the open batch of a reactor to a phase") { url, reactor, phaseId };
        phase.SetAction((p, ct) => SendAsync(p.GetValue(url)!, $"/api/batches/{p.GetValue(reactor)}/phase", new PhaseCommand(p.GetValue(phaseId)), Console.Out, Console.Error, ct));
        var status = new Command("status", "Show the open batch of a reactor with its phase") { url, reactor };
        status.SetAction((p, ct) => SendAsync(p.GetValue(url)!, $"/api/batches/{p.GetValue(reactor)}", null, Console.Out, Console.Error, ct));
        return new Command("batch", "Batch commands to a running daemon: start, phase, end, status") { start, phase, end, status };
    }

    /// <summary>
    /// POSTs <paramref name="body"/> (GET when null) and prints the answer; the exit code. The bearer token is
    /// <paramref name="token"/>, else the environment's <c>SOFTSENSOR_TOKEN</c>, else the file named by <c>SOFTSENSOR_TOKEN_FILE</c>.
    /// </summary>
    public static async Task<int> SendAsync(string baseUrl, string path, object? body, TextWriter output, TextWriter error, CancellationToken ct, string? token = null)
    {
        if (!Uri.TryCreate(baseUrl, UriKind.Absolute, out var root) || (root.Scheme != Uri.UriSchemeHttp && root.Scheme != Uri.UriSchemeHttps))
        {
            return CliOutput.BadInput(error, $"--url is '{baseUrl}' (expected an http:// or https:// URL such as http://127.0.0.1:8470)");
        }

        using var http = new HttpClient { BaseAddress = root, Timeout = TimeSpan.FromSeconds(10) };
        if ((token ?? Access.ClientToken.FromEnvironment()) is { Length: > 0 } bearer)
        {
            http.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", bearer);
        }

        HttpResponseMessage response;
        try
        {
            response = body is null ? await http.GetAsync(new Uri(path, UriKind.Relative), ct) : await http.PostAsJsonAsync(new Uri(path, UriKind.Relative), body, ct);
        }
        catch (HttpRequestException e)
        {
            error.WriteLine($"error: daemon at {root} not reachable: {e.Message}");
            return ExitCodes.Failure;
        }

        using (response)
        {
            string text = await response.Content.ReadAsStringAsync(ct);
            if (response.IsSuccessStatusCode)
            {
                output.WriteLine(text);
                return ExitCodes.Ok;
            }

            string problems = text;
            try
            {
                using var doc = JsonDocument.Parse(text);
                if (doc.RootElement.TryGetProperty("problems", out var p))
                {
                    problems = string.Join(" | ", p.EnumerateArray().Select(x => x.GetString()));
                }
            }
            catch (JsonException)
            {
                problems = text;
            }

            return CliOutput.BadInput(error, $"daemon refused ({(int)response.StatusCode}): {problems}");
        }
    }
}
