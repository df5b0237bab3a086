using RunWatch.Imaging.Scale;

namespace RunWatch.Simulation.Sem;

/// <summary>Writes a <see cref="MicroscopeField"/> as a 16-bit PNG and a sidecar with its pixel size and tilt.</summary>
public static class MicroscopeFieldWriter
{
    /// <param name="field">The field.</param>
    /// <param name="path">PNG path.</param>
    /// <param name="sidecarPixelSizeNm">Pixel size written to the sidecar; the field's own when null (give another to model a wrong setting).</param>
    /// <param name="waferId">Wafer id for the sidecar.</param>
    /// <param name="position">Field position for the sidecar.</param>
    public static void Write(MicroscopeField field, string path, double? sidecarPixelSizeNm = null, string? waferId = null, FieldPosition? position = null)
    {
        ArgumentNullException.ThrowIfNull(field);
        SemFieldWriter.Write(field.ToSemField(), path, sidecar: false);
        new FieldSidecar
        {
            PixelSizeNm = sidecarPixelSizeNm ?? field.Spec.PixelSizeNm,
            WaferId = waferId,
            FieldPosition = position,
            TiltDeg = field.Spec.TiltDeg,
        }.WriteFor(path);
    }
}
