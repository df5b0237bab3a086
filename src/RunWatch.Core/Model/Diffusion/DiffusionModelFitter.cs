using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// Fits λ₀², E_λ, κ and r₀ of <see cref="DiffusionRadiusModel"/> jointly to the per-wire radii of several wafers by
/// nonlinear least squares on r (MathNet.Numerics Levenberg–Marquardt), with profile-likelihood 95 % intervals,
/// and refuses with a plain reason when the data cannot locate λ.
/// </summary>
/// <remarks>
/// Internally λ is parametrised at the wafers' mean temperature T_ref (ln λ_ref²), where it is least correlated with
/// E_λ; κ as ln κ; r₀ as r₀². The start comes from a grid over (λ_ref, E_λ), on which r² = r₀² + κ·I is a straight
/// line in I solved exactly. Profile intervals: the parameter is fixed at values stepping away from the estimate and
/// the others refitted; the bound is where n·ln(SSR/SSR_min) reaches χ²₁,₀.₉₅ = 3.841 (Venzon &amp; Moolgavkar 1988,
/// Appl. Stat. 37, 87, for the method; FROM MEMORY). A profile that never reaches it within the search is unbounded.
/// </remarks>
public static class DiffusionModelFitter
{
    private const double ChiSquare95 = 3.841458820694124;
    private const int LambdaRef = 0, Activation = 1, LogKappa = 2, R0Squared = 3;

    /// <summary>Fits the model, or refuses. The wafers' tables should span the λ values the fit may need.</summary>
    public static DiffusionFitResult Fit(IReadOnlyList<DiffusionWafer> wafers)
    {
        ArgumentNullException.ThrowIfNull(wafers);
        var problem = new Problem(wafers);
        if (wafers.Count < 3)
        {
            return Refuse(problem, $"Only {wafers.Count} wafer(s): at least 3, at two or more growth temperatures, are needed to locate λ and its temperature dependence.");
        }
        double tMin = double.MaxValue, tMax = double.MinValue;
        var conditions = new List<(double T, double S)>();
        foreach (DiffusionWafer w in wafers)
        {
            tMin = Math.Min(tMin, w.Exposure.MeanTemperatureK);
            tMax = Math.Max(tMax, w.Exposure.MeanTemperatureK);
            if (!conditions.Exists(c => Math.Abs(c.T - w.Exposure.MeanTemperatureK) < 5 && Math.Abs(c.S - w.Exposure.CoveredS) < 0.05 * c.S))
            {
                conditions.Add((w.Exposure.MeanTemperatureK, w.Exposure.CoveredS));
            }
        }
        if (tMax - tMin < 5)
        {
            return Refuse(problem, $"Every wafer grew at about one temperature ({PhysicalConstants.KelvinToCelsius(tMin):F1} to {PhysicalConstants.KelvinToCelsius(tMax):F1} °C): the temperature dependence E_λ cannot be told apart from λ₀. Add wafers grown at least 5 K apart.");
        }
        if (conditions.Count < 3)
        {
            return Refuse(problem, $"The wafers cover only {conditions.Count} distinct growth conditions (temperature within 5 K and time within 5 %): at least 3 are needed.");
        }
        if (problem.Count < 8)
        {
            return Refuse(problem, $"Only {problem.Count} unguarded wires with measured radii: too few to fit four parameters.");
        }

        double[] best = problem.StartingPoint();
        double ssrMin = double.NaN;
        Vector<double>? se = null;
        // The wires used depend on λ (guard), λ on the fit: refit until the choice settles (it does within a few rounds).
        for (int round = 0; round < 4; round++)
        {
            if (round > 0 && !problem.SelectWires(best))
            {
                break;
            }
            if (round == 0)
            {
                problem.SelectWires(best);
                best = problem.StartingPoint();
            }
            (best, ssrMin, se) = problem.Minimise(best, null, false);
        }
        if (problem.Count < 8)
        {
            return Refuse(problem, $"Only {problem.Count} unguarded wires with measured radii at the fitted λ: too few to fit four parameters.");
        }
        IReadOnlyList<DiffusionWaferFigures> figures = problem.Figures(best);
        double lambdaRef = Math.Exp(0.5 * best[LambdaRef]);
        double medianSlope = Median(figures.Select(f => f.MedianLogSlope).ToArray());
        if (medianSlope < 0.05)
        {
            return Refuse(problem, $"Every wire is held by its neighbours (median d ln A/d ln λ = {medianSlope:F3} at the best λ_ref = {lambdaRef:G3} µm): the radii follow the Voronoi cells and say nothing about λ. Wafers with sparser wires or cooler growth are needed.", figures);
        }
        double outside = problem.SecondsOutsideTables(best);
        if (outside > 0)
        {
            return Refuse(problem, $"The best fit needs λ outside the solved range for {outside:F0} s of growth (λ_ref = {lambdaRef:G3} µm): the radii do not locate λ within it.", figures);
        }

        var estimates = new List<ParameterEstimate>();
        (double lo, double hi) = problem.ProfileInterval(best, ssrMin, LambdaRef, false, StepFor(se, LambdaRef, 0.1));
        if (double.IsInfinity(lo) || double.IsInfinity(hi))
        {
            return Refuse(problem, $"The fit is flat in λ: the 95 % profile interval of λ at {PhysicalConstants.KelvinToCelsius(problem.ReferenceK):F0} °C is unbounded {(double.IsInfinity(lo) ? "below" : "above")} (best {lambdaRef:G3} µm). The radii cannot locate λ.", figures);
        }
        estimates.Add(new ParameterEstimate("lambda_ref", lambdaRef, Se(se, LambdaRef) * lambdaRef / 2, Math.Exp(0.5 * lo), Math.Exp(0.5 * hi), "µm"));
        double lnL0 = best[LambdaRef] + (best[Activation] / (PhysicalConstants.BoltzmannEvPerK * problem.ReferenceK));
        double[] alt = [lnL0, best[1], best[2], best[3]];
        (lo, hi) = problem.ProfileInterval(alt, ssrMin, LambdaRef, true, StepFor(se, Activation, 0.05) / (PhysicalConstants.BoltzmannEvPerK * problem.ReferenceK));
        estimates.Add(new ParameterEstimate("lambda0_squared", Math.Exp(lnL0), double.NaN, Math.Exp(lo), Math.Exp(hi), "µm²"));
        (lo, hi) = problem.ProfileInterval(best, ssrMin, Activation, false, StepFor(se, Activation, 0.05));
        estimates.Add(new ParameterEstimate("E_lambda", best[Activation], Se(se, Activation), lo, hi, "eV"));
        (lo, hi) = problem.ProfileInterval(best, ssrMin, LogKappa, false, StepFor(se, LogKappa, 0.05));
        double kappa = Math.Exp(best[LogKappa]);
        estimates.Add(new ParameterEstimate("kappa", kappa, Se(se, LogKappa) * kappa, Math.Exp(lo), Math.Exp(hi), "nm²/(µm²·s)"));
        (lo, hi) = problem.ProfileInterval(best, ssrMin, R0Squared, false, StepFor(se, R0Squared, 10 + (0.1 * Math.Abs(best[R0Squared]))));
        double r0 = Math.Sqrt(Math.Max(best[R0Squared], 0));
        estimates.Add(new ParameterEstimate("r0", r0, double.NaN, Math.Sqrt(Math.Max(lo, 0)), Math.Sqrt(Math.Max(hi, 0)), "nm"));

        double sMin = wafers.Min(w => w.Exposure.CoveredS), sMax = wafers.Max(w => w.Exposure.CoveredS);
        var model = new DiffusionRadiusModel(Math.Exp(lnL0), best[Activation], kappa, best[R0Squared], problem.ReferenceK, estimates,
            PhysicalConstants.KelvinToCelsius(tMin), PhysicalConstants.KelvinToCelsius(tMax), sMin, sMax,
            Math.Sqrt(ssrMin / Math.Max(problem.Count - 4, 1)));
        return new DiffusionFitResult(model, null, figures, problem.Count);
    }

    private static double Se(Vector<double>? se, int index) => se is null ? double.NaN : se[index];

    private static double StepFor(Vector<double>? se, int index, double fallback)
    {
        double s = Se(se, index);
        return double.IsFinite(s) && s > 0 ? Math.Min(s, 10 * fallback) : fallback;
    }

    private static DiffusionFitResult Refuse(Problem problem, string reason, IReadOnlyList<DiffusionWaferFigures>? figures = null) =>
        new(null, reason, figures ?? [], problem.Count);

    internal static double Median(double[] values)
    {
        double[] v = values.Where(double.IsFinite).ToArray();
        if (v.Length == 0)
        {
            return double.NaN;
        }
        Array.Sort(v);
        return v.Length % 2 == 1 ? v[v.Length / 2] : 0.5 * (v[(v.Length / 2) - 1] + v[v.Length / 2]);
    }

    /// <summary>The least-squares problem over all wafers' usable wires.</summary>
    private sealed class Problem
    {
        private readonly IReadOnlyList<DiffusionWafer> _wafers;
        private readonly int[][] _used;
        private double[] _observed;
        private readonly double[][] _weights;
        private readonly double[][] _integrals;

        public Problem(IReadOnlyList<DiffusionWafer> wafers)
        {
            _wafers = wafers;
            _used = new int[wafers.Count][];
            _weights = new double[wafers.Count][];
            _integrals = new double[wafers.Count][];
            double tSum = 0;
            for (int w = 0; w < wafers.Count; w++)
            {
                _weights[w] = new double[wafers[w].Table.FineCount];
                _integrals[w] = new double[wafers[w].Table.WireCount];
                _used[w] = [];
                tSum += wafers[w].Exposure.MeanTemperatureK;
            }
            _observed = [];
            ReferenceK = wafers.Count > 0 ? tSum / wafers.Count : double.NaN;
            SelectWires(null);
        }

        /// <summary>
        /// Chooses each wafer's wires: measured, and unguarded at the largest λ its history reaches under
        /// <paramref name="p"/> (at each table's smallest λ when <paramref name="p"/> is null). Returns true when the choice changed.
        /// </summary>
        public bool SelectWires(double[]? p)
        {
            bool changed = false;
            var observed = new List<double>();
            for (int w = 0; w < _wafers.Count; w++)
            {
                DiffusionWafer wafer = _wafers[w];
                double lambdaMax = p is null ? wafer.Table.LambdaMinUm : wafer.Exposure.LambdaRange(Law(p[LambdaRef], p[Activation])).Max;
                var guarded = new bool[wafer.Table.WireCount];
                wafer.Table.GuardFor(lambdaMax, guarded);
                var used = new List<int>();
                for (int i = 0; i < wafer.Table.WireCount; i++)
                {
                    if (!guarded[i] && i < wafer.MeasuredRadiiNm.Length && double.IsFinite(wafer.MeasuredRadiiNm[i]) && wafer.MeasuredRadiiNm[i] > 0)
                    {
                        used.Add(i);
                        observed.Add(wafer.MeasuredRadiiNm[i]);
                    }
                }
                changed |= !used.SequenceEqual(_used[w]);
                _used[w] = used.ToArray();
            }
            _observed = observed.ToArray();
            return changed;
        }

        public int Count => _observed.Length;

        public double ReferenceK { get; }

        private CaptureLengthLaw Law(double lnLambdaRefSq, double activation) =>
            CaptureLengthLaw.Through(Math.Exp(0.5 * lnLambdaRefSq), ReferenceK, activation);

        /// <summary>Fills each wafer's ∫A dt for a law.</summary>
        private double Integrate(double lnLambdaRefSq, double activation)
        {
            CaptureLengthLaw law = Law(lnLambdaRefSq, activation);
            double outside = 0;
            for (int w = 0; w < _wafers.Count; w++)
            {
                outside += _wafers[w].Exposure.Weights(law, _wafers[w].Table, _weights[w]);
                _wafers[w].Table.Collect(_weights[w], _integrals[w]);
            }
            return outside;
        }

        public double SecondsOutsideTables(double[] p) => Integrate(p[LambdaRef], p[Activation]);

        private void Predict(double[] p, Span<double> predicted)
        {
            Integrate(p[LambdaRef], p[Activation]);
            double kappa = Math.Exp(p[LogKappa]);
            int k = 0;
            for (int w = 0; w < _wafers.Count; w++)
            {
                foreach (int i in _used[w])
                {
                    predicted[k++] = Math.Sqrt(Math.Max(p[R0Squared] + (kappa * _integrals[w][i]), 1e-6));
                }
            }
        }

        private double Ssr(double[] p)
        {
            var predicted = new double[Count];
            Predict(p, predicted);
            double ssr = 0;
            for (int k = 0; k < Count; k++)
            {
                double d = _observed[k] - predicted[k];
                ssr += d * d;
            }
            return ssr;
        }

        /// <summary>Grid over (λ_ref, E_λ); for each, r² = q + κ·I by ordinary least squares; the best SSR on r wins.</summary>
        public double[] StartingPoint()
        {
            double lo = _wafers.Max(w => w.Table.LambdaMinUm), hi = _wafers.Min(w => w.Table.LambdaMaxUm);
            double[] best = [Math.Log(lo * hi), 0, 0, 0];
            double bestSsr = double.PositiveInfinity;
            for (int a = 0; a < 16; a++)
            {
                double lambda = lo * Math.Pow(hi / lo, (a + 0.5) / 16);
                for (int e = -4; e <= 4; e++)
                {
                    double activation = 0.5 * e;
                    Integrate(2 * Math.Log(lambda), activation);
                    double sx = 0, sy = 0, sxx = 0, sxy = 0;
                    int n = 0;
                    for (int w = 0; w < _wafers.Count; w++)
                    {
                        foreach (int i in _used[w])
                        {
                            double x = _integrals[w][i], y = _observed[n] * _observed[n];
                            sx += x;
                            sy += y;
                            sxx += x * x;
                            sxy += x * y;
                            n++;
                        }
                    }
                    double slope = ((n * sxy) - (sx * sy)) / ((n * sxx) - (sx * sx));
                    if (!(slope > 0))
                    {
                        continue;
                    }
                    double intercept = (sy - (slope * sx)) / n;
                    double[] p = [2 * Math.Log(lambda), activation, Math.Log(slope), intercept];
                    double ssr = Ssr(p);
                    if (ssr < bestSsr)
                    {
                        bestSsr = ssr;
                        best = p;
                    }
                }
            }
            return best;
        }

        /// <summary>Levenberg–Marquardt from <paramref name="start"/>; <paramref name="fixedIndex"/> held fixed when given. <paramref name="lambda0Mode"/>: p[0] is ln λ₀² instead of ln λ_ref².</summary>
        public (double[] Point, double Ssr, Vector<double>? StandardErrors) Minimise(double[] start, int? fixedIndex, bool lambda0Mode)
        {
            double[] Convert(Vector<double> p)
            {
                double[] q = p.ToArray();
                if (lambda0Mode)
                {
                    q[LambdaRef] = p[LambdaRef] - (p[Activation] / (PhysicalConstants.BoltzmannEvPerK * ReferenceK));
                }
                return q;
            }
            Vector<double> x = Vector<double>.Build.Dense(Count, i => i);
            Vector<double> y = Vector<double>.Build.DenseOfArray(_observed);
            IObjectiveModel objective = ObjectiveFunction.NonlinearModel(
                (p, _) =>
                {
                    var predicted = new double[Count];
                    Predict(Convert(p), predicted);
                    return Vector<double>.Build.DenseOfArray(predicted);
                },
                x, y, null, accuracyOrder: 2);
            var solver = new LevenbergMarquardtMinimizer(maximumIterations: 200);
            List<bool>? isFixed = fixedIndex is int f ? [f == 0, f == 1, f == 2, f == 3] : null;
            Vector<double> scales = Vector<double>.Build.DenseOfArray([1, 0.1, 1, Math.Max(100, Math.Abs(start[R0Squared]))]);
            NonlinearMinimizationResult result = solver.FindMinimum(objective, Vector<double>.Build.DenseOfArray(start), null, null, scales, isFixed);
            double[] point = result.MinimizingPoint.ToArray();
            double[] basePoint = Convert(result.MinimizingPoint);
            return (point, Ssr(basePoint), fixedIndex is null ? result.StandardErrors : null);
        }

        /// <summary>Profile-likelihood 95 % interval of parameter <paramref name="index"/> (in the fitted parametrisation).</summary>
        public (double Lower, double Upper) ProfileInterval(double[] best, double ssrMin, int index, bool lambda0Mode, double step)
        {
            double Side(int sign)
            {
                double[] current = (double[])best.Clone();
                double previousOffset = 0, previousStat = 0;
                double offset = step;
                for (int s = 0; s < 14; s++)
                {
                    double[] startPoint = (double[])current.Clone();
                    startPoint[index] = best[index] + (sign * offset);
                    (double[] point, double ssr, _) = Minimise(startPoint, index, lambda0Mode);
                    double stat = Count * Math.Log(Math.Max(ssr, 1e-300) / ssrMin);
                    if (stat >= ChiSquare95)
                    {
                        double t = (ChiSquare95 - previousStat) / (stat - previousStat);
                        return best[index] + (sign * (previousOffset + (t * (offset - previousOffset))));
                    }
                    current = point;
                    previousOffset = offset;
                    previousStat = Math.Max(stat, 0);
                    offset *= 1.6;
                }
                return sign * double.PositiveInfinity;
            }
            return (Side(-1), Side(+1));
        }

        public IReadOnlyList<DiffusionWaferFigures> Figures(double[] p)
        {
            Integrate(p[LambdaRef], p[Activation]);
            CaptureLengthLaw law = Law(p[LambdaRef], p[Activation]);
            double kappa = Math.Exp(p[LogKappa]);
            var list = new List<DiffusionWaferFigures>();
            for (int w = 0; w < _wafers.Count; w++)
            {
                DiffusionWafer wafer = _wafers[w];
                double sumM = 0, sumP = 0, sumD2 = 0;
                var slopes = new double[_used[w].Length];
                var guarded = new bool[wafer.Table.WireCount];
                Array.Fill(guarded, true);
                foreach (int i in _used[w])
                {
                    guarded[i] = false;
                }
                double lambdaEff = EffectiveCaptureLength.Find(wafer.Table, guarded, EffectiveCaptureLength.UnguardedTotal(guarded, _integrals[w]), wafer.Exposure.CoveredS);
                int k = 0;
                foreach (int i in _used[w])
                {
                    double predicted = Math.Sqrt(Math.Max(p[R0Squared] + (kappa * _integrals[w][i]), 0));
                    double measured = wafer.MeasuredRadiiNm[i];
                    sumM += measured;
                    sumP += predicted;
                    sumD2 += (predicted - measured) * (predicted - measured);
                    slopes[k++] = wafer.Table.LogSlope(i, double.IsFinite(lambdaEff) ? lambdaEff : law.LambdaUm(wafer.Exposure.MeanTemperatureK));
                }
                int n = Math.Max(_used[w].Length, 1);
                list.Add(new DiffusionWaferFigures(wafer.Id, _used[w].Length, PhysicalConstants.KelvinToCelsius(wafer.Exposure.MeanTemperatureK),
                    wafer.Exposure.CoveredS, law.LambdaUm(wafer.Exposure.MeanTemperatureK), lambdaEff,
                    sumM / n, sumP / n, (sumP - sumM) / n, Math.Sqrt(sumD2 / n), Median(slopes)));
            }
            return list;
        }
    }
}
