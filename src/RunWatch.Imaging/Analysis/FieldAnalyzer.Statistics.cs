using RunWatch.Core.Profiles;
using RunWatch.Imaging.Measurement;

namespace RunWatch.Imaging.Analysis;

public static partial class FieldAnalyzer
{
    private static WireMeasurement[] Classify(List<RawWire> raw, EdgeProfile[]? edges, double[] alignedProfiles, int width, int validHeight, double lengthScale, double cosTilt,
        FieldAnalysisOptions options, List<string> notes, out double edgeSigma, out double edgeOffset)
    {
        var profileSet = new List<int>(raw.Count);
        ClassificationOptions rules = options.Classification;
        var candidateAreas = new List<double>(raw.Count);
        var interiorAreas = new List<double>(raw.Count);
        var contrasts = new List<double>(raw.Count);
        var roundContrasts = new List<double>();
        var sigmas = new List<double>(raw.Count);
        for (int i = 0; i < raw.Count; i++)
        {
            RawWire r = raw[i];
            if (TouchesBorder(r, width, validHeight))
            {
                continue;
            }
            interiorAreas.Add(r.Area);
            if (Aspect(r) <= rules.MaxAspectRatio && Solidity(r) >= rules.MinSolidity)
            {
                candidateAreas.Add(r.Area);
                if (edges is not null && edges[i].ValidRays >= EdgeRefiner.MostRays && edges[i].Irregularity <= rules.MaxIrregularity)
                {
                    EdgeProfile e = edges[i];
                    (e.SixFold >= rules.MaxDropletSixFold ? contrasts : roundContrasts).Add(e.Top - e.Substrate);
                    if (e.SixFold >= rules.MaxDropletSixFold)
                    {
                        profileSet.Add(i);
                    }
                    if (e.EdgeSigma is > 0 and < 4)
                    {
                        sigmas.Add(e.EdgeSigma);
                    }
                }
            }
        }
        List<double> basis = candidateAreas.Count > 0 ? candidateAreas : interiorAreas;
        double medianArea = basis.Count > 0 ? Median(basis) : double.PositiveInfinity;
        // The reference top contrast is the hexagonal tops', taken per tile so that charging drift and gradients cancel.
        // Without ten of them no object is taken for a bare droplet.
        bool reference = contrasts.Count >= 10;
        double medianContrast = reference ? Median(contrasts) : roundContrasts.Count + contrasts.Count > 0 ? Median([.. contrasts, .. roundContrasts]) : double.NaN;
        ContrastTiles tiles = reference && edges is not null ? ContrastTiles.Build(raw, edges, profileSet, width, validHeight, medianContrast) : ContrastTiles.Flat(medianContrast);
        // Noise roughens every outline by about the same number of pixels, so the irregularity allowed grows as 1/r.
        double noiseIrregularity = edges is null ? 0 : IrregularityScale(raw, edges, profileSet);
        // The field's edge model (rim and blur) from the hexagonal tops; the flank width is the fallback for σ.
        BlurredEdge? model = edges is null ? null : FitFieldEdge(alignedProfiles, profileSet);
        edgeSigma = model?.Sigma ?? (sigmas.Count >= 5 ? Median(sigmas) : double.NaN);
        edgeOffset = model?.Offset ?? 0;
        if (edges is not null && double.IsNaN(edgeSigma))
        {
            notes.Add("too few clean wire edges to measure the edge blur; radii at the sub-pixel edge are not corrected for it");
        }
        double blurArea = double.IsNaN(edgeSigma) ? 0 : Math.PI * edgeSigma * edgeSigma;
        double? sinTheta = options.DropletContactAngleDeg is { } theta ? Math.Sin(theta * Math.PI / 180) : null;

        // Bare droplets have their own edge (the secant-law brightening of a sphere's slope): their own edge model.
        var dropletSet = new List<int>();
        if (edges is not null && reference)
        {
            for (int i = 0; i < raw.Count; i++)
            {
                EdgeProfile e = edges[i];
                if (e.ValidRays >= EdgeRefiner.MostRays && e.SixFold < rules.MaxDropletSixFold && e.Irregularity <= rules.MaxIrregularity
                    && (e.Top - e.Substrate) / tiles.At(raw[i].CentroidX, raw[i].CentroidY) > rules.MaxRelativeContrast)
                {
                    dropletSet.Add(i);
                }
            }
        }
        BlurredEdge? dropletModel = dropletSet.Count >= 5 ? FitFieldEdge(alignedProfiles, dropletSet) : null;
        double dropletOffset = dropletModel?.Offset ?? edgeOffset;

        var wires = new WireMeasurement[raw.Count];
        double areaScale = lengthScale * lengthScale;
        int dropletOnlyCount = 0;
        for (int i = 0; i < raw.Count; i++)
        {
            RawWire r = raw[i];
            EdgeProfile e = edges is null ? default : edges[i];
            bool hasEdge = e.ValidRays >= EdgeRefiner.Rays / 4 && e.HalfLevelArea > 0;
            double relative = hasEdge ? (e.Top - e.Substrate) / tiles.At(r.CentroidX, r.CentroidY) : double.NaN;
            double irregularLimit = hasEdge ? Math.Max(rules.MaxIrregularity, 2.5 * noiseIrregularity / Math.Sqrt(e.HalfLevelArea / Math.PI)) : rules.MaxIrregularity;
            // A split piece's Feret box includes its cut; the located edge rays do not (the cut's rays are blocked).
            double aspect = (r.FromSplit || cosTilt < 0.9999) && double.IsFinite(e.RayAspect) ? e.RayAspect : Aspect(r);
            double solidity = Solidity(r);
            double circularity = r.Perimeter > 0 ? 4 * Math.PI * r.Area / (r.Perimeter * r.Perimeter) : 0;
            bool round = hasEdge && e.SixFold < rules.MaxDropletSixFold && e.Irregularity <= irregularLimit;
            bool dropletOnly = round && reference && relative > rules.MaxRelativeContrast;
            // A droplet on the top brightens it (a bright core): the upper contrast limit does not apply then.
            bool unlikeWire = hasEdge && !dropletOnly
                && (e.Irregularity > irregularLimit || relative < rules.MinRelativeContrast || (relative > rules.MaxRelativeContrast && e.CoreRadius <= 0 && e.SixFold < rules.MaxDropletSixFold));
            WireClass cls =
                aspect > rules.MaxAspectRatio ? WireClass.Elongated
                : dropletOnly ? WireClass.Vertical
                : r.Area > rules.MaxAreaOverMedian * medianArea ? WireClass.Oversized
                : solidity < rules.MinSolidity || circularity < rules.MinCircularity || unlikeWire ? WireClass.Irregular
                : WireClass.Vertical;

            double thresholdRadius = Math.Sqrt(r.Area / cosTilt / Math.PI);
            double radius = thresholdRadius;
            string method = "threshold";
            double? droplet = null;
            if (hasEdge)
            {
                double crossingRadius = Math.Sqrt(e.HalfLevelArea / Math.PI);
                double edgeRadius = Math.Sqrt(Math.Pow(crossingRadius + edgeOffset, 2) + (blurArea / Math.PI));
                if (dropletOnly)
                {
                    droplet = Math.Sqrt(Math.Pow(crossingRadius + dropletOffset, 2) + (blurArea / Math.PI));
                    radius = sinTheta is { } sin ? droplet.Value * sin : double.NaN;
                    method = "droplet";
                    dropletOnlyCount += cls == WireClass.Vertical ? 1 : 0;
                }
                else
                {
                    radius = edgeRadius;
                    method = "edge";
                    // The core's half-level circle shrinks by σ²/(2r) under the blur, as any curved edge does (DERIVED).
                    droplet = e.CoreRadius > 0 ? e.CoreRadius + (blurArea / Math.PI / (2 * e.CoreRadius)) : null;
                }
            }
            wires[i] = new WireMeasurement
            {
                Id = r.Label,
                AreaPixels = r.Area,
                Area = Math.PI * radius * radius * areaScale,
                EquivalentRadius = radius * lengthScale,
                ThresholdRadius = thresholdRadius * lengthScale,
                RadiusMethod = method,
                DropletRadius = droplet * lengthScale,
                Irregularity = e.Irregularity,
                RelativeContrast = relative,
                CentroidX = r.CentroidX * lengthScale,
                CentroidY = r.CentroidY / cosTilt * lengthScale,
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
        if (dropletOnlyCount > 0 && sinTheta is null)
        {
            notes.Add($"{dropletOnlyCount} wires show only their droplet; set the process's droplet contact angle to turn droplet radii into wire radii (they are left out of the radius statistics)");
        }
        return wires;
    }

    /// <summary>Median of irregularity × edge radius over the wire candidates: the part of irregularity that noise explains, in px.</summary>
    private static double IrregularityScale(List<RawWire> raw, EdgeProfile[] edges, List<int> candidates)
    {
        var scaled = new List<double>(candidates.Count);
        foreach (int i in candidates)
        {
            if (double.IsFinite(edges[i].Irregularity))
            {
                scaled.Add(edges[i].Irregularity * Math.Sqrt(edges[i].HalfLevelArea / Math.PI));
            }
        }
        return scaled.Count >= 5 ? Median(scaled) : 0;
    }

    private static double Median(List<double> values)
    {
        double[] sorted = values.ToArray();
        Array.Sort(sorted);
        return DistributionSummary.Percentile(sorted, 50);
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
                    if (double.IsFinite(wire.EquivalentRadius))
                    {
                        radii.Add(wire.EquivalentRadius);
                    }
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
