using SoftSensor.Core.Gas;

namespace SoftSensor.Daemon.Cli.Offgas;

/// <summary>One balance as the flags asked for it, in Core's types.</summary>
internal sealed record OffgasRequest(
    GasLineFlows Flows,
    InletComposition Inlet,
    AnalyserReading Outlet,
    double VolumeL,
    GasBalanceSettings Settings,
    bool Json);
