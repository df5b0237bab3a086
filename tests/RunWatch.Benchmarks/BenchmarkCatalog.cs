namespace RunWatch.Benchmarks;

/// <summary>Every benchmark the runner knows. Add one line per benchmark.</summary>
internal static class BenchmarkCatalog
{
    public static IReadOnlyList<IBenchmark> All { get; } =
    [
        new ImagingBenchmark(),
        new CaptureZoneBenchmark(),
        new DiffusionSolverBenchmark(),
        new ModelPredictBenchmark(),
        new ThermalBenchmark(),
        new IngestBenchmark(),
        new StoreWriteBenchmark(),
        new PostgresWriteBenchmark(),
        new FleetIngestBenchmark(),
        new DashboardBenchmark(),
    ];
}
