namespace SoftSensor.OpcUa.Tests.Encoding;

/// <summary>Hex helpers for byte sequences written as in the specification ("03 01 00 ...").</summary>
internal static class Hex
{
    public static byte[] Bytes(string hex) => Convert.FromHexString(hex.Replace(" ", string.Empty, StringComparison.Ordinal));

    public static string Of(ReadOnlySpan<byte> bytes) => string.Join(' ', bytes.ToArray().Select(b => b.ToString("X2", System.Globalization.CultureInfo.InvariantCulture)));
}
