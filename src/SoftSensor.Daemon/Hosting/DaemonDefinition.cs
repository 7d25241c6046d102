using Microsoft.Extensions.Configuration;
using SoftSensor.Daemon.Alarming;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Hosting;

/// <summary>
/// The reactor definition as every verb reads it (run, check, replay, demo): the layers of
/// <see cref="DaemonConfiguration"/>, each file's JSON syntax, then every key and value strictly
/// (<see cref="DefinitionSchema"/>). One line per problem.
/// </summary>
internal static class DaemonDefinition
{
    /// <summary>The root sections besides <see cref="SoftSensorOptions"/>'s own.</summary>
    public static readonly IReadOnlyDictionary<string, Type> Sections = new Dictionary<string, Type>(StringComparer.OrdinalIgnoreCase)
    {
        [AlarmOptions.Section] = typeof(AlarmOptions),
        [TimeseriesOptions.Section] = typeof(TimeseriesOptions),
    };

    /// <summary>The problems that keep the definition from being read at all; empty when it reads.</summary>
    public static IReadOnlyList<string> Problems(DaemonHostSettings settings)
    {
        var syntax = DaemonConfiguration.Files(settings).Select(DefinitionFile.SyntaxProblem).OfType<string>().ToList();
        if (syntax.Count > 0)
        {
            return syntax;
        }

        var manager = new ConfigurationManager();
        DaemonConfiguration.Apply(manager, settings);
        return DefinitionSchema.Problems(manager, typeof(SoftSensorOptions), Sections);
    }
}
