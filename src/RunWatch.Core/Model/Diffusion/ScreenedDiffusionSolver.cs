namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// Steady-state adatom density on a <see cref="SinkGrid"/>: D·∇²n − n/τ + F = 0 on the free cells, n = 0 on every
/// wire footprint (a perfect sink), with a chosen <see cref="BorderCondition"/>. Works in u = n·D/F (an area), so
/// the equation reads ∇²u − u/λ² + 1 = 0 with λ = √(D·τ), and a wire's current ÷ F is the sum of u over the free
/// cells next to its footprint: its capture area.
/// </summary>
/// <remarks>
/// Discretisation: the 5-point Laplacian on square cells of side h, multiplied through by h²:
/// (4 + h²/λ²)·u_c − Σ u_neighbour = h² (BCF-type surface diffusion with desorption: Burton, Cabrera &amp; Frank 1951;
/// capture by islands in the rate-equation picture: Venables 1973, Phil. Mag. 27, 697; both FROM MEMORY). The matrix
/// is symmetric positive definite, so it is solved by the conjugate gradient method (Hestenes &amp; Stiefel 1952)
/// preconditioned by the modified incomplete Cholesky factor M = (D̃ + L)·D̃⁻¹·(D̃ + Lᵀ) with the dropped fill
/// moved to the diagonal (Gustafsson 1978, BIT 18, 142; relaxed by <see cref="DiffusionSolverOptions.Relaxation"/>).
/// The footprint's true circle is kept where it cuts a face: a free cell whose neighbour is a sink sees the
/// boundary at θ·h (θ ∈ (0, 1], where the circle crosses the segment between the two centres), so that face
/// conducts u_c/θ instead of u_c. Only the diagonal changes, so the matrix stays symmetric (the symmetric
/// second-order Dirichlet treatment of Gibou, Fedkiw, Cheng &amp; Kang 2002, J. Comput. Phys. 176, 205; FROM
/// MEMORY); without it a disc behaves as if about one cell smaller. Every array is allocated once per grid and reused for each λ and border; loops run over runs of free cells
/// in one row, so the stencil has no branch. Not thread-safe: one solver per thread.
/// </remarks>
public sealed class ScreenedDiffusionSolver
{
    // The token of the solve in progress (one solve at a time per solver); checked between iterations.
    private CancellationToken _cancellation;

    /// <summary>Smallest boundary fraction θ used, so a circle grazing a cell centre cannot make the matrix ill-conditioned.</summary>
    public const double MinimumBoundaryFraction = 0.1;

    private readonly SinkGrid _grid;
    private readonly DiffusionSolverOptions _options;
    private readonly int[] _runStart;
    private readonly int[] _runEnd;
    private readonly int[] _faceCell;
    private readonly int[] _faceWire;
    private readonly double[] _faceWeight;
    private readonly double[] _extraDiagonal;
    private readonly byte[] _outsideFaces;
    private readonly double[] _u, _r, _z, _p, _q, _diag, _invD, _rhs;

    /// <summary>Prepares the solver for <paramref name="grid"/>.</summary>
    /// <exception cref="ArgumentException">Invalid options.</exception>
    public ScreenedDiffusionSolver(SinkGrid grid, DiffusionSolverOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(grid);
        _options = options ?? new DiffusionSolverOptions();
        IReadOnlyList<string> problems = _options.Validate();
        if (problems.Count > 0)
        {
            throw new ArgumentException(string.Join(" ", problems), nameof(options));
        }
        _grid = grid;
        int size = grid.Labels.Length;
        _u = new double[size];
        _r = new double[size];
        _z = new double[size];
        _p = new double[size];
        _q = new double[size];
        _diag = new double[size];
        _invD = new double[size];
        _rhs = new double[size];
        _outsideFaces = new byte[size];
        _extraDiagonal = new double[size];
        (_runStart, _runEnd) = BuildRuns(grid);
        (_faceCell, _faceWire, _faceWeight) = BuildFaces(grid, _outsideFaces, _extraDiagonal);
    }

    /// <summary>The grid this solver works on.</summary>
    public SinkGrid Grid => _grid;

    /// <summary>The last solution u = n·D/F (padded layout, zero off the free cells).</summary>
    public ReadOnlySpan<double> Solution => _u;

    /// <summary>
    /// Solves for capture length <paramref name="lambda"/> (grid length unit; +∞ means no desorption) with border
    /// <paramref name="border"/>, starting from zero.
    /// </summary>
    /// <exception cref="ArgumentException">λ not positive, or infinite with a saturated border, or a periodic border on a non-periodic grid (or the reverse).</exception>
    /// <exception cref="InvalidOperationException">No convergence within the iteration limit (e.g. λ = ∞ with no sink and no absorbing border).</exception>
    /// <exception cref="OperationCanceledException"><paramref name="cancellationToken"/> was cancelled (checked every 16 iterations).</exception>
    public SinkCurrents Solve(double lambda, BorderCondition border, CancellationToken cancellationToken = default)
    {
        _cancellation = cancellationToken;
        if (!(lambda > 0) || double.IsNaN(lambda))
        {
            throw new ArgumentException($"The capture length must be positive (got {lambda}).", nameof(lambda));
        }
        if (border == BorderCondition.Saturated && double.IsPositiveInfinity(lambda))
        {
            throw new ArgumentException("A saturated border needs a finite capture length.", nameof(border));
        }
        if ((border == BorderCondition.Periodic) != _grid.Periodic)
        {
            throw new ArgumentException(_grid.Periodic
                ? "A periodic grid takes only the periodic border."
                : "The periodic border needs a grid made from a periodic field.", nameof(border));
        }
        double h = _grid.CellSize;
        double screening = double.IsPositiveInfinity(lambda) ? 0.0 : h * h / (lambda * lambda);
        double saturation = border == BorderCondition.Saturated ? lambda * lambda : 0.0;
        Assemble(border, screening, saturation, h * h);
        Factorise(_options.Relaxation);
        (int iterations, double residual) = ConjugateGradient();

        var capture = new double[_grid.WireCount];
        for (int f = 0; f < _faceCell.Length; f++)
        {
            capture[_faceWire[f]] += _faceWeight[f] * _u[_faceCell[f]];
        }
        double sumU = 0;
        double outflow = 0;
        for (int k = 0; k < _runStart.Length; k++)
        {
            for (int c = _runStart[k]; c < _runEnd[k]; c++)
            {
                sumU += _u[c];
                if (border is BorderCondition.Absorbing or BorderCondition.Saturated)
                {
                    outflow += _outsideFaces[c] * (_u[c] - saturation);
                }
            }
        }
        return new SinkCurrents(capture, screening * sumU, outflow, _grid.FreeCellCount * h * h, iterations, residual);
    }

    private void Assemble(BorderCondition border, double screening, double saturation, double cellArea)
    {
        Array.Clear(_diag);
        Array.Clear(_rhs);
        bool reflecting = border == BorderCondition.Reflecting;
        for (int k = 0; k < _runStart.Length; k++)
        {
            for (int c = _runStart[k]; c < _runEnd[k]; c++)
            {
                int outside = _outsideFaces[c];
                _diag[c] = (reflecting ? 4 - outside : 4) + screening + _extraDiagonal[c];
                _rhs[c] = cellArea + (saturation * outside);
            }
        }
    }

    private void Factorise(double omega)
    {
        Array.Clear(_invD);
        ReadOnlySpan<int> labels = _grid.Labels;
        int w = _grid.Stride;
        for (int k = 0; k < _runStart.Length; k++)
        {
            for (int c = _runStart[k]; c < _runEnd[k]; c++)
            {
                // invD is zero off the free cells, so a sink or outside neighbour drops out by itself.
                double westFill = labels[c - 1 + w] == SinkGrid.Free ? omega : 0.0;
                double southFill = labels[c - w + 1] == SinkGrid.Free ? omega : 0.0;
                double d = _diag[c] - ((1 + westFill) * _invD[c - 1]) - ((1 + southFill) * _invD[c - w]);
                // Any positive D̃ keeps M symmetric positive definite; the floor only matters for near-singular rows.
                d = Math.Max(d, 1e-3 * _diag[c]);
                _invD[c] = 1.0 / d;
            }
        }
    }

    private (int Iterations, double Residual) ConjugateGradient()
    {
        Array.Clear(_u);
        Array.Clear(_z);
        Array.Clear(_p);
        Array.Clear(_q);
        Array.Clear(_r);
        double bNorm2 = 0;
        for (int k = 0; k < _runStart.Length; k++)
        {
            for (int c = _runStart[k]; c < _runEnd[k]; c++)
            {
                _r[c] = _rhs[c];
                bNorm2 += _rhs[c] * _rhs[c];
            }
        }
        if (bNorm2 == 0)
        {
            return (0, 0);
        }
        double stop2 = _options.RelativeTolerance * _options.RelativeTolerance * bNorm2;
        double rz = Precondition();
        CopyZToP();
        double rr = bNorm2;
        for (int iteration = 1; iteration <= _options.MaxIterations; iteration++)
        {
            if ((iteration & 15) == 0)
            {
                _cancellation.ThrowIfCancellationRequested();
            }
            double pq = MultiplyPQ();
            double alpha = rz / pq;
            rr = 0;
            for (int k = 0; k < _runStart.Length; k++)
            {
                for (int c = _runStart[k]; c < _runEnd[k]; c++)
                {
                    _u[c] += alpha * _p[c];
                    double r = _r[c] - (alpha * _q[c]);
                    _r[c] = r;
                    rr += r * r;
                }
            }
            if (rr <= stop2)
            {
                return (iteration, Math.Sqrt(rr / bNorm2));
            }
            double rzNew = Precondition();
            double beta = rzNew / rz;
            rz = rzNew;
            for (int k = 0; k < _runStart.Length; k++)
            {
                for (int c = _runStart[k]; c < _runEnd[k]; c++)
                {
                    _p[c] = _z[c] + (beta * _p[c]);
                }
            }
        }
        throw new InvalidOperationException(
            $"The diffusion solve did not converge in {_options.MaxIterations} iterations (relative residual {Math.Sqrt(rr / bNorm2):E2}).");
    }

    /// <summary>z = M⁻¹·r by a forward and a backward sweep; returns r·z.</summary>
    private double Precondition()
    {
        int w = _grid.Stride;
        double[] z = _z, r = _r, invD = _invD;
        for (int k = 0; k < _runStart.Length; k++)
        {
            int end = _runEnd[k];
            for (int c = _runStart[k]; c < end; c++)
            {
                z[c] = (r[c] + z[c - 1] + z[c - w]) * invD[c];
            }
        }
        double rz = 0;
        for (int k = _runStart.Length - 1; k >= 0; k--)
        {
            int start = _runStart[k];
            for (int c = _runEnd[k] - 1; c >= start; c--)
            {
                double v = z[c] + ((z[c + 1] + z[c + w]) * invD[c]);
                z[c] = v;
                rz += r[c] * v;
            }
        }
        return rz;
    }

    private void CopyZToP()
    {
        for (int k = 0; k < _runStart.Length; k++)
        {
            for (int c = _runStart[k]; c < _runEnd[k]; c++)
            {
                _p[c] = _z[c];
            }
        }
    }

    /// <summary>q = A·p on the free cells; returns p·q.</summary>
    private double MultiplyPQ()
    {
        if (_grid.Periodic)
        {
            WrapGhosts(_p);
        }
        int w = _grid.Stride;
        double[] p = _p, q = _q, diag = _diag;
        double pq = 0;
        for (int k = 0; k < _runStart.Length; k++)
        {
            int end = _runEnd[k];
            for (int c = _runStart[k]; c < end; c++)
            {
                double v = (diag[c] * p[c]) - (p[c - 1] + p[c + 1] + p[c - w] + p[c + w]);
                q[c] = v;
                pq += p[c] * v;
            }
        }
        return pq;
    }

    /// <summary>Copies the opposite edge into the ghost ring, so the stencil sees the torus.</summary>
    private void WrapGhosts(double[] values)
    {
        int nx = _grid.Nx, ny = _grid.Ny, w = _grid.Stride;
        for (int iy = 1; iy <= ny; iy++)
        {
            int row = iy * w;
            values[row] = values[row + nx];
            values[row + nx + 1] = values[row + 1];
        }
        Array.Copy(values, ny * w, values, 0, w);
        Array.Copy(values, w, values, (ny + 1) * w, w);
    }

    private static (int[] Start, int[] End) BuildRuns(SinkGrid grid)
    {
        ReadOnlySpan<int> labels = grid.Labels;
        var start = new List<int>();
        var end = new List<int>();
        for (int iy = 0; iy < grid.Ny; iy++)
        {
            int c = grid.Index(0, iy);
            int last = c + grid.Nx;
            while (c < last)
            {
                while (c < last && labels[c] != SinkGrid.Free)
                {
                    c++;
                }
                int s = c;
                while (c < last && labels[c] == SinkGrid.Free)
                {
                    c++;
                }
                if (c > s)
                {
                    start.Add(s);
                    end.Add(c);
                }
            }
        }
        return (start.ToArray(), end.ToArray());
    }

    private static (int[] Cell, int[] Wire, double[] Weight) BuildFaces(SinkGrid grid, byte[] outsideFaces, double[] extraDiagonal)
    {
        ReadOnlySpan<int> labels = grid.Labels;
        var cells = new List<int>();
        var wires = new List<int>();
        var weights = new List<double>();
        ReadOnlySpan<int> stepX = [-1, 1, 0, 0];
        ReadOnlySpan<int> stepY = [0, 0, -1, 1];
        Span<int> neighbours = stackalloc int[4];
        for (int iy = 0; iy < grid.Ny; iy++)
        {
            for (int ix = 0; ix < grid.Nx; ix++)
            {
                int c = grid.Index(ix, iy);
                if (labels[c] != SinkGrid.Free)
                {
                    continue;
                }
                if (grid.Periodic)
                {
                    neighbours[0] = grid.Index((ix + grid.Nx - 1) % grid.Nx, iy);
                    neighbours[1] = grid.Index((ix + 1) % grid.Nx, iy);
                    neighbours[2] = grid.Index(ix, (iy + grid.Ny - 1) % grid.Ny);
                    neighbours[3] = grid.Index(ix, (iy + 1) % grid.Ny);
                }
                else
                {
                    neighbours[0] = c - 1;
                    neighbours[1] = c + 1;
                    neighbours[2] = c - grid.Stride;
                    neighbours[3] = c + grid.Stride;
                }
                byte outside = 0;
                for (int d = 0; d < 4; d++)
                {
                    int label = labels[neighbours[d]];
                    if (label >= 0)
                    {
                        double weight = 1.0 / grid.BoundaryFraction(ix, iy, stepX[d], stepY[d], label, MinimumBoundaryFraction);
                        cells.Add(c);
                        wires.Add(label);
                        weights.Add(weight);
                        extraDiagonal[c] += weight - 1.0;
                    }
                    else if (label == SinkGrid.Outside)
                    {
                        outside++;
                    }
                }
                outsideFaces[c] = outside;
            }
        }
        return (cells.ToArray(), wires.ToArray(), weights.ToArray());
    }
}
