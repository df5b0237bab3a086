using MathNet.Numerics.Interpolation;
using RunWatch.Core.Geometry;

namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// One field's capture areas A_i(λ) over a range of capture lengths, from a few diffusion solves, so that the
/// collection over a whole thermal history needs no solve per sample. Lengths in µm, areas in µm².
/// </summary>
/// <remarks>
/// The field is solved with a reflecting border at geometric nodes λ_k (ratio <see cref="CaptureTableOptions.NodeRatio"/>);
/// ln A_i is a smooth function of ln λ (from 2·ln λ − ln ln λ for an isolated wire to a constant for a wire
/// crowded into its Voronoi cell), so each wire gets a natural cubic spline through (ln λ_k, ln A_ik) (MathNet.Numerics),
/// resampled every 0.01 in ln λ; between those fine nodes A is linear in ln λ, which makes the collection over a history
/// a weighted sum of fine-node areas with weights that depend on the history alone (<see cref="AccumulateWeights"/>).
/// Guard rule: at every node the field is also solved with an absorbing and a saturated border. Every real
/// surrounding holds the density beyond the edge between those two (maximum principle), and the discrete solution
/// is monotone in its border values, so each wire's true collection lies between the two results. A wire whose
/// two results differ by more than <see cref="CaptureTableOptions.GuardTolerance"/> of their mean is guarded at that λ.
/// The bound width grows with λ (a larger λ carries the border further in), so a wire is judged at the largest λ its
/// history reaches (<see cref="GuardFor"/>).
/// Not thread-safe for <see cref="AccumulateWeights"/> callers sharing one weight span; the table itself is immutable.
/// </remarks>
public sealed class CaptureAreaTable
{
    /// <summary>Spacing of the resampled table in ln λ.</summary>
    public const double FineStep = 0.01;

    private readonly double[] _fine;
    private readonly bool[] _guarded;
    private readonly double[] _boundWidth;
    private readonly bool[] _empty;
    private readonly double[] _nodeLambdas;
    private readonly double[] _nodeAreas;
    private readonly double[] _lowerBound;
    private readonly double[] _upperBound;

    private CaptureAreaTable(int wireCount, double[] nodeLambdas, double[] nodeAreas, double[] lower, double[] upper, double[] boundWidth,
        bool[] empty, double tolerance, double cellSize)
    {
        _boundWidth = boundWidth;
        _empty = empty;
        GuardTolerance = tolerance;
        _guarded = new bool[wireCount];
        WireCount = wireCount;
        _nodeLambdas = nodeLambdas;
        _nodeAreas = nodeAreas;
        _lowerBound = lower;
        _upperBound = upper;
        CellSizeUm = cellSize;
        LnLambdaMin = Math.Log(nodeLambdas[0]);
        GuardFor(nodeLambdas[^1], _guarded);
        FineCount = (int)Math.Ceiling((Math.Log(nodeLambdas[^1]) - LnLambdaMin) / FineStep) + 1;
        _fine = new double[FineCount * wireCount];
        var x = new double[nodeLambdas.Length];
        var y = new double[nodeLambdas.Length];
        for (int k = 0; k < x.Length; k++)
        {
            x[k] = Math.Log(nodeLambdas[k]);
        }
        for (int i = 0; i < wireCount; i++)
        {
            for (int k = 0; k < x.Length; k++)
            {
                y[k] = Math.Log(Math.Max(nodeAreas[(k * wireCount) + i], 1e-300));
            }
            CubicSpline spline = CubicSpline.InterpolateNaturalSorted(x, y);
            for (int f = 0; f < FineCount; f++)
            {
                double lnLambda = Math.Min(LnLambdaMin + (f * FineStep), x[^1]);
                _fine[(f * wireCount) + i] = Math.Exp(spline.Interpolate(lnLambda));
            }
        }
    }

    /// <summary>Number of wires.</summary>
    public int WireCount { get; }

    /// <summary>Cell side used.</summary>
    public double CellSizeUm { get; }

    /// <summary>Smallest λ in the table.</summary>
    public double LambdaMinUm => _nodeLambdas[0];

    /// <summary>Largest λ in the table.</summary>
    public double LambdaMaxUm => _nodeLambdas[^1];

    /// <summary>λ values where the field was solved.</summary>
    public ReadOnlySpan<double> NodeLambdasUm => _nodeLambdas;

    /// <summary>Node areas, node-major: [k·WireCount + i].</summary>
    public ReadOnlySpan<double> NodeAreasUm2 => _nodeAreas;

    /// <summary>Capture areas with an absorbing border (lower bounds), node-major like <see cref="NodeAreasUm2"/> (every node holds the largest node's when <see cref="CaptureTableOptions.BoundsAtEveryNode"/> is false).</summary>
    public ReadOnlySpan<double> LowerBoundsUm2 => _lowerBound;

    /// <summary>Capture areas with a saturated border (upper bounds), node-major.</summary>
    public ReadOnlySpan<double> UpperBoundsUm2 => _upperBound;

    /// <summary>The guard tolerance the table was built with.</summary>
    public double GuardTolerance { get; }

    /// <summary>True for wires whose collection at the table's largest λ depends on what lies outside the image.</summary>
    public ReadOnlySpan<bool> Guarded => _guarded;

    /// <summary>
    /// Which wires are guarded for histories reaching up to <paramref name="lambdaMaxUm"/>: the bound width
    /// (upper − lower)/mean, interpolated in ln λ between nodes, above <see cref="GuardTolerance"/>.
    /// </summary>
    public int GuardFor(double lambdaMaxUm, Span<bool> guarded)
    {
        double x = Math.Clamp((Math.Log(lambdaMaxUm) - Math.Log(_nodeLambdas[0])) / Math.Log(_nodeLambdas[1] / _nodeLambdas[0]), 0, _nodeLambdas.Length - 1);
        // A λ on a node is judged by that node alone (an infinite width next door must not leak in through t·∞).
        if (Math.Abs(x - Math.Round(x)) < 1e-9)
        {
            x = Math.Round(x);
        }
        int k = Math.Min((int)x, _nodeLambdas.Length - 2);
        double t = x - k;
        int count = 0;
        for (int i = 0; i < WireCount; i++)
        {
            double w0 = _boundWidth[(k * WireCount) + i], w1 = _boundWidth[((k + 1) * WireCount) + i];
            double w = t == 0 ? w0 : t == 1 ? w1 : ((1 - t) * w0) + (t * w1);
            guarded[i] = _empty[i] || !(w <= GuardTolerance);
            count += guarded[i] ? 1 : 0;
        }
        return count;
    }

    /// <summary>Number of unguarded wires.</summary>
    public int UnguardedCount
    {
        get
        {
            int n = 0;
            foreach (bool g in _guarded)
            {
                n += g ? 0 : 1;
            }
            return n;
        }
    }

    /// <summary>Number of resampled nodes (length of a weight span).</summary>
    public int FineCount { get; }

    private double LnLambdaMin { get; }

    /// <summary>
    /// Solves the field at every node between <paramref name="lambdaMinUm"/> and <paramref name="lambdaMaxUm"/>
    /// (at least four nodes; the range is widened evenly when it is narrower than that).
    /// </summary>
    /// <exception cref="ArgumentException">Bad range or options, or the spans/field problems of <see cref="SinkGrid.Rasterise"/>.</exception>
    public static CaptureAreaTable Build(ReadOnlySpan<Point2D> centresUm, ReadOnlySpan<double> radiiUm, CaptureField fieldUm,
        double lambdaMinUm, double lambdaMaxUm, CaptureTableOptions? options = null, CancellationToken cancellationToken = default)
    {
        options ??= new CaptureTableOptions();
        IReadOnlyList<string> problems = options.Validate();
        if (problems.Count > 0)
        {
            throw new ArgumentException(string.Join(" ", problems), nameof(options));
        }
        if (!(lambdaMinUm > 0) || !(lambdaMaxUm >= lambdaMinUm) || !double.IsFinite(lambdaMaxUm))
        {
            throw new ArgumentException($"The λ range must be positive, finite and ordered (got {lambdaMinUm} to {lambdaMaxUm} µm).", nameof(lambdaMinUm));
        }
        double[] nodes = Nodes(lambdaMinUm, lambdaMaxUm, options.NodeRatio);
        if (options.Method == CaptureAreaMethod.VoronoiDisc)
        {
            return BuildVoronoiDisc(centresUm, fieldUm, nodes, options);
        }
        double cell = Math.Min(options.CellSizeUm, nodes[0] / 4);
        SinkGrid grid = SinkGrid.Rasterise(centresUm, radiiUm, fieldUm, cell);
        int n = grid.WireCount;
        var areas = new double[nodes.Length * n];
        var lower = new double[nodes.Length * n];
        var upper = new double[nodes.Length * n];
        bool periodic = fieldUm.Periodic;
        // Work items: every node with the estimate border, and (unless periodic) with the two bounding borders.
        int boundNodes = periodic ? 0 : options.BoundsAtEveryNode ? nodes.Length : 1;
        int items = nodes.Length + (2 * boundNodes);
        var parallel = new ParallelOptions
        {
            MaxDegreeOfParallelism = options.MaxDegreeOfParallelism > 0 ? options.MaxDegreeOfParallelism : Environment.ProcessorCount,
            CancellationToken = cancellationToken,
        };
        Parallel.For(0, items, parallel, () => new ScreenedDiffusionSolver(grid, options.Solver), (item, _, solver) =>
        {
            if (item < nodes.Length)
            {
                SinkCurrents c = solver.Solve(nodes[item], periodic ? BorderCondition.Periodic : BorderCondition.Reflecting, cancellationToken);
                c.CaptureAreas.CopyTo(areas, item * n);
            }
            else
            {
                int node = nodes.Length - boundNodes + ((item - nodes.Length) % boundNodes);
                bool absorbing = item < nodes.Length + boundNodes;
                SinkCurrents c = solver.Solve(nodes[node], absorbing ? BorderCondition.Absorbing : BorderCondition.Saturated, cancellationToken);
                c.CaptureAreas.CopyTo(absorbing ? lower : upper, node * n);
            }
            return solver;
        }, _ => { });
        if (periodic)
        {
            areas.CopyTo(lower, 0);
            areas.CopyTo(upper, 0);
        }
        if (!periodic && boundNodes < nodes.Length)
        {
            for (int k = 0; k < nodes.Length - 1; k++)
            {
                Array.Copy(lower, (nodes.Length - 1) * n, lower, k * n, n);
                Array.Copy(upper, (nodes.Length - 1) * n, upper, k * n, n);
            }
        }
        var width = new double[nodes.Length * n];
        var empty = new bool[n];
        for (int i = 0; i < n; i++)
        {
            empty[i] = grid.FootprintCells[i] == 0;
        }
        for (int k = 0; k < width.Length; k++)
        {
            double mid = 0.5 * (lower[k] + upper[k]);
            width[k] = mid > 0 ? (upper[k] - lower[k]) / mid : double.PositiveInfinity;
        }
        return new CaptureAreaTable(n, nodes, areas, lower, upper, width, empty, options.GuardTolerance, cell);
    }

    private static CaptureAreaTable BuildVoronoiDisc(ReadOnlySpan<Point2D> centres, CaptureField field, double[] nodes, CaptureTableOptions options)
    {
        int n = centres.Length;
        var areas = new double[nodes.Length * n];
        var width = new double[nodes.Length * n];
        for (int k = 0; k < nodes.Length; k++)
        {
            CaptureZoneResult zones = CaptureZones.Compute(centres, field, new CaptureZoneOptions { DiffusionLength = nodes[k], GuardRule = GuardRule.UnseenNeighbourCouldCut });
            zones.Areas.CopyTo(areas.AsSpan(k * n, n));
            for (int i = 0; i < n; i++)
            {
                width[(k * n) + i] = zones.Guarded[i] ? double.PositiveInfinity : 0;
            }
        }
        return new CaptureAreaTable(n, nodes, areas, areas, areas, width, new bool[n], options.GuardTolerance, 0);
    }

    /// <summary>Wire <paramref name="wire"/>'s capture area at <paramref name="lambdaUm"/> (clamped to the table's range).</summary>
    public double AreaAt(int wire, double lambdaUm)
    {
        (int f, double t) = Locate(lambdaUm);
        double a = _fine[(f * WireCount) + wire];
        return t == 0 ? a : a + (t * (_fine[((f + 1) * WireCount) + wire] - a));
    }

    /// <summary>d ln A / d ln λ of one wire at <paramref name="lambdaUm"/>: 0 for a wire that has collected its whole cell, 2 for λ far below the wire size.</summary>
    public double LogSlope(int wire, double lambdaUm)
    {
        (int f, _) = Locate(lambdaUm);
        int g = Math.Min(f + 1, FineCount - 1);
        f = g - 1;
        return (Math.Log(_fine[(g * WireCount) + wire]) - Math.Log(_fine[(f * WireCount) + wire])) / FineStep;
    }

    /// <summary>
    /// Adds <paramref name="seconds"/> spent at <paramref name="lambdaUm"/> to the fine-node weights (length
    /// <see cref="FineCount"/>). Returns false when λ lay outside the table (it is then clamped to the nearer end).
    /// </summary>
    public bool AccumulateWeights(double lambdaUm, double seconds, Span<double> weights)
    {
        (int f, double t) = Locate(lambdaUm);
        weights[f] += seconds * (1 - t);
        if (t > 0)
        {
            weights[f + 1] += seconds * t;
        }
        return lambdaUm >= LambdaMinUm * (1 - 1e-12) && lambdaUm <= LambdaMaxUm * (1 + 1e-12);
    }

    /// <summary>integrals_i = Σ_f weights_f · A_i(λ_f): each wire's ∫A dt for the history the weights describe (µm²·s).</summary>
    public void Collect(ReadOnlySpan<double> weights, Span<double> integrals)
    {
        integrals[..WireCount].Clear();
        for (int f = 0; f < FineCount; f++)
        {
            double w = weights[f];
            if (w == 0)
            {
                continue;
            }
            ReadOnlySpan<double> row = _fine.AsSpan(f * WireCount, WireCount);
            for (int i = 0; i < row.Length; i++)
            {
                integrals[i] += w * row[i];
            }
        }
    }

    private (int Fine, double Fraction) Locate(double lambdaUm)
    {
        double x = (Math.Log(lambdaUm) - LnLambdaMin) / FineStep;
        if (!(x > 0))
        {
            return (0, 0);
        }
        if (x >= FineCount - 1)
        {
            return (FineCount - 1, 0);
        }
        int f = (int)x;
        return (f, x - f);
    }

    private static double[] Nodes(double min, double max, double ratio)
    {
        // At least three intervals (a cubic needs four nodes); a narrow range gets finer nodes rather than a wider range.
        double span = Math.Log(max / min);
        double step = Math.Min(Math.Log(ratio), Math.Max(span / 3, 0.01));
        int intervals = Math.Max(3, (int)Math.Ceiling((span / step) - 1e-9));
        double start = Math.Log(min) - (Math.Max(0, (intervals * step) - span) / 2);
        var nodes = new double[intervals + 1];
        for (int k = 0; k <= intervals; k++)
        {
            nodes[k] = Math.Exp(start + (k * step));
        }
        return nodes;
    }
}
