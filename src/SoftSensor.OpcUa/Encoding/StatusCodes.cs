using System.Collections.Frozen;

namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// The status codes this client acts on or reports, with their values from the specification's
/// table of status codes (Part 4 §7.39 and Part 6 Annex A StatusCode.csv; Part 8 §7.3.2 for the
/// data-access uncertain codes).
/// </summary>
public static class StatusCodes
{
    public const uint Good = 0x00000000;
    public const uint Uncertain = 0x40000000;
    public const uint UncertainLastUsableValue = 0x40900000;
    public const uint UncertainInitialValue = 0x40920000;
    public const uint UncertainSensorNotAccurate = 0x40930000;
    public const uint UncertainEngineeringUnitsExceeded = 0x40940000;
    public const uint UncertainSubNormal = 0x40950000;
    public const uint Bad = 0x80000000;
    public const uint BadUnexpectedError = 0x80010000;
    public const uint BadInternalError = 0x80020000;
    public const uint BadOutOfMemory = 0x80030000;
    public const uint BadCommunicationError = 0x80050000;
    public const uint BadEncodingError = 0x80060000;
    public const uint BadDecodingError = 0x80070000;
    public const uint BadEncodingLimitsExceeded = 0x80080000;
    public const uint BadRequestTooLarge = 0x80B80000;
    public const uint BadResponseTooLarge = 0x80B90000;
    public const uint BadUnknownResponse = 0x80090000;
    public const uint BadTimeout = 0x800A0000;
    public const uint BadServiceUnsupported = 0x800B0000;
    public const uint BadShutdown = 0x800C0000;
    public const uint BadServerNotConnected = 0x800D0000;
    public const uint BadServerHalted = 0x800E0000;
    public const uint BadNothingToDo = 0x800F0000;
    public const uint BadTooManyOperations = 0x80100000;
    public const uint BadSecurityChecksFailed = 0x80130000;
    public const uint BadIdentityTokenInvalid = 0x80200000;
    public const uint BadIdentityTokenRejected = 0x80210000;
    public const uint BadSecureChannelIdInvalid = 0x80220000;
    public const uint BadSessionIdInvalid = 0x80250000;
    public const uint BadSessionClosed = 0x80260000;
    public const uint BadSessionNotActivated = 0x80270000;
    public const uint BadSubscriptionIdInvalid = 0x80280000;
    public const uint BadRequestHeaderInvalid = 0x802A0000;
    public const uint BadNoCommunication = 0x80310000;
    public const uint BadWaitingForInitialData = 0x80320000;
    public const uint BadNodeIdInvalid = 0x80330000;
    public const uint BadNodeIdUnknown = 0x80340000;
    public const uint BadAttributeIdInvalid = 0x80350000;
    public const uint BadNotReadable = 0x803A0000;
    public const uint BadNotWritable = 0x803B0000;
    public const uint BadOutOfRange = 0x803C0000;
    public const uint BadNotSupported = 0x803D0000;
    public const uint BadNotFound = 0x803E0000;
    public const uint BadUserAccessDenied = 0x801F0000;
    public const uint BadTypeMismatch = 0x80740000;
    public const uint BadTooManyPublishRequests = 0x80780000;
    public const uint BadNoSubscription = 0x80790000;
    public const uint BadSequenceNumberUnknown = 0x807A0000;
    public const uint BadMessageNotAvailable = 0x807B0000;
    public const uint BadTcpMessageTypeInvalid = 0x807E0000;
    public const uint BadTcpSecureChannelUnknown = 0x807F0000;
    public const uint BadTcpMessageTooLarge = 0x80800000;
    public const uint BadTcpNotEnoughResources = 0x80810000;
    public const uint BadTcpInternalError = 0x80820000;
    public const uint BadTcpEndpointUrlInvalid = 0x80830000;
    public const uint BadRequestInterrupted = 0x80840000;
    public const uint BadRequestTimeout = 0x80850000;
    public const uint BadSecureChannelClosed = 0x80860000;
    public const uint BadSecureChannelTokenUnknown = 0x80870000;
    public const uint BadSequenceNumberInvalid = 0x80880000;
    public const uint BadConfigurationError = 0x80890000;
    public const uint BadNotConnected = 0x808A0000;
    public const uint BadOutOfService = 0x808D0000;
    public const uint BadNoMatch = 0x806F0000;
    public const uint BadBrowseNameInvalid = 0x80600000;
    public const uint BadContinuationPointInvalid = 0x804A0000;
    public const uint BadMaxConnectionsReached = 0x80B70000;
    public const uint BadConnectionClosed = 0x80AE0000;
    public const uint BadCertificateInvalid = 0x80120000;
    public const uint BadCertificateTimeInvalid = 0x80140000;
    public const uint BadCertificateHostNameInvalid = 0x80160000;
    public const uint BadCertificateUriInvalid = 0x80170000;
    public const uint BadCertificateUseNotAllowed = 0x80180000;
    public const uint BadCertificateUntrusted = 0x801A0000;
    public const uint BadCertificateRevocationUnknown = 0x801B0000;
    public const uint BadCertificateRevoked = 0x801D0000;
    public const uint BadCertificateIssuerRevoked = 0x801E0000;
    public const uint BadNonceInvalid = 0x80240000;
    public const uint BadSecurityModeRejected = 0x80540000;
    public const uint BadSecurityPolicyRejected = 0x80550000;
    public const uint BadApplicationSignatureInvalid = 0x80580000;

    private static readonly FrozenDictionary<uint, string> Names = typeof(StatusCodes)
        .GetFields(System.Reflection.BindingFlags.Public | System.Reflection.BindingFlags.Static)
        .Where(f => f.IsLiteral && f.FieldType == typeof(uint))
        .ToFrozenDictionary(f => (uint)f.GetRawConstantValue()!, f => f.Name);

    /// <summary>The symbolic name of a code (info bits ignored), or null when this table does not hold it.</summary>
    public static string? NameOf(uint code) => Names.TryGetValue(code & 0xFFFF0000, out var name) ? name : null;
}
