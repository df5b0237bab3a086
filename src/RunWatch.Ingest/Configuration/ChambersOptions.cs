namespace RunWatch.Ingest.Configuration;

/// <summary>The configured chambers, bound from the <c>Chambers</c> section (a list).</summary>
public sealed class ChambersOptions
{
    /// <summary>Configuration section name.</summary>
    public const string SectionName = "Chambers";

    /// <summary>Chambers.</summary>
    public List<ChamberOptions> Items { get; set; } = [];

    /// <summary>Problems that make the chamber list unusable (empty when valid).</summary>
    public IReadOnlyList<string> Validate()
    {
        var problems = new List<string>();
        var names = new HashSet<string>(StringComparer.Ordinal);
        foreach (var chamber in Items)
        {
            if (string.IsNullOrWhiteSpace(chamber.Name) || chamber.Name.AsSpan().IndexOfAny("/#+") >= 0)
            {
                problems.Add("chamber name empty or containing / # +: '" + chamber.Name + "'");
            }
            if (string.IsNullOrWhiteSpace(chamber.Site) || chamber.Site.AsSpan().IndexOfAny("/#+") >= 0)
            {
                problems.Add("chamber " + chamber.Name + ": site empty or containing / # +");
            }
            if (!names.Add(chamber.Name))
            {
                problems.Add("chamber " + chamber.Name + " defined twice");
            }
            var channels = new HashSet<string>(StringComparer.Ordinal);
            foreach (var channel in chamber.Channels)
            {
                if (string.IsNullOrWhiteSpace(channel.Name) || !channels.Add(channel.Name))
                {
                    problems.Add("chamber " + chamber.Name + ": channel name empty or duplicated: '" + channel.Name + "'");
                }
                if (channel.Min is { } min && channel.Max is { } max && !(min < max))
                {
                    problems.Add("chamber " + chamber.Name + ", channel " + channel.Name + ": Min must be below Max");
                }
                for (int i = 1; i < channel.Calibration.Count; i++)
                {
                    if (!(channel.Calibration[i].Reading > channel.Calibration[i - 1].Reading))
                    {
                        problems.Add("chamber " + chamber.Name + ", channel " + channel.Name + ": calibration readings must increase");
                    }
                }
            }
            // Every role but Other names one channel: the thermal record, the run detector and the reminders read that one.
            foreach (var role in Enum.GetValues<Storage.ChannelRole>().Where(r => r != Storage.ChannelRole.Other))
            {
                if (chamber.Channels.Count(c => c.Role == role) > 1)
                {
                    problems.Add("chamber " + chamber.Name + ": more than one channel with role " + role);
                }
            }
            problems.AddRange(chamber.Excursions.Validate().Select(e => "chamber " + chamber.Name + ", Excursions: " + e));
            problems.AddRange(chamber.DiffusionLength.Validate().Select(e => "chamber " + chamber.Name + ", DiffusionLength: " + e));
            problems.AddRange(chamber.Process.Diffusivity.Validate().Select(e => "chamber " + chamber.Name + ", Process: " + e));
            if (chamber.Runs.Mode == RunDetectionMode.Shutter && !chamber.Channels.Exists(c => c.Role == Storage.ChannelRole.GrowthShutter))
            {
                problems.Add("chamber " + chamber.Name + ": shutter run detection needs a channel with role GrowthShutter");
            }
        }
        return problems;
    }
}
