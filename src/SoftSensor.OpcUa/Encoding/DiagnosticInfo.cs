namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// Diagnostic information of a service result (Part 4 §7.12; Part 6 §5.2.2.12). Indexes point
/// into the response header's string table; -1 or absent means none.
/// </summary>
public sealed record DiagnosticInfo
{
    public int? SymbolicId { get; init; }

    public int? NamespaceUri { get; init; }

    public int? Locale { get; init; }

    public int? LocalizedText { get; init; }

    public string? AdditionalInfo { get; init; }

    public StatusCode? InnerStatusCode { get; init; }

    public DiagnosticInfo? InnerDiagnosticInfo { get; init; }
}
