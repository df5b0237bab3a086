namespace RunWatch.Web.Data.Fields;

/// <summary>Reads a field for the full-field viewer.</summary>
public interface IFieldDetails
{
    /// <summary>The field, or null when unknown.</summary>
    Task<FieldDetail?> GetFieldAsync(string fieldId, CancellationToken cancellationToken);

    /// <summary>The field's image at full resolution as PNG or JPEG: the plain image, or with the analysis drawn in; null when not available.</summary>
    Task<ReportFile?> GetFullImageAsync(string fieldId, bool analysisDrawn, CancellationToken cancellationToken);
}
