using System.Diagnostics;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Scale;
using RunWatch.Imaging.Segmentation;

namespace RunWatch.Imaging.Analysis;

/// <summary>
/// Finds, measures and classifies every wire in one top-down SEM field and computes capture zones: decode →
/// scale → excluded band → background flattening → denoising → threshold → 8-connected labelling → watershed
/// split → measurement → classification → statistics and zones. See docs/imaging.md. Thread-safe; each call
/// works on its own buffers.
/// </summary>
public static partial class FieldAnalyzer
{
    /// <summary>Decodes and analyses the image at <paramref name="path"/>, reading its sidecar if there is one.</summary>
    /// <exception cref="ImageDecodeException">The image cannot be decoded.</exception>
    /// <exception cref="FieldSidecarException">The sidecar exists but is invalid.</exception>
    public static FieldAnalysis Analyze(string path, FieldAnalysisOptions? options = null) => AnalyzeWithRaster(path, options).Analysis;

    /// <summary>As <see cref="Analyze(string, FieldAnalysisOptions?)"/>, also returning the rasters for an overlay.</summary>
    public static (FieldAnalysis Analysis, FieldRaster Raster) AnalyzeWithRaster(string path, FieldAnalysisOptions? options = null) =>
        AnalyzeWithRaster(path, options, CancellationToken.None);

    /// <summary>
    /// As <see cref="AnalyzeWithRaster(string, FieldAnalysisOptions?)"/>, stopping with <see cref="OperationCanceledException"/>
    /// soon after <paramref name="cancellationToken"/> is cancelled: it is checked between stages and every few
    /// wires, rows or points inside them, so a time budget really ends the work.
    /// </summary>
    public static (FieldAnalysis Analysis, FieldRaster Raster) AnalyzeWithRaster(string path, FieldAnalysisOptions? options, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(path);
        options ??= new FieldAnalysisOptions();
        options.Validate();
        var clock = Stopwatch.StartNew();
        GrayImage image = GrayImageDecoder.Decode(path, options.Limits);
        double decodeMs = clock.Elapsed.TotalMilliseconds;
        FieldSidecar? sidecar = FieldSidecar.TryLoadFor(path);
        cancellationToken.ThrowIfCancellationRequested();
        return Run(image, Path.GetFileName(path), sidecar, options, decodeMs, cancellationToken);
    }

    /// <summary>Analyses an image already in memory.</summary>
    public static (FieldAnalysis Analysis, FieldRaster Raster) AnalyzeWithRaster(GrayImage image, string name, FieldSidecar? sidecar, FieldAnalysisOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(image);
        options ??= new FieldAnalysisOptions();
        options.Validate();
        return Run(image, name, sidecar, options, 0, CancellationToken.None);
    }

    /// <summary>
    /// A strip at the top is cut off and the rest analysed as its own image; positions are then shifted back and the
    /// label rasters padded, so callers see the whole field's coordinates.
    /// </summary>
    private static (FieldAnalysis, FieldRaster) Run(GrayImage image, string name, FieldSidecar? sidecar, FieldAnalysisOptions options, double decodeMs,
        CancellationToken cancellationToken)
    {
        int w = image.Width, h = image.Height;
        bool detect = options.DetectInfoStrip && sidecar?.ExcludedBottomRows is null && options.ExcludedBottomRows is null;
        int top = detect ? InfoStripDetector.DetectTopRows(image.Pixels, w, h) : 0;
        if (top == 0 || top >= h - 8)
        {
            return RunRows(image, name, sidecar, options, decodeMs, cancellationToken);
        }
        var below = new GrayImage(w, h - top, image.Pixels[(top * w)..])
        {
            SourceBitsPerPixel = image.SourceBitsPerPixel,
            SourceFormat = image.SourceFormat,
            Resolution = image.Resolution,
        };
        (FieldAnalysis a, FieldRaster r) = RunRows(below, name, sidecar, options, decodeMs, cancellationToken);
        double lengthScale = a.Scale.HasScale ? a.Scale.PixelSizeNm!.Value : 1;
        double cosTilt = sidecar?.TiltDeg is { } t && Math.Abs(t) > 1 ? Math.Cos(t * Math.PI / 180) : 1;
        double shift = top / cosTilt * lengthScale;
        var wires = a.Wires.Select(wire => wire with { CentroidY = wire.CentroidY + shift }).ToArray();
        var labels = new int[w * h];
        Array.Copy(r.Labels, 0, labels, top * w, r.Labels.Length);
        int[]? zones = null;
        if (r.ZoneMap is not null)
        {
            zones = new int[w * h];
            Array.Copy(r.ZoneMap, 0, zones, top * w, r.ZoneMap.Length);
        }
        int? bar = ScaleBarDetector.Measure(image.Pixels, w, 0, top);
        var notes = new List<string>(a.Notes);
        ScaleBarCheck.AddNote(notes, bar, a.Scale);
        FieldAnalysis shifted = a with
        {
            Height = h,
            Wires = wires,
            ExcludedTopRows = top,
            ScaleBarPixels = bar,
            ScaleBarLength = bar * lengthScale,
            Notes = notes,
        };
        return (shifted, new FieldRaster(image, labels, zones, r.ValidHeight + top));
    }

    private static (FieldAnalysis, FieldRaster) RunRows(GrayImage image, string name, FieldSidecar? sidecar, FieldAnalysisOptions options, double decodeMs,
        CancellationToken cancellationToken)
    {
        var timings = new List<StageTiming>();
        if (decodeMs > 0)
        {
            timings.Add(new StageTiming("decode", decodeMs));
        }
        var notes = new List<string>();
        var clock = Stopwatch.StartNew();
        void Mark(string stage)
        {
            timings.Add(new StageTiming(stage, clock.Elapsed.TotalMilliseconds));
            clock.Restart();
            cancellationToken.ThrowIfCancellationRequested();
        }

        int w = image.Width;
        int h = image.Height;
        FieldScale scale = ScaleResolver.Resolve(sidecar, options.PixelSizeNm, image.Resolution);
        if (scale.Note.Length > 0)
        {
            notes.Add(scale.Note);
        }
        if (sidecar?.TiltDeg is { } tilt && Math.Abs(tilt) > 1)
        {
            notes.Add($"the field was imaged at {tilt:0.#}° tilt: positions, radii, shapes and densities are corrected for the foreshortening (cos θ along y); edge-based zones are counted on the image raster and are not");
        }

        (int bandRows, string bandSource) = ExcludedBand(image, sidecar, options);
        if (bandRows >= h)
        {
            bandRows = 0;
            bandSource = "none";
            notes.Add("the excluded band would cover the whole image; it was ignored");
        }
        int validH = h - bandRows;
        int? scaleBar = bandRows >= 4 ? ScaleBarDetector.Measure(image.Pixels, w, validH, bandRows) : null;
        ScaleBarCheck.AddNote(notes, scaleBar, scale);
        Mark("band");

        // One 16-bit work image serves first as the flattened image, then as the zones' column pass.
        var work = new ushort[w * h];
        ushort[] processed = Preprocess(image, validH, options, out double backgroundRemoved, Mark, work);

        int threshold = options.ManualThreshold ?? OtsuThreshold.Compute(processed);
        string method = options.ManualThreshold is null ? "otsu" : "manual";
        Mark("threshold");

        var labels = new int[w * h];
        int count = ConnectedLabeling.Label(processed, w, validH, threshold, labels, out ComponentBox[] boxes);
        processed = null!;
        Mark("label");

        List<RawWire> raw = SplitAndMeasure(labels, image.Pixels, w, count, boxes, options, cancellationToken);
        Mark("split+measure");

        double cosTilt = sidecar?.TiltDeg is { } t && Math.Abs(t) > 1 ? Math.Cos(t * Math.PI / 180) : 1;
        double[] alignedProfiles = [];
        EdgeProfile[]? edges = options.SubPixelEdges ? RefineEdges(raw, image.Pixels, labels, w, validH, cosTilt, out alignedProfiles, cancellationToken) : null;
        Mark("sub-pixel edges");

        double pixelNm = scale.PixelSizeNm ?? 1;
        double lengthScale = scale.HasScale ? pixelNm : 1;
        double? lengthL = DiffusionLength(options, scale, notes);
        WireMeasurement[] wires = Classify(raw, edges, alignedProfiles, w, validH, lengthScale, cosTilt, options, notes, out double edgeSigma, out double edgeOffset);
        Mark("classify");

        int[]? zoneMap = null;
        long[]? zoneAreas = null;
        if (lengthL is { } l)
        {
            zoneMap = options.KeepZoneMap ? new int[w * h] : null;
            zoneAreas = RasterCaptureZones.Compute(labels, w, h, validH, wires.Length, l / lengthScale, zoneMap, work, cancellationToken);
            Mark("edge zones");
        }

        // Statistics and point patterns work in the sample plane: the analysed rows stretched by 1/cos θ.
        int planeH = (int)Math.Round(validH / cosTilt);
        (wires, FieldStatistics stats) = Summarise(wires, w, planeH, lengthScale, scale.HasScale, lengthL, zoneAreas, notes);
        Mark("statistics");
        (wires, stats) = AddPointPatterns(wires, stats, w, planeH, lengthScale, lengthL, notes, cancellationToken);
        Mark("point patterns");
        if (wires.Length == 0)
        {
            notes.Add("no wires were found");
        }

        var analysis = new FieldAnalysis
        {
            Source = name,
            Width = w,
            Height = h,
            SourceDescription = $"{image.SourceFormat}, {image.SourceBitsPerPixel} bit",
            Scale = scale,
            Threshold = threshold,
            ThresholdMethod = method,
            BackgroundRemoved = backgroundRemoved,
            ExcludedBottomRows = bandRows,
            ExcludedBandSource = bandSource,
            WaferId = sidecar?.WaferId,
            FieldPosition = sidecar?.FieldPosition,
            TiltDeg = sidecar?.TiltDeg,
            ScaleBarPixels = scaleBar,
            ScaleBarLength = scaleBar * (scale.HasScale ? scale.PixelSizeNm!.Value : 1),
            EdgeSigmaPixels = edgeSigma,
            EdgeOffsetPixels = edgeOffset,
            RadiusMethod = options.SubPixelEdges ? $"half-maximum edge along {EdgeRefiner.Rays} rays, blur-corrected (docs/imaging.md)" : "threshold outline area",
            Wires = wires,
            Statistics = stats,
            Notes = notes,
            Timings = timings,
        };
        return (analysis, new FieldRaster(image, labels, zoneMap, validH));
    }

    /// <summary>Flattening and denoising of the rows above the band: the image the threshold is applied to.</summary>
    internal static ushort[] Preprocess(GrayImage image, int validHeight, FieldAnalysisOptions options, out double backgroundRemoved, Action<string>? mark = null, ushort[]? destination = null)
    {
        int w = image.Width;
        int validN = w * validHeight;
        ushort[] processed = destination ?? new ushort[validN];
        backgroundRemoved = 0;
        if (options.BackgroundWindowPixels > 0 && Math.Min(w, validHeight) >= 8)
        {
            backgroundRemoved = BackgroundFlattener.Flatten(image.Pixels, processed, w, validHeight, options.BackgroundWindowPixels);
        }
        else
        {
            Array.Copy(image.Pixels, processed, validN);
        }
        mark?.Invoke("flatten");
        if (options.DenoiseRadius == 1)
        {
            TriangleSmoothing.Apply(processed, w, validHeight);
        }
        else if (options.DenoiseRadius > 1)
        {
            var temp = new ushort[validN];
            BoxBlur.Apply(processed, processed, temp, w, validHeight, options.DenoiseRadius);
            BoxBlur.Apply(processed, processed, temp, w, validHeight, options.DenoiseRadius);
        }
        mark?.Invoke("denoise");
        return processed;
    }

    private static (int Rows, string Source) ExcludedBand(GrayImage image, FieldSidecar? sidecar, FieldAnalysisOptions options)
    {
        if (sidecar?.ExcludedBottomRows is { } fromSidecar)
        {
            return (fromSidecar, "sidecar");
        }
        if (options.ExcludedBottomRows is { } given)
        {
            return (given, "given");
        }
        if (options.DetectInfoStrip)
        {
            int rows = InfoStripDetector.DetectBottomRows(image.Pixels, image.Width, image.Height);
            if (rows > 0)
            {
                return (rows, "detected");
            }
        }
        return (0, "none");
    }

    private static double? DiffusionLength(FieldAnalysisOptions options, FieldScale scale, List<string> notes)
    {
        if (options.DiffusionLengthNm is { } nm)
        {
            if (scale.HasScale)
            {
                return nm;
            }
            if (options.DiffusionLengthPixels is null)
            {
                notes.Add("a diffusion length in nm needs a pixel size; capture zones were skipped");
                return null;
            }
        }
        return options.DiffusionLengthPixels;
    }

    private static List<RawWire> SplitAndMeasure(int[] labels, ushort[] intensity, int width, int count, ComponentBox[] boxes, FieldAnalysisOptions options,
        CancellationToken cancellationToken)
    {
        var perComponent = new List<RawWire>[count + 1];
        var maps = new int[]?[count + 1];
        // Parallel.For checks the token before each component it hands out.
        Parallel.For(1, count + 1, new ParallelOptions { CancellationToken = cancellationToken }, () => new ComponentSplitter(options.HMaximaPixels, options.CompactFactor, options.MaxHolePixels, options.NotchDepthPixels), (c, _, splitter) =>
        {
            var list = new List<RawWire>(1);
            maps[c] = splitter.Process(labels, intensity, width, c, boxes[c], list);
            perComponent[c] = list;
            return splitter;
        }, _ => { });

        // Final ids 1..n in component order, pieces in piece order; pieces below the minimum size get 0.
        var result = new List<RawWire>(count + count / 8);
        var lookup = new int[count + 1];
        var pieceIds = new int[16];
        for (int c = 1; c <= count; c++)
        {
            List<RawWire> pieces = perComponent[c];
            int[]? map = maps[c];
            if (map is null)
            {
                RawWire only = pieces[0];
                if (only.Area >= options.MinWireAreaPixels)
                {
                    result.Add(only with { Label = result.Count + 1 });
                    lookup[c] = result.Count;
                }
                continue;
            }
            // A split component: write −(final id) through its piece map; the global pass flips the sign.
            if (pieceIds.Length < pieces.Count)
            {
                pieceIds = new int[pieces.Count * 2];
            }
            for (int k = 0; k < pieces.Count; k++)
            {
                pieceIds[k] = 0;
                if (pieces[k].Area >= options.MinWireAreaPixels)
                {
                    result.Add(pieces[k] with { Label = result.Count + 1 });
                    pieceIds[k] = result.Count;
                }
            }
            ComponentBox box = boxes[c];
            int pw = box.Width + 2;
            for (int y = box.MinY; y <= box.MaxY; y++)
            {
                for (int x = box.MinX; x <= box.MaxX; x++)
                {
                    int i = y * width + x;
                    if (labels[i] == c)
                    {
                        int k = map[(y - box.MinY + 1) * pw + (x - box.MinX + 1)] - 1;
                        labels[i] = -pieceIds[k];
                    }
                }
            }
        }
        Parallel.For(0, BoxBlur.BandCount(labels.Length / width), band =>
        {
            (int y0, int y1) = BoxBlur.Band(band, labels.Length / width);
            Span<int> rows = labels.AsSpan(y0 * width, (y1 - y0) * width);
            for (int i = 0; i < rows.Length; i++)
            {
                int v = rows[i];
                rows[i] = v < 0 ? -v : lookup[v];
            }
        });
        return result;
    }
}
