using RunWatch.Core.Wafers;

namespace RunWatch.Web.Data;

/// <summary>Wire (facet) and droplet radius of a wafer's wires that carry a droplet: every field pooled, and per field.</summary>
/// <param name="Wafer">All analysed fields pooled.</param>
/// <param name="Fields">Each analysed field with at least one wire carrying a droplet.</param>
public sealed record WaferDroplets(DropletFigures Wafer, IReadOnlyList<FieldDroplets> Fields);
