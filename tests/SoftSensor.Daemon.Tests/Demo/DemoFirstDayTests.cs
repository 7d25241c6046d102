using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Tests.Cli;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Demo;

/// <summary>
/// A new user's first look, on one run of the demo (embedded broker, virtual reactor: invented demo
/// data, no mosquitto needed) started in-process from its embedded files on a random port: the client
/// verbs find it without <c>--url</c>, the status page in headless Chromium shows trends with a time
/// axis, plain labels and the alarm panel from its first paint, and every page shares the navigation.
/// </summary>
public sealed partial class DemoFirstDayTests
{
    [Fact]
    public async Task Demo_on_a_random_port_is_found_by_batch_status_without_url_and_its_pages_show_trends_labels_and_alarm_panel()
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-firstday-").FullName;
        var output = new LockedWriter();
        using var stop = new CancellationTokenSource();
        var request = DemoVerb.Validate(240, "12h", dir, null, null, out string? problem) ?? throw new InvalidOperationException(problem);
        var run = Task.Run(() => DemoSession.RunAsync(request, output, output, stop.Token));
        try
        {
            // The demo wrote its definition out of the program and the daemon its status file into the data folder.
            await Until(() => File.Exists(Path.Combine(dir, "daemon.json")) && output.Text.Contains(" good\n", StringComparison.Ordinal), output, "a good cycle and data/daemon.json");
            Assert.True(File.Exists(Path.Combine(dir, "definition", "demo.json")));
            Assert.Matches(@"time \(UTC\) +reactor +cycle +OUR mmol/\(L·h\) +CER mmol/\(L·h\) +RQ mol/mol +µ 1/h +biomass g/L +quality", output.Text);
            Assert.Single(Regex.Matches(output.Text, "mmol/\\(L·h\\) +CER"));   // units once, in the header

            // batch status finds the daemon from its state directory: no --url, no port typed.
            var (code, text, error) = await Task.Run(() => CliRunner.Run("batch", "status", "--reactor", "r1", "--data", dir));
            Assert.True(code == ExitCodes.Ok, error);
            Assert.StartsWith("reactor r1: batch demo-glycerol open, phase batch since ", text, StringComparison.Ordinal);
            Assert.DoesNotContain("\\u0022", text, StringComparison.Ordinal);
            var (jsonCode, json, _) = await Task.Run(() => CliRunner.Run("batch", "status", "--reactor", "r1", "--data", dir, "--json"));
            Assert.Equal(ExitCodes.Ok, jsonCode);
            using (var doc = JsonDocument.Parse(json))
            {
                Assert.Equal("demo-glycerol", doc.RootElement.GetProperty("batchId").GetString());
            }

            string url;
            using (var status = JsonDocument.Parse(await File.ReadAllTextAsync(Path.Combine(dir, "daemon.json"))))
            {
                url = status.RootElement.GetProperty("statusUrl").GetString()!;
            }

            // One source of truth: the status header names the batch the book has open.
            using var http = new HttpClient { BaseAddress = new Uri(url) };
            using (var api = JsonDocument.Parse(await http.GetStringAsync(new Uri("/api/status", UriKind.Relative))))
            {
                var r1 = api.RootElement.GetProperty("reactors")[0];
                Assert.Equal("demo-glycerol", r1.GetProperty("batch").GetString());
                Assert.True(r1.GetProperty("batchOpen").GetBoolean());
            }

            // Wait for an hour of culture, so the trends have a time axis to draw.
            await Until(() => SimulatedHours(output.Text) >= 1.0, output, "an hour of simulated time");

            // The page carries its trends: the plots are drawn by the first script run, before any poll answered.
            string source = await http.GetStringAsync(new Uri("/", UriKind.Relative));
            Assert.Contains("\"series\":{\"our\":", source, StringComparison.Ordinal);
            string firstPaint = await HeadlessChromium.DumpDomAsync(url + "/", virtualTimeMs: 1);
            Assert.True(Regex.Matches(firstPaint, "<polyline").Count >= 5, "trends not drawn at the first paint: " + firstPaint[..Math.Min(3000, firstPaint.Length)]);

            string dom = await HeadlessChromium.DumpDomAsync(url + "/");
            foreach (var label in new[] { "Oxygen uptake rate (OUR)", "CO2 evolution rate (CER)", "Respiratory quotient (RQ)", "Growth rate µ", "Biomass (dry weight)", "Balance consistency" })
            {
                Assert.Contains(label, dom, StringComparison.Ordinal);
            }

            Assert.Contains("id=\"alarm-panel\"", dom, StringComparison.Ordinal);
            Assert.Contains("local time (UTC", dom, StringComparison.Ordinal);
            Assert.Contains("class=\"age\"", dom, StringComparison.Ordinal);          // batch hours under the clock
            Assert.Contains("batch demo-glycerol · phase batch · age ", dom, StringComparison.Ordinal);
            Assert.Contains("broth weight, used as liquid volume", dom, StringComparison.Ordinal);
            Assert.Matches(@"\d+\.\d{3} kg<", dom);                                  // the load cell as read, in kg
            // Raw ids only in the detail table: no tile is titled with one.
            Assert.DoesNotMatch("class=\"n\">(mu_raw_per_h|biomass_g|h_critical|feed_cap_l_per_h) ", dom);

            // Every page: one navigation, one style.
            foreach (var page in new[] { "/batches", "/samples", "/reports" })
            {
                string html = await http.GetStringAsync(new Uri(page, UriKind.Relative));
                Assert.Contains("<nav id=\"nav\">", html, StringComparison.Ordinal);
                Assert.Contains("header.top", html, StringComparison.Ordinal);
                foreach (var link in new[] { "href=\"/\"", "href=\"/batches\"", "href=\"/samples\"", "href=\"/reports\"" })
                {
                    Assert.Contains(link, html, StringComparison.Ordinal);
                }
            }

            // The demo's rules fit its culture: in its first hour no process alarm is active
            // (the quality alarms depend on this machine's timing at 240x and are left out here).
            using var alarms = JsonDocument.Parse(await http.GetStringAsync(new Uri("/api/alarms", UriKind.Relative)));
            var process = alarms.RootElement.EnumerateArray().Select(a => a.GetProperty("alarmId").GetString()).Where(a => a is not ("our_bad" or "balance_inconsistent" or "analyser_o2_flat" or "analyser_co2_flat")).ToList();
            Assert.True(process.Count == 0, "process alarms active on the demo culture: " + string.Join(", ", process));
        }
        finally
        {
            await stop.CancelAsync();
            Assert.Equal(ExitCodes.Ok, await run.WaitAsync(TimeSpan.FromSeconds(60)));
            Assert.False(File.Exists(Path.Combine(dir, "daemon.json")), "the status file outlived the daemon");
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            Directory.Delete(dir, recursive: true);
        }
    }

    private static double SimulatedHours(string text)
    {
        var times = CycleTime().Matches(text);
        if (times.Count < 2)
        {
            return 0;
        }

        var first = DateTimeOffset.Parse(times[0].Groups[1].Value, CultureInfo.InvariantCulture);
        var last = DateTimeOffset.Parse(times[^1].Groups[1].Value, CultureInfo.InvariantCulture);
        return (last - first).TotalHours;
    }

    private static async Task Until(Func<bool> condition, LockedWriter output, string what)
    {
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(120);
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < until, $"no {what} within 120 s; the demo said:\n" + Tail(output.Text));
            await Task.Delay(100);
        }
    }

    private static string Tail(string text) => text.Length <= 3000 ? text : text[^3000..];

    [GeneratedRegex(@"^(\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ) r1 ", RegexOptions.Multiline)]
    private static partial Regex CycleTime();

    /// <summary>A writer that several threads write to and the test reads.</summary>
    private sealed class LockedWriter : TextWriter
    {
        private readonly System.Text.StringBuilder _text = new();

        public override System.Text.Encoding Encoding => System.Text.Encoding.UTF8;

        public string Text
        {
            get
            {
                lock (_text)
                {
                    return _text.ToString();
                }
            }
        }

        public override void Write(char value)
        {
            lock (_text)
            {
                _text.Append(value);
            }
        }

        public override void Write(string? value)
        {
            lock (_text)
            {
                _text.Append(value);
            }
        }

        public override void WriteLine(string? value)
        {
            lock (_text)
            {
                _text.Append(value).Append('\n');
            }
        }
    }
}
