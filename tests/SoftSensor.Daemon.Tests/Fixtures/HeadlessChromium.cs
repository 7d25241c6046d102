using System.Diagnostics;

namespace SoftSensor.Daemon.Tests.Fixtures;

/// <summary>Headless Chromium (Debian package, /usr/bin/chromium) loading a loopback page, with a fresh profile each time.</summary>
internal static class HeadlessChromium
{
    private const string Binary = "/usr/bin/chromium";

    /// <summary>The DOM after the page's scripts ran for <paramref name="virtualTimeMs"/> of virtual time.</summary>
    public static async Task<string> DumpDomAsync(string url, int virtualTimeMs = 3000)
    {
        if (!File.Exists(Binary))
        {
            throw new InvalidOperationException($"{Binary} is missing: run tests/run.sh, which installs the Debian package chromium");
        }

        var profile = Directory.CreateTempSubdirectory("softsensor-chromium-").FullName;
        try
        {
            var psi = new ProcessStartInfo(Binary,
            [
                "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                "--disable-background-networking", "--disable-component-update", "--disable-sync",
                "--user-data-dir=" + profile, $"--virtual-time-budget={virtualTimeMs}", "--dump-dom", url,
            ])
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                UseShellExecute = false,
            };
            using var p = Process.Start(psi) ?? throw new InvalidOperationException("chromium did not start");
            var stdout = p.StandardOutput.ReadToEndAsync();
            var stderr = p.StandardError.ReadToEndAsync();
            using var cts = new CancellationTokenSource(TimeSpan.FromSeconds(60));
            try
            {
                await p.WaitForExitAsync(cts.Token);
            }
            catch (OperationCanceledException)
            {
                p.Kill(entireProcessTree: true);
                throw new TimeoutException("chromium did not finish within 60 s: " + await stderr);
            }

            return await stdout;
        }
        finally
        {
            try
            {
                Directory.Delete(profile, recursive: true);
            }
            catch (IOException)
            {
                // Chromium may still hold a lock file; a leftover temp folder is harmless.
            }
        }
    }
}
