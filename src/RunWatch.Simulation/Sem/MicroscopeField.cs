namespace RunWatch.Simulation.Sem;

/// <summary>A field made by <see cref="MicroscopeFieldGenerator"/>: 16-bit pixels, row-major, and the truth behind them.</summary>
public sealed class MicroscopeField(MicroscopeFieldSpec spec, ushort[] pixels, int scaleBarPixels)
{
    public MicroscopeFieldSpec Spec { get; } = spec;

    public int Width => Spec.Width;

    public int Height => Spec.Height;

    public ushort[] Pixels { get; } = pixels;

    public IReadOnlyList<MicroscopeObject> Objects => Spec.Objects;

    /// <summary>Length of the drawn scale bar in pixels (0 without a strip).</summary>
    public int ScaleBarPixels { get; } = scaleBarPixels;

    /// <summary>As a <see cref="SemField"/> for code written against the plain generator (the strip's rows; strip position is lost).</summary>
    public SemField ToSemField() => new(Width, Height, Pixels,
        Objects.Select(o => new SemObject(o.Kind, o.X, o.Y, o.Size, o.Length, o.AngleDeg)).ToList(), Spec.StripRows, Spec.PixelSizeNm);
}
