namespace RunWatch.Imaging.Scale;

/// <summary>A field's position on the wafer, in millimetres from the wafer centre (x right, y towards the flat's opposite).</summary>
public sealed record FieldPosition(double XMm, double YMm);
