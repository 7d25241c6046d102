using System.IO.Compression;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// The text form of an estimator checkpoint: the state's bytes (<see cref="Core.Estimation.EstimatorStateCodec"/>)
/// compressed with Brotli (RFC 7932) and written as <c>br:</c> + Base64. Most of a state is its history
/// ring, whose timestamps and slowly moving inputs compress well. A checkpoint written before
/// (plain Base64, no prefix) still reads.
/// </summary>
internal static class CheckpointCompression
{
    private const string Prefix = "br:";

    /// <summary>Compresses and encodes <paramref name="state"/>.</summary>
    public static string Pack(byte[] state)
    {
        using var output = new MemoryStream(state.Length / 2);
        // Quality 5 of 11: most of the gain at a small fraction of the time of the highest settings.
        using (var brotli = new BrotliStream(output, new BrotliCompressionOptions { Quality = 5 }, leaveOpen: true))
        {
            brotli.Write(state);
        }

        return Prefix + Convert.ToBase64String(output.GetBuffer(), 0, (int)output.Length);
    }

    /// <summary>The state's bytes of a checkpoint written by <see cref="Pack"/> (or by a version before it, uncompressed). Throws <see cref="FormatException"/> when it is neither.</summary>
    public static byte[] Unpack(string text)
    {
        if (!text.StartsWith(Prefix, StringComparison.Ordinal))
        {
            return Convert.FromBase64String(text);
        }

        try
        {
            using var input = new MemoryStream(Convert.FromBase64String(text[Prefix.Length..]));
            using var brotli = new BrotliStream(input, CompressionMode.Decompress);
            using var output = new MemoryStream();
            brotli.CopyTo(output);
            return output.ToArray();
        }
        catch (InvalidDataException e)
        {
            throw new FormatException($"estimator checkpoint: compressed state unreadable ({e.Message})", e);
        }
    }
}
