namespace RunWatch.Imaging.Scale;

/// <summary>Where a field's pixel size came from, in the order they are tried.</summary>
public enum ScaleSource
{
    /// <summary>No scale: lengths are in pixels.</summary>
    None,

    /// <summary>The field sidecar file beside the image.</summary>
    Sidecar,

    /// <summary>The command line or configuration.</summary>
    Given,

    /// <summary>The standard TIFF resolution tags of the file.</summary>
    TiffResolution,
}
