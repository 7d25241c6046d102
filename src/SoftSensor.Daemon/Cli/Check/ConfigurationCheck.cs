using Microsoft.Extensions.Configuration;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Hosting;

namespace SoftSensor.Daemon.Cli.Check;

/// <summary>
/// Validates a daemon configuration without starting anything: the layers and binding of <c>run</c>
/// (<see cref="DaemonConfiguration"/>, <see cref="SoftSensorOptionsValidator"/>), then per reactor the
/// tag units, the model's structure with the measured rates, and the alarm rules. Collects every problem.
/// </summary>
internal static class ConfigurationCheck
{
    /// <summary>Checks the configuration <paramref name="settings"/> names.</summary>
    public static CheckReport Run(DaemonHostSettings settings)
    {
        string file = settings.ConfigFile ?? "";
        var problems = new List<string>(DaemonDefinition.Problems(settings));
        if (problems.Count > 0)
        {
            return new CheckReport(file, false, problems, [], []);
        }

        var manager = new ConfigurationManager();
        var options = new SoftSensorOptions();
        try
        {
            DaemonConfiguration.Apply(manager, settings);
            manager.Bind(options);
        }
        catch (Exception e) when (e is InvalidDataException or FormatException or InvalidOperationException or IOException)
        {
            problems.Add($"configuration '{file}' cannot be read: {e.Message} {e.InnerException?.Message}".TrimEnd());
            return new CheckReport(file, false, problems, [], []);
        }

        var validation = new SoftSensorOptionsValidator().Validate(null, options);
        if (validation.Failed)
        {
            problems.AddRange(validation.Failures);
        }

        string folder = Path.GetDirectoryName(Path.GetFullPath(file)) ?? ".";
        var alarms = AlarmCheck.Run(manager, options, folder, problems);
        var reactors = new List<ReactorCheck>();
        for (int i = 0; i < options.Reactors.Count; i++)
        {
            var r = options.Reactors[i];
            string key = $"reactors:{i}";
            var tags = r.Tags.Select(t => Tag(key, t.Key, t.Value, problems)).ToList();
            ModelCheck? model = null;
            if (!string.IsNullOrWhiteSpace(r.ModelFile))
            {
                model = ModelStructure.Run(key + ":modelFile", Resolve(r.ModelFile, folder), r, problems);
            }

            string? TagOf(SignalRole role) => r.Tags.FirstOrDefault(t => string.Equals(t.Value.Role, role.ToString(), StringComparison.OrdinalIgnoreCase)).Key;
            var b = r.Batches;
            var lifecycle = new BatchLifecycleLine(TagOf(SignalRole.BatchId), TagOf(SignalRole.BatchPhaseCode), b.PhaseCodes,
                double.IsNaN(b.FedBatchFeedAboveLPerH) ? null : b.FedBatchFeedAboveLPerH, b.FedBatchHold, b.InitialVolumeFromTag);
            reactors.Add(new ReactorCheck(r.Id, r.BatchId, r.CyclePeriod, tags, model) { Batches = lifecycle });
        }

        return new CheckReport(file, problems.Count == 0, problems, reactors, alarms);
    }

    /// <summary>A path as given when it exists from the working folder, else relative to the configuration's folder.</summary>
    public static string Resolve(string path, string configFolder) => DefinitionPaths.Resolve(path, configFolder);

    private static TagLine Tag(string reactorKey, string name, TagOptions t, List<string> problems)
    {
        bool known = Enum.TryParse<SignalRole>(t.Role, ignoreCase: true, out var role) && Enum.IsDefined(role) && !int.TryParse(t.Role, out _);
        string roleUnit = known ? SignalRoles.UnitOf(role) : "?";
        bool converts = true;
        if (known && PlantUnits.Problem(role, t.Unit) is not null)
        {
            // The validator reports it (reactors:N:tags:T:unit).
            converts = false;
        }

        return new TagLine(name, t.Role, t.Unit, roleUnit, t.Scale, t.Offset, t.DeadTime, t.Topic, converts);
    }
}
