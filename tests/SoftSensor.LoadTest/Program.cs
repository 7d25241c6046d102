using System.Globalization;
using System.Text.Json;

namespace SoftSensor.LoadTest;

/// <summary>
/// The daemon load benchmark (issue 6): N simulated reactors × 20 tags at 1 Hz through mosquitto,
/// N stepped up until the p99 tag-to-estimate latency reaches 50 ms or messages are lost.
/// <code>dotnet run -c Release --project tests/SoftSensor.LoadTest -- --reactors 50,100,200,500,1000 --for 60s</code>
/// </summary>
internal static class Program
{
    public static async Task<int> Main(string[] args)
    {
        if (!LoadOptions.TryParse(args, out var options, out string error))
        {
            await Console.Error.WriteLineAsync("error: " + error);
            return 2;
        }

        string? demo = Find("config/demo.json");
        string? scenario = Find("config/scenarios/glycerol.json");
        if (demo is null || scenario is null)
        {
            await Console.Error.WriteLineAsync("error: config/demo.json or config/scenarios/glycerol.json not found above the working folder (run from the repository)");
            return 2;
        }

        var step = new LoadStep(options, demo, scenario);
        var results = new List<StepResult>();
        Console.Error.WriteLine($"load: {string.Join(", ", options.Reactors)} reactors × 20 tags at 1 Hz; window {options.Window.TotalSeconds:0} s after {options.WarmUp.TotalSeconds:0} s warm-up; {Environment.ProcessorCount} cores");
        foreach (int n in options.Reactors)
        {
            var r = await step.RunAsync(n, Console.Error);
            results.Add(r);
            Console.Error.WriteLine(StepResult.Header);
            Console.Error.WriteLine(r);
            if (!r.Held && !options.All)
            {
                break;
            }
        }

        var held = results.Where(r => r.Held).Select(r => r.Reactors).DefaultIfEmpty(0).Max();
        if (options.Json)
        {
            Console.WriteLine(JsonSerializer.Serialize(new { largestHeld = held, steps = results }, new JsonSerializerOptions { WriteIndented = true, PropertyNamingPolicy = JsonNamingPolicy.CamelCase }));
        }
        else
        {
            Console.WriteLine(StepResult.Header);
            foreach (var r in results)
            {
                Console.WriteLine(r);
            }

            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"largest N held (p99 < 50 ms, nothing lost): {held}"));
        }

        return 0;
    }

    private static string? Find(string relative)
    {
        for (var dir = new DirectoryInfo(Directory.GetCurrentDirectory()); dir is not null; dir = dir.Parent)
        {
            string candidate = Path.Combine(dir.FullName, relative);
            if (File.Exists(candidate))
            {
                return candidate;
            }
        }

        return null;
    }
}

/// <summary>Command-line options of the load benchmark.</summary>
internal sealed class LoadOptions
{
    public IReadOnlyList<int> Reactors { get; private set; } = [50, 100, 200, 500, 1000];

    public TimeSpan Window { get; private set; } = TimeSpan.FromSeconds(60);

    public TimeSpan WarmUp { get; private set; } = TimeSpan.FromSeconds(10);

    /// <summary>0: start a private mosquitto per step on a free loopback port.</summary>
    public int BrokerPort { get; private set; }

    public bool Json { get; private set; }

    public bool All { get; private set; }

    public bool KeepFiles { get; private set; }

    /// <summary>Another build of the daemon to run (an A/B comparison in one session); null: the one beside this program.</summary>
    public string? DaemonDll { get; private set; }

    public static bool TryParse(string[] args, out LoadOptions options, out string error)
    {
        options = new LoadOptions();
        error = "";
        for (int i = 0; i < args.Length; i++)
        {
            string a = args[i];
            string? Next() => i + 1 < args.Length ? args[++i] : null;
            switch (a)
            {
                case "--reactors":
                    var list = Next()?.Split(',').Select(t => int.TryParse(t, NumberStyles.None, CultureInfo.InvariantCulture, out int n) && n > 0 ? n : -1).ToList();
                    if (list is null || list.Count == 0 || list.Contains(-1))
                    {
                        error = "--reactors: expected positive counts separated by commas, e.g. 50,100,200";
                        return false;
                    }

                    options.Reactors = list;
                    break;
                case "--for" or "--warmup":
                    if (!TryDuration(Next(), out var d))
                    {
                        error = $"{a}: expected a duration such as 60s or 2m";
                        return false;
                    }

                    if (a == "--for")
                    {
                        options.Window = d;
                    }
                    else
                    {
                        options.WarmUp = d;
                    }

                    break;
                case "--broker":
                    string? url = Next();
                    if (url is null || !Uri.TryCreate(url, UriKind.Absolute, out var u) || u.Scheme != "mqtt" || u.Host != "127.0.0.1" || u.Port <= 0)
                    {
                        error = "--broker: expected mqtt://127.0.0.1:PORT (a broker on this machine: latency is measured against this machine's clock)";
                        return false;
                    }

                    options.BrokerPort = u.Port;
                    break;
                case "--json":
                    options.Json = true;
                    break;
                case "--all":
                    options.All = true;
                    break;
                case "--daemon":
                    options.DaemonDll = Next() is { } dll && File.Exists(dll) ? Path.GetFullPath(dll) : null;
                    if (options.DaemonDll is null)
                    {
                        error = "--daemon: expected the path of an existing softsensor.dll";
                        return false;
                    }

                    break;
                case "--keep":
                    options.KeepFiles = true;
                    break;
                default:
                    error = $"unknown argument '{a}' (expected --reactors, --for, --warmup, --broker, --daemon, --all, --json, --keep)";
                    return false;
            }
        }

        return true;
    }

    private static bool TryDuration(string? text, out TimeSpan d)
    {
        d = default;
        if (text is null || text.Length < 2)
        {
            return false;
        }

        char unit = text[^1];
        if (!double.TryParse(text[..^1], NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || v <= 0)
        {
            return false;
        }

        d = unit switch { 's' => TimeSpan.FromSeconds(v), 'm' => TimeSpan.FromMinutes(v), _ => TimeSpan.Zero };
        return d > TimeSpan.Zero;
    }
}
