using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.PointPatterns;
using RunWatch.Testing.Reference;

namespace RunWatch.Benchmarks;

/// <summary>
/// Capture areas of a 20 × 15 µm field at 20 nm cells (1000 × 750 = 750,000 cells, about 400 wires; --quick:
/// 10 × 7.5 µm) at λ = 1 µm with a reflecting border: RunWatch's preconditioned CG against SciPy's conjugate gradient
/// (scipy.sparse.linalg.cg, no preconditioner, the same matrix assembled independently by
/// tests/reference/diffusion_grid_reference.py, which times its own solve) in the same run. Both solve to a relative
/// residual far below the 1e-6 agreement required of the capture areas. Goal: at least 5× faster.
/// </summary>
internal sealed class DiffusionSolverBenchmark : IBenchmark
{
    private const double CellUm = 0.02, LambdaUm = 1.0, DensityPerUm2 = 1.33;
    private const int Repeats = 3;

    public string Name => "diffusion-solver";

    public string Description => "capture areas of a 20 × 15 µm field at 20 nm cells (750,000 cells) vs scipy.sparse.linalg.cg";

    public int Run(bool quick, TextWriter output)
    {
        double width = quick ? 10 : 20, height = quick ? 7.5 : 15;
        var field = CaptureField.Rectangle(width, height);
        Point2D[] centres = NucleationSites.RandomSequentialAdsorption(field, DensityPerUm2, 0.15, 2026).Points;
        var random = new Random(2026);
        var radii = new double[centres.Length];
        for (int i = 0; i < radii.Length; i++)
        {
            radii[i] = 0.025 + (0.025 * random.NextDouble());
        }
        var options = new DiffusionSolverOptions { RelativeTolerance = 1e-11 };

        // Warm-up so the timed runs see tiered-up code.
        new ScreenedDiffusionSolver(SinkGrid.Rasterise(centres, radii, field, CellUm), options).Solve(LambdaUm, BorderCondition.Reflecting);
        var wall = new double[Repeats];
        var cpu = new double[Repeats];
        SinkCurrents? ours = null;
        SinkGrid? grid = null;
        for (int r = 0; r < Repeats; r++)
        {
            long start = Stopwatch.GetTimestamp();
            double cpuStart = ThreadCpuClock.NowNs();
            grid = SinkGrid.Rasterise(centres, radii, field, CellUm);
            ours = new ScreenedDiffusionSolver(grid, options).Solve(LambdaUm, BorderCondition.Reflecting);
            cpu[r] = (ThreadCpuClock.NowNs() - cpuStart) / 1e6;
            wall[r] = Stopwatch.GetElapsedTime(start).TotalMilliseconds;
        }
        Array.Sort(wall);
        Array.Sort(cpu);
        using JsonDocument peer = DiffusionReference.Run(grid!, LambdaUm, BorderCondition.Reflecting, "cg");
        JsonElement root = peer.RootElement;
        double[] theirs = root.GetProperty("capture").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        double worst = 0;
        for (int i = 0; i < theirs.Length; i++)
        {
            worst = Math.Max(worst, Math.Abs(ours!.CaptureAreas[i] - theirs[i]) / theirs[i]);
        }
        double peerWall = root.GetProperty("solve_s").GetDouble() * 1000, peerCpu = root.GetProperty("solve_cpu_s").GetDouble() * 1000;
        double ratioWall = peerWall / wall[Repeats / 2], ratioCpu = peerCpu / cpu[Repeats / 2];
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"   {grid!.Nx} × {grid.Ny} cells of {CellUm * 1000} nm, {centres.Length} wires, λ = {LambdaUm} µm, reflecting border; {Environment.ProcessorCount} processors"));
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"   RunWatch (rasterise + MIC-CG, {ours!.Iterations} iterations): wall {wall[Repeats / 2],8:F1} ms, thread CPU {cpu[Repeats / 2],8:F1} ms (median of {Repeats})"));
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"   scipy.sparse.linalg.cg ({root.GetProperty("iterations").GetInt32()} iterations, solve only):  wall {peerWall,8:F1} ms, process CPU {peerCpu,8:F1} ms"));
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"   ratio wall {ratioWall:F1}×, CPU {ratioCpu:F1}×   goal ≥ 5×: {(ratioCpu >= 5 ? "met" : "NOT met")}   largest relative difference per wire {worst:E2} (required ≤ 1e-6: {(worst <= 1e-6 ? "met" : "NOT met")})"));
        return 0;
    }
}
