using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Overlay;
using RunWatch.Imaging.Reporting;
using RunWatch.Imaging.Scale;

namespace RunWatch.Commands;

/// <summary>
/// <c>runwatch analyze IMAGE... [--pixel-size-nm X] [--diffusion-length-um L] [--json] [--csv FILE] [--overlay FILE]</c>:
/// finds and measures every wire in top-down SEM fields. Exit code 0 when every image was analysed, 2 when any
/// image could not be read (the others are still analysed and reported).
/// </summary>
internal static class AnalyzeCommand
{
    public const int BadInputExitCode = 2;

    public static Command Create()
    {
        var images = new Argument<string[]>("image")
        {
            Description = "SEM images (TIFF, PNG, JPEG or BMP) of top-down fields. A sidecar IMAGE.field.json beside an image gives its pixel size, wafer and field position.",
            Arity = ArgumentArity.OneOrMore,
        };
        var pixelSize = new Option<double?>("--pixel-size-nm") { Description = "Pixel size in nm for images without a sidecar (overrides TIFF resolution tags)." };
        var diffusion = new Option<double?>("--diffusion-length-um") { Description = "Diffusion length L in µm: computes capture zones (needs a pixel size)." };
        var json = new Option<bool>("--json") { Description = "Write the results as JSON on standard output instead of the summary." };
        var csv = new Option<string?>("--csv") { Description = "Write every wire of every image to this CSV file." };
        var overlay = new Option<string?>("--overlay") { Description = "Write an overlay PNG (outlines by class, zones, scale bar, legend); with several images the image name is added to the file name." };
        var threshold = new Option<int?>("--threshold") { Description = "Fixed threshold (0..65535) on the flattened 16-bit image instead of Otsu's." };
        var band = new Option<int?>("--exclude-bottom-rows") { Description = "Rows at the bottom to leave out (the instrument's information strip); default: from the sidecar, else detected." };
        var maxPixels = new Option<long?>("--max-megapixels") { Description = "Refuse images larger than this many megapixels (default 100)." };

        var command = new Command("analyze", "Find, measure and classify every wire in top-down SEM images and compute capture zones.");
        command.Arguments.Add(images);
        foreach (Option o in (Option[])[pixelSize, diffusion, json, csv, overlay, threshold, band, maxPixels])
        {
            command.Options.Add(o);
        }
        command.SetAction(parse =>
        {
            double? px = parse.GetValue(pixelSize);
            double? lUm = parse.GetValue(diffusion);
            int? t = parse.GetValue(threshold);
            int? rows = parse.GetValue(band);
            long? mp = parse.GetValue(maxPixels);
            string? problem =
                px is { } p && RunWatch.Imaging.Scale.FieldValueBounds.Check("--pixel-size-nm", p, RunWatch.Imaging.Scale.FieldValueBounds.MinPixelSizeNm, RunWatch.Imaging.Scale.FieldValueBounds.MaxPixelSizeNm, "nm") is { } pixelProblem ? pixelProblem
                : lUm is { } l && RunWatch.Imaging.Scale.FieldValueBounds.Check("--diffusion-length-um", l, RunWatch.Imaging.Scale.FieldValueBounds.MinDiffusionLengthNm / 1000, RunWatch.Imaging.Scale.FieldValueBounds.MaxDiffusionLengthNm / 1000, "µm") is { } lengthProblem ? lengthProblem
                : t is < 0 or > 65535 ? "--threshold must lie in 0..65535"
                : rows is < 0 ? "--exclude-bottom-rows must not be negative"
                : mp is <= 0 ? "--max-megapixels must be positive"
                : null;
            if (problem is not null)
            {
                Console.Error.WriteLine("runwatch analyze: " + problem);
                return BadInputExitCode;
            }
            var options = new FieldAnalysisOptions
            {
                PixelSizeNm = px,
                DiffusionLengthNm = lUm * 1000,
                ManualThreshold = t,
                ExcludedBottomRows = rows,
                KeepZoneMap = parse.GetValue(overlay) is not null && lUm is not null,
                Limits = mp is { } m ? new ImageLimits { MaxPixels = m * 1_000_000 } : ImageLimits.Default,
            };
            return Run(parse.GetValue(images) ?? [], options, parse.GetValue(json), parse.GetValue(csv), parse.GetValue(overlay), Console.Out, Console.Error);
        });
        return command;
    }

    internal static int Run(string[] images, FieldAnalysisOptions options, bool json, string? csvPath, string? overlayPath, TextWriter stdout, TextWriter stderr)
    {
        var results = new List<FieldAnalysis>();
        var failures = new List<(string Image, string Reason)>();
        StreamWriter? csv = null;
        try
        {
            if (csvPath is not null)
            {
                csv = new StreamWriter(csvPath, append: false);
                csv.WriteLine(FieldAnalysisCsv.Header);
            }
            for (int k = 0; k < images.Length; k++)
            {
                string image = images[k];
                if (images.Length > 1)
                {
                    stderr.WriteLine($"[{k + 1}/{images.Length}] {Path.GetFileName(image)}");
                }
                try
                {
                    (FieldAnalysis analysis, FieldRaster raster) = FieldAnalyzer.AnalyzeWithRaster(image, options);
                    results.Add(analysis);
                    if (csv is not null)
                    {
                        FieldAnalysisCsv.WriteRows(csv, analysis);
                    }
                    if (overlayPath is not null)
                    {
                        OverlayRenderer.Write(analysis, raster, OverlayPathFor(overlayPath, image, images.Length));
                    }
                    if (!json)
                    {
                        stdout.Write(FieldAnalysisText.Summary(analysis));
                        stdout.WriteLine();
                    }
                }
                catch (Exception ex) when (ex is ImageDecodeException or FieldSidecarException or IOException or UnauthorizedAccessException)
                {
                    failures.Add((image, ex.Message));
                    stderr.WriteLine("runwatch analyze: " + ex.Message);
                }
            }
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            stderr.WriteLine("runwatch analyze: cannot write output: " + ex.Message);
            return BadInputExitCode;
        }
        finally
        {
            csv?.Dispose();
        }
        if (json)
        {
            var document = new
            {
                format = FieldAnalysisJson.Format,
                fields = results,
                failures = failures.Select(f => new { image = f.Image, reason = f.Reason }).ToArray(),
            };
            stdout.WriteLine(JsonSerializer.Serialize(document, FieldAnalysisJson.Options));
        }
        if (images.Length > 1)
        {
            stderr.WriteLine(string.Create(CultureInfo.InvariantCulture, $"analysed {results.Count} of {images.Length} images; {failures.Count} could not be read"));
        }
        return failures.Count == 0 ? 0 : BadInputExitCode;
    }

    private static string OverlayPathFor(string overlay, string image, int count)
    {
        if (count == 1)
        {
            return overlay;
        }
        string folder = Path.GetDirectoryName(overlay) ?? "";
        return Path.Combine(folder, $"{Path.GetFileNameWithoutExtension(overlay)}-{Path.GetFileNameWithoutExtension(image)}{Path.GetExtension(overlay)}");
    }
}
