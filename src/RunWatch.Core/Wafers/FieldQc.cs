using RunWatch.Core.Qc;

namespace RunWatch.Core.Wafers;

/// <summary>
/// The verdict of one SEM field: the wafer's specification restricted to the rules a single field can be held to
/// (mean radius, radius CV, density, vertical yield). Wire count, prediction bias and the thermal rules belong to
/// the wafer and the run, so a field is not judged on them.
/// </summary>
public static class FieldQc
{
    /// <summary>Judges a field's figures with the field rules of <paramref name="spec"/>.</summary>
    public static QcVerdict Evaluate(FieldFigures figures, string fieldName, string recipe, QcSpecification spec)
    {
        ArgumentNullException.ThrowIfNull(figures);
        ArgumentNullException.ThrowIfNull(spec);
        var fieldSpec = new QcSpecification
        {
            TargetMeanRadiusNm = spec.TargetMeanRadiusNm,
            MeanRadiusToleranceNm = spec.MeanRadiusToleranceNm,
            MeanRadiusWarnToleranceNm = spec.MeanRadiusWarnToleranceNm,
            MaxRadiusCv = spec.MaxRadiusCv,
            WarnRadiusCv = spec.WarnRadiusCv,
            MinDensityPerCm2 = spec.MinDensityPerCm2,
            MaxDensityPerCm2 = spec.MaxDensityPerCm2,
            WarnMinDensityPerCm2 = spec.WarnMinDensityPerCm2,
            WarnMaxDensityPerCm2 = spec.WarnMaxDensityPerCm2,
            MinVerticalYield = spec.MinVerticalYield,
            WarnVerticalYield = spec.WarnVerticalYield,
            MissingValueOutcome = spec.MissingValueOutcome,
        };
        var input = new WaferQcInput(fieldName, recipe, figures.CountedWires, Finite(figures.MeanRadiusNm), Finite(figures.RadiusCv),
            Finite(figures.DensityPerCm2), Finite(figures.VerticalYield), null, null, null, null);
        return QcEvaluator.Evaluate(input, fieldSpec);
    }

    private static double? Finite(double value) => double.IsFinite(value) ? value : null;
}
