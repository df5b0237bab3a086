namespace RunWatch.Core.Qc;

/// <summary>QC specifications per recipe, bound from the configuration section <c>Qc</c>.</summary>
public sealed class QcOptions
{
    /// <summary>The configuration section name.</summary>
    public const string SectionName = "Qc";

    /// <summary>Specification per recipe name (ordinal, case-sensitive match).</summary>
    public Dictionary<string, QcSpecification> Recipes { get; set; } = new(StringComparer.Ordinal);

    /// <summary>Specification for recipes not listed, or null to refuse a verdict for unknown recipes.</summary>
    public QcSpecification? Default { get; set; }

    /// <summary>The specification for <paramref name="recipe"/>.</summary>
    /// <exception cref="KeyNotFoundException">The recipe has no specification and there is no default.</exception>
    public QcSpecification SpecificationFor(string recipe)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        if (Recipes.TryGetValue(recipe, out QcSpecification? spec))
        {
            return spec;
        }
        return Default ?? throw new KeyNotFoundException($"No QC specification for recipe '{recipe}' and no default specification.");
    }

    /// <summary>Validates every specification; messages are prefixed with the recipe name.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        foreach ((string recipe, QcSpecification spec) in Recipes)
        {
            if (string.IsNullOrWhiteSpace(recipe))
            {
                errors.Add("A QC specification has an empty recipe name.");
            }
            if (spec is null)
            {
                errors.Add($"Recipes:{recipe}: specification is empty.");
                continue;
            }
            foreach (string e in spec.Validate())
            {
                errors.Add($"Recipes:{recipe}: {e}");
            }
        }
        if (Default is not null)
        {
            foreach (string e in Default.Validate())
            {
                errors.Add($"Default: {e}");
            }
        }
        return errors;
    }
}
