using RunWatch.Ingest.Configuration;
using RunWatch.Storage;

namespace RunWatch.Ingest.Chambers;

/// <summary>The configured chambers after registration in the store; looked up by topic segments without allocating.</summary>
internal sealed class ChamberRegistry
{
    private readonly Dictionary<string, ChamberRuntime>.AlternateLookup<ReadOnlySpan<char>> _byNameSpan;
    private readonly Dictionary<long, ChamberRuntime> _byId;

    public ChamberRegistry(IReadOnlyList<ChamberOptions> chambers, IReadOnlyList<RegisteredChamber> registered)
    {
        var byName = new Dictionary<string, ChamberRuntime>(StringComparer.Ordinal);
        _byId = [];
        var all = new List<ChamberRuntime>(chambers.Count);
        foreach (var options in chambers)
        {
            var match = registered.First(r => r.Definition.Name == options.Name);
            var runtime = new ChamberRuntime(options, match);
            byName[options.Name] = runtime;
            _byId[runtime.ChamberId] = runtime;
            all.Add(runtime);
        }
        All = all;
        _byNameSpan = byName.GetAlternateLookup<ReadOnlySpan<char>>();
    }

    public IReadOnlyList<ChamberRuntime> All { get; }

    public ChamberRuntime? Find(ReadOnlySpan<char> name) => _byNameSpan.TryGetValue(name, out var chamber) ? chamber : null;

    public ChamberRuntime? Find(long chamberId) => _byId.GetValueOrDefault(chamberId);

    /// <summary>The store definitions of the configured chambers.</summary>
    public static IReadOnlyList<ChamberDefinition> ToDefinitions(IReadOnlyList<ChamberOptions> chambers) =>
        chambers.Select(c => new ChamberDefinition(c.Name, c.Site, c.Description,
            c.Channels.Select(ch => new ChannelDefinition(ch.Name, ch.Role, ch.Unit, ch.Min, ch.Max,
                ch.Calibration.Select(p => new CalibrationPoint(p.Reading, p.True)).ToArray())).ToArray())).ToArray();
}
