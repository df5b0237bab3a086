using System.Globalization;

namespace RunWatch.Thermal;

/// <summary>
/// Reads a thermal log in CSV (format in docs/thermal.md): optional '#' comment lines, a header row whose first
/// column is the timestamp and whose other columns are channels, then one row per instant. Timestamps are either
/// all ISO-8601 with an offset or all plain seconds, non-decreasing. Values use '.' as decimal separator; an empty
/// cell means no sample. Any other problem throws <see cref="ThermalCsvException"/> naming line and column.
/// </summary>
internal static class ThermalCsvReader
{
    private const NumberStyles Number = NumberStyles.Float;

    public static ThermalCsv Read(TextReader reader)
    {
        ArgumentNullException.ThrowIfNull(reader);
        int lineNumber = 0;
        string[]? header = null;
        string? line;
        while ((line = reader.ReadLine()) is not null)
        {
            lineNumber++;
            if (IsSkippable(line))
            {
                continue;
            }
            header = SplitHeader(line, lineNumber);
            break;
        }
        if (header is null)
        {
            throw new ThermalCsvException(Math.Max(lineNumber, 1), null, null, "no header row (expected a timestamp column and at least one channel)");
        }

        int channelCount = header.Length - 1;
        var times = new List<double>();
        var columns = new List<double>[channelCount];
        for (int c = 0; c < channelCount; c++)
        {
            columns[c] = [];
        }
        bool? iso = null;
        DateTimeOffset origin = default;
        double previous = double.NegativeInfinity;
        while ((line = reader.ReadLine()) is not null)
        {
            lineNumber++;
            if (IsSkippable(line))
            {
                continue;
            }
            string[] cells = line.Split(',');
            if (cells.Length != header.Length)
            {
                throw new ThermalCsvException(lineNumber, null, null, $"{cells.Length} cells, but the header has {header.Length} columns");
            }
            string stamp = Unquote(cells[0]);
            double t;
            if (double.TryParse(stamp, Number, CultureInfo.InvariantCulture, out double seconds) && double.IsFinite(seconds))
            {
                if (iso == true)
                {
                    throw new ThermalCsvException(lineNumber, 1, header[0], $"'{stamp}' is plain seconds but earlier rows use ISO-8601 times");
                }
                iso = false;
                t = seconds;
            }
            else if (TryParseIso(stamp, out DateTimeOffset instant))
            {
                if (iso == false)
                {
                    throw new ThermalCsvException(lineNumber, 1, header[0], $"'{stamp}' is an ISO-8601 time but earlier rows use plain seconds");
                }
                if (iso is null)
                {
                    origin = instant;
                }
                iso = true;
                t = (instant - origin).Ticks / (double)TimeSpan.TicksPerSecond;
            }
            else
            {
                throw new ThermalCsvException(lineNumber, 1, header[0], $"'{stamp}' is neither seconds nor an ISO-8601 time with an offset (e.g. 2026-03-04T10:00:00.125Z)");
            }
            if (t < previous)
            {
                throw new ThermalCsvException(lineNumber, 1, header[0], $"time goes backwards ('{stamp}' is before the previous row)");
            }
            previous = t;
            times.Add(t);
            for (int c = 0; c < channelCount; c++)
            {
                string cell = Unquote(cells[c + 1]);
                if (cell.Length == 0)
                {
                    columns[c].Add(double.NaN);
                }
                else if (double.TryParse(cell, Number, CultureInfo.InvariantCulture, out double v) && double.IsFinite(v))
                {
                    columns[c].Add(v);
                }
                else
                {
                    throw new ThermalCsvException(lineNumber, c + 2, header[c + 1], $"'{cell}' is not a number (use '.' as the decimal separator; leave the cell empty for no sample)");
                }
            }
        }
        if (times.Count == 0)
        {
            throw new ThermalCsvException(lineNumber, null, null, "the file has a header but no data rows");
        }
        return new ThermalCsv(header[0], header[1..], iso == true ? origin : null, times.ToArray(), columns.Select(c => c.ToArray()).ToArray());
    }

    /// <summary>Parses an ISO-8601 instant that carries an offset ('Z' or ±hh:mm); local times without one are refused.</summary>
    public static bool TryParseIso(string text, out DateTimeOffset instant)
    {
        instant = default;
        if (text.Length < 11 || text[10] is not ('T' or 't' or ' '))
        {
            return false;
        }
        ReadOnlySpan<char> tail = text.AsSpan(11);
        bool hasOffset = tail.EndsWith("Z", StringComparison.OrdinalIgnoreCase) || tail.LastIndexOfAny('+', '-') > 0;
        return hasOffset && DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.None, out instant);
    }

    private static bool IsSkippable(string line) => line.Length == 0 || line.AsSpan().Trim().IsEmpty || line.TrimStart().StartsWith('#');

    private static string[] SplitHeader(string line, int lineNumber)
    {
        string[] names = line.Split(',').Select(Unquote).ToArray();
        if (names.Length < 2)
        {
            throw new ThermalCsvException(lineNumber, null, null, "the header needs a timestamp column and at least one channel, separated by commas");
        }
        for (int i = 0; i < names.Length; i++)
        {
            if (names[i].Length == 0)
            {
                throw new ThermalCsvException(lineNumber, i + 1, null, "empty column name in the header");
            }
            if (Array.IndexOf(names, names[i]) != i)
            {
                throw new ThermalCsvException(lineNumber, i + 1, names[i], "the column name appears twice");
            }
        }
        return names;
    }

    private static string Unquote(string cell)
    {
        string trimmed = cell.Trim();
        return trimmed.Length >= 2 && trimmed[0] == '"' && trimmed[^1] == '"' ? trimmed[1..^1].Trim() : trimmed;
    }
}
