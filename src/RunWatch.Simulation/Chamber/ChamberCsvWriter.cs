using System.Globalization;

namespace RunWatch.Simulation.Chamber;

/// <summary>
/// Writes simulated samples as a thermal log in the CSV format that <c>runwatch thermal</c> reads (docs/thermal.md):
/// ISO-8601 UTC timestamps (the origin plus the simulated time), one column per channel.
/// </summary>
public static class ChamberCsvWriter
{
    public static void Write(IEnumerable<ChamberSample> samples, DateTimeOffset origin, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(samples);
        ArgumentNullException.ThrowIfNull(output);
        output.WriteLine("# invented demo data from the RunWatch chamber simulator");
        output.WriteLine("time,substrate_tc,substrate_sp,ga_shutter");
        DateTimeOffset utc = origin.ToUniversalTime();
        foreach (ChamberSample s in samples)
        {
            DateTimeOffset at = utc.AddTicks((long)Math.Round(s.TimeS * TimeSpan.TicksPerSecond));
            output.Write(at.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", CultureInfo.InvariantCulture));
            output.Write(',');
            output.Write(s.SubstrateTcC.ToString("0.###", CultureInfo.InvariantCulture));
            output.Write(',');
            output.Write(s.SubstrateSpC.ToString("0.###", CultureInfo.InvariantCulture));
            output.Write(',');
            output.WriteLine(s.GaShutter.ToString(CultureInfo.InvariantCulture));
        }
    }
}
