namespace RunWatch.Web.Data;

/// <summary>A wafer with its SEM fields, statistics, per-wire measurements and verdict; droplet figures where wires carry droplets.</summary>
public sealed record WaferDetail(string WaferId, string RunId, IReadOnlyList<FieldView> Fields, WaferStatistics? Statistics, IReadOnlyList<WireMeasurement> Wires, VerdictView? Verdict, IReadOnlyList<string> ReportFormats,
    WaferDiffusionView? Diffusion = null, WaferDroplets? Droplets = null);
