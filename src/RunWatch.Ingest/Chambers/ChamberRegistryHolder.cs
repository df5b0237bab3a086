namespace RunWatch.Ingest.Chambers;

/// <summary>Holds the chamber registry once the store is migrated and the chambers are registered (at host start).</summary>
internal sealed class ChamberRegistryHolder
{
    private ChamberRegistry? _registry;

    public ChamberRegistry Registry => _registry ?? throw new InvalidOperationException("The store is not initialised yet.");

    public bool IsReady => _registry is not null;

    public void Set(ChamberRegistry registry) => _registry = registry;
}
