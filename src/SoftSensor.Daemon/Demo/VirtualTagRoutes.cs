using SoftSensor.Core.Signals;
using SoftSensor.Simulation;

namespace SoftSensor.Daemon.Demo;

/// <summary>One tag of a reactor definition fed from the virtual reactor: raw = (signal − offset) / scale.</summary>
internal sealed record VirtualTagRoute(string Tag, string Topic, int SimulatorIndex, double Factor, double Scale, double Offset)
{
    /// <summary>The tag's raw value for the virtual reactor's readings (in the simulator's tag order).</summary>
    public double Raw(ReadOnlySpan<double> readings) => (readings[SimulatorIndex] * Factor - Offset) / Scale;
}

/// <summary>
/// Maps each MQTT tag of a reactor definition to the virtual reactor's signal of the same role, so
/// that <c>softsensor demo --config FILE</c> runs any definition against the virtual reactor: the
/// value is sent in the tag's own plant unit (the inverse of its <c>scale</c> and <c>offset</c>).
/// A volume tag is fed from the load cell through the scenario's broth density. Tags whose role the
/// virtual reactor does not have stay unfed (they turn stale, as they would on a plant).
/// </summary>
internal static class VirtualTagRoutes
{
    /// <summary>One tag of the definition: name, role, topic, scale, offset.</summary>
    internal readonly record struct DefinedTag(string Name, string Role, string Topic, double Scale, double Offset);

    /// <summary>The routes, and the tags that cannot be fed (name and why).</summary>
    public static (IReadOnlyList<VirtualTagRoute> Routes, IReadOnlyList<string> Unfed) For(IEnumerable<DefinedTag> tags, VirtualReactor reactor)
    {
        var routes = new List<VirtualTagRoute>();
        var unfed = new List<string>();
        foreach (var t in tags)
        {
            if (string.IsNullOrEmpty(t.Topic))
            {
                unfed.Add($"{t.Name} (not an MQTT tag)");
                continue;
            }

            if (!Enum.TryParse<SignalRole>(t.Role, ignoreCase: false, out var role) || SignalRoles.IsBatchRole(role))
            {
                unfed.Add($"{t.Name} (role {t.Role}: the virtual reactor has no such signal)");
                continue;
            }

            if (t.Scale == 0 || !double.IsFinite(t.Scale) || !double.IsFinite(t.Offset))
            {
                unfed.Add($"{t.Name} (scale {t.Scale}, offset {t.Offset}: no raw value maps to it)");
            }
            else if (Find(reactor, role) is int direct)
            {
                routes.Add(new VirtualTagRoute(t.Name, t.Topic, direct, 1.0, t.Scale, t.Offset));
            }
            else if (role == SignalRole.LiquidVolumeL && Find(reactor, SignalRole.WeightKg) is int weight)
            {
                routes.Add(new VirtualTagRoute(t.Name, t.Topic, weight, 1.0 / reactor.Scenario.Vessel.BrothDensityKgPerL, t.Scale, t.Offset));
            }
            else
            {
                unfed.Add($"{t.Name} (role {t.Role}: the virtual reactor has no such signal)");
            }
        }

        return (routes, unfed);
    }

    private static int? Find(VirtualReactor reactor, SignalRole role)
    {
        for (int i = 0; i < reactor.Tags.Count; i++)
        {
            if (reactor.Tags[i].Role == role)
            {
                return i;
            }
        }

        return null;
    }
}
