namespace RunWatch.Reports.Model;

/// <summary>One SEM field's thumbnail with its overlay already drawn (PNG bytes).</summary>
/// <param name="FieldName">Field name (usually the image file name; escaped on output).</param>
/// <param name="Png">PNG-encoded thumbnail with overlays; anything that is not a PNG is left out of the report with a note.</param>
/// <param name="Caption">Caption text.</param>
/// <param name="WireCount">Wires measured in this field.</param>
/// <param name="Droplets">Wire and droplet radius of this field's wires carrying a droplet; null when not reported.</param>
public sealed record FieldThumbnail(string FieldName, ReadOnlyMemory<byte> Png, string Caption, int WireCount, RunWatch.Core.Wafers.DropletFigures? Droplets = null);
