using System.Diagnostics;

namespace SoftSensor.Daemon.Tests.Cli;

/// <summary>The real executable, started as a user would (dotnet softsensor.dll), with its real Program and exit codes.</summary>
public class OffgasProcessTests
{
    private static (int ExitCode, string Output, string Error) Start(params string[] args)
    {
        var info = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "softsensor.dll"));
        foreach (var a in args)
        {
            info.ArgumentList.Add(a);
        }

        using var process = Process.Start(info)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        Assert.True(process.WaitForExit(30_000), "softsensor did not exit within 30 s");
        return (process.ExitCode, stdout.Result, stderr.Result);
    }

    [Fact]
    public void Offgas_executable_hand_case_prints_one_json_document()
    {
        // docs/methods.md §6, off-gas case worked by hand: OTR 38.629 mmol/(L h).
        var (code, output, error) = Start(
            "offgas", "--air", "10", "--inlet-o2", "20.946", "--inlet-co2", "0.042", "--outlet-o2", "19.5", "--outlet-co2", "1.5", "--volume", "10", "--json");

        Assert.Equal(0, code);
        Assert.Empty(error);
        using var doc = System.Text.Json.JsonDocument.Parse(output);
        Assert.Equal(38.629, doc.RootElement.GetProperty("our").GetDouble(), 0.0005);
    }

    [Fact]
    public void Offgas_executable_malformed_volume_exits_2_with_one_line()
    {
        var (code, output, error) = Start("offgas", "--air", "10", "--outlet-o2", "19.5", "--outlet-co2", "1.5", "--volume", "-3");

        Assert.Equal(2, code);
        Assert.Empty(output);
        Assert.Equal("error: --volume '-3': expected a liquid volume in L above 0", error.TrimEnd('\n'));
    }

    [Fact]
    public void Offgas_executable_several_unknown_flags_exit_2_with_one_line_naming_each()
    {
        var (code, output, error) = Start("offgas", "--air", "10", "--outlet-o2", "19.5", "--outlet-co2", "1.5", "--volume", "10", "--bogus", "1", "--zap", "2");

        Assert.Equal(2, code);
        Assert.Empty(output);
        string line = Assert.Single(error.TrimEnd('\n').Split('\n'));
        Assert.Contains("'--bogus'", line, StringComparison.Ordinal);
        Assert.Contains("'--zap'", line, StringComparison.Ordinal);
    }
}
