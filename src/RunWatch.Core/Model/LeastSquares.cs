namespace RunWatch.Core.Model;

/// <summary>
/// Least-squares solvers written here (closed-form straight line, Householder QR for small dense problems), so the
/// numbers can be checked against independent references (NIST StRD, MathNet.Numerics, SciPy).
/// </summary>
/// <remarks>
/// Straight line: the two-pass centred formulas b = Sxy/Sxx, a = ȳ − b·x̄, SE(b) = s/√Sxx,
/// SE(a) = s·√(1/n + x̄²/Sxx), s² = SSR/(n − 2) (Draper &amp; Smith, Applied Regression Analysis, ch. 1; the centred
/// form avoids the cancellation of the raw normal equations). QR: Golub &amp; Van Loan, Matrix Computations, §5.2.
/// </remarks>
internal static class LeastSquares
{
    /// <summary>Fits y = a + b·x. Needs at least three points and two distinct x values.</summary>
    public static LineFit FitLine(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length != y.Length)
        {
            throw new ArgumentException($"x has {x.Length} values but y has {y.Length}.", nameof(y));
        }
        int n = x.Length;
        if (n < 3)
        {
            throw new ArgumentException($"A straight-line fit with intervals needs at least 3 points; got {n}.", nameof(x));
        }
        double meanX = 0;
        double meanY = 0;
        for (int i = 0; i < n; i++)
        {
            if (!double.IsFinite(x[i]) || !double.IsFinite(y[i]))
            {
                throw new ArgumentException($"Point {i} is not finite (x = {x[i]}, y = {y[i]}).", nameof(x));
            }
            meanX += x[i];
            meanY += y[i];
        }
        meanX /= n;
        meanY /= n;
        double sxx = 0;
        double sxy = 0;
        double syy = 0;
        for (int i = 0; i < n; i++)
        {
            double dx = x[i] - meanX;
            double dy = y[i] - meanY;
            sxx += dx * dx;
            sxy += dx * dy;
            syy += dy * dy;
        }
        if (sxx <= 0)
        {
            throw new ArgumentException("All x values are equal: the slope is undetermined.", nameof(x));
        }
        double slope = sxy / sxx;
        double intercept = meanY - (slope * meanX);
        double ssr = 0;
        for (int i = 0; i < n; i++)
        {
            double r = y[i] - intercept - (slope * x[i]);
            ssr += r * r;
        }
        double s = Math.Sqrt(ssr / (n - 2));
        double seSlope = s / Math.Sqrt(sxx);
        double seIntercept = s * Math.Sqrt((1.0 / n) + (meanX * meanX / sxx));
        double r2 = syy > 0 ? 1 - (ssr / syy) : double.NaN;
        return new LineFit(n, intercept, slope, seIntercept, seSlope, ssr, syy, s, r2, meanX, sxx);
    }

    /// <summary>
    /// Solves min ‖A·x − b‖ by Householder QR. <paramref name="a"/> (rows × cols, row-major) and <paramref name="b"/>
    /// are overwritten. Returns false when A is rank deficient (a diagonal of R below a relative 1e-13).
    /// On success <paramref name="solution"/> holds x and <paramref name="rFactor"/> the upper triangle R (cols × cols).
    /// </summary>
    public static bool SolveQr(Span<double> a, int rows, int cols, Span<double> b, Span<double> solution, Span<double> rFactor)
    {
        if (rows < cols || a.Length < rows * cols || b.Length < rows || solution.Length < cols || rFactor.Length < cols * cols)
        {
            throw new ArgumentException("Inconsistent QR problem dimensions.");
        }
        double scale = 0;
        for (int i = 0; i < rows * cols; i++)
        {
            scale = Math.Max(scale, Math.Abs(a[i]));
        }
        for (int k = 0; k < cols; k++)
        {
            double norm = 0;
            for (int i = k; i < rows; i++)
            {
                norm += a[(i * cols) + k] * a[(i * cols) + k];
            }
            norm = Math.Sqrt(norm);
            if (norm <= 1e-13 * scale)
            {
                return false;
            }
            double alpha = a[(k * cols) + k] > 0 ? -norm : norm;
            // v = x − alpha·e1 stored in place of column k; the diagonal of R becomes alpha.
            a[(k * cols) + k] -= alpha;
            double vNorm2 = 0;
            for (int i = k; i < rows; i++)
            {
                vNorm2 += a[(i * cols) + k] * a[(i * cols) + k];
            }
            for (int j = k + 1; j < cols; j++)
            {
                double dot = 0;
                for (int i = k; i < rows; i++)
                {
                    dot += a[(i * cols) + k] * a[(i * cols) + j];
                }
                double f = 2 * dot / vNorm2;
                for (int i = k; i < rows; i++)
                {
                    a[(i * cols) + j] -= f * a[(i * cols) + k];
                }
            }
            double dotB = 0;
            for (int i = k; i < rows; i++)
            {
                dotB += a[(i * cols) + k] * b[i];
            }
            double fb = 2 * dotB / vNorm2;
            for (int i = k; i < rows; i++)
            {
                b[i] -= fb * a[(i * cols) + k];
            }
            rFactor[(k * cols) + k] = alpha;
            for (int j = k + 1; j < cols; j++)
            {
                rFactor[(k * cols) + j] = a[(k * cols) + j];
            }
            for (int j = 0; j < k; j++)
            {
                rFactor[(k * cols) + j] = 0;
            }
        }
        for (int k = cols - 1; k >= 0; k--)
        {
            double sum = b[k];
            for (int j = k + 1; j < cols; j++)
            {
                sum -= rFactor[(k * cols) + j] * solution[j];
            }
            solution[k] = sum / rFactor[(k * cols) + k];
        }
        return true;
    }

    /// <summary>(RᵀR)⁻¹ = R⁻¹·R⁻ᵀ for an upper-triangular R (cols × cols, row-major).</summary>
    public static double[] InverseGram(ReadOnlySpan<double> rFactor, int cols)
    {
        var rInv = new double[cols * cols];
        for (int j = 0; j < cols; j++)
        {
            rInv[(j * cols) + j] = 1 / rFactor[(j * cols) + j];
            for (int i = j - 1; i >= 0; i--)
            {
                double sum = 0;
                for (int k = i + 1; k <= j; k++)
                {
                    sum += rFactor[(i * cols) + k] * rInv[(k * cols) + j];
                }
                rInv[(i * cols) + j] = -sum / rFactor[(i * cols) + i];
            }
        }
        var result = new double[cols * cols];
        for (int i = 0; i < cols; i++)
        {
            for (int j = 0; j < cols; j++)
            {
                double sum = 0;
                for (int k = Math.Max(i, j); k < cols; k++)
                {
                    sum += rInv[(i * cols) + k] * rInv[(j * cols) + k];
                }
                result[(i * cols) + j] = sum;
            }
        }
        return result;
    }
}
