namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>
/// Sequence numbers of secure-conversation chunks (Part 6 §6.7.2.4): each chunk sent takes the
/// next number; after UInt32.MaxValue − 1024 the number wraps to a value below 1024. The first
/// number of a channel is below 1024. Renewing the token does not reset them. Not thread-safe: the
/// channel takes numbers under its send lock so they go out in order.
/// </summary>
public sealed class SequenceNumbers
{
    /// <summary>Numbers at or above this wrap around (Part 6 §6.7.2.4).</summary>
    public const uint WrapThreshold = uint.MaxValue - 1024;

    private uint last;

    public SequenceNumbers(uint first = 1) => last = first - 1;

    /// <summary>The next number to send.</summary>
    public uint Next()
    {
        last = last >= WrapThreshold ? 1 : last + 1;
        return last;
    }

    /// <summary>
    /// Checks a received number against the previous one: it must be one more, or below 1024 after
    /// a wrap. The first number received is accepted as it comes.
    /// </summary>
    public static bool IsValidSuccessor(uint? previous, uint received) =>
        previous is not { } p || received == p + 1 || (p >= WrapThreshold && received < 1024);
}
