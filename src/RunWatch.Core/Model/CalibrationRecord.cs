namespace RunWatch.Core.Model;

/// <summary>
/// A calibration of one process (recipe family) computed from past wafers: the radius model and, when wafers at
/// several temperatures exist, the Arrhenius parameters. Serialisable with <see cref="ModelJson"/>.
/// </summary>
/// <param name="Id">Unique id chosen by the caller (used to accept exactly the candidate that was reviewed).</param>
/// <param name="Process">Process / recipe family the calibration applies to.</param>
/// <param name="CreatedAt">When the fit was computed.</param>
/// <param name="WaferIds">Every wafer whose wires or best-fit L went into the fit.</param>
/// <param name="RadiusModel">Both radius fits and the selected one, or null when only Arrhenius was refitted.</param>
/// <param name="CaptureRadii">Each wafer's best-fit capture radius; the radius fit used every wafer's Â at its own L.</param>
/// <param name="Arrhenius">Arrhenius fit across wafers, or null.</param>
/// <param name="Note">Free text from the person or job that requested the fit.</param>
public sealed record CalibrationRecord(
    string Id,
    string Process,
    DateTimeOffset CreatedAt,
    IReadOnlyList<string> WaferIds,
    RadiusModelComparison? RadiusModel,
    IReadOnlyList<WaferCaptureRadius> CaptureRadii,
    ArrheniusFit? Arrhenius,
    string? Note);
