namespace RunWatch.Web.Data;

/// <summary>A channel's samples: times in Unix seconds (ascending) and values, as arrays for span-based downsampling.</summary>
public sealed record SampleSeries(double[] UnixSeconds, double[] Values);
