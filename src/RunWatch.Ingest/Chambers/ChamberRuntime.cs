using RunWatch.Ingest.Configuration;
using RunWatch.Storage;

namespace RunWatch.Ingest.Chambers;

/// <summary>A configured chamber with store ids and fast channel lookup.</summary>
internal sealed class ChamberRuntime
{
    private readonly Dictionary<string, ChannelRuntime>.AlternateLookup<ReadOnlySpan<char>> _byNameSpan;

    public ChamberRuntime(ChamberOptions options, RegisteredChamber registered)
    {
        Options = options;
        ChamberId = registered.ChamberId;
        var channels = new ChannelRuntime[options.Channels.Count];
        var byName = new Dictionary<string, ChannelRuntime>(StringComparer.Ordinal);
        for (int i = 0; i < channels.Length; i++)
        {
            var channelOptions = options.Channels[i];
            var match = registered.Channels.First(c => c.Definition.Name == channelOptions.Name);
            channels[i] = new ChannelRuntime(channelOptions, match.ChannelId);
            byName[channelOptions.Name] = channels[i];
        }
        Channels = channels;
        _byNameSpan = byName.GetAlternateLookup<ReadOnlySpan<char>>();
        GrowthTemperature = Array.Find(channels, c => c.Role == ChannelRole.GrowthTemperature);
        Setpoint = Array.Find(channels, c => c.Role == ChannelRole.Setpoint);
        GrowthShutter = Array.Find(channels, c => c.Role == ChannelRole.GrowthShutter);
    }

    public ChamberOptions Options { get; }

    public string Name => Options.Name;

    public string Site => Options.Site;

    public long ChamberId { get; }

    public ChannelRuntime[] Channels { get; }

    public ChannelRuntime? GrowthTemperature { get; }

    public ChannelRuntime? Setpoint { get; }

    public ChannelRuntime? GrowthShutter { get; }

    /// <summary>Finds a channel by its UTF-8 JSON property name without allocating (linear: chambers have few channels).</summary>
    public ChannelRuntime? FindChannel(ref System.Text.Json.Utf8JsonReader reader)
    {
        var channels = Channels;
        for (int i = 0; i < channels.Length; i++)
        {
            if (reader.ValueTextEquals(channels[i].Utf8Name))
            {
                return channels[i];
            }
        }
        return null;
    }

    public ChannelRuntime? FindChannel(ReadOnlySpan<char> name) => _byNameSpan.TryGetValue(name, out var channel) ? channel : null;

    public ChannelRuntime? FindChannel(long channelId)
    {
        foreach (var channel in Channels)
        {
            if (channel.ChannelId == channelId)
            {
                return channel;
            }
        }
        return null;
    }
}
