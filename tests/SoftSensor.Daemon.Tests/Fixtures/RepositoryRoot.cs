namespace SoftSensor.Daemon.Tests.Fixtures;

/// <summary>The repository's root folder: the first folder above the test's output that holds SoftSensor.sln.</summary>
internal static class RepositoryRoot
{
    public static string Path { get; } = Find();

    private static string Find()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(System.IO.Path.Combine(d.FullName, "SoftSensor.sln")))
        {
            d = d.Parent;
        }

        return d?.FullName ?? throw new DirectoryNotFoundException("SoftSensor.sln not found above " + AppContext.BaseDirectory);
    }
}
