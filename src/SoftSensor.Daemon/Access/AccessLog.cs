using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Access;

/// <summary>Log messages of access control (event ids 1600–1649). Passwords and tokens are never logged.</summary>
internal static partial class AccessLog
{
    [LoggerMessage(1600, LogLevel.Warning, "no credentials in {Path}: nobody can change anything through the status server; create the first user with `softsensor user add NAME --role operator --file {Path}`")]
    public static partial void NoCredentials(ILogger logger, string path);

    [LoggerMessage(1601, LogLevel.Error, "credentials file {Path} refused (nobody can log in until it is fixed): {Problems}")]
    public static partial void BadCredentials(ILogger logger, string path, string problems);

    [LoggerMessage(1602, LogLevel.Warning, "credentials file {Path} is readable or writable by group or others (expected mode 0600)")]
    public static partial void OpenPermissions(ILogger logger, string path);

    [LoggerMessage(1603, LogLevel.Information, "{User} ({Role}, {Method}) {HttpMethod} {Path} -> {Status}")]
    public static partial void Change(ILogger logger, string user, string role, string method, string httpMethod, string path, int status);

    [LoggerMessage(1604, LogLevel.Warning, "login of '{User}' from {Remote} refused")]
    public static partial void LoginRefused(ILogger logger, string user, string remote);

    [LoggerMessage(1605, LogLevel.Warning, "request refused ({Status}): {Reason}; {HttpMethod} {Path} from {Remote}")]
    public static partial void Refused(ILogger logger, int status, string reason, string httpMethod, string path, string remote);
}
