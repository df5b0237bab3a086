using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.PointPatterns;
using Xunit;

namespace RunWatch.Core.Tests.Cancellation;

/// <summary>
/// The long loops of Core stop on a cancelled token (the wafer pipeline's per-field budget cancels it): the diffusion
/// solve between iterations, the nearest-neighbour search per point, the capture zones per chunk of points. Each is
/// also run with a live token and must give what it gives without one.
/// </summary>
public sealed class CoreCancellationTests
{
    [Fact]
    public void ScreenedDiffusionSolver_CancelledToken_StopsBetweenIterations()
    {
        var box = CaptureField.PeriodicBox(6, 5);
        Point2D[] centres = NucleationSites.RandomSequentialAdsorption(box, 1.5, 0.25, 9).Points;
        double[] radii = Enumerable.Repeat(0.04, centres.Length).ToArray();
        SinkGrid grid = SinkGrid.Rasterise(centres, radii, box, 0.01);
        using var cancelled = new CancellationTokenSource();
        cancelled.Cancel();

        Assert.Throws<OperationCanceledException>(() => new ScreenedDiffusionSolver(grid).Solve(0.6, BorderCondition.Periodic, cancelled.Token));
        SinkCurrents live = new ScreenedDiffusionSolver(grid).Solve(0.6, BorderCondition.Periodic, new CancellationTokenSource().Token);
        SinkCurrents plain = new ScreenedDiffusionSolver(grid).Solve(0.6, BorderCondition.Periodic);
        Assert.Equal(plain.Iterations, live.Iterations);
    }

    [Fact]
    public void NearestNeighboursAndCaptureZones_CancelledToken_Stop()
    {
        var field = CaptureField.Rectangle(200, 150);
        Point2D[] points = NucleationSites.RandomSequentialAdsorption(field, 0.2, 0.5, 4).Points;
        using var cancelled = new CancellationTokenSource();
        cancelled.Cancel();

        Assert.True(points.Length > 1000);
        Assert.Throws<OperationCanceledException>(() => NearestNeighbours.Distances(points, field, cancelled.Token));
        Assert.ThrowsAny<OperationCanceledException>(() => CaptureZones.Compute(points, field, null, cancelled.Token));
        Assert.Equal(NearestNeighbours.Distances(points, field), NearestNeighbours.Distances(points, field, new CancellationTokenSource().Token));
    }
}
