using RunWatch.Imaging.Measurement;

namespace RunWatch.Imaging.Analysis;

public static partial class FieldAnalyzer
{
    private static WireMeasurement[] Classify(List<RawWire> raw, int width, int validHeight, double lengthScale, ClassificationOptions rules)
    {
        var candidateAreas = new List<double>(raw.Count);
        var interiorAreas = new List<double>(raw.Count);
        foreach (RawWire r in raw)
        {
            if (TouchesBorder(r, width, validHeight))
            {
                continue;
            }
            interiorAreas.Add(r.Area);
            if (Aspect(r) <= rules.MaxAspectRatio && Solidity(r) >= rules.MinSolidity)
            {
                candidateAreas.Add(r.Area);
            }
        }
        List<double> basis = candidateAreas.Count > 0 ? candidateAreas : interiorAreas;
        double medianArea = double.PositiveInfinity;
        if (basis.Count > 0)
        {
            double[] sorted = basis.ToArray();
            Array.Sort(sorted);
            medianArea = DistributionSummary.Percentile(sorted, 50);
        }

        var wires = new WireMeasurement[raw.Count];
        double areaScale = lengthScale * lengthScale;
        for (int i = 0; i < raw.Count; i++)
        {
            RawWire r = raw[i];
            double aspect = Aspect(r);
            double solidity = Solidity(r);
            double circularity = r.Perimeter > 0 ? 4 * Math.PI * r.Area / (r.Perimeter * r.Perimeter) : 0;
            WireClass cls =
                aspect > rules.MaxAspectRatio ? WireClass.Elongated
                : r.Area > rules.MaxAreaOverMedian * medianArea ? WireClass.Oversized
                : solidity < rules.MinSolidity || circularity < rules.MinCircularity ? WireClass.Irregular
                : WireClass.Vertical;
            wires[i] = new WireMeasurement
            {
                Id = r.Label,
                AreaPixels = r.Area,
                Area = r.Area * areaScale,
                EquivalentRadius = Math.Sqrt(r.Area / Math.PI) * lengthScale,
                CentroidX = r.CentroidX * lengthScale,
                CentroidY = r.CentroidY * lengthScale,
                MinFeret = r.MinFeret * lengthScale,
                MaxFeret = r.MaxFeret * lengthScale,
                Circularity = circularity,
                AspectRatio = aspect,
                Solidity = solidity,
                MeanIntensity = r.MeanIntensity,
                Class = cls,
                TouchesBorder = TouchesBorder(r, width, validHeight),
                Split = r.FromSplit,
            };
        }
        return wires;
    }

    private static bool TouchesBorder(in RawWire r, int width, int validHeight) =>
        r.MinX <= 0 || r.MinY <= 0 || r.MaxX >= width - 1 || r.MaxY >= validHeight - 1;

    private static double Aspect(in RawWire r) => r.MinFeret > 0 ? r.MaxFeret / r.MinFeret : double.PositiveInfinity;

    private static double Solidity(in RawWire r) => r.HullArea > 0 ? Math.Min(1, r.Area / r.HullArea) : 0;

    private static (WireMeasurement[] Wires, FieldStatistics Stats) Summarise(
        WireMeasurement[] wires, int width, int validHeight, double lengthScale, bool hasScale, double? diffusionLength,
        long[]? zoneAreas, List<string> notes)
    {
        int border = 0, vertical = 0, elongated = 0, oversized = 0, irregular = 0;
        var radii = new List<double>(wires.Length);
        foreach (WireMeasurement wire in wires)
        {
            if (wire.TouchesBorder)
            {
                border++;
                continue;
            }
            switch (wire.Class)
            {
                case WireClass.Vertical:
                    vertical++;
                    radii.Add(wire.EquivalentRadius);
                    break;
                case WireClass.Elongated:
                    elongated++;
                    break;
                case WireClass.Oversized:
                    oversized++;
                    break;
                default:
                    irregular++;
                    break;
            }
        }
        int interior = wires.Length - border;
        double areaPx = (double)width * validHeight;
        double? perUm2 = hasScale ? wires.Length / (areaPx * lengthScale * lengthScale * 1e-6) : null;

        DistributionSummary? edgeZones = null;
        if (diffusionLength is { } l && zoneAreas is not null)
        {
            double lPx = l / lengthScale;
            double disc = Math.PI * l * l;
            var normalized = new List<double>(wires.Length);
            for (int i = 0; i < wires.Length; i++)
            {
                WireMeasurement wire = wires[i];
                double area = zoneAreas[wire.Id] * lengthScale * lengthScale;
                bool guarded = GuardedByExtent(wire, lengthScale, lPx, width, validHeight);
                wires[i] = wire with { EdgeZoneArea = area, EdgeZoneNormalized = area / disc, ZoneGuarded = guarded };
                if (!guarded)
                {
                    normalized.Add(area / disc);
                }
            }
            edgeZones = DistributionSummary.Of(normalized.ToArray());
            if (normalized.Count == 0 && wires.Length > 0)
            {
                notes.Add("every wire's capture zone reaches the image edge or the excluded band (L is large for this field): no zone statistics");
            }
        }

        var stats = new FieldStatistics
        {
            ObjectsFound = wires.Length,
            ObjectsTouchingBorder = border,
            InteriorObjects = interior,
            Vertical = vertical,
            Elongated = elongated,
            Oversized = oversized,
            Irregular = irregular,
            VerticalYield = interior > 0 ? (double)vertical / interior : double.NaN,
            AnalysedAreaPixels = areaPx,
            DensityPerPixel2 = wires.Length / areaPx,
            DensityPerUm2 = perUm2,
            DensityPerCm2 = perUm2 * 1e8,
            VerticalDensityPerCm2 = hasScale && interior > 0 ? perUm2 * 1e8 * vertical / interior : null,
            Radius = DistributionSummary.Of(radii.ToArray()),
            DiffusionLength = diffusionLength,
            EdgeZoneNormalized = edgeZones,
        };
        return (wires, stats);
    }

    /// <summary>Guard-zone rule (docs/imaging.md): the wire's extent grown by L must stay inside the analysed area.</summary>
    private static bool GuardedByExtent(WireMeasurement wire, double lengthScale, double lPx, int width, int validHeight)
    {
        double cx = wire.CentroidX / lengthScale;
        double cy = wire.CentroidY / lengthScale;
        double reach = wire.MaxFeret / lengthScale / 2 + lPx;
        return cx - reach < 0 || cy - reach < 0 || cx + reach > width || cy + reach > validHeight;
    }
}
