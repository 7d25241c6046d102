using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>A service request: an encodeable structure that starts with a <see cref="RequestHeader"/>.</summary>
public interface IServiceRequest : IUaEncodeable
{
    /// <summary>The header; the session fills token, handle, timestamp and time-out hint before sending.</summary>
    RequestHeader Header { get; set; }
}

/// <summary>A service response: a structure that starts with a <see cref="ResponseHeader"/>.</summary>
public interface IServiceResponse
{
    ResponseHeader Header { get; }
}
