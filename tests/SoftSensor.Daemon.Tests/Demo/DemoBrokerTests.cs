using System.Diagnostics;
using System.Net.Sockets;
using MQTTnet;
using SoftSensor.Daemon.Demo;

namespace SoftSensor.Daemon.Tests.Demo;

/// <summary>
/// The demo's embedded broker takes the standard clients the README tells users to run.
/// </summary>
public class DemoBrokerTests
{
    /// <summary>
    /// A hand-encoded MQTT 3.1.1 CONNECT (OASIS MQTT Version 3.1.1, §3.1): protocol name "MQTT", level 4,
    /// connect flags 0x02 (clean session), keep-alive 60 s, and a zero-byte client identifier.
    /// </summary>
    private static byte[] ConnectWithEmptyClientId(bool cleanSession) =>
    [
        0x10, 12, // fixed header: CONNECT, remaining length 12
        0x00, 0x04, (byte)'M', (byte)'Q', (byte)'T', (byte)'T', // protocol name (§3.1.2.1)
        0x04, // protocol level 4 = 3.1.1 (§3.1.2.2)
        cleanSession ? (byte)0x02 : (byte)0x00, // connect flags (§3.1.2.3)
        0x00, 0x3C, // keep alive 60 s (§3.1.2.10)
        0x00, 0x00, // client identifier: zero bytes (§3.1.3.1)
    ];

    private static async Task<byte[]> ConnAckFor(int port, byte[] connect)
    {
        using var tcp = new TcpClient();
        await tcp.ConnectAsync("127.0.0.1", port);
        var stream = tcp.GetStream();
        await stream.WriteAsync(connect);
        var ack = new byte[4];
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        var read = await stream.ReadAtLeastAsync(ack, ack.Length, throwOnEndOfStream: false, timeout.Token);
        return ack[..read];
    }

    [Fact]
    public async Task A_3_1_1_client_with_an_empty_id_and_a_clean_session_is_accepted()
    {
        await using var broker = await DemoBroker.StartAsync();

        // MQTT 3.1.1 §3.1.3.1: "A Server MAY allow a Client to supply a ClientId that has a length of zero
        // bytes, however if it does so the Server MUST treat this as a special case and assign a unique
        // ClientId to that Client"; CONNACK return code 0 = accepted (§3.2.2.3).
        var ack = await ConnAckFor(broker.Port, ConnectWithEmptyClientId(cleanSession: true));
        Assert.Equal(new byte[] { 0x20, 0x02, 0x00, 0x00 }, ack);
    }

    [Fact]
    public async Task A_3_1_1_client_with_an_empty_id_and_a_kept_session_is_refused_as_the_standard_requires()
    {
        await using var broker = await DemoBroker.StartAsync();

        // MQTT 3.1.1 §3.1.3.1 [MQTT-3.1.3-8]: empty ClientId with CleanSession 0 → CONNACK 0x02
        // (identifier rejected) and the connection closed. MQTTnet 5.2 may close before the CONNACK
        // reaches the socket; either way the client is not accepted.
        var ack = await ConnAckFor(broker.Port, ConnectWithEmptyClientId(cleanSession: false));
        Assert.True(ack.Length == 0 || ack.SequenceEqual(new byte[] { 0x20, 0x02, 0x00, 0x02 }), $"CONNACK was {Convert.ToHexString(ack)}");
    }

    [Fact]
    public async Task Plain_mosquitto_sub_as_the_README_shows_it_receives_what_is_published()
    {
        // The README's subscribe hint: mosquitto_sub -h 127.0.0.1 -p PORT -t 'softsensor/#' (no -i: the
        // Eclipse Mosquitto client then sends an empty client id over MQTT 3.1.1).
        await using var broker = await DemoBroker.StartAsync();
        var sub = Process.Start(new ProcessStartInfo("mosquitto_sub",
            ["-h", "127.0.0.1", "-p", broker.Port.ToString(System.Globalization.CultureInfo.InvariantCulture), "-t", "softsensor/#", "-C", "1", "-W", "60"])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
        }) ?? throw new InvalidOperationException("mosquitto_sub did not start (tests/run.sh installs mosquitto-clients)");

        using var client = new MqttClientFactory().CreateMqttClient();
        await client.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", broker.Port).WithClientId("demo-broker-test").Build());
        var output = sub.StandardOutput.ReadToEndAsync();
        using var deadline = new CancellationTokenSource(TimeSpan.FromSeconds(60));

        // Publish until the subscriber has its message (its subscription may not be in place yet).
        while (!sub.HasExited && !deadline.IsCancellationRequested)
        {
            await client.PublishStringAsync("softsensor/r1/estimate", "hello");
            await Task.WhenAny(sub.WaitForExitAsync(deadline.Token), Task.Delay(200, deadline.Token)).ContinueWith(_ => { }, TaskScheduler.Default);
        }

        await sub.WaitForExitAsync(deadline.Token);
        var error = await sub.StandardError.ReadToEndAsync();
        Assert.True(sub.ExitCode == 0, $"mosquitto_sub exited {sub.ExitCode}: {error}");
        Assert.Equal("hello", (await output).Trim());
    }
}
