using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using RunWatch.Imaging.Measurement;

namespace RunWatch.Imaging.Analysis;

public static partial class FieldAnalyzer
{
    /// <summary>Wigner-surmise fits need at least this many unguarded Voronoi cells.</summary>
    private const int MinCellsForWignerFit = 30;

    /// <summary>
    /// Point-pattern statistics of the wire centroids from RunWatch.Core (docs/geometry.md): nearest-neighbour
    /// distances, the Clark–Evans ratio with its guard-region edge rule, centroid-based capture zones
    /// (Voronoi cell ∩ disc of radius L) and the generalised Wigner surmise fitted to the unguarded Voronoi cells.
    /// </summary>
    private static (WireMeasurement[] Wires, FieldStatistics Stats) AddPointPatterns(
        WireMeasurement[] wires, FieldStatistics stats, int width, int validHeight, double lengthScale, double? diffusionLength, List<string> notes,
        CancellationToken cancellationToken)
    {
        if (wires.Length < 2)
        {
            return (wires, stats);
        }
        var points = new Point2D[wires.Length];
        for (int i = 0; i < wires.Length; i++)
        {
            points[i] = new Point2D(wires[i].CentroidX, wires[i].CentroidY);
        }
        var field = CaptureField.Rectangle(width * lengthScale, validHeight * lengthScale);
        try
        {
            double[] nn = NearestNeighbours.Distances(points, field, cancellationToken);
            var interiorNn = new List<double>(wires.Length);
            for (int i = 0; i < wires.Length; i++)
            {
                wires[i] = wires[i] with { NearestNeighbourDistance = nn[i] };
                if (!wires[i].TouchesBorder)
                {
                    interiorNn.Add(nn[i]);
                }
            }
            stats = stats with { NearestNeighbourDistance = DistributionSummary.Of(interiorNn.ToArray()) };

            cancellationToken.ThrowIfCancellationRequested();
            ClarkEvansResult ce = ClarkEvans.Compute(points, field);
            stats = stats with { ClarkEvansR = ce.Ratio, ClarkEvansZ = ce.Z };

            if (diffusionLength is { } l)
            {
                cancellationToken.ThrowIfCancellationRequested();
                CaptureZoneResult zones = CaptureZones.Compute(points, field, new CaptureZoneOptions { DiffusionLength = l }, cancellationToken);
                var normalized = new List<double>(wires.Length);
                for (int i = 0; i < wires.Length; i++)
                {
                    CaptureZone zone = zones[i];
                    bool guarded = zone.Guarded || (wires[i].ZoneGuarded ?? false) || wires[i].TouchesBorder;
                    wires[i] = wires[i] with { CentroidZoneArea = zone.Area, CentroidZoneNormalized = zone.NormalisedArea, ZoneGuarded = guarded };
                    if (!guarded)
                    {
                        normalized.Add(zone.NormalisedArea);
                    }
                }
                stats = stats with { CentroidZoneNormalized = DistributionSummary.Of(normalized.ToArray()) };
            }

            cancellationToken.ThrowIfCancellationRequested();
            double[] cells = CaptureZones.Compute(points, field, null, cancellationToken).UnguardedAreas();
            if (cells.Length >= MinCellsForWignerFit)
            {
                WignerFitResult fit = WignerSurmiseFit.Fit(cells);
                stats = stats with { WignerBeta = fit.Beta, CriticalNucleus = fit.CriticalNucleusSize, WignerMapping = fit.MappingDescription };
                if (fit.AtSearchBound)
                {
                    notes.Add($"the Voronoi cell areas do not follow the generalised Wigner surmise (β at the search bound {fit.Beta:0.##})");
                }
            }
            else
            {
                notes.Add($"only {cells.Length} unguarded Voronoi cells: no Wigner-surmise fit (needs {MinCellsForWignerFit})");
            }
        }
        catch (ArgumentException ex)
        {
            notes.Add("point-pattern statistics skipped: " + ex.Message);
        }
        catch (MathNet.Numerics.Optimization.OptimizationException ex)
        {
            // Near-identical cells (a regular lattice) leave the Wigner likelihood without an interior maximum.
            notes.Add("point-pattern statistics skipped: the Wigner surmise fit found no maximum (" + ex.Message + ")");
        }
        return (wires, stats);
    }
}
