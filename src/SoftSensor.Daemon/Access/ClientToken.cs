namespace SoftSensor.Daemon.Access;

/// <summary>
/// The bearer token of the client verbs (batch, sample, ...): never a command-line argument (other
/// users see those in the process list), but the environment's <c>SOFTSENSOR_TOKEN</c> or the first
/// line of the file named by <c>SOFTSENSOR_TOKEN_FILE</c>.
/// </summary>
internal static class ClientToken
{
    public const string Variable = "SOFTSENSOR_TOKEN";
    public const string FileVariable = "SOFTSENSOR_TOKEN_FILE";

    public static string? FromEnvironment()
    {
        if (Environment.GetEnvironmentVariable(Variable) is { Length: > 0 } token)
        {
            return token.Trim();
        }

        return Environment.GetEnvironmentVariable(FileVariable) is { Length: > 0 } file && File.Exists(file)
            ? File.ReadLines(file).FirstOrDefault()?.Trim()
            : null;
    }
}
