namespace SoftSensor.Daemon.Status;

/// <summary>The self-contained status page (embedded resource; no external scripts, fonts or styles).</summary>
internal static class StatusPage
{
    private const string Marker = "/*INITIAL*/null";

    /// <summary>The page's template.</summary>
    public static string Html { get; } = Load();

    /// <summary>The page with the current status embedded, so it shows values before its first poll.</summary>
    /// <param name="initialJson">The <c>/api/status</c> document, serialised with HTML-safe escaping.</param>
    public static string With(string initialJson) => Html.Replace(Marker, initialJson, StringComparison.Ordinal);

    private static string Load()
    {
        using var s = typeof(StatusPage).Assembly.GetManifestResourceStream("SoftSensor.Daemon.Status.StatusPage.html")
            ?? throw new InvalidOperationException("embedded resource SoftSensor.Daemon.Status.StatusPage.html is missing from the build");
        using var r = new StreamReader(s);
        return r.ReadToEnd();
    }
}
