namespace SoftSensor.Daemon.Demo;

/// <summary>Finds the demo's files (config/demo.json, config/scenarios/glycerol.json) from the working folder or the build output, upwards.</summary>
internal static class DemoFiles
{
    public const string Config = "config/demo.json";
    public const string Scenario = "config/scenarios/glycerol.json";

    /// <summary>The full path of a repository-relative file, or null.</summary>
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
}
