namespace SoftSensor.Daemon.Cli;

/// <summary>Process exit codes shared by every verb.</summary>
internal static class ExitCodes
{
    public const int Ok = 0;
    public const int Failure = 1;
    public const int BadInput = 2;
}
