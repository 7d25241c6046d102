using System.Net;
using System.Net.Sockets;

namespace SoftSensor.Daemon.Tests.Fixtures;

/// <summary>A free TCP port on the loopback interface.</summary>
internal static class FreePort
{
    public static int Next()
    {
        using var l = new TcpListener(IPAddress.Loopback, 0);
        l.Start();
        int port = ((IPEndPoint)l.LocalEndpoint).Port;
        l.Stop();
        return port;
    }

    /// <summary>Waits until something accepts connections on 127.0.0.1:<paramref name="port"/>.</summary>
    public static async Task WaitListeningAsync(int port, TimeSpan timeout)
    {
        var until = DateTime.UtcNow + timeout;
        while (true)
        {
            try
            {
                using var c = new TcpClient();
                await c.ConnectAsync(IPAddress.Loopback, port);
                return;
            }
            catch (SocketException) when (DateTime.UtcNow < until)
            {
                await Task.Delay(50);
            }
        }
    }
}
