using System.Text;
using RunWatch.Ingest.Configuration;
using RunWatch.Core.Thermal;
using RunWatch.Storage;

namespace RunWatch.Ingest.Chambers;

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
        Calibration = new TemperatureCalibration(options.Calibration.Select(p => new Core.Thermal.CalibrationPoint(p.Reading, p.True)));
    }

    public string Name { get; }

    public byte[] Utf8Name { get; }

    public long ChannelId { get; }

    public ChannelRole Role { get; }

    public double Min { get; }

    public double Max { get; }

    /// <summary>Newest committed sample time, µs; used to count out-of-order samples. Touched by the single committer only.</summary>
    public long LastTimestampUs { get; set; } = long.MinValue;

    /// <summary>Maps readings to true values (Core's piecewise-linear calibration; identity without points).</summary>
    public TemperatureCalibration Calibration { get; }
}
