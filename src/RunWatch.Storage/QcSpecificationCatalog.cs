using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;

namespace RunWatch.Storage;

/// <summary>
/// The QC specifications in force, kept in the store: configuration (<see cref="QcOptions"/>) seeds each recipe once
/// (the first time the catalog is used on a store without it); afterwards the stored value, edited by admins, is the
/// one the verdict uses, across restarts. A recipe added to configuration later is seeded then; a changed
/// configuration value of a recipe already stored does not overwrite it. Thread-safe.
/// </summary>
public sealed class QcSpecificationCatalog(ISettingsStore store, IOptions<QcOptions> defaults, TimeProvider time)
{
    /// <summary>Actor recorded for seeded specifications.</summary>
    public const string SeedActor = "configuration";

    private readonly Lock _gate = new();
    private Task? _seeding;

    /// <summary>Every stored specification, the default (recipe "") first.</summary>
    public async Task<IReadOnlyList<StoredQcSpecification>> ListAsync(CancellationToken cancellationToken)
    {
        await EnsureSeededAsync().WaitAsync(cancellationToken).ConfigureAwait(false);
        return await store.GetQcSpecificationsAsync(cancellationToken).ConfigureAwait(false);
    }

    /// <summary>The specification in force for <paramref name="recipe"/>: its own, else the default.</summary>
    /// <exception cref="KeyNotFoundException">Neither the recipe nor a default is stored.</exception>
    public async Task<QcSpecification> SpecificationForAsync(string recipe, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        var all = await ListAsync(cancellationToken).ConfigureAwait(false);
        StoredQcSpecification? own = recipe.Length > 0 ? all.FirstOrDefault(s => s.Recipe == recipe) : null;
        StoredQcSpecification? fallback = all.FirstOrDefault(s => s.Recipe == ISettingsStore.DefaultRecipe);
        return (own ?? fallback)?.Specification
            ?? throw new KeyNotFoundException($"No QC specification for recipe '{recipe}' and no default specification.");
    }

    /// <summary>
    /// Validates and stores a new specification for a recipe already stored, with an audit entry naming
    /// <paramref name="actor"/> and <paramref name="change"/> (old → new). Nothing is written when it is invalid, or,
    /// with <paramref name="expectedUpdatedAt"/> (the <see cref="StoredQcSpecification.UpdatedAt"/> the edit started
    /// from), when someone else changed the recipe's specification in between.
    /// </summary>
    /// <exception cref="ArgumentException">The specification is invalid; the message lists every problem.</exception>
    /// <exception cref="KeyNotFoundException">The recipe has no stored specification.</exception>
    /// <exception cref="InvalidOperationException">The stored specification changed since it was read.</exception>
    public async Task UpdateAsync(string recipe, QcSpecification specification, string actor, string change, DateTimeOffset? expectedUpdatedAt,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        ArgumentNullException.ThrowIfNull(specification);
        ArgumentException.ThrowIfNullOrWhiteSpace(actor);
        var errors = specification.Validate();
        if (errors.Count > 0)
        {
            throw new ArgumentException("Not saved: " + string.Join(" ", errors));
        }
        await EnsureSeededAsync().WaitAsync(cancellationToken).ConfigureAwait(false);
        var audit = new AuditEntry(time.GetUtcNow(), actor, "spec edited", recipe.Length == 0 ? "default spec" : "spec " + recipe, AuditDetail.Json(change));
        await store.SaveQcSpecificationAsync(recipe, specification, actor, audit, expectedUpdatedAt, cancellationToken).ConfigureAwait(false);
    }

    private Task EnsureSeededAsync()
    {
        lock (_gate)
        {
            // A failed seed (store not reachable) is tried again on the next call.
            if (_seeding is null || _seeding.IsFaulted || _seeding.IsCanceled)
            {
                _seeding = SeedAsync();
            }
            return _seeding;
        }
    }

    private async Task SeedAsync()
    {
        QcOptions options = defaults.Value;
        var seed = new Dictionary<string, QcSpecification>(options.Recipes, StringComparer.Ordinal);
        if (options.Default is { } fallback)
        {
            seed[ISettingsStore.DefaultRecipe] = fallback;
        }
        if (seed.Count > 0)
        {
            await store.SeedQcSpecificationsAsync(seed, SeedActor, time.GetUtcNow(), CancellationToken.None).ConfigureAwait(false);
        }
    }
}
