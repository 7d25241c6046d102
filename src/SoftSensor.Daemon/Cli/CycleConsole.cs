using System.Globalization;
using System.Text;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Contracts;
using SoftSensor.Daemon.Pipeline;
using StatusCodes = SoftSensor.OpcUa.Encoding.StatusCodes;

namespace SoftSensor.Daemon.Cli;

/// <summary>
/// The demo's console: one header line with the units, then one line per cycle with the main
/// estimates, the frame's quality and, after an uncertain or bad line, why.
/// </summary>
internal static class CycleConsole
{
    private static readonly (string Name, string Label, string Unit, int Width)[] Columns =
    [
        (EstimateNames.Our, "OUR", "mmol/(L·h)", 15),
        (EstimateNames.Cer, "CER", "mmol/(L·h)", 15),
        (EstimateNames.Rq, "RQ", "mol/mol", 11),
        (EstimateNames.MuPerH, "µ", "1/h", 8),
        (EstimateNames.BiomassGPerL, "biomass", "g/L", 12),
    ];

    /// <summary>The header: column labels with their units.</summary>
    public static string Header()
    {
        var b = new StringBuilder();
        b.Append("time (UTC)".PadRight(21)).Append("reactor".PadRight(9)).Append("cycle".PadLeft(6)).Append(' ');
        foreach (var c in Columns)
        {
            b.Append((c.Label + " " + c.Unit).PadLeft(c.Width)).Append(' ');
        }

        return b.Append(" quality").ToString();
    }

    /// <summary>One cycle's line; a value in another unit than its column's carries its unit.</summary>
    public static string Line(ReactorSnapshot s)
    {
        var f = s.Frame;
        var b = new StringBuilder();
        b.Append(s.CycleTime.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture).PadRight(21))
            .Append(s.Reactor.PadRight(9)).Append(s.Cycle.ToString(CultureInfo.InvariantCulture).PadLeft(6)).Append(' ');
        foreach (var c in Columns)
        {
            string text = "-";
            if (Find(f, c.Name) is { } v && double.IsFinite(v.Value))
            {
                text = v.Value.ToString(Math.Abs(v.Value) >= 100 ? "F1" : "F3", CultureInfo.InvariantCulture);
                if (v.Unit != c.Unit)
                {
                    text += " " + v.Unit;
                }
            }

            b.Append(text.PadLeft(c.Width)).Append(' ');
        }

        var quality = f?.Quality ?? SampleQuality.Bad;
        b.Append(' ').Append(quality.ToString().ToLowerInvariant());
        if (quality != SampleQuality.Good)
        {
            b.Append(": ").Append(Reason(s));
        }

        return b.ToString();
    }

    /// <summary>Why a cycle is not good: the inputs that made it so, a failed balance test, or the status code.</summary>
    public static string Reason(ReactorSnapshot s)
    {
        var reasons = new List<string>();
        var waiting = s.Inputs.Where(i => i.State == InputState.Waiting).Select(i => i.Tag).ToList();
        if (waiting.Count > 0)
        {
            reasons.Add("no value yet from " + string.Join(", ", waiting));
        }

        foreach (var i in s.Inputs.Where(i => i.State == InputState.Stale))
        {
            reasons.Add(string.Create(CultureInfo.InvariantCulture, $"{i.Tag} stale ({i.AgeSeconds:F0} s old)"));
        }

        foreach (var i in s.Inputs.Where(i => i.State == InputState.Ok && i.Quality != SampleQuality.Good))
        {
            reasons.Add($"{i.Tag} arrived {i.Quality.ToString().ToLowerInvariant()} ({StatusText(i.StatusCode)})");
        }

        if (Find(s.Frame, EstimateNames.ConsistencyH) is { } h && Find(s.Frame, EstimateNames.ConsistencyCritical) is { } crit
            && double.IsFinite(h.Value) && double.IsFinite(crit.Value) && h.Value > crit.Value)
        {
            reasons.Add(string.Create(CultureInfo.InvariantCulture, $"balance test failed (h {h.Value:F1} > {crit.Value:F1}): a measurement or the model is off"));
        }

        if (reasons.Count == 0 && s.Frame is { } f)
        {
            var worst = f.Values.Where(v => v.Quality == f.Quality).Select(v => v.StatusCode).FirstOrDefault(c => c != 0);
            reasons.Add(worst != 0 ? StatusText(worst) : "an input or a step of the cycle was " + f.Quality.ToString().ToLowerInvariant());
        }

        return reasons.Count == 0 ? "no estimate yet" : string.Join("; ", reasons);
    }

    /// <summary>The name of a status code (OPC UA Part 8 §7.3.2), else its hex value.</summary>
    public static string StatusText(uint code) =>
        code == StatusCodes.BadOutOfService ? "BadOutOfService: analyser calibrating"
        : StatusCodes.NameOf(code) ?? "status 0x" + code.ToString("X8", CultureInfo.InvariantCulture);

    private static EstimateValue? Find(EstimateFrame? frame, string name)
    {
        foreach (var v in frame?.Values ?? [])
        {
            if (v.Name == name)
            {
                return v;
            }
        }

        return null;
    }
}
