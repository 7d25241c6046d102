namespace SoftSensor.Core.Alarms;

/// <summary>
/// Priority of an alarm rule. ANSI/ISA-18.2 asks for a small number of priorities set by the
/// consequence and the time to respond; three or four is common practice.
/// </summary>
public enum AlarmPriority
{
    Low = 1,
    Medium = 2,
    High = 3,
    Urgent = 4,
}
