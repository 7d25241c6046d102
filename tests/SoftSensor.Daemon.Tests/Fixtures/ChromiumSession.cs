using System.Diagnostics;
using System.Net.WebSockets;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace SoftSensor.Daemon.Tests.Fixtures;

/// <summary>
/// Headless Chromium driven over the Chrome DevTools Protocol (a WebSocket, no package): navigate,
/// evaluate script in the page, wait for a condition. One browser with a fresh profile per instance,
/// so cookies live as long as the instance.
/// </summary>
internal sealed class ChromiumSession : IAsyncDisposable
{
    private const string Binary = "/usr/bin/chromium";
    private readonly Process _process;
    private readonly string _profile;
    private readonly ClientWebSocket _socket;
    private int _nextId;

    private ChromiumSession(Process process, string profile, ClientWebSocket socket)
    {
        _process = process;
        _profile = profile;
        _socket = socket;
    }

    public static bool Available => File.Exists(Binary);

    public static async Task<ChromiumSession> StartAsync()
    {
        if (!Available)
        {
            throw new InvalidOperationException($"{Binary} is missing: run tests/run.sh, which installs the Debian package chromium");
        }

        string profile = Directory.CreateTempSubdirectory("softsensor-cdp-").FullName;
        var psi = new ProcessStartInfo(Binary,
        [
            "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
            "--disable-component-update", "--disable-sync", "--remote-debugging-port=0", "--user-data-dir=" + profile, "about:blank",
        ])
        { RedirectStandardError = true, RedirectStandardOutput = true, UseShellExecute = false };
        var p = Process.Start(psi) ?? throw new InvalidOperationException("chromium did not start");
        _ = p.StandardError.ReadToEndAsync();
        _ = p.StandardOutput.ReadToEndAsync();
        string portFile = Path.Combine(profile, "DevToolsActivePort");
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(30);
        while (!File.Exists(portFile) || File.ReadAllLines(portFile).Length < 2)
        {
            if (DateTime.UtcNow > until || p.HasExited)
            {
                p.Kill(entireProcessTree: true);
                throw new TimeoutException("chromium did not open its DevTools port within 30 s");
            }

            await Task.Delay(50);
        }

        string port = File.ReadAllLines(portFile)[0].Trim();
        using var http = new HttpClient();
        string? ws = null;
        while (ws is null)
        {
            var list = JsonNode.Parse(await http.GetStringAsync(new Uri($"http://127.0.0.1:{port}/json/list")))!.AsArray();
            ws = list.FirstOrDefault(t => (string?)t!["type"] == "page")?["webSocketDebuggerUrl"]?.GetValue<string>();
            if (ws is null)
            {
                Assert.True(DateTime.UtcNow < until, "chromium opened no page target");
                await Task.Delay(50);
            }
        }

        var socket = new ClientWebSocket();
        await socket.ConnectAsync(new Uri(ws), CancellationToken.None);
        return new ChromiumSession(p, profile, socket);
    }

    /// <summary>Loads <paramref name="url"/> and waits until the document is complete.</summary>
    public async Task NavigateAsync(string url)
    {
        await SendAsync("Page.navigate", new JsonObject { ["url"] = url });
        await WaitForAsync($"document.readyState === 'complete' && location.href.startsWith({JsonSerializer.Serialize(url.Split('?')[0])})", "the page " + url);
    }

    /// <summary>Runs <paramref name="script"/> in the page (promises awaited); its value as JSON.</summary>
    public async Task<JsonNode?> EvaluateAsync(string script)
    {
        var r = await SendAsync("Runtime.evaluate", new JsonObject { ["expression"] = script, ["returnByValue"] = true, ["awaitPromise"] = true });
        if (r["exceptionDetails"] is { } ex)
        {
            throw new InvalidOperationException("script failed: " + ex.ToJsonString());
        }

        return r["result"]?["value"];
    }

    /// <summary>Polls <paramref name="condition"/> (a script yielding true) for up to 20 s.</summary>
    public async Task WaitForAsync(string condition, string what)
    {
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(20);
        while (true)
        {
            try
            {
                if (await EvaluateAsync($"!!({condition})") is JsonValue v && v.GetValue<bool>())
                {
                    return;
                }
            }
            catch (InvalidOperationException)
            {
                // The page is navigating: evaluate again.
            }

            if (DateTime.UtcNow > until)
            {
                string body = (await EvaluateAsync("document.body ? document.body.innerText.slice(0, 1500) : ''"))?.ToString() ?? "";
                throw new TimeoutException($"waited 20 s for {what}; the page shows: {body}");
            }

            await Task.Delay(100);
        }
    }

    private async Task<JsonNode> SendAsync(string method, JsonObject parameters)
    {
        int id = Interlocked.Increment(ref _nextId);
        var message = new JsonObject { ["id"] = id, ["method"] = method, ["params"] = parameters };
        await _socket.SendAsync(Encoding.UTF8.GetBytes(message.ToJsonString()), WebSocketMessageType.Text, true, CancellationToken.None);
        using var cts = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        var buffer = new byte[1 << 16];
        while (true)
        {
            using var ms = new MemoryStream();
            WebSocketReceiveResult r;
            do
            {
                r = await _socket.ReceiveAsync(buffer, cts.Token);
                ms.Write(buffer, 0, r.Count);
            }
            while (!r.EndOfMessage);
            var node = JsonNode.Parse(ms.ToArray())!;
            if (node["id"] is { } got && got.GetValue<int>() == id)
            {
                return node["error"] is { } error ? throw new InvalidOperationException(method + ": " + error.ToJsonString()) : node["result"]!;
            }
        }
    }

    public async ValueTask DisposeAsync()
    {
        try
        {
            await _socket.CloseAsync(WebSocketCloseStatus.NormalClosure, "", CancellationToken.None);
        }
        catch (WebSocketException)
        {
            // The browser may already be gone.
        }

        _socket.Dispose();
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
            await _process.WaitForExitAsync();
        }

        _process.Dispose();
        try
        {
            Directory.Delete(_profile, recursive: true);
        }
        catch (IOException)
        {
            // A leftover temp folder is harmless.
        }
    }
}
