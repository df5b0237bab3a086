using System.Globalization;

namespace RunWatch.Core.Qc;

/// <summary>
/// Judges a wafer against its recipe's QC specification. Limits are inclusive (a value equal to a fail limit
/// passes that limit); the verdict is the worst rule outcome. Pure; thread-safe.
/// </summary>
public static class QcEvaluator
{
    /// <summary>Evaluates every configured rule in a fixed order.</summary>
    /// <exception cref="ArgumentException">The specification does not validate.</exception>
    public static QcVerdict Evaluate(WaferQcInput input, QcSpecification spec)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(spec);
        IReadOnlyList<string> problems = spec.Validate();
        if (problems.Count > 0)
        {
            throw new ArgumentException("Invalid QC specification: " + string.Join(" ", problems), nameof(spec));
        }
        var rules = new List<QcRuleResult>(9);
        var missing = spec.MissingValueOutcome;

        if (spec.MinWireCount is { } minWires)
        {
            rules.Add(Lower("wire-count", "wires measured", input.WireCount, minWires, null, "", missing, "0"));
        }
        if (spec.TargetMeanRadiusNm is { } target && spec.MeanRadiusToleranceNm is { } tolerance)
        {
            rules.Add(MeanRadius(input.MeanRadiusNm, target, tolerance, spec.MeanRadiusWarnToleranceNm, missing));
        }
        if (spec.MaxRadiusCv is { } maxCv)
        {
            rules.Add(Upper("radius-cv", "radius CV (SD / mean)", input.RadiusCv, maxCv, spec.WarnRadiusCv, "", missing, "0.###"));
        }
        if (spec.MinDensityPerCm2 is not null || spec.MaxDensityPerCm2 is not null)
        {
            rules.Add(Density(input.DensityPerCm2, spec, missing));
        }
        if (spec.MinVerticalYield is { } minYield)
        {
            rules.Add(Lower("vertical-yield", "vertical yield", input.VerticalYield, minYield, spec.WarnVerticalYield, "", missing, "0.###"));
        }
        if (spec.MaxAbsBiasNm is { } maxBias)
        {
            double? absBias = input.PredictionBiasNm is { } bias ? Math.Abs(bias) : null;
            QcRuleResult r = Upper("prediction-bias", "|predicted − measured| radius bias", absBias, maxBias, spec.WarnAbsBiasNm, "nm", missing, "0.##");
            rules.Add(r with { Measured = input.PredictionBiasNm });
        }
        if (spec.MaxExcursionCount is { } maxExc)
        {
            rules.Add(Upper("excursion-count", "excursions in the growth window", input.ExcursionCount, maxExc, spec.WarnExcursionCount, "", missing, "0"));
        }
        if (spec.MaxAbsRelativeLChange is { } maxDl)
        {
            rules.Add(Upper("excursion-effect", "largest |ΔL/L| of one excursion", input.MaxAbsRelativeLChange, maxDl, spec.WarnAbsRelativeLChange, "", missing, "0.####"));
        }
        if (spec.MinThermalCoverage is { } minCov)
        {
            rules.Add(Lower("thermal-coverage", "thermal record coverage of the window", input.ThermalCoverage, minCov, spec.WarnThermalCoverage, "", missing, "0.###"));
        }

        QcOutcome worst = QcOutcome.Pass;
        foreach (QcRuleResult r in rules)
        {
            if (r.Outcome > worst)
            {
                worst = r.Outcome;
            }
        }
        return new QcVerdict(input.WaferId, input.Recipe, worst, rules);
    }

    private static QcRuleResult MeanRadius(double? mean, double target, double tolerance, double? warnTolerance, QcOutcome missing)
    {
        const string Rule = "mean-radius";
        const string Description = "mean radius against target";
        string limit = F("{0:0.##} ± {1:0.##}", target, tolerance);
        string warnLimit = warnTolerance is { } w ? F("{0:0.##} ± {1:0.##}", target, w) : "";
        if (mean is not { } m || !double.IsFinite(m))
        {
            return Missing(Rule, Description, limit, warnLimit, "nm", missing);
        }
        double deviation = Math.Abs(m - target);
        if (deviation > tolerance)
        {
            return new QcRuleResult(Rule, Description, m, limit, warnLimit, "nm", QcOutcome.Fail, F("mean radius {0:0.##} nm is {1:0.##} nm from the target {2:0.##} nm, beyond the tolerance ± {3:0.##} nm", m, deviation, target, tolerance));
        }
        if (warnTolerance is { } wt && deviation > wt)
        {
            return new QcRuleResult(Rule, Description, m, limit, warnLimit, "nm", QcOutcome.Warn, F("mean radius {0:0.##} nm is {1:0.##} nm from the target, beyond the warn band ± {2:0.##} nm", m, deviation, wt));
        }
        return new QcRuleResult(Rule, Description, m, limit, warnLimit, "nm", QcOutcome.Pass, F("mean radius {0:0.##} nm is within ± {1:0.##} nm of the target", m, warnTolerance ?? tolerance));
    }

    private static QcRuleResult Density(double? density, QcSpecification spec, QcOutcome missing)
    {
        const string Rule = "density";
        const string Description = "wire density";
        const string Unit = "cm⁻²";
        string limit = Window(spec.MinDensityPerCm2, spec.MaxDensityPerCm2);
        string warnLimit = spec.WarnMinDensityPerCm2 is null && spec.WarnMaxDensityPerCm2 is null ? "" : Window(spec.WarnMinDensityPerCm2, spec.WarnMaxDensityPerCm2);
        if (density is not { } d || !double.IsFinite(d))
        {
            return Missing(Rule, Description, limit, warnLimit, Unit, missing);
        }
        if (d < (spec.MinDensityPerCm2 ?? double.NegativeInfinity) || d > (spec.MaxDensityPerCm2 ?? double.PositiveInfinity))
        {
            return new QcRuleResult(Rule, Description, d, limit, warnLimit, Unit, QcOutcome.Fail, F("density {0:0.00e+0} cm⁻² is outside the window {1}", d, limit));
        }
        if (d < (spec.WarnMinDensityPerCm2 ?? double.NegativeInfinity) || d > (spec.WarnMaxDensityPerCm2 ?? double.PositiveInfinity))
        {
            return new QcRuleResult(Rule, Description, d, limit, warnLimit, Unit, QcOutcome.Warn, F("density {0:0.00e+0} cm⁻² is outside the warn window {1}", d, warnLimit));
        }
        return new QcRuleResult(Rule, Description, d, limit, warnLimit, Unit, QcOutcome.Pass, F("density {0:0.00e+0} cm⁻² is inside the window", d));
    }

    private static QcRuleResult Upper(string rule, string description, double? measured, double limit, double? warn, string unit, QcOutcome missing, string format)
    {
        string limitText = "≤ " + N(limit, format);
        string warnText = warn is { } w ? "≤ " + N(w, format) : "";
        if (measured is not { } m || !double.IsFinite(m))
        {
            return Missing(rule, description, limitText, warnText, unit, missing);
        }
        string u = unit.Length > 0 ? " " + unit : "";
        if (m > limit)
        {
            return new QcRuleResult(rule, description, m, limitText, warnText, unit, QcOutcome.Fail, $"{description}: {N(m, format)}{u} exceeds the limit {N(limit, format)}{u}");
        }
        if (warn is { } wl && m > wl)
        {
            return new QcRuleResult(rule, description, m, limitText, warnText, unit, QcOutcome.Warn, $"{description}: {N(m, format)}{u} exceeds the warn limit {N(wl, format)}{u}");
        }
        return new QcRuleResult(rule, description, m, limitText, warnText, unit, QcOutcome.Pass, $"{description}: {N(m, format)}{u} within {N(warn ?? limit, format)}{u}");
    }

    private static QcRuleResult Lower(string rule, string description, double? measured, double limit, double? warn, string unit, QcOutcome missing, string format)
    {
        string limitText = "≥ " + N(limit, format);
        string warnText = warn is { } w ? "≥ " + N(w, format) : "";
        if (measured is not { } m || !double.IsFinite(m))
        {
            return Missing(rule, description, limitText, warnText, unit, missing);
        }
        string u = unit.Length > 0 ? " " + unit : "";
        if (m < limit)
        {
            return new QcRuleResult(rule, description, m, limitText, warnText, unit, QcOutcome.Fail, $"{description}: {N(m, format)}{u} is below the limit {N(limit, format)}{u}");
        }
        if (warn is { } wl && m < wl)
        {
            return new QcRuleResult(rule, description, m, limitText, warnText, unit, QcOutcome.Warn, $"{description}: {N(m, format)}{u} is below the warn limit {N(wl, format)}{u}");
        }
        return new QcRuleResult(rule, description, m, limitText, warnText, unit, QcOutcome.Pass, $"{description}: {N(m, format)}{u} at or above {N(warn ?? limit, format)}{u}");
    }

    private static QcRuleResult Missing(string rule, string description, string limit, string warnLimit, string unit, QcOutcome outcome) =>
        new(rule, description, null, limit, warnLimit, unit, outcome, $"{description}: not measured, so the rule could not be checked");

    private static string Window(double? min, double? max) =>
        F("{0} … {1}", min is { } a ? a.ToString("0.##e+0", CultureInfo.InvariantCulture) : "−∞", max is { } b ? b.ToString("0.##e+0", CultureInfo.InvariantCulture) : "∞");

    private static string N(double value, string format) => value.ToString(format, CultureInfo.InvariantCulture);

    private static string F(string format, params object[] args) => string.Format(CultureInfo.InvariantCulture, format, args);
}
