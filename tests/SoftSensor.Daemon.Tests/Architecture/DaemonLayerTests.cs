using System.Text.RegularExpressions;

namespace SoftSensor.Daemon.Tests.Architecture;

/// <summary>
/// Pins the Daemon's folders in layers (bottom first): a folder may use the folders of the layers
/// below it, never one of its own layer or above. A lower folder that needs an upper one gets an
/// interface (in Contracts, Sources or Sinks) that the upper folder implements.
/// </summary>
public partial class DaemonLayerTests
{
    /// <summary>The layers, bottom first. A new folder must be placed here.</summary>
    internal static readonly string[][] Layers =
    [
        ["Configuration", "Demo"],          // the reactor definition, units, demo assets (no Daemon dependency)
        ["Sources", "Sinks"],               // the ports samples come in by and estimates go out by
        ["Contracts"],                      // cycle, checkpoint, tag binding, metrics contracts
        ["Store"],                          // the embedded store (checkpoints, frames, outbox)
        ["Mqtt", "OpcUa", "Timeseries", "Replay"], // adapters: sources and sinks of the outside world
        ["Report"],                         // batch and replay reports
        ["Access"],                         // who may use the status server: credentials, sessions, request checks
        ["Batches"],
        ["Samples"],
        ["Pipeline"],                       // alignment, cycle host, dispatch
        ["Alarming"],
        ["Status"],                         // status page, metrics endpoint
        ["Hosting"],                        // the daemon host and its service wiring
        ["Cli"],                            // verbs
    ];

    [Fact]
    public void Every_Daemon_folder_has_a_layer()
    {
        var placed = Layers.SelectMany(l => l).ToHashSet(StringComparer.Ordinal);
        var unplaced = Directory.GetDirectories(DaemonSource())
            .Select(Path.GetFileName)
            .Where(n => n is not ("bin" or "obj") && !placed.Contains(n!))
            .ToList();
        Assert.True(unplaced.Count == 0, "Daemon folders without a layer in DaemonLayerTests.Layers: " + string.Join(", ", unplaced));
    }

    [Fact]
    public void No_Daemon_folder_uses_its_own_layer_or_one_above()
    {
        var root = DaemonSource();
        var problems = new List<string>();
        foreach (var folder in Layers.SelectMany(l => l))
        {
            var dir = Path.Combine(root, folder);
            if (!Directory.Exists(dir)) continue;
            foreach (var file in Directory.EnumerateFiles(dir, "*.cs", SearchOption.AllDirectories))
            {
                if (file.Contains(Path.DirectorySeparatorChar + "obj" + Path.DirectorySeparatorChar, StringComparison.Ordinal)) continue;
                foreach (var used in Violations(folder, File.ReadAllText(file)))
                    problems.Add($"{Path.GetRelativePath(root, file)} uses {used} (layer {LayerOf(used)}), but {folder} is in layer {LayerOf(folder)}");
            }
        }
        Assert.True(problems.Count == 0, "Upward or sideways Daemon dependencies:\n" + string.Join("\n", problems));
    }

    [Theory]
    [InlineData("Store", "using SoftSensor.Daemon.Pipeline;\nnamespace SoftSensor.Daemon.Store;", "Pipeline")]
    [InlineData("Configuration", "namespace SoftSensor.Daemon.Configuration;\nclass A { Replay.ReplayLog? x; }", "Replay")]
    [InlineData("Mqtt", "namespace SoftSensor.Daemon.Mqtt;\nclass A { global::SoftSensor.Daemon.Status.StatusPage? p; }", "Status")]
    [InlineData("Mqtt", "using static SoftSensor.Daemon.OpcUa.OpcUaLog;", "OpcUa")]
    public void The_rule_flags_an_import_of_a_higher_or_sibling_folder(string folder, string source, string expected)
    {
        Assert.Contains(expected, Violations(folder, source));
    }

    [Fact]
    public void The_rule_lets_a_folder_use_lower_layers_and_ignores_comments()
    {
        const string source = "using SoftSensor.Daemon.Configuration;\nusing SoftSensor.Daemon.Contracts;\n// see Cli.RunVerb\n/// <see cref=\"Hosting.DaemonHost\"/>\nnamespace SoftSensor.Daemon.Pipeline;\nclass A { object o = options.Status.Port; }";
        Assert.Empty(Violations("Pipeline", source));
    }

    /// <summary>The Daemon folders <paramref name="source"/> (a file of <paramref name="folder"/>) uses that are not below it.</summary>
    internal static IReadOnlyList<string> Violations(string folder, string source)
    {
        var code = Comment().Replace(StringLiteral().Replace(source, "\"\""), "");
        var own = LayerOf(folder);
        var used = new HashSet<string>(StringComparer.Ordinal);
        foreach (Match m in Qualified().Matches(code)) used.Add(m.Groups[1].Value);
        foreach (var other in Layers.SelectMany(l => l))
        {
            // A bare "Folder.Type" resolves through the parent namespace SoftSensor.Daemon; a member
            // access ("options.Status.Port") is preceded by a dot, and a file that declares a member of
            // that name ("public StatusOptions Status { get; }") means the member.
            if (other != folder && Regex.IsMatch(code, @"(?<![\w.])" + other + @"\.[A-Z]") && !IsLocalMember(code, other))
                used.Add(other);
        }
        used.Remove(folder);
        return used.Where(u => LayerOf(u) >= own).Order(StringComparer.Ordinal).ToList();
    }

    // "Status" may also be a property of the file's own type (e.g. SoftSensorOptions.Status); such a
    // file declares it, and then a bare "Status.X" is that member.
    private static bool IsLocalMember(string code, string name) =>
        Regex.IsMatch(code, @"\b\w+\??\s+" + name + @"\s*\{") || Regex.IsMatch(code, @"\b\w+\??\s+" + name + @"\s*[;=,)]");

    private static int LayerOf(string folder)
    {
        for (var i = 0; i < Layers.Length; i++)
            if (Layers[i].Contains(folder)) return i;
        return int.MaxValue;
    }

    private static string DaemonSource()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "SoftSensor.sln"))) d = d.Parent;
        return Path.Combine(d?.FullName ?? throw new DirectoryNotFoundException("SoftSensor.sln not found above " + AppContext.BaseDirectory), "src", "SoftSensor.Daemon");
    }

    [GeneratedRegex(@"//[^\n]*|/\*.*?\*/", RegexOptions.Singleline)]
    private static partial Regex Comment();

    [GeneratedRegex(@"@?""(?:[^""\\\n]|\\.)*""|'(?:[^'\\\n]|\\.)'")]
    private static partial Regex StringLiteral();

    [GeneratedRegex(@"SoftSensor\.Daemon\.(\w+)")]
    private static partial Regex Qualified();
}
