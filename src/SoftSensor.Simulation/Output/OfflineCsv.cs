using System.Text;

namespace SoftSensor.Simulation.Output;

/// <summary>offline.csv: time, the assay's dry cell weight, its standard deviation and the volume withdrawn.</summary>
internal static class OfflineCsv
{
    public static void Write(string path, IReadOnlyList<OfflineSample> samples)
    {
        using var w = new StreamWriter(path, false, new UTF8Encoding(false));
        w.WriteLine("time,dcw_g_per_l,sd_g_per_l,volume_ml");
        foreach (var s in samples)
        {
            w.WriteLine($"{CsvFormat.Time(s.Time)},{CsvFormat.Truth(s.DcwGPerL)},{CsvFormat.Truth(s.SdGPerL)},{CsvFormat.Truth(s.VolumeMl)}");
        }
    }
}
