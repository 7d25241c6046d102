using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace SoftSensor.Daemon.Access;

/// <summary>
/// Password hashes as PBKDF2 with HMAC-SHA-256 (RFC 8018 §5.2), a 16-byte random salt and a 32-byte
/// key, written <c>pbkdf2-sha256$ITERATIONS$SALT$KEY</c> (base64). The default iteration count is
/// OWASP's Password Storage Cheat Sheet figure for PBKDF2-HMAC-SHA256 (600,000, 2023). Bearer tokens
/// are 32 random bytes: their hash is a plain SHA-256 (<c>sha256$HASH</c>), enough for a secret of
/// that entropy (no dictionary to guess from).
/// </summary>
internal static class PasswordHash
{
    public const int DefaultIterations = 600_000;

    private const string Pbkdf2Prefix = "pbkdf2-sha256$";
    private const string TokenPrefix = "sha256$";

    /// <summary>A new hash of <paramref name="password"/>.</summary>
    public static string Hash(string password, int iterations = DefaultIterations)
    {
        byte[] salt = RandomNumberGenerator.GetBytes(16);
        byte[] key = Rfc2898DeriveBytes.Pbkdf2(Encoding.UTF8.GetBytes(password), salt, iterations, HashAlgorithmName.SHA256, 32);
        return string.Create(CultureInfo.InvariantCulture, $"{Pbkdf2Prefix}{iterations}${Convert.ToBase64String(salt)}${Convert.ToBase64String(key)}");
    }

    /// <summary>Whether <paramref name="password"/> matches <paramref name="hash"/> (constant time in the key comparison).</summary>
    public static bool Verify(string password, string hash)
    {
        if (!hash.StartsWith(Pbkdf2Prefix, StringComparison.Ordinal))
        {
            return false;
        }

        var parts = hash[Pbkdf2Prefix.Length..].Split('$');
        if (parts.Length != 3 || !int.TryParse(parts[0], NumberStyles.None, CultureInfo.InvariantCulture, out int iterations) || iterations < 1)
        {
            return false;
        }

        try
        {
            byte[] salt = Convert.FromBase64String(parts[1]);
            byte[] expected = Convert.FromBase64String(parts[2]);
            byte[] key = Rfc2898DeriveBytes.Pbkdf2(Encoding.UTF8.GetBytes(password), salt, iterations, HashAlgorithmName.SHA256, expected.Length);
            return CryptographicOperations.FixedTimeEquals(key, expected);
        }
        catch (FormatException)
        {
            return false;
        }
    }

    /// <summary>Whether <paramref name="hash"/> is a well-formed password hash.</summary>
    public static bool IsPasswordHash(string hash) => hash.StartsWith(Pbkdf2Prefix, StringComparison.Ordinal) && hash.Split('$').Length == 4;

    /// <summary>A new bearer token (43 characters of base64url) and the hash to store.</summary>
    public static (string Token, string Hash) NewToken()
    {
        string token = Base64Url(RandomNumberGenerator.GetBytes(32));
        return (token, TokenHash(token));
    }

    /// <summary>The stored form of a token.</summary>
    public static string TokenHash(string token) => TokenPrefix + Convert.ToBase64String(SHA256.HashData(Encoding.UTF8.GetBytes(token)));

    /// <summary>Whether <paramref name="hash"/> is a well-formed token hash.</summary>
    public static bool IsTokenHash(string hash) => hash.StartsWith(TokenPrefix, StringComparison.Ordinal) && hash.Length == TokenPrefix.Length + 44;

    /// <summary>Random bytes as base64url (session ids, anti-forgery tokens).</summary>
    public static string RandomId() => Base64Url(RandomNumberGenerator.GetBytes(32));

    private static string Base64Url(byte[] bytes) => Convert.ToBase64String(bytes).TrimEnd('=').Replace('+', '-').Replace('/', '_');
}
