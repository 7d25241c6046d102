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
    /// <remarks>
    /// The plant unit converts here, the one place (<see cref="PlantUnits"/>): role value =
    /// f × (raw × scale + offset) + o, kept as one scale and one offset.
    /// </remarks>
    public static IReadOnlyList<TagBinding> FromOptions(ReactorOptions reactor) =>
        reactor.Tags
            .OrderBy(kv => kv.Key, StringComparer.Ordinal)
            .Select(kv =>
            {
                var role = Enum.Parse<SignalRole>(kv.Value.Role, ignoreCase: true);
                var (f, o) = PlantUnits.Map(role, kv.Value.Unit, kv.Value.AtmosphereKPa);
                return new TagBinding(
                    kv.Key,
                    role,
                    kv.Value.Unit,
                    f * kv.Value.Scale,
                    (f * kv.Value.Offset) + o,
                    kv.Value.MaxAge,
                    kv.Value.DeadTime,
                    kv.Value.Topic,
                    kv.Value.Payload,
                    kv.Value.OpcUaNode)
                {
                    Column = string.IsNullOrEmpty(kv.Value.Column) ? kv.Key : kv.Value.Column,
                };
            })
            .ToList();

    /// <summary>The historian column holding this tag (replay): its <c>column</c> alias, else the tag name.</summary>
    public string Column { get; init; } = Tag;

    /// <summary>The tags that enter the cycle (every role but the batch roles, <see cref="SignalRoles.IsBatchRole"/>).</summary>
    public static IReadOnlyList<TagBinding> Process(IReadOnlyList<TagBinding> bindings) =>
        bindings.Any(b => SignalRoles.IsBatchRole(b.Role)) ? [.. bindings.Where(b => !SignalRoles.IsBatchRole(b.Role))] : bindings;

    /// <summary>The raw plant value converted to the role's unit.</summary>
    public double ToRoleUnit(double raw) => raw * Scale + Offset;
}
