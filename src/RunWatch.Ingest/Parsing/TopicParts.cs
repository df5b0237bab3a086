namespace RunWatch.Ingest.Parsing;

/// <summary>Topic split into its levels as ranges of the topic string (no substrings allocated).</summary>
internal readonly ref struct TopicParts
{
    public TopicParts(TopicKind kind, ReadOnlySpan<char> site, ReadOnlySpan<char> chamber, ReadOnlySpan<char> channel)
    {
        Kind = kind;
        Site = site;
        Chamber = chamber;
        Channel = channel;
    }

    public TopicKind Kind { get; }

    public ReadOnlySpan<char> Site { get; }

    public ReadOnlySpan<char> Chamber { get; }

    public ReadOnlySpan<char> Channel { get; }

    /// <summary>Splits <paramref name="topic"/> against the contract under <paramref name="root"/>.</summary>
    public static TopicParts Parse(ReadOnlySpan<char> topic, ReadOnlySpan<char> root)
    {
        if (!topic.StartsWith(root, StringComparison.Ordinal) || topic.Length <= root.Length || topic[root.Length] != '/')
        {
            return default;
        }
        var rest = topic[(root.Length + 1)..];
        Span<Range> levels = stackalloc Range[6];
        int count = rest.Split(levels, '/');
        if (count < 3 || count > 4)
        {
            return default;
        }
        var site = rest[levels[0]];
        var chamber = rest[levels[1]];
        var kind = rest[levels[2]];
        if (site.IsEmpty || chamber.IsEmpty)
        {
            return default;
        }
        if (count == 3 && kind.SequenceEqual("telemetry"))
        {
            return new TopicParts(TopicKind.Telemetry, site, chamber, default);
        }
        if (count == 3 && kind.SequenceEqual("event"))
        {
            return new TopicParts(TopicKind.Event, site, chamber, default);
        }
        if (count == 4 && kind.SequenceEqual("ch") && !rest[levels[3]].IsEmpty)
        {
            return new TopicParts(TopicKind.Channel, site, chamber, rest[levels[3]]);
        }
        return default;
    }
}
