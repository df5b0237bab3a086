using RunWatch.Core.Thermal;

namespace RunWatch.Thermal;

/// <summary>
/// A parsed thermal log: one time axis (s from <see cref="Origin"/>, or the file's own seconds) and one column per
/// channel, NaN where a row has no value for that channel.
/// </summary>
internal sealed class ThermalCsv(string timeColumn, IReadOnlyList<string> channels, DateTimeOffset? origin, double[] timesS, double[][] values)
{
    /// <summary>Name of the timestamp column.</summary>
    public string TimeColumn { get; } = timeColumn;

    /// <summary>Channel names in file order.</summary>
    public IReadOnlyList<string> Channels { get; } = channels;

    /// <summary>The first timestamp when the file uses ISO-8601 times (times are then seconds after it); null for numeric times.</summary>
    public DateTimeOffset? Origin { get; } = origin;

    /// <summary>Row times in s.</summary>
    public IReadOnlyList<double> TimesS => timesS;

    /// <summary>Number of data rows.</summary>
    public int RowCount => timesS.Length;

    /// <summary>True when the file has a channel of that name (ordinal, case-sensitive).</summary>
    public bool HasChannel(string name) => IndexOf(name) >= 0;

    /// <summary>The samples of one channel (rows without a value are left out).</summary>
    /// <exception cref="KeyNotFoundException">No such channel.</exception>
    public ThermalRecord Record(string channel)
    {
        double[] column = Column(channel);
        int n = 0;
        foreach (double v in column)
        {
            n += double.IsNaN(v) ? 0 : 1;
        }
        var t = new double[n];
        var r = new double[n];
        int j = 0;
        for (int i = 0; i < column.Length; i++)
        {
            if (!double.IsNaN(column[i]))
            {
                t[j] = timesS[i];
                r[j] = column[i];
                j++;
            }
        }
        return new ThermalRecord(channel, t, r, Origin);
    }

    /// <summary>One channel's column, NaN where a row has no value.</summary>
    public double[] Column(string channel)
    {
        int index = IndexOf(channel);
        if (index < 0)
        {
            throw new KeyNotFoundException($"no channel '{channel}' (the file has: {string.Join(", ", Channels)})");
        }
        return values[index];
    }

    private int IndexOf(string name)
    {
        for (int i = 0; i < Channels.Count; i++)
        {
            if (string.Equals(Channels[i], name, StringComparison.Ordinal))
            {
                return i;
            }
        }
        return -1;
    }
}
