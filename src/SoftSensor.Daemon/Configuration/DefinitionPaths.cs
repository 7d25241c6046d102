namespace SoftSensor.Daemon.Configuration;

/// <summary>
/// The one rule for relative paths in a reactor definition (model files, alarm rule files): a
/// relative path is taken from the folder of the configuration file that names it; an absolute path
/// as it is. Without a configuration file (settings given only on the command line or in the
/// environment), from the working folder.
/// </summary>
internal static class DefinitionPaths
{
    /// <summary>The full path <paramref name="path"/> names, read beside <paramref name="configFolder"/>.</summary>
    public static string Resolve(string path, string? configFolder) =>
        Path.IsPathRooted(path) || configFolder is null ? Path.GetFullPath(path) : Path.GetFullPath(Path.Combine(configFolder, path));
}
