namespace SoftSensor.Daemon.Status;

/// <summary>The self-contained status page (embedded resource; no external scripts, fonts or styles).</summary>
internal static class StatusPage
{
    private const string Marker = "/*INITIAL*/null";
    private const string TrendsMarker = "/*TRENDS*/null";

    /// <summary>The page's template.</summary>
    public static string Html { get; } = Load();

    /// <summary>The page with the current status and trends embedded, so its first paint shows values and plots.</summary>
    /// <param name="initialJson">The <c>/api/status</c> document, serialised with HTML-safe escaping.</param>
    /// <param name="trendsJson">A list of <c>/api/trends</c> documents, one per reactor, serialised the same way.</param>
    public static string With(string initialJson, string trendsJson = "null") =>
        Html.Replace(Marker, initialJson, StringComparison.Ordinal).Replace(TrendsMarker, trendsJson, StringComparison.Ordinal);

    private static string Load()
    {
        using var s = typeof(StatusPage).Assembly.GetManifestResourceStream("SoftSensor.Daemon.Status.StatusPage.html")
            ?? throw new InvalidOperationException("embedded resource SoftSensor.Daemon.Status.StatusPage.html is missing from the build");
        using var r = new StreamReader(s);
        return r.ReadToEnd()
            .Replace("/*STYLE*/", Report.PageChrome.Style, StringComparison.Ordinal)
            .Replace("<!--NAV-->", Report.PageChrome.Nav("status"), StringComparison.Ordinal)
            .Replace("<!--CAUTION-->", Report.PageChrome.Caution, StringComparison.Ordinal);
    }
}
