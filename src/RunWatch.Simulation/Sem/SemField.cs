namespace RunWatch.Simulation.Sem;

/// <summary>A generated field: 16-bit pixels, row-major, and what was drawn.</summary>
public sealed class SemField(int width, int height, ushort[] pixels, IReadOnlyList<SemObject> objects, int infoStripRows, double pixelSizeNm)
{
    public int Width { get; } = width;

    public int Height { get; } = height;

    public ushort[] Pixels { get; } = pixels;

    /// <summary>Ground truth, in drawing order.</summary>
    public IReadOnlyList<SemObject> Objects { get; } = objects;

    public int InfoStripRows { get; } = infoStripRows;

    public double PixelSizeNm { get; } = pixelSizeNm;
}
