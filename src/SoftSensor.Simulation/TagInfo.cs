using SoftSensor.Core.Signals;

namespace SoftSensor.Simulation;

/// <summary>One tag the virtual reactor publishes: its name, plant unit, meaning to the cycle (when it has one) and a description.</summary>
public sealed record TagInfo(string Name, string Unit, SignalRole? Role, string Description);
