using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Tests.Fuzz;

/// <summary>
/// 100 000 random and mutated frames into the frame decoder: it must give a result or a
/// <see cref="UaDecodeException"/>, never another exception, and never hang (common practice of
/// protocol fuzzing: seeds of valid messages, bit flips, boundary values in length fields,
/// truncation, splicing; a fixed seed keeps failures reproducible).
/// </summary>
public sealed class DecoderFuzzTests
{
    private const int Iterations = 100_000;
    private static readonly int[] Boundary = [-1, 0, 1, 0x7F, 0x80, 0xFF, 0x7FFF, 0xFFFF, int.MaxValue, int.MinValue, 0x00FFFFFF];
    private static readonly DecodeLimits Limits = new() { MaxArrayLength = 100_000, MaxStringLengthBytes = 1 << 20, MaxNestingDepth = 32 };

    [Fact]
    public async Task Decode_HundredThousandRandomAndMutatedFrames_OnlyDecodeErrors()
    {
        var seeds = ResponseFrames.All();
        foreach (var seed in seeds)
        {
            InboundFrameDecoder.Decode(seed, 65535, Limits); // every seed is valid to begin with
        }

        var counts = await Task.Run(() => Run(seeds)).WaitAsync(TimeSpan.FromMinutes(2));

        Assert.Equal(Iterations, counts.Decoded + counts.Rejected);
        Assert.True(counts.Decoded > 0 && counts.Rejected > 0, $"decoded {counts.Decoded}, rejected {counts.Rejected}");
    }

    [Fact]
    public void Decode_EverySeedFrame_GivesItsContent()
    {
        var decoded = ResponseFrames.All().Select(f => InboundFrameDecoder.Decode(f, 65535).Content).ToList();

        Assert.IsType<SoftSensor.OpcUa.Transport.TransportLimits>(decoded[0]);
        Assert.Equal(new StatusCode(StatusCodes.BadTcpMessageTooLarge), decoded[1]);
        Assert.Equal(60000u, Assert.IsType<OpenSecureChannelResponse>(decoded[2]).SecurityToken.RevisedLifetimeMs);
        Assert.Equal(8, Assert.IsType<ReadResponse>(decoded[3]).Results.Length);
        Assert.Equal("Reactor1", Assert.IsType<BrowseResponse>(decoded[4]).Results[0].References[0].BrowseName.Name);
        var publish = Assert.IsType<PublishResponse>(decoded[5]);
        var changes = Notifications.ReadDataChanges(publish.Message.NotificationData[0]);
        Assert.Equal(0.8, changes[0].Value.Value.AsDouble());
        Assert.True(changes[1].Value.Status.Is(StatusCodes.BadNoCommunication));
        Assert.True(Assert.IsType<ServiceFault>(decoded[6]).Header.ServiceResult.Is(StatusCodes.BadSessionIdInvalid));
        Assert.Equal(new StatusCode(StatusCodes.BadResponseTooLarge), decoded[7]);
    }

    private static (int Decoded, int Rejected) Run(List<byte[]> seeds)
    {
        var random = new Random(62541);
        int decoded = 0, rejected = 0;
        for (int i = 0; i < Iterations; i++)
        {
            byte[] frame = i % 10 == 0 ? RandomFrame(random) : Mutate(seeds[random.Next(seeds.Count)], random);
            try
            {
                var result = InboundFrameDecoder.Decode(frame, 65535, Limits);
                if (result.Content is PublishResponse p)
                {
                    foreach (var data in p.Message.NotificationData)
                    {
                        Notifications.ReadDataChanges(data, Limits);
                    }
                }

                decoded++;
            }
            catch (UaDecodeException)
            {
                rejected++;
            }
        }

        return (decoded, rejected);
    }

    private static byte[] RandomFrame(Random random)
    {
        var frame = new byte[random.Next(0, 200)];
        random.NextBytes(frame);
        if (frame.Length >= 8 && random.Next(2) == 0)
        {
            "MSGF"u8.CopyTo(frame);
            BitConverter.TryWriteBytes(frame.AsSpan(4), frame.Length);
        }

        return frame;
    }

    private static byte[] Mutate(byte[] seed, Random random)
    {
        var frame = new List<byte>(seed);
        int edits = random.Next(1, 5);
        for (int e = 0; e < edits && frame.Count > 0; e++)
        {
            int at = random.Next(frame.Count);
            switch (random.Next(6))
            {
                case 0:
                    frame[at] ^= (byte)(1 << random.Next(8));
                    break;
                case 1:
                    frame[at] = (byte)random.Next(256);
                    break;
                case 2 when at + 4 <= frame.Count:
                    var bytes = BitConverter.GetBytes(Boundary[random.Next(Boundary.Length)]);
                    for (int k = 0; k < 4; k++)
                    {
                        frame[at + k] = bytes[k];
                    }

                    break;
                case 3:
                    frame.RemoveRange(at, frame.Count - at);
                    break;
                case 4:
                    int from = random.Next(frame.Count);
                    frame.InsertRange(at, frame.GetRange(from, Math.Min(8, frame.Count - from)));
                    break;
                default:
                    frame.RemoveAt(at);
                    break;
            }
        }

        var result = frame.ToArray();
        if (result.Length >= 8 && random.Next(4) != 0)
        {
            BitConverter.TryWriteBytes(result.AsSpan(4), result.Length); // keep the size right so the body is reached
        }

        return result;
    }
}
