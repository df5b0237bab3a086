using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Fleet;

/// <summary>Reads a daemon's fleet ownership from its /healthz ("owned": locked, state rebuilt and subscribed).</summary>
internal static class FleetHealth
{
    public static async Task WaitOwnedAsync(ServeProcess daemon, int count, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (DateTime.UtcNow < deadline)
        {
            if ((await OwnedAsync(daemon)).Count == count)
            {
                return;
            }
            await Task.Delay(50);
        }
        throw new TimeoutException($"daemon did not come to own {count} chamber(s): {daemon.Output}");
    }

    public static async Task<List<string>> OwnedAsync(ServeProcess daemon)
    {
        using var health = await daemon.HealthAsync();
        if (health is null || !health.RootElement.GetProperty("checks").TryGetProperty("fleet", out var fleet) || !fleet.TryGetProperty("owned", out var owned))
        {
            return [];
        }
        return [.. owned.EnumerateArray().Select(e => e.GetString()!).Order(StringComparer.Ordinal)];
    }
}
