using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Contracts;

/// <summary>A tag of a reactor's map, compiled from <see cref="TagOptions"/> after validation.</summary>
internal sealed record TagBinding(
    string Tag,
    SignalRole Role,
    string PlantUnit,
    double Scale,
    double Offset,
    TimeSpan MaxAge,
    TimeSpan DeadTime,
    string Topic,
    PayloadOptions Payload,
    string OpcUaNode = "")
{
    /// <summary>Compiles every tag of a validated reactor.</summary>
    public static IReadOnlyList<TagBinding> FromOptions(ReactorOptions reactor) =>
        reactor.Tags
            .OrderBy(kv => kv.Key, StringComparer.Ordinal)
            .Select(kv => new TagBinding(
                kv.Key,
                Enum.Parse<SignalRole>(kv.Value.Role, ignoreCase: true),
                kv.Value.Unit,
                kv.Value.Scale,
                kv.Value.Offset,
                kv.Value.MaxAge,
                kv.Value.DeadTime,
                kv.Value.Topic,
                kv.Value.Payload,
                kv.Value.OpcUaNode))
            .ToList();

    /// <summary>The tags that enter the cycle (every role but the batch roles, <see cref="SignalRoles.IsBatchRole"/>).</summary>
    public static IReadOnlyList<TagBinding> Process(IReadOnlyList<TagBinding> bindings) =>
        bindings.Any(b => SignalRoles.IsBatchRole(b.Role)) ? [.. bindings.Where(b => !SignalRoles.IsBatchRole(b.Role))] : bindings;

    /// <summary>The raw plant value converted to the role's unit.</summary>
    public double ToRoleUnit(double raw) => raw * Scale + Offset;
}
