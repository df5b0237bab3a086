using System.Net;
using System.Net.Sockets;

namespace RunWatch.Testing.Mqtt;

/// <summary>Free TCP ports on loopback.</summary>
public static class FreePort
{
    /// <summary>A port that was free a moment ago (the OS picks it).</summary>
    public static int Next()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        int port = ((IPEndPoint)listener.LocalEndpoint).Port;
        listener.Stop();
        return port;
    }

    /// <summary>Waits until something accepts TCP connections on <paramref name="port"/>.</summary>
    public static async Task WaitForListenerAsync(int port, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (true)
        {
            try
            {
                using var client = new TcpClient();
                await client.ConnectAsync(IPAddress.Loopback, port).ConfigureAwait(false);
                return;
            }
            catch (SocketException) when (DateTime.UtcNow < deadline)
            {
                await Task.Delay(50).ConfigureAwait(false);
            }
        }
    }
}
