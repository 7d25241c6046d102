using System.Diagnostics;
using System.Globalization;
using System.Text.RegularExpressions;
using Xunit.Abstractions;

namespace SoftSensor.Daemon.Tests.Deploy;

/// <summary>
/// deploy/softsensor.service rated by `systemd-analyze security --offline=true` (systemd's own exposure
/// score, 0 best to 10 worst): at or below 2.5. Where systemd-analyze is missing the test says so and passes.
/// </summary>
public sealed partial class SystemdUnitTests(ITestOutputHelper output)
{
    private const double Aim = 2.5;

    [Fact]
    public async Task The_unit_rates_at_or_below_2_5_in_systemd_analyze_security()
    {
        string unit = Path.Combine(Repo(), "deploy", "softsensor.service");
        string? tool = new[] { "/usr/bin/systemd-analyze", "/bin/systemd-analyze" }.FirstOrDefault(File.Exists);
        if (tool is null)
        {
            output.WriteLine("SKIPPED: systemd-analyze is not installed; the unit was not rated");
            return;
        }

        var psi = new ProcessStartInfo(tool, ["security", "--offline=true", "--no-pager", unit]) { RedirectStandardOutput = true, RedirectStandardError = true };
        using var p = Process.Start(psi)!;
        string text = await p.StandardOutput.ReadToEndAsync() + await p.StandardError.ReadToEndAsync();
        await p.WaitForExitAsync();
        var m = Exposure().Match(text);
        Assert.True(m.Success, "no exposure level in: " + text[^Math.Min(text.Length, 800)..]);
        double level = double.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture);
        output.WriteLine($"systemd-analyze security: {level}");
        Assert.True(level <= Aim, $"exposure {level} (aim {Aim} or lower)");
    }

    private static string Repo()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "SoftSensor.sln")))
        {
            d = d.Parent;
        }

        return d?.FullName ?? throw new InvalidOperationException("repository root not found above " + AppContext.BaseDirectory);
    }

    [GeneratedRegex(@"Overall exposure level for \S+: ([0-9]+\.[0-9]+)")]
    private static partial Regex Exposure();
}
