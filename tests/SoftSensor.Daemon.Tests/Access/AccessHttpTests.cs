using System.Diagnostics;
using System.Net;
using System.Net.Http.Headers;
using System.Text;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using SoftSensor.Daemon.Access;
using SoftSensor.Daemon.Alarming;
using SoftSensor.Daemon.Batches;
using SoftSensor.Daemon.Samples;
using SoftSensor.Daemon.Tests.Alarming;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Access;

/// <summary>
/// Access control over real HTTP (a real Kestrel on a loopback port): who may write, cross-site
/// requests, foreign Host headers, oversized bodies. The attacks are those of OWASP's Cross-Site
/// Request Forgery Prevention Cheat Sheet (form post and no-cors fetch from another origin) and of
/// DNS rebinding (a foreign Host header).
/// </summary>
public sealed class AccessHttpTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>, IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-acc-").FullName;

    /// <summary>Every write of the status server, with a body that would be accepted from an operator.</summary>
    internal static readonly (string Path, Func<HttpContent> Body)[] Writes =
    [
        ("/api/batches/r1/start", () => Json("""{"batchId":"x-1","initialVolumeL":5,"inoculumBiomassGPerL":0.5,"inoculumBiomassSigmaGPerL":0.05,"initialSubstrateGPerL":20}""")),
        ("/api/batches/r1/end", () => Json("{}")),
        ("/api/batches/r1/phase", () => Json("""{"phase":"harvest"}""")),
        ("/api/samples/r1", () => Json("""{"kind":"dcw","sampledAt":"2026-03-01T10:00:00Z","valueGPerL":50,"sigmaGPerL":1}""")),
        ("/api/alarm-commands", () => Json("""{"command":"acknowledge","alarm":"*","operator":"csrf","reactor":"r1"}""")),
        ("/batches/r1/start", () => Form(("batchId", "x-2"), ("initialVolumeL", "5"), ("inoculumBiomassGPerL", "0.5"), ("inoculumBiomassSigmaGPerL", "0.05"), ("initialSubstrateGPerL", "20"))),
        ("/batches/r1/phase", () => Form(("phase", "harvest"))),
        ("/batches/r1/end", () => Form()),
        ("/samples/r1", () => Form(("kind", "removal"), ("sampledAt", "2026-03-01T10:00:00Z"), ("withdrawnMl", "5000"))),
    ];

    [Fact]
    public async Task Every_write_endpoint_answers_401_without_credentials_and_403_for_a_viewer()
    {
        await using var daemon = await StartAsync("it-acc-roles");
        // The list above is every write the server maps: a new write endpoint fails here until it is listed (and so tested).
        var mapped = daemon.Get<EndpointDataSource>().Endpoints.OfType<RouteEndpoint>()
            .Where(e => e.Metadata.GetMetadata<Microsoft.AspNetCore.Routing.HttpMethodMetadata>()?.HttpMethods.Any(m => m != "GET" && m != "HEAD") == true)
            .Select(e => "/" + e.RoutePattern.RawText!.TrimStart('/').Replace("{reactor}", "r1", StringComparison.Ordinal))
            .Where(p => p is not "/login" and not "/logout").Order(StringComparer.Ordinal).ToList();
        Assert.Equal(Writes.Select(w => w.Path).Order(StringComparer.Ordinal), mapped);

        using var anonymous = new HttpClient { BaseAddress = new Uri(daemon.StatusAddress) };
        using var viewer = new HttpClient { BaseAddress = new Uri(daemon.StatusAddress) };
        viewer.DefaultRequestHeaders.Authorization = TestAccess.Viewer;
        using var wrongToken = new HttpClient { BaseAddress = new Uri(daemon.StatusAddress) };
        wrongToken.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", "not-a-token");
        using var viewerSession = await LoginClient.LogInAsync(daemon.StatusAddress, TestAccess.ViewerUser);
        foreach (var (path, body) in Writes)
        {
            Assert.Equal(HttpStatusCode.Unauthorized, await StatusAsync(anonymous, path, body()));
            Assert.Equal(HttpStatusCode.Unauthorized, await StatusAsync(wrongToken, path, body()));
            Assert.Equal(HttpStatusCode.Forbidden, await StatusAsync(viewer, path, body()));
            Assert.Equal(HttpStatusCode.Forbidden, await StatusAsync(viewerSession.Http, path, body()));
        }

        Assert.Null(daemon.Get<BatchBook>().Current("r1"));
        Assert.Empty(daemon.Get<SampleBook>().List("r1", null, 10));
        Assert.Empty(daemon.Get<AccessJournal>().Recent(10));
        // Reading stays open on loopback (access:anonymousRead defaults to true there).
        Assert.Equal(HttpStatusCode.OK, (await anonymous.GetAsync(new Uri("/api/status", UriKind.Relative))).StatusCode);
    }

    [Fact]
    public async Task A_cross_origin_form_post_and_a_no_cors_fetch_with_a_valid_session_but_no_anti_forgery_token_change_nothing()
    {
        await using var daemon = await StartAsync("it-acc-csrf");
        using var alice = await LoginClient.LogInAsync(daemon.StatusAddress, TestAccess.OperatorUser);
        string origin = daemon.StatusAddress.TrimEnd('/');
        foreach (var (path, body) in Writes)
        {
            // What a browser sends for a form auto-submitted by a page of another origin (cookie included: same site, other port).
            using var form = new HttpRequestMessage(HttpMethod.Post, path) { Content = body() };
            form.Headers.Add("Origin", "http://127.0.0.1:1");
            form.Headers.Add("Sec-Fetch-Site", "same-site");
            Assert.Equal(HttpStatusCode.Forbidden, (await alice.Http.SendAsync(form)).StatusCode);
            // A no-cors fetch from an attacker's page: the Origin is the attacker's, or "null" from a sandboxed frame.
            using var fetch = new HttpRequestMessage(HttpMethod.Post, path) { Content = body() };
            fetch.Headers.Add("Origin", "null");
            Assert.Equal(HttpStatusCode.Forbidden, (await alice.Http.SendAsync(fetch)).StatusCode);
            // Same origin but without the token (an injected form without the hidden field): refused too.
            using var tokenless = new HttpRequestMessage(HttpMethod.Post, path) { Content = body() };
            tokenless.Headers.Add("Origin", origin);
            Assert.Equal(HttpStatusCode.Forbidden, (await alice.Http.SendAsync(tokenless)).StatusCode);
        }

        Assert.Null(daemon.Get<BatchBook>().Current("r1"));
        Assert.Empty(daemon.Get<SampleBook>().List("r1", null, 10));
        Assert.Empty(daemon.Get<AccessJournal>().Recent(10));

        // With the page's token the same session may write: the refusals above were the missing token, not the session.
        string token = await alice.AntiForgeryAsync();
        using var ok = new HttpRequestMessage(HttpMethod.Post, "/batches/r1/start")
        {
            Content = Form(("_csrf", token), ("batchId", "b-ok"), ("initialVolumeL", "5"), ("inoculumBiomassGPerL", "0.5"), ("inoculumBiomassSigmaGPerL", "0.05"), ("initialSubstrateGPerL", "20")),
        };
        ok.Headers.Add("Origin", origin);
        Assert.Equal(HttpStatusCode.OK, (await alice.Http.SendAsync(ok)).StatusCode);
        Assert.Equal("b-ok", daemon.Get<BatchBook>().Current("r1")?.BatchId);
    }

    [Theory]
    [InlineData("attacker.example")]
    [InlineData("attacker.example:8470")]
    [InlineData("10.0.0.5")]
    public async Task A_foreign_Host_header_answers_421(string host)
    {
        await using var daemon = await StartAsync("it-acc-host");
        using var http = TestAccess.OperatorClient(daemon.StatusAddress);
        foreach (string path in new[] { "/", "/api/status", "/metrics", "/login" })
        {
            using var get = new HttpRequestMessage(HttpMethod.Get, path);
            get.Headers.Host = host;
            Assert.Equal(HttpStatusCode.MisdirectedRequest, (await http.SendAsync(get)).StatusCode);
        }

        using var post = new HttpRequestMessage(HttpMethod.Post, "/api/batches/r1/end") { Content = Json("{}") };
        post.Headers.Host = host;
        Assert.Equal(HttpStatusCode.MisdirectedRequest, (await http.SendAsync(post)).StatusCode);
        using var own = new HttpRequestMessage(HttpMethod.Get, "/api/status");
        own.Headers.Host = "localhost";
        Assert.Equal(HttpStatusCode.OK, (await http.SendAsync(own)).StatusCode);
    }

    [Fact]
    public async Task A_25_MB_body_answers_413_and_resident_memory_stays_within_50_MB()
    {
        await using var daemon = await StartAsync("it-acc-size");
        using var http = TestAccess.OperatorClient(daemon.StatusAddress);
        const long size = 25L * 1024 * 1024;
        // Warm up every path once, then measure: the growth is what the large bodies cost.
        foreach (var (path, body) in Writes)
        {
            await StatusAsync(http, path, body());
        }

        int samples = daemon.Get<SampleBook>().List("r1", null, 100).Count;
        long before = ResidentBytes();
        var posts = new List<Task<HttpStatusCode>>();
        for (int i = 0; i < 8; i++)
        {
            foreach (string path in new[] { "/api/samples/r1", "/api/alarm-commands", "/batches/r1/start", "/samples/r1" })
            {
                posts.Add(PostLargeAsync(daemon.StatusAddress, path, size, chunked: i % 2 == 1));
            }
        }

        var answers = await Task.WhenAll(posts);
        long after = ResidentBytes();
        Assert.All(answers, a => Assert.Equal(HttpStatusCode.RequestEntityTooLarge, a));
        Assert.True(after - before < 50L * 1024 * 1024, $"resident memory grew by {(after - before) / 1024.0 / 1024.0:0.0} MB (from {before / 1024 / 1024} MB)");
        Assert.Equal(samples, daemon.Get<SampleBook>().List("r1", null, 100).Count);
    }

    [Fact]
    public async Task Each_state_change_is_journaled_with_the_authenticated_user_never_a_name_from_the_body()
    {
        var config = TestConfigs.HandCase(broker.Port, "it-acc-journal");
        config["alarms:ruleFiles:0"] = DaemonAlarmsTests.RuleFile(_dir);
        await using var daemon = await TestDaemon.StartAsync(config);
        await using var client = await TestMqttClient.ConnectAsync(broker.Port, "it-acc-journal-client");
        await Integration.DaemonMqttTests.PublishHandCaseAsync(client, "it-acc-journal");
        var alarms = daemon.Get<AlarmService>();
        await WaitAsync(() => alarms.Engine.States().Any(s => s.Alarm == "rq_high" && s.AwaitingAcknowledgement), "rq_high awaiting acknowledgement");

        using var alice = await LoginClient.LogInAsync(daemon.StatusAddress, TestAccess.OperatorUser);
        string token = await alice.AntiForgeryAsync();
        Assert.Equal(HttpStatusCode.OK, await StatusAsync(alice.Http, "/batches/r1/start",
            Form(("_csrf", token), ("batchId", "j-1"), ("initialVolumeL", "5"), ("inoculumBiomassGPerL", "0.5"), ("inoculumBiomassSigmaGPerL", "0.05"), ("initialSubstrateGPerL", "20"))));
        Assert.Equal(HttpStatusCode.OK, await StatusAsync(alice.Http, "/batches/r1/phase", Form(("_csrf", token), ("phase", "fed-batch"))));
        using var bearer = TestAccess.OperatorClient(daemon.StatusAddress);
        Assert.Equal(HttpStatusCode.OK, await StatusAsync(bearer, "/api/samples/r1",
            Json($$"""{"kind":"dcw","sampledAt":"{{DateTimeOffset.UtcNow:O}}","valueGPerL":5,"sigmaGPerL":0.2,"operator":"mallory"}""")));
        using var ack = new HttpRequestMessage(HttpMethod.Post, "/api/alarm-commands") { Content = Json("""{"command":"acknowledge","alarm":"rq_high","operator":"mallory","reactor":"r1"}""") };
        ack.Headers.Add(AccessMiddleware.AntiForgeryHeader, token);
        Assert.Equal(HttpStatusCode.OK, (await alice.Http.SendAsync(ack)).StatusCode);
        Assert.Equal(HttpStatusCode.OK, await StatusAsync(alice.Http, "/batches/r1/end", Form(("_csrf", token))));

        var book = daemon.Get<BatchBook>();
        Assert.Equal(["alice", "alice"], book.Phases("r1", "j-1").Select(p => p.Source));
        Assert.Equal("ci-operator", daemon.Get<SampleBook>().List("r1", null, 10).Single().Operator);
        Assert.Equal("alice", alarms.Journal.Recent("r1", 50).First(e => AlarmPayloads.CauseId(e.Transition.Cause) == "acknowledged").Transition.Operator);
        var rows = daemon.Get<AccessJournal>().Recent(10);
        Assert.Equal(
            ["alice POST /batches/r1/end 200", "alice POST /api/alarm-commands 200", "ci-operator POST /api/samples/r1 200", "alice POST /batches/r1/phase 200", "alice POST /batches/r1/start 200"],
            rows.Select(r => $"{r.User} {r.HttpMethod} {r.Path} {r.Status}"));
        Assert.Equal(["operator"], rows.Select(r => r.Role).Distinct());
    }

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private async Task<TestDaemon> StartAsync(string id)
    {
        var config = TestConfigs.HandCase(broker.Port, id);
        config["alarms:ruleFiles:0"] = DaemonAlarmsTests.RuleFile(_dir);
        return await TestDaemon.StartAsync(config);
    }

    internal static StringContent Json(string json) => new(json, Encoding.UTF8, "application/json");

    internal static FormUrlEncodedContent Form(params (string Key, string Value)[] fields) => new(fields.Select(f => KeyValuePair.Create(f.Key, f.Value)));

    private static async Task<HttpStatusCode> StatusAsync(HttpClient http, string path, HttpContent body)
    {
        using (body)
        using (var r = await http.PostAsync(new Uri(path, UriKind.Relative), body))
        {
            return r.StatusCode;
        }
    }

    /// <summary>
    /// POSTs <paramref name="size"/> bytes over a raw connection (declared, or chunked), reading the answer
    /// while writing: a server that answers early and closes is what is tested, not a client error.
    /// </summary>
    private static async Task<HttpStatusCode> PostLargeAsync(string baseAddress, string path, long size, bool chunked)
    {
        var uri = new Uri(baseAddress);
        using var tcp = new System.Net.Sockets.TcpClient();
        await tcp.ConnectAsync(uri.Host, uri.Port);
        var stream = tcp.GetStream();
        string head = $"POST {path} HTTP/1.1\r\nHost: {uri.Host}:{uri.Port}\r\nAuthorization: Bearer {TestAccess.OperatorToken}\r\nContent-Type: {(path.StartsWith("/api/", StringComparison.Ordinal) ? "application/json" : "application/x-www-form-urlencoded")}\r\n"
            + (chunked ? "Transfer-Encoding: chunked\r\n" : $"Content-Length: {size}\r\n") + "\r\n";
        await stream.WriteAsync(Encoding.ASCII.GetBytes(head));
        var answer = ReadStatusAsync(stream);
        var block = new byte[64 * 1024];
        Array.Fill(block, (byte)' ');
        byte[] chunkHead = Encoding.ASCII.GetBytes($"{block.Length:x}\r\n");
        try
        {
            for (long sent = 0; sent < size && !answer.IsCompleted; sent += block.Length)
            {
                if (chunked)
                {
                    await stream.WriteAsync(chunkHead);
                }

                await stream.WriteAsync(block);
                if (chunked)
                {
                    await stream.WriteAsync("\r\n"u8.ToArray());
                }
            }
        }
        catch (IOException)
        {
            // The server closed the connection after answering: read what it said.
        }

        return await answer.WaitAsync(TimeSpan.FromSeconds(30));
    }

    private static async Task<HttpStatusCode> ReadStatusAsync(Stream stream)
    {
        var buffer = new byte[256];
        int n = 0;
        while (n < 12)
        {
            int r = await stream.ReadAsync(buffer.AsMemory(n));
            if (r == 0)
            {
                throw new IOException("the server closed the connection without an answer");
            }

            n += r;
        }

        string line = Encoding.ASCII.GetString(buffer, 0, n);
        return (HttpStatusCode)int.Parse(line.AsSpan(9, 3), System.Globalization.CultureInfo.InvariantCulture);
    }

    private static long ResidentBytes()
    {
        GC.Collect();
        GC.WaitForPendingFinalizers();
        using var p = Process.GetCurrentProcess();
        p.Refresh();
        return p.WorkingSet64;
    }

    private static async Task WaitAsync(Func<bool> condition, string what)
    {
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(15);
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < until, "waited 15 s for " + what);
            await Task.Delay(50);
        }
    }
}
