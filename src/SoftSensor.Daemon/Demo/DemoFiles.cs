using System.Reflection;

namespace SoftSensor.Daemon.Demo;

/// <summary>
/// The demo's files: the reactor definition, its balance model, its alarm rules and the virtual
/// reactor's scenario. They are embedded in the program (so <c>softsensor demo</c> runs from any
/// folder) and written out to the demo's data folder at start, where the definition finds its model
/// and rules beside itself and a user can read them or start a plant definition from them.
/// </summary>
internal static class DemoFiles
{
    /// <summary>The demo definition, as the repository holds it.</summary>
    public const string Config = "config/demo.json";

    /// <summary>The demo's scenario, as the repository holds it.</summary>
    public const string Scenario = "config/scenarios/glycerol.json";

    /// <summary>Embedded resource (its repository path under config/) → path in the written folder.</summary>
    private static readonly (string Resource, string File)[] Embedded =
    [
        ("demo.json", "demo.json"),
        ("estimator-glycerol-model.json", "estimator-glycerol-model.json"),
        ("demo-alarms.json", "demo-alarms.json"),
        ("scenarios/glycerol.json", "scenarios/glycerol.json"),
    ];

    /// <summary>Path of the definition inside a folder written by <see cref="WriteTo"/>.</summary>
    public static string DefinitionIn(string folder) => Path.Combine(folder, "demo.json");

    /// <summary>Path of the scenario inside a folder written by <see cref="WriteTo"/>.</summary>
    public static string ScenarioIn(string folder) => Path.Combine(folder, "scenarios", "glycerol.json");

    /// <summary>Writes every embedded demo file into <paramref name="folder"/> (created; files replaced).</summary>
    public static void WriteTo(string folder)
    {
        var assembly = typeof(DemoFiles).Assembly;
        foreach (var (resource, file) in Embedded)
        {
            string target = Path.Combine(folder, file);
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            using var source = Open(assembly, resource);
            using var output = File.Create(target);
            source.CopyTo(output);
        }
    }

    /// <summary>The text of one embedded demo file (its path under config/, e.g. <c>demo.json</c>).</summary>
    public static string Read(string resource)
    {
        using var reader = new StreamReader(Open(typeof(DemoFiles).Assembly, resource));
        return reader.ReadToEnd();
    }

    /// <summary>The full path of a repository-relative file found from the working folder or the build output, upwards; or null (tests).</summary>
    public static string? Find(string relative)
    {
        foreach (var start in new[] { Directory.GetCurrentDirectory(), AppContext.BaseDirectory })
        {
            for (var dir = new DirectoryInfo(start); dir is not null; dir = dir.Parent)
            {
                string candidate = Path.Combine(dir.FullName, relative);
                if (File.Exists(candidate))
                {
                    return candidate;
                }
            }
        }

        return null;
    }

    private static Stream Open(Assembly assembly, string resource) =>
        assembly.GetManifestResourceStream("demo/" + resource)
        ?? throw new InvalidOperationException($"the program lacks its embedded demo file 'demo/{resource}' (a build without config/)");
}
