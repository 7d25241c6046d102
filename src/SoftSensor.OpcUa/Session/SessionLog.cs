using Microsoft.Extensions.Logging;

namespace SoftSensor.OpcUa.Session;

/// <summary>Log events of sessions (event ids 4200–4299). Passwords are never logged.</summary>
internal static partial class SessionLog
{
    [LoggerMessage(EventId = 4200, Level = LogLevel.Information, Message = "OPC UA session {SessionId} created on {Endpoint} as {User}, timeout {TimeoutMs} ms")]
    public static partial void Created(ILogger logger, string sessionId, string endpoint, string user, double timeoutMs);

    [LoggerMessage(EventId = 4201, Level = LogLevel.Warning, Message = "OPC UA user-name password for {User} is sent in clear text: the channel and the token policy {PolicyId} use SecurityPolicy None")]
    public static partial void ClearTextPassword(ILogger logger, string user, string? policyId);

    [LoggerMessage(EventId = 4202, Level = LogLevel.Information, Message = "OPC UA session {SessionId} re-activated on a new channel")]
    public static partial void Reactivated(ILogger logger, string sessionId);

    [LoggerMessage(EventId = 4203, Level = LogLevel.Information, Message = "OPC UA session {SessionId} could not be re-activated ({Status}); a new session is needed")]
    public static partial void ReactivationRefused(ILogger logger, string sessionId, string status);
}
