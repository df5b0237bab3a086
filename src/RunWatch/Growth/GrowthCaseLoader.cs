using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Scale;
using RunWatch.Thermal;

namespace RunWatch.Growth;

/// <summary>Reads a case's thermal log and analyses its image into a <see cref="LoadedWafer"/>.</summary>
internal static class GrowthCaseLoader
{
    public static LoadedWafer Load(GrowthCase c, string caseFile, int index)
    {
        string at = $"wafers[{index}]";
        ThermalCsv csv;
        try
        {
            using var reader = new StreamReader(c.ThermalLogPath);
            csv = ThermalCsvReader.Read(reader);
        }
        catch (ThermalCsvException ex)
        {
            throw new GrowthCaseException(caseFile, at + ".thermalLog", $"({c.ThermalLogPath}) {ex.Message}");
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw new GrowthCaseException(caseFile, at + ".thermalLog", $"({c.ThermalLogPath}) cannot be read: {ex.Message}");
        }
        if (!csv.HasChannel(c.Channel))
        {
            throw new GrowthCaseException(caseFile, at + ".channel", $"'{c.Channel}' is not a column of {c.ThermalLogPath} (it has: {string.Join(", ", csv.Channels)})");
        }
        ThermalRecord record = csv.Record(c.Channel);
        double from = c.GrowthFrom.ToLogSeconds(csv.Origin, caseFile, at + ".growthFrom");
        double to = c.GrowthTo.ToLogSeconds(csv.Origin, caseFile, at + ".growthTo");
        if (!(to > from))
        {
            throw new GrowthCaseException(caseFile, at + ".growthTo", "must be later than growthFrom");
        }
        var window = new GrowthWindow(from, to);
        ThermalExposure exposure = ThermalExposure.FromRecord(record, TemperatureCalibration.Identity, window);
        if (exposure.CoveredS < 0.5 * window.DurationS)
        {
            throw new GrowthCaseException(caseFile, at + ".growthFrom", $"and growthTo: the log covers only {exposure.CoveredS:F0} s of the {window.DurationS:F0} s window");
        }

        FieldAnalysis analysis;
        try
        {
            analysis = FieldAnalyzer.Analyze(c.ImagePath, new FieldAnalysisOptions { PixelSizeNm = c.PixelSizeNm });
        }
        catch (Exception ex) when (ex is ImageDecodeException or FieldSidecarException or IOException or UnauthorizedAccessException)
        {
            throw new GrowthCaseException(caseFile, at + ".image", $"({c.ImagePath}) cannot be analysed: {ex.Message}");
        }
        double px = analysis.Scale.PixelSizeNm ?? c.PixelSizeNm;
        double widthUm = analysis.Width * px / 1000, heightUm = (analysis.Height - analysis.ExcludedBottomRows) * px / 1000;
        var field = CaptureField.Rectangle(widthUm, heightUm);
        var centres = new List<Point2D>();
        var pxX = new List<double>();
        var pxY = new List<double>();
        var footprints = new List<double>();
        var measured = new List<double>();
        foreach (WireMeasurement w in analysis.Wires)
        {
            // Centroids and radii come in nm when the image has a scale.
            double x = w.CentroidX / 1000, y = w.CentroidY / 1000;
            if (x < 0 || y < 0 || x > widthUm || y > heightUm)
            {
                continue;
            }
            centres.Add(new Point2D(x, y));
            pxX.Add(w.CentroidX / px);
            pxY.Add(w.CentroidY / px);
            footprints.Add(GrowthFootprint.FootprintUm(w.EquivalentRadius));
            measured.Add(w.Class == WireClass.Vertical && !w.TouchesBorder ? w.EquivalentRadius : double.NaN);
        }
        if (centres.Count == 0)
        {
            throw new GrowthCaseException(caseFile, at + ".image", $"({c.ImagePath}): no wires were found");
        }
        return new LoadedWafer(c, exposure, field, centres.ToArray(), pxX.ToArray(), pxY.ToArray(), footprints.ToArray(), measured.ToArray(), window);
    }
}
