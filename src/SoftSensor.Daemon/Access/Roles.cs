namespace SoftSensor.Daemon.Access;

/// <summary>
/// The roles of the status server, each including the ones before it: a viewer reads; an operator
/// also starts, phases and ends batches, enters samples and removals, acknowledges and shelves alarms;
/// an engineer also does what changes configuration or models (nothing on the HTTP side yet).
/// </summary>
internal enum Role
{
    /// <summary>Reads the status page and the API.</summary>
    Viewer = 1,

    /// <summary>Batch, phase, samples, removals, alarm commands.</summary>
    Operator = 2,

    /// <summary>Configuration and models.</summary>
    Engineer = 3,
}

/// <summary>Role ids as written in the credentials file and on the command line.</summary>
internal static class Roles
{
    public const string Ids = "viewer, operator, engineer";

    public static string Id(Role role) => role switch
    {
        Role.Viewer => "viewer",
        Role.Operator => "operator",
        Role.Engineer => "engineer",
        _ => throw new ArgumentOutOfRangeException(nameof(role), role, "expected viewer, operator or engineer"),
    };

    public static bool TryParse(string? id, out Role role)
    {
        role = id switch
        {
            "viewer" => Role.Viewer,
            "operator" => Role.Operator,
            "engineer" => Role.Engineer,
            _ => 0,
        };
        return role != 0;
    }
}
