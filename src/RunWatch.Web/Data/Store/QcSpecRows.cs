using System.Globalization;
using RunWatch.Core.Qc;

namespace RunWatch.Web.Data.Store;

/// <summary>
/// Shows a <see cref="QcSpecification"/> as one editable row per QC rule (fail window and warn window) and applies an
/// edited row back, refusing what does not fit the rule: a side the rule does not have, a unit other than the
/// rule's, numbers that are not finite, a lower limit not below the upper, counts that are not whole.
/// </summary>
internal static class QcSpecRows
{
    public const string WireCount = "wire count";
    public const string MeanRadius = "mean radius";
    public const string RadiusCv = "radius CV";
    public const string Density = "density";
    public const string VerticalYield = "vertical yield";
    public const string PredictionBias = "|prediction bias|";
    public const string ExcursionCount = "excursions in growth window";
    public const string ExcursionEffect = "largest excursion |ΔL/L|";
    public const string ThermalCoverage = "thermal coverage";

    public static IReadOnlyList<SpecEntry> From(string recipe, QcSpecification s)
    {
        double? target = s.TargetMeanRadiusNm;
        return
        [
            new(WireCount, s.MinWireCount, null, "wires", null, null, recipe, SpecSides.Lower, HasWarn: false),
            new(MeanRadius, target - s.MeanRadiusToleranceNm, target + s.MeanRadiusToleranceNm, "nm",
                target - s.MeanRadiusWarnToleranceNm, target + s.MeanRadiusWarnToleranceNm, recipe, SpecSides.Both),
            new(RadiusCv, null, s.MaxRadiusCv, "fraction", null, s.WarnRadiusCv, recipe, SpecSides.Upper),
            new(Density, s.MinDensityPerCm2, s.MaxDensityPerCm2, "cm⁻²", s.WarnMinDensityPerCm2, s.WarnMaxDensityPerCm2, recipe, SpecSides.Both),
            new(VerticalYield, s.MinVerticalYield, null, "fraction", s.WarnVerticalYield, null, recipe, SpecSides.Lower),
            new(PredictionBias, null, s.MaxAbsBiasNm, "nm", null, s.WarnAbsBiasNm, recipe, SpecSides.Upper),
            new(ExcursionCount, null, s.MaxExcursionCount, "count", null, s.WarnExcursionCount, recipe, SpecSides.Upper),
            new(ExcursionEffect, null, s.MaxAbsRelativeLChange, "fraction", null, s.WarnAbsRelativeLChange, recipe, SpecSides.Upper),
            new(ThermalCoverage, s.MinThermalCoverage, null, "fraction", s.WarnThermalCoverage, null, recipe, SpecSides.Lower),
        ];
    }

    /// <summary>A copy of <paramref name="current"/> with the edited row applied.</summary>
    /// <exception cref="KeyNotFoundException">No rule of that name.</exception>
    /// <exception cref="ArgumentException">The edit does not fit the rule; the message says why.</exception>
    public static QcSpecification Apply(QcSpecification current, SpecEntry edit)
    {
        SpecEntry row = From(edit.Recipe, current).FirstOrDefault(r => r.Name == edit.Name)
            ?? throw new KeyNotFoundException($"No spec '{edit.Name}'.");
        if (edit.Unit.Length > 0 && edit.Unit != row.Unit)
        {
            throw new ArgumentException($"Not saved: {row.Name} is set in {row.Unit}, not {edit.Unit}.");
        }
        foreach (double? v in new[] { edit.Min, edit.Max, edit.WarnMin, edit.WarnMax })
        {
            if (v is { } x && !double.IsFinite(x))
            {
                throw new ArgumentException($"Not saved: {row.Name} limits must be finite numbers.");
            }
        }
        if (!row.HasWarn && (edit.WarnMin is not null || edit.WarnMax is not null))
        {
            throw new ArgumentException($"Not saved: {row.Name} has no warn limit; leave the warn boxes empty.");
        }
        if (row.Sides == SpecSides.Lower && (edit.Max is not null || edit.WarnMax is not null))
        {
            throw new ArgumentException($"Not saved: {row.Name} has a lower limit only; leave the maximum empty.");
        }
        if (row.Sides == SpecSides.Upper && (edit.Min is not null || edit.WarnMin is not null))
        {
            throw new ArgumentException($"Not saved: {row.Name} has an upper limit only; leave the minimum empty.");
        }
        if (edit.Min is { } lo && edit.Max is { } hi && !(lo < hi))
        {
            throw new ArgumentException($"Not saved: the lower limit of {row.Name} ({lo.ToString(CultureInfo.InvariantCulture)}) must be below the upper ({hi.ToString(CultureInfo.InvariantCulture)}).");
        }
        if (edit.WarnMin is { } wlo && edit.WarnMax is { } whi && !(wlo < whi))
        {
            throw new ArgumentException($"Not saved: the lower warn limit of {row.Name} must be below the upper warn limit.");
        }
        QcSpecification s = Copy(current);
        switch (row.Name)
        {
            case WireCount:
                s.MinWireCount = Whole(edit.Min, row.Name);
                break;
            case MeanRadius:
                ApplyMeanRadius(s, edit);
                break;
            case RadiusCv:
                (s.MaxRadiusCv, s.WarnRadiusCv) = (edit.Max, edit.WarnMax);
                break;
            case Density:
                (s.MinDensityPerCm2, s.MaxDensityPerCm2, s.WarnMinDensityPerCm2, s.WarnMaxDensityPerCm2) = (edit.Min, edit.Max, edit.WarnMin, edit.WarnMax);
                break;
            case VerticalYield:
                (s.MinVerticalYield, s.WarnVerticalYield) = (edit.Min, edit.WarnMin);
                break;
            case PredictionBias:
                (s.MaxAbsBiasNm, s.WarnAbsBiasNm) = (edit.Max, edit.WarnMax);
                break;
            case ExcursionCount:
                (s.MaxExcursionCount, s.WarnExcursionCount) = (Whole(edit.Max, row.Name), Whole(edit.WarnMax, row.Name));
                break;
            case ExcursionEffect:
                (s.MaxAbsRelativeLChange, s.WarnAbsRelativeLChange) = (edit.Max, edit.WarnMax);
                break;
            default:
                (s.MinThermalCoverage, s.WarnThermalCoverage) = (edit.Min, edit.WarnMin);
                break;
        }
        return s;
    }

    /// <summary>"name: old → new unit" for the audit log.</summary>
    public static string Describe(SpecEntry before, SpecEntry after) =>
        $"{Subject(before)} {before.Name}: {Window(before)} → {Window(after)} {before.Unit}";

    private static string Subject(SpecEntry e) => e.Recipe.Length == 0 ? "default spec," : "recipe " + e.Recipe + ",";

    private static string Window(SpecEntry e)
    {
        string fail = $"{N(e.Min)}…{N(e.Max)}";
        return e.WarnMin is null && e.WarnMax is null ? fail : $"{fail} (warn {N(e.WarnMin)}…{N(e.WarnMax)})";
    }

    private static string N(double? v) => v is { } x ? x.ToString("G6", CultureInfo.InvariantCulture) : "—";

    private static void ApplyMeanRadius(QcSpecification s, SpecEntry edit)
    {
        // The rule is |mean − target| ≤ tolerance: the window is stored as its centre and half-width.
        if ((edit.Min is null) != (edit.Max is null) || (edit.WarnMin is null) != (edit.WarnMax is null))
        {
            throw new ArgumentException("Not saved: mean radius needs both limits of a window (or neither).");
        }
        if (edit.Min is not { } lo || edit.Max is not { } hi)
        {
            if (edit.WarnMin is not null)
            {
                throw new ArgumentException("Not saved: a mean-radius warn window needs the fail window.");
            }
            (s.TargetMeanRadiusNm, s.MeanRadiusToleranceNm, s.MeanRadiusWarnToleranceNm) = (null, null, null);
            return;
        }
        double target = (lo + hi) / 2;
        s.TargetMeanRadiusNm = target;
        s.MeanRadiusToleranceNm = (hi - lo) / 2;
        s.MeanRadiusWarnToleranceNm = null;
        if (edit.WarnMin is { } wlo && edit.WarnMax is { } whi)
        {
            if (Math.Abs(((wlo + whi) / 2) - target) > 1e-9 * Math.Max(1, Math.Abs(target)))
            {
                throw new ArgumentException($"Not saved: the mean-radius warn window must be centred on the same target ({target.ToString("G6", CultureInfo.InvariantCulture)} nm) as the fail window.");
            }
            s.MeanRadiusWarnToleranceNm = (whi - wlo) / 2;
        }
    }

    private static int? Whole(double? value, string name)
    {
        if (value is not { } v)
        {
            return null;
        }
        if (v != Math.Floor(v) || v < 0 || v > int.MaxValue)
        {
            throw new ArgumentException($"Not saved: {name} is a whole number ≥ 0 (got {v.ToString(CultureInfo.InvariantCulture)}).");
        }
        return (int)v;
    }

    private static QcSpecification Copy(QcSpecification s) => new()
    {
        TargetMeanRadiusNm = s.TargetMeanRadiusNm,
        MeanRadiusToleranceNm = s.MeanRadiusToleranceNm,
        MeanRadiusWarnToleranceNm = s.MeanRadiusWarnToleranceNm,
        MaxRadiusCv = s.MaxRadiusCv,
        WarnRadiusCv = s.WarnRadiusCv,
        MinDensityPerCm2 = s.MinDensityPerCm2,
        MaxDensityPerCm2 = s.MaxDensityPerCm2,
        WarnMinDensityPerCm2 = s.WarnMinDensityPerCm2,
        WarnMaxDensityPerCm2 = s.WarnMaxDensityPerCm2,
        MinVerticalYield = s.MinVerticalYield,
        WarnVerticalYield = s.WarnVerticalYield,
        MaxAbsBiasNm = s.MaxAbsBiasNm,
        WarnAbsBiasNm = s.WarnAbsBiasNm,
        MaxExcursionCount = s.MaxExcursionCount,
        WarnExcursionCount = s.WarnExcursionCount,
        MaxAbsRelativeLChange = s.MaxAbsRelativeLChange,
        WarnAbsRelativeLChange = s.WarnAbsRelativeLChange,
        MinThermalCoverage = s.MinThermalCoverage,
        WarnThermalCoverage = s.WarnThermalCoverage,
        MinWireCount = s.MinWireCount,
        DropletContactAngleDeg = s.DropletContactAngleDeg,
        MissingValueOutcome = s.MissingValueOutcome,
    };
}
