namespace SoftSensor.OpcUa.Encoding;

/// <summary>Severity of a StatusCode, ordered so that the worst of several is their maximum (Part 4 §7.39).</summary>
public enum StatusSeverity
{
    Good = 0,
    Uncertain = 1,
    Bad = 2,
}
