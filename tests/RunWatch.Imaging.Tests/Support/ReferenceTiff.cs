using RunWatch.Testing.Reference;

namespace RunWatch.Imaging.Tests.Support;

/// <summary>TIFF files written by an independent writer: Pillow (Debian's python3-pil) via tests/reference/imaging_write_tiff.py.</summary>
internal static class ReferenceTiff
{
    public static void Write(string path, string mode, double xResolution, double yResolution, int unit) =>
        ReferencePython.Run("imaging_write_tiff.py", path, mode,
            xResolution.ToString(System.Globalization.CultureInfo.InvariantCulture),
            yResolution.ToString(System.Globalization.CultureInfo.InvariantCulture),
            unit.ToString(System.Globalization.CultureInfo.InvariantCulture));
}
