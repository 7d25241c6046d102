using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>
/// A request or a connection failed with an OPC UA status: a ServiceFault, an ERR message, a
/// time-out (BadTimeout), a lost connection (BadConnectionClosed, BadNotConnected) or a response
/// that could not be decoded (BadDecodingError). The status is kept for the caller to act on.
/// </summary>
public sealed class ServiceResultException : Exception
{
    public ServiceResultException(StatusCode status, string message)
        : base($"{message} ({status})") => Status = status;

    public ServiceResultException(StatusCode status, string message, Exception innerException)
        : base($"{message} ({status})", innerException) => Status = status;

    public ServiceResultException()
        : this(new StatusCode(StatusCodes.Bad), "The operation failed.")
    {
    }

    public ServiceResultException(string message)
        : this(new StatusCode(StatusCodes.Bad), message)
    {
    }

    public ServiceResultException(string message, Exception innerException)
        : this(new StatusCode(StatusCodes.Bad), message, innerException)
    {
    }

    public StatusCode Status { get; }
}
