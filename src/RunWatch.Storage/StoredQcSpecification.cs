using RunWatch.Core.Qc;

namespace RunWatch.Storage;

/// <summary>A QC specification as stored, with who last set it.</summary>
/// <param name="Recipe">Recipe name; <see cref="ISettingsStore.DefaultRecipe"/> for the default specification.</param>
/// <param name="Specification">The limits.</param>
/// <param name="UpdatedAt">When it was last written.</param>
/// <param name="UpdatedBy">User name, or <c>configuration</c> for the seeded value.</param>
public sealed record StoredQcSpecification(string Recipe, QcSpecification Specification, DateTimeOffset UpdatedAt, string UpdatedBy);
