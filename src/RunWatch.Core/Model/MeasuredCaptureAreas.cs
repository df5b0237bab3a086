using RunWatch.Core.Geometry;

namespace RunWatch.Core.Model;

/// <summary>
/// Builds a <see cref="CaptureAreaEvaluator"/> over a wafer's measured fields with the geometry room's capture
/// zones: the wires of field 0 first, then field 1, and so on, each in its given order. Guarded wires get NaN.
/// </summary>
public static class MeasuredCaptureAreas
{
    /// <summary>The evaluator; its span must hold one slot per wire over all fields.</summary>
    public static CaptureAreaEvaluator ForFields(IReadOnlyList<MeasuredField> fields, GuardRule guardRule = GuardRule.DiscCrossesEdge)
    {
        ArgumentNullException.ThrowIfNull(fields);
        int total = 0;
        foreach (MeasuredField f in fields)
        {
            total += f.WirePositionsNm.Length;
        }
        int wireCount = total;
        return (l, areas) =>
        {
            if (areas.Length != wireCount)
            {
                throw new ArgumentException($"The fields hold {wireCount} wires but {areas.Length} slots were given.", nameof(areas));
            }
            var options = new CaptureZoneOptions { DiffusionLength = l, GuardRule = guardRule, MaxDegreeOfParallelism = 1 };
            int offset = 0;
            foreach (MeasuredField f in fields)
            {
                CaptureZoneResult zones = CaptureZones.Compute(f.WirePositionsNm, f.Field, options);
                ReadOnlySpan<double> zoneAreas = zones.Areas;
                ReadOnlySpan<bool> guarded = zones.Guarded;
                double disc = Math.PI * l * l;
                for (int i = 0; i < zoneAreas.Length; i++)
                {
                    areas[offset + i] = guarded[i] ? double.NaN : zoneAreas[i] / disc;
                }
                offset += zoneAreas.Length;
            }
        };
    }
}
