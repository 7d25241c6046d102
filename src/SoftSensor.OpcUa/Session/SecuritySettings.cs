namespace SoftSensor.OpcUa.Session;

/// <summary>Which message security the client asks for.</summary>
public enum SecurityChoice
{
    /// <summary>The most secure endpoint both sides support (the choice is logged).</summary>
    Auto,

    /// <summary>SecurityPolicy None: for test servers only.</summary>
    None,

    /// <summary>Every chunk signed.</summary>
    Sign,

    /// <summary>Every chunk signed and encrypted.</summary>
    SignAndEncrypt,
}

/// <summary>
/// The security a client asks for: mode, policy (short name such as <c>Basic256Sha256</c> or URI;
/// null: the most secure both support) and the PKI folder of its certificate and trust lists.
/// </summary>
public sealed record SecuritySettings
{
    /// <summary>SecurityPolicy None, no endpoint discovery (the library's default, for test servers).</summary>
    public static SecuritySettings None { get; } = new() { Mode = SecurityChoice.None };

    public SecurityChoice Mode { get; init; } = SecurityChoice.Auto;

    public string? Policy { get; init; }

    /// <summary>PKI folder (own/, trusted/, issuers/, rejected/); null: <see cref="DefaultPkiDirectory"/>.</summary>
    public string? PkiDirectory { get; init; }

    /// <summary>The PKI folder used when none is given: softsensor/opcua-pki under the user's local application data.</summary>
    public static string DefaultPkiDirectory =>
        Path.Combine(Environment.GetFolderPath(Environment.SpecialFolder.LocalApplicationData, Environment.SpecialFolderOption.Create), "softsensor", "opcua-pki");

    /// <summary>Parses the command-line and configuration words none, sign, sign-encrypt (and auto); null when unknown.</summary>
    public static SecurityChoice? ParseMode(string? text) => text?.Trim().ToLowerInvariant() switch
    {
        null or "" or "auto" => SecurityChoice.Auto,
        "none" => SecurityChoice.None,
        "sign" => SecurityChoice.Sign,
        "sign-encrypt" => SecurityChoice.SignAndEncrypt,
        _ => null,
    };
}
