namespace SoftSensor.Simulation.Scenarios;

/// <summary>A scenario file that cannot be used; the message names the key, the value and the expectation.</summary>
public sealed class ScenarioException : Exception
{
    public ScenarioException()
    {
    }

    public ScenarioException(string message)
        : base(message)
    {
    }

    public ScenarioException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
