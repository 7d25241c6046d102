using SoftSensor.Daemon.Alarming;

namespace SoftSensor.Daemon.Tests.Alarming;

/// <summary>
/// <c>alarms:ruleFiles</c> resolves by the definition's one rule for relative paths, as <c>check</c>
/// does: a relative path is taken beside the configuration file (the layout the shipped configurations use).
/// </summary>
public sealed class AlarmOptionsTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-ao-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void ResolveFiles_RelativeFolderBesideConfig_ExpandsItsJsonFilesInNameOrder()
    {
        string folder = Path.Combine(_dir, "rules-beside-config");
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "b.json"), "{}");
        File.WriteAllText(Path.Combine(folder, "a.json"), "{}");
        File.WriteAllText(Path.Combine(folder, "notes.txt"), "");
        var options = new AlarmOptions { RuleFiles = ["rules-beside-config"] };

        var files = options.ResolveFiles(_dir);

        Assert.Equal([Path.Combine(folder, "a.json"), Path.Combine(folder, "b.json")], files);
    }

    [Fact]
    public void ResolveFiles_AbsolutePath_KeptAsGiven()
    {
        string file = Path.Combine(_dir, "one.json");
        File.WriteAllText(file, "{}");
        var options = new AlarmOptions { RuleFiles = [file] };

        Assert.Equal([file], options.ResolveFiles("/nonexistent-config-folder"));
    }

    [Fact]
    public void ResolveFiles_MissingEverywhere_ReturnsThePathBesideConfigSoTheErrorNamesIt()
    {
        var options = new AlarmOptions { RuleFiles = ["missing.json"] };

        Assert.Equal([Path.Combine(_dir, "missing.json")], options.ResolveFiles(_dir));
    }
}
