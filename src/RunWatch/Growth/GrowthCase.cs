namespace RunWatch.Growth;

/// <summary>One wafer of a growth-cases/1 file, paths already resolved against the case file's folder.</summary>
/// <param name="Wafer">Wafer id.</param>
/// <param name="ThermalLogPath">CSV thermal log (as <c>runwatch thermal</c> reads it).</param>
/// <param name="Channel">Substrate temperature channel in the log.</param>
/// <param name="GrowthFrom">Start of the growth window: an ISO-8601 instant, or seconds on the log's axis.</param>
/// <param name="GrowthTo">End of the growth window.</param>
/// <param name="ImagePath">SEM image of a top-down field.</param>
/// <param name="PixelSizeNm">Pixel size of the image.</param>
internal sealed record GrowthCase(string Wafer, string ThermalLogPath, string Channel, GrowthInstant GrowthFrom, GrowthInstant GrowthTo, string ImagePath, double PixelSizeNm);
