namespace RunWatch.Core.Model;

/// <summary>
/// Finds the capture radius L whose capture areas best explain measured radii: a coarse scan of r² over
/// [min, max] (log-spaced, because plausible L spans decades), then golden-section refinement between the best
/// scan point's neighbours. Maximising r² is the same as minimising SSR over a fixed wire set; with wires left
/// out at some L, r² stays comparable because it is scaled by each set's own total sum of squares.
/// Golden-section search: Kiefer (1953); Press et al., Numerical Recipes, §10.2.
/// </summary>
public static class CaptureRadiusSearch
{
    private const int MinimumWires = 5;

    /// <summary>Searches L in [<paramref name="minNm"/>, <paramref name="maxNm"/>].</summary>
    /// <param name="radiiNm">Measured radius per wire, in the evaluator's wire order.</param>
    /// <param name="evaluator">Fills Â per wire for a given L.</param>
    /// <param name="kind">Model form whose r² is maximised.</param>
    /// <param name="minNm">Smallest L (nm), &gt; 0.</param>
    /// <param name="maxNm">Largest L (nm), &gt; <paramref name="minNm"/>.</param>
    /// <param name="scanPoints">Coarse scan points (≥ 3).</param>
    /// <param name="relativeTolerance">Golden-section stops when the bracket is narrower than this fraction of L.</param>
    /// <exception cref="InvalidOperationException">No L in the range leaves at least five usable wires.</exception>
    public static CaptureRadiusFit Find(
        ReadOnlySpan<double> radiiNm,
        CaptureAreaEvaluator evaluator,
        RadiusModelKind kind,
        double minNm,
        double maxNm,
        int scanPoints = 24,
        double relativeTolerance = 1e-4)
    {
        ArgumentNullException.ThrowIfNull(evaluator);
        if (!(minNm > 0) || !(maxNm > minNm))
        {
            throw new ArgumentOutOfRangeException(nameof(maxNm), $"Need 0 < min < max; got [{minNm}, {maxNm}] nm.");
        }
        ArgumentOutOfRangeException.ThrowIfLessThan(scanPoints, 3);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(relativeTolerance);

        var radii = radiiNm.ToArray();
        var areas = new double[radii.Length];
        var usedAreas = new double[radii.Length];
        var usedRadii = new double[radii.Length];
        var scan = new List<CaptureRadiusScanPoint>(scanPoints + 64);

        double Quality(double l)
        {
            evaluator(l, areas);
            int m = 0;
            for (int i = 0; i < areas.Length; i++)
            {
                if (double.IsFinite(areas[i]) && (kind == RadiusModelKind.Linear || areas[i] > 0))
                {
                    usedAreas[m] = areas[i];
                    usedRadii[m] = radii[i];
                    m++;
                }
            }
            double r2 = double.NaN;
            if (m >= MinimumWires)
            {
                try
                {
                    r2 = RadiusModelFitter.Fit(kind, usedAreas.AsSpan(0, m), usedRadii.AsSpan(0, m)).RSquared;
                }
                catch (Exception ex) when (ex is ArgumentException or InvalidOperationException)
                {
                    // All Â equal at this L (every disc inside its cell): no information about L here. The linear
                    // fit refuses with ArgumentException, the power law with a singular Jacobian.
                    r2 = double.NaN;
                }
            }
            scan.Add(new CaptureRadiusScanPoint(l, r2, m));
            return double.IsNaN(r2) ? double.NegativeInfinity : r2;
        }

        double logMin = Math.Log(minNm);
        double logStep = (Math.Log(maxNm) - logMin) / (scanPoints - 1);
        int best = -1;
        double bestQuality = double.NegativeInfinity;
        for (int i = 0; i < scanPoints; i++)
        {
            double q = Quality(Math.Exp(logMin + (i * logStep)));
            if (q > bestQuality)
            {
                bestQuality = q;
                best = i;
            }
        }
        if (best < 0)
        {
            throw new InvalidOperationException($"No capture radius in [{minNm}, {maxNm}] nm leaves {MinimumWires} usable wires with distinct Â.");
        }

        // Golden section on log L between the neighbours of the best scan point.
        double lo = logMin + (Math.Max(best - 1, 0) * logStep);
        double hi = logMin + (Math.Min(best + 1, scanPoints - 1) * logStep);
        double bestLog = logMin + (best * logStep);
        const double InvPhi = 0.6180339887498949;
        double c = hi - (InvPhi * (hi - lo));
        double d = lo + (InvPhi * (hi - lo));
        double qc = Quality(Math.Exp(c));
        double qd = Quality(Math.Exp(d));
        double tolerance = Math.Log(1 + relativeTolerance);
        while (hi - lo > tolerance)
        {
            if (qc >= qd)
            {
                hi = d;
                d = c;
                qd = qc;
                c = hi - (InvPhi * (hi - lo));
                qc = Quality(Math.Exp(c));
            }
            else
            {
                lo = c;
                c = d;
                qc = qd;
                d = lo + (InvPhi * (hi - lo));
                qd = Quality(Math.Exp(d));
            }
        }
        if (Math.Max(qc, qd) > bestQuality)
        {
            bestLog = qc >= qd ? c : d;
        }
        double bestL = Math.Exp(bestLog);

        evaluator(bestL, areas);
        int count = 0;
        for (int i = 0; i < areas.Length; i++)
        {
            if (double.IsFinite(areas[i]) && (kind == RadiusModelKind.Linear || areas[i] > 0))
            {
                usedAreas[count] = areas[i];
                usedRadii[count] = radii[i];
                count++;
            }
        }
        RadiusModelFit fit = RadiusModelFitter.Fit(kind, usedAreas.AsSpan(0, count), usedRadii.AsSpan(0, count));
        bool atEdge = best == 0 || best == scanPoints - 1;
        return new CaptureRadiusFit(bestL, fit, scan, atEdge);
    }
}
