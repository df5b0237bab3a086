using RunWatch.Imaging.Measurement;

namespace RunWatch.Imaging.Analysis;

public static partial class FieldAnalyzer
{
    /// <summary>The sub-pixel edge step for every object, row bands in parallel (one <see cref="EdgeRefiner"/> per thread).</summary>
    private static EdgeProfile[] RefineEdges(List<RawWire> raw, ushort[] image, int[] labels, int width, int validHeight, double cosTilt)
    {
        var result = new EdgeProfile[raw.Count];
        Parallel.For(0, raw.Count, () => new EdgeRefiner(), (i, _, refiner) =>
        {
            result[i] = refiner.Measure(image, labels, width, 0, validHeight, raw[i], cosTilt);
            return refiner;
        }, _ => { });
        return result;
    }
}
