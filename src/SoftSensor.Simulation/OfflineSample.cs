namespace SoftSensor.Simulation;

/// <summary>A broth sample taken by the virtual operator: dry cell weight as the assay reads it, its standard deviation, the true value and the volume withdrawn.</summary>
public sealed record OfflineSample(DateTimeOffset Time, double DcwGPerL, double SdGPerL, double TrueDcwGPerL, double VolumeMl);
