using System.Text;
using RunWatch.Ingest.Configuration;
using RunWatch.Storage;

namespace RunWatch.Ingest.Pipeline;

/// <summary>A configured channel with its store id and its UTF-8 name for allocation-free matching in payloads.</summary>
internal sealed class ChannelRuntime
{
    public ChannelRuntime(ChannelOptions options, long channelId)
    {
        Name = options.Name;
        Utf8Name = Encoding.UTF8.GetBytes(options.Name);
        ChannelId = channelId;
        Role = options.Role;
        Min = options.Min ?? double.NegativeInfinity;
        Max = options.Max ?? double.PositiveInfinity;
        Calibration = [.. options.Calibration.Select(p => new CalibrationPoint(p.Reading, p.True))];
    }

    public string Name { get; }

    public byte[] Utf8Name { get; }

    public long ChannelId { get; }

    public ChannelRole Role { get; }

    public double Min { get; }

    public double Max { get; }

    public CalibrationPoint[] Calibration { get; }

    /// <summary>Newest committed sample time, µs; used to count out-of-order samples. Touched by the single committer only.</summary>
    public long LastTimestampUs { get; set; } = long.MinValue;

    /// <summary>
    /// Maps a reading to the true value: piecewise linear through the calibration points, extended beyond the ends with the
    /// slope of the nearest segment; identity without points, a constant offset with one point.
    /// </summary>
    public double Calibrate(double reading)
    {
        var points = Calibration;
        if (points.Length == 0)
        {
            return reading;
        }
        if (points.Length == 1)
        {
            return reading + (points[0].True - points[0].Reading);
        }
        int i = 1;
        while (i < points.Length - 1 && reading > points[i].Reading)
        {
            i++;
        }
        var a = points[i - 1];
        var b = points[i];
        double slope = (b.True - a.True) / (b.Reading - a.Reading);
        return a.True + ((reading - a.Reading) * slope);
    }
}
