namespace RunWatch.Imaging.Scale;

/// <summary>A field sidecar file that exists but cannot be used.</summary>
public sealed class FieldSidecarException(string path, string reason)
    : Exception($"{Path.GetFileName(path)}: {reason}")
{
    public string SidecarPath { get; } = path;
}
