using System.Globalization;
using System.Text;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>
/// Maps an estimate frame to InfluxDB line protocol (InfluxDB v2 documentation, "Line protocol"):
/// <c>measurement,tag=v,... field=v,... timestamp</c>. One measurement per kind of estimate
/// (<see cref="EstimateKinds"/>), tags <c>site</c>, <c>unit</c> (the reactor) and <c>batch</c>;
/// per estimate a float field with its value (left out when not finite: line protocol has no
/// NaN), an integer field <c>&lt;name&gt;_quality</c> (0 good, 1 uncertain, 2 bad) and, when
/// known, a float field <c>&lt;name&gt;_sigma</c>. A frame that knows its inputs' time (or why it
/// has none) adds a measurement <c>frame</c> with the frame's quality and <c>input_age_s</c>, the
/// age of the newest input the cycle used. The timestamp is the frame's (its cycle's scheduled
/// time, one per cycle and reactor), in milliseconds: the same frame always maps to the same
/// points, so a resend overwrites instead of duplicating.
/// </summary>
internal static class LineProtocol
{
    /// <summary>The lines of one frame, in a stable order (kinds, then estimates, by name).</summary>
    public static IReadOnlyList<string> Lines(EstimateFrame frame, string site, string measurementPrefix)
    {
        long ms = frame.Time.ToUnixTimeMilliseconds();
        var lines = new List<string>(4);
        foreach (var group in frame.Values.GroupBy(v => EstimateKinds.Of(v.Name)).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var sb = new StringBuilder(256);
            AppendName(sb, measurementPrefix + group.Key, measurement: true);
            AppendTag(sb, "site", site);
            AppendTag(sb, "unit", frame.Reactor);
            AppendTag(sb, "batch", frame.BatchId);
            sb.Append(' ');
            bool first = true;
            foreach (var v in group.OrderBy(v => v.Name, StringComparer.Ordinal))
            {
                if (double.IsFinite(v.Value))
                {
                    AppendField(sb, ref first, v.Name, Float(v.Value));
                }

                AppendField(sb, ref first, v.Name + "_quality", ((int)v.Quality).ToString(CultureInfo.InvariantCulture) + "i");
                if (double.IsFinite(v.Sigma))
                {
                    AppendField(sb, ref first, v.Name + "_sigma", Float(v.Sigma));
                }
            }

            sb.Append(' ').Append(ms.ToString(CultureInfo.InvariantCulture));
            lines.Add(sb.ToString());
        }

        if (frame.InputTime is not null || frame.Reason.Length > 0)
        {
            lines.Add(FrameLine(frame, site, measurementPrefix, ms));
        }

        return lines;
    }

    private static string FrameLine(EstimateFrame frame, string site, string measurementPrefix, long ms)
    {
        var sb = new StringBuilder(128);
        AppendName(sb, measurementPrefix + "frame", measurement: true);
        AppendTag(sb, "site", site);
        AppendTag(sb, "unit", frame.Reactor);
        AppendTag(sb, "batch", frame.BatchId);
        sb.Append(' ');
        bool first = true;
        AppendField(sb, ref first, "quality", ((int)frame.Quality).ToString(CultureInfo.InvariantCulture) + "i");
        if (frame.InputAge is { } age)
        {
            AppendField(sb, ref first, "input_age_s", Float(age.TotalSeconds));
        }

        sb.Append(' ').Append(ms.ToString(CultureInfo.InvariantCulture));
        return sb.ToString();
    }

    /// <summary>Escapes a measurement (commas, spaces) or a tag/field key or tag value (commas, equals signs, spaces), and backslashes.</summary>
    public static string Escape(string text, bool measurement)
    {
        var sb = new StringBuilder(text.Length + 4);
        AppendName(sb, text, measurement);
        return sb.ToString();
    }

    private static string Float(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    private static void AppendTag(StringBuilder sb, string key, string value)
    {
        if (string.IsNullOrEmpty(value))
        {
            return; // line protocol has no empty tag values
        }

        sb.Append(',');
        AppendName(sb, key, measurement: false);
        sb.Append('=');
        AppendName(sb, value, measurement: false);
    }

    private static void AppendField(StringBuilder sb, ref bool first, string key, string value)
    {
        if (!first)
        {
            sb.Append(',');
        }

        first = false;
        AppendName(sb, key, measurement: false);
        sb.Append('=').Append(value);
    }

    private static void AppendName(StringBuilder sb, string text, bool measurement)
    {
        foreach (char c in text)
        {
            if (c is ',' or ' ' or '\\' || (!measurement && c == '='))
            {
                sb.Append('\\');
            }

            sb.Append(c is '\n' or '\r' ? ' ' : c);
        }
    }
}
