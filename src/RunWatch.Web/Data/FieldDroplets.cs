using RunWatch.Core.Wafers;

namespace RunWatch.Web.Data;

/// <summary>One field's wire and droplet radius figures.</summary>
/// <param name="FileName">The field's image.</param>
/// <param name="Figures">Its wires carrying a droplet.</param>
public sealed record FieldDroplets(string FileName, DropletFigures Figures);
