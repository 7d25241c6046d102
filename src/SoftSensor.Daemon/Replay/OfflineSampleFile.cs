using System.Globalization;
using SoftSensor.Core.Estimation;

namespace SoftSensor.Daemon.Replay;

/// <summary>An offline sample as the replay schedules it: the assay, when the result reaches the estimator, and the broth withdrawn.</summary>
internal readonly record struct ScheduledSample(OfflineSample Sample, DateTimeOffset ArrivesAt, double WithdrawnL, long LineNumber);

/// <summary>Reads the offline samples file per <see cref="OfflineLayout"/>; malformed rows are skipped and reported like history rows.</summary>
internal static class OfflineSampleFile
{
    public static bool TryRead(string path, OfflineLayout layout, List<ScheduledSample> samples, List<SkippedRow> skipped, out string? error)
    {
        using var reader = new CsvLineReader(File.OpenRead(path));
        if (!reader.TryReadLine(out var header))
        {
            error = $"offline file '{path}' is empty; expected a header line";
            return false;
        }

        var names = header.ToString().Split(',').Select(h => h.Trim().Trim('"')).ToList();
        int ti = names.IndexOf(layout.TimeColumn), vi = names.IndexOf(layout.ValueColumn);
        int si = layout.SigmaColumn is null ? -1 : names.IndexOf(layout.SigmaColumn);
        int mi = layout.VolumeMlColumn is null ? -1 : names.IndexOf(layout.VolumeMlColumn);
        if (ti < 0 || vi < 0)
        {
            error = $"offline file '{path}' has columns {string.Join(", ", names)}; expected offline.timeColumn '{layout.TimeColumn}' and offline.valueColumn '{layout.ValueColumn}'";
            return false;
        }

        TimestampParser.TryCreate(new TimestampSpec(), out var time, out _);
        var cells = new Range[names.Count + 1];
        while (reader.TryReadLine(out var line))
        {
            if (line.IsWhiteSpace())
            {
                continue;
            }

            int n = line.Split(cells, ',');
            string? fault = null;
            double value = double.NaN, sigma = layout.DefaultSigmaGPerL, volumeMl = 0;
            DateTimeOffset t = default;
            if (n <= Math.Max(ti, vi))
            {
                fault = "missing cell";
            }
            else if (!time!.TryParse(line[cells[ti]], out t))
            {
                fault = $"bad time '{line[cells[ti]].ToString()}'";
            }
            else if (!TryNumber(line[cells[vi]], out value) || value < 0)
            {
                fault = $"'{layout.ValueColumn}' is not a number >= 0";
            }
            else if (si >= 0 && si < n && !line[cells[si]].IsWhiteSpace() && (!TryNumber(line[cells[si]], out sigma) || sigma <= 0))
            {
                fault = $"'{layout.SigmaColumn}' is not a number > 0";
            }
            else if (mi >= 0 && mi < n && !line[cells[mi]].IsWhiteSpace() && (!TryNumber(line[cells[mi]], out volumeMl) || volumeMl < 0))
            {
                fault = $"'{layout.VolumeMlColumn}' is not a number >= 0";
            }

            if (fault is not null)
            {
                skipped.Add(new SkippedRow(path, reader.LineNumber, fault));
                continue;
            }

            samples.Add(new ScheduledSample(new OfflineSample(t, value, sigma), t.AddMinutes(layout.ReportDelayMinutes), volumeMl / 1000.0, reader.LineNumber));
        }

        samples.Sort((a, b) => a.Sample.SampledAt.CompareTo(b.Sample.SampledAt));
        error = null;
        return true;
    }

    private static bool TryNumber(ReadOnlySpan<char> cell, out double value) =>
        double.TryParse(cell.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out value) && double.IsFinite(value);
}

/// <summary>A skipped input row: file, line number (1-based) and the reason.</summary>
internal readonly record struct SkippedRow(string File, long Line, string Reason);
