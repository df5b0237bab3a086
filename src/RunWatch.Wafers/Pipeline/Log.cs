using Microsoft.Extensions.Logging;

namespace RunWatch.Wafers.Pipeline;

/// <summary>Log messages of the wafer pipeline (event ids 3000–3099).</summary>
internal static partial class Log
{
    [LoggerMessage(3000, LogLevel.Information, "Field {RelativePath} taken in for wafer {Wafer} (field {FieldId})")]
    public static partial void FieldTakenIn(ILogger logger, string relativePath, string wafer, long fieldId);

    [LoggerMessage(3001, LogLevel.Information, "Field {RelativePath} waits unassigned: {Reason}")]
    public static partial void FieldUnassigned(ILogger logger, string relativePath, string reason);

    [LoggerMessage(3002, LogLevel.Warning, "File {RelativePath} in the drop folder refused: {Reason}")]
    public static partial void FileRefused(ILogger logger, string relativePath, string reason);

    [LoggerMessage(3003, LogLevel.Information, "Field {FieldId} analysed: {WireCount} objects in {ElapsedMs} ms")]
    public static partial void FieldAnalysed(ILogger logger, long fieldId, int wireCount, long elapsedMs);

    [LoggerMessage(3004, LogLevel.Warning, "Field {FieldId} analysis failed: {Reason}")]
    public static partial void FieldFailed(ILogger logger, long fieldId, string reason);

    [LoggerMessage(3005, LogLevel.Information, "Wafer {Wafer} report written: verdict {Verdict}, {Folder}")]
    public static partial void ReportWritten(ILogger logger, string wafer, string verdict, string folder);

    [LoggerMessage(3006, LogLevel.Error, "Wafer {Wafer} report failed")]
    public static partial void ReportFailed(ILogger logger, string wafer, Exception exception);

    [LoggerMessage(3007, LogLevel.Error, "Drop-folder scan failed; retrying at the next interval")]
    public static partial void ScanFailed(ILogger logger, Exception exception);

    [LoggerMessage(3008, LogLevel.Warning, "Field {RelativePath} could not be taken in: {Reason}")]
    public static partial void IntakeFailed(ILogger logger, string relativePath, string reason);
}
