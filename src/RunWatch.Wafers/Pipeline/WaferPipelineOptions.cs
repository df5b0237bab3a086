namespace RunWatch.Wafers.Pipeline;

/// <summary>How SEM fields are analysed and wafer reports written. Bound from the <c>WaferPipeline</c> section.</summary>
public sealed class WaferPipelineOptions
{
    public const string SectionName = "WaferPipeline";

    /// <summary>Folder for report files (relative paths are under the data folder). Default <c>reports</c>.</summary>
    public string ReportsFolder { get; set; } = "reports";

    /// <summary>Fields waiting for analysis at most; intake waits when the queue is full. Default 64.</summary>
    public int QueueCapacity { get; set; } = 64;

    /// <summary>Process (recipe family) used when neither the wafer nor its run names one. Default <c>default</c>.</summary>
    public string DefaultProcess { get; set; } = "default";

    /// <summary>A note added to every report when set (the demo: invented data, accelerated clock). Empty adds none.</summary>
    public string DataNote { get; set; } = "";

    /// <summary>Pixel size for fields that carry none (no sidecar, no TIFF tags), nm; null = such fields fail with a reason.</summary>
    public double? DefaultPixelSizeNm { get; set; }

    /// <summary>Seed of the nucleation-site simulation behind the prediction before SEM (reproducible). Default 1.</summary>
    public int PredictionSeed { get; set; } = 1;

    /// <summary>Simulated fields per prediction. Default 8.</summary>
    public int PredictionFields { get; set; } = 8;

    /// <summary>Search range of the best-fit capture radius, as multiples of the run's L_eff. Default 0.25 … 3.</summary>
    public double CaptureRadiusSearchMin { get; set; } = 0.25;

    public double CaptureRadiusSearchMax { get; set; } = 3.0;

    /// <summary>
    /// Radius model of the wafer verdict: <c>Diffusion</c> (the diffusion solution over the run's real history),
    /// <c>VoronoiDisc</c> (the same with Voronoi ∩ disc(λ) areas) or <c>CaptureAreaRegression</c> (the older Â
    /// regression, kept for comparison). <value>Default <c>Diffusion</c>.</value>
    /// </summary>
    public RunWatch.Core.Wafers.WaferRadiusModel RadiusModel { get; set; } = RunWatch.Core.Wafers.WaferRadiusModel.Diffusion;

    /// <summary>Cell side of the diffusion solution, nm (never more than λ/4). <value>Default 20.</value></summary>
    public double CaptureCellNm { get; set; } = 20;

    /// <summary>Smallest capture length a diffusion-model refit may use, µm. <value>Default 0.1.</value></summary>
    public double CalibrationLambdaMinUm { get; set; } = 0.1;

    /// <summary>Largest capture length a diffusion-model refit may use, µm. <value>Default 3.</value></summary>
    public double CalibrationLambdaMaxUm { get; set; } = 3.0;

    /// <summary>
    /// Longest one field's analysis may take; a field over it is marked failed and the queue moves on (the bounded
    /// inputs keep real fields far below it: a 100-megapixel field takes seconds). <value>Default 2 minutes.</value>
    /// </summary>
    public TimeSpan FieldAnalysisBudget { get; set; } = TimeSpan.FromMinutes(2);

    /// <summary>
    /// Time zone of the times in reports. Not set on its own: the pipeline takes <c>RunWatch:Dashboard:TimeZone</c>, so
    /// reports and screens show the same lab-local time with its UTC offset. Empty means the machine's local zone.
    /// </summary>
    public string TimeZone { get; set; } = "";

    /// <summary>Returns the problems with these options, empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var problems = new List<string>();
        if (string.IsNullOrWhiteSpace(ReportsFolder))
        {
            problems.Add("WaferPipeline:ReportsFolder is empty");
        }
        if (QueueCapacity is < 1 or > 100_000)
        {
            problems.Add("WaferPipeline:QueueCapacity must be 1 … 100000");
        }
        if (string.IsNullOrWhiteSpace(DefaultProcess))
        {
            problems.Add("WaferPipeline:DefaultProcess is empty");
        }
        if (DefaultPixelSizeNm is { } p && RunWatch.Imaging.Scale.FieldValueBounds.Check("WaferPipeline:DefaultPixelSizeNm", p,
            RunWatch.Imaging.Scale.FieldValueBounds.MinPixelSizeNm, RunWatch.Imaging.Scale.FieldValueBounds.MaxPixelSizeNm, "nm") is { } pixelProblem)
        {
            problems.Add(pixelProblem);
        }
        if (FieldAnalysisBudget <= TimeSpan.Zero || FieldAnalysisBudget > TimeSpan.FromHours(1))
        {
            problems.Add("WaferPipeline:FieldAnalysisBudget must be above 0 and at most 1 hour");
        }
        if (!string.IsNullOrWhiteSpace(TimeZone) && !TimeZoneInfo.TryFindSystemTimeZoneById(TimeZone, out _))
        {
            problems.Add($"RunWatch:Dashboard:TimeZone '{TimeZone}' is not a time zone this machine knows (an IANA id such as Europe/Berlin)");
        }
        if (PredictionFields is < 1 or > 1000)
        {
            problems.Add("WaferPipeline:PredictionFields must be 1 … 1000");
        }
        if (!(CaptureRadiusSearchMin > 0 && CaptureRadiusSearchMax > CaptureRadiusSearchMin))
        {
            problems.Add("WaferPipeline:CaptureRadiusSearchMin must be > 0 and below CaptureRadiusSearchMax");
        }
        if (!Enum.IsDefined(RadiusModel))
        {
            problems.Add("WaferPipeline:RadiusModel must be Diffusion, VoronoiDisc or CaptureAreaRegression");
        }
        if (!(CaptureCellNm >= 2 && CaptureCellNm <= 500))
        {
            problems.Add("WaferPipeline:CaptureCellNm must be 2 … 500");
        }
        if (!(CalibrationLambdaMinUm > 0 && CalibrationLambdaMaxUm > CalibrationLambdaMinUm && CalibrationLambdaMaxUm <= 100))
        {
            problems.Add("WaferPipeline:CalibrationLambdaMinUm must be > 0 and below CalibrationLambdaMaxUm (at most 100 µm)");
        }
        return problems;
    }
}
