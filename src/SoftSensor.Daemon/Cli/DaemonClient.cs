using System.CommandLine;
using System.Net;
using System.Net.Http.Json;
using System.Text.Json;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// The options and the HTTP exchange the client verbs (<c>batch</c>, <c>sample</c>) share: how to find
/// the daemon (<see cref="DaemonLocator"/>), <c>--json</c> for the daemon's answer as it came, else
/// readable text. Exit 0 answered, 1 not reachable, 2 bad input or refused (the daemon's problems on
/// one stderr line).
/// </summary>
internal sealed class DaemonClient
{
    public Option<string?> Url { get; } = new("--url") { Description = "status URL of the running daemon (default: found from --config, --data, ./data or /var/lib/softsensor)" };

    public Option<string?> Config { get; } = new("--config") { Description = "the definition the daemon runs: its state directory holds the daemon's status file" };

    public Option<string?> Data { get; } = new("--data") { Description = "the daemon's state directory (the folder of its store; the demo's --data)" };

    public Option<bool> Json { get; } = new("--json") { Description = "print the daemon's answer as one JSON document" };

    /// <summary>Adds the shared options to a command.</summary>
    public T On<T>(T command)
        where T : Command
    {
        command.Options.Add(Url);
        command.Options.Add(Config);
        command.Options.Add(Data);
        command.Options.Add(Json);
        return command;
    }

    /// <summary>
    /// POSTs <paramref name="body"/> (GET when null) to the daemon and prints the answer. <paramref name="human"/>
    /// renders a success as text (default: <see cref="JsonText"/>); <paramref name="notFound"/>, when given,
    /// renders a 404 as an ordinary answer (exit 0) instead of a refusal.
    /// </summary>
    public async Task<int> SendAsync(ParseResult p, string path, object? body, CancellationToken ct,
        Func<JsonElement, string>? human = null, Func<JsonElement, string?>? notFound = null)
    {
        var (target, problem) = DaemonLocator.Find(p.GetValue(Url), p.GetValue(Config), p.GetValue(Data));
        return target is null
            ? CliOutput.BadInput(p.InvocationConfiguration.Error, problem!)
            : await ExchangeAsync(target, path, body, p.GetValue(Json), human, notFound, p.InvocationConfiguration.Output, p.InvocationConfiguration.Error, ct);
    }

    /// <summary>One request to a found daemon; the answer printed as JSON (<paramref name="json"/>) or text.</summary>
    public static async Task<int> ExchangeAsync(DaemonTarget target, string path, object? body, bool json, Func<JsonElement, string>? human, Func<JsonElement, string?>? notFound,
        TextWriter output, TextWriter error, CancellationToken ct)
    {
        using var http = new HttpClient { BaseAddress = target.Url, Timeout = TimeSpan.FromSeconds(10) };
        // The bearer token: SOFTSENSOR_TOKEN, else the file SOFTSENSOR_TOKEN_FILE names (docs/security.md).
        if (Access.ClientToken.FromEnvironment() is { Length: > 0 } bearer)
        {
            http.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", bearer);
        }

        HttpResponseMessage response;
        try
        {
            response = body is null ? await http.GetAsync(new Uri(path, UriKind.Relative), ct) : await http.PostAsJsonAsync(new Uri(path, UriKind.Relative), body, ct);
        }
        catch (Exception e) when (e is HttpRequestException or TaskCanceledException && !ct.IsCancellationRequested)
        {
            await error.WriteLineAsync($"error: daemon at {target.Url} (from {target.FoundBy}) not reachable: {e.Message}");
            return ExitCodes.Failure;
        }

        using (response)
        {
            string text = await response.Content.ReadAsStringAsync(ct);
            if (response.IsSuccessStatusCode)
            {
                await output.WriteLineAsync(json ? text : Readable(text, human));
                return ExitCodes.Ok;
            }

            if (response.StatusCode == HttpStatusCode.NotFound && notFound is not null)
            {
                using var doc = Parse(text);
                if (doc is not null && notFound(doc.RootElement) is { } answer)
                {
                    await output.WriteLineAsync(json ? text : answer);
                    return ExitCodes.Ok;
                }
            }

            return CliOutput.BadInput(error, $"daemon refused ({(int)response.StatusCode}): {Problems(text)}");
        }
    }

    private static string Readable(string text, Func<JsonElement, string>? human)
    {
        using var doc = Parse(text);
        return doc is null ? text : (human ?? JsonText.Render)(doc.RootElement);
    }

    private static string Problems(string text)
    {
        using var doc = Parse(text);
        return doc is not null && doc.RootElement.ValueKind == JsonValueKind.Object && doc.RootElement.TryGetProperty("problems", out var p) && p.ValueKind == JsonValueKind.Array
            ? string.Join(" | ", p.EnumerateArray().Select(x => x.ToString()))
            : text;
    }

    private static JsonDocument? Parse(string text)
    {
        try
        {
            return JsonDocument.Parse(text);
        }
        catch (JsonException)
        {
            return null;
        }
    }
}
