using System.Globalization;
using RunWatch.Core.Runs;
using RunWatch.Core.Thermal;

namespace RunWatch.Thermal;

/// <summary>
/// Computes a <see cref="ThermalLogReport"/> from a parsed log with the daemon's own run evaluation (Core
/// <see cref="RunThermalEvaluator"/>): the log is the run, --from/--to its growth window. Diffusion length over the
/// window; excursions over the whole log, each marked in or outside the window with its effect on L_eff.
/// </summary>
internal static class ThermalLogAnalysis
{
    public static ThermalLogReport Analyze(ThermalCsv csv, ThermalLogSettings settings)
    {
        var notes = new List<string>();
        string channel = settings.Channel ?? csv.Channels[0];
        if (!csv.HasChannel(channel))
        {
            throw new ArgumentException($"the file has no channel '{channel}' (it has: {string.Join(", ", csv.Channels)})");
        }
        ThermalRecord record = csv.Record(channel);
        if (record.Count == 0)
        {
            throw new ArgumentException($"channel '{channel}' has no values");
        }
        double from = settings.From is null ? record.TimesS[0] : ResolveTime(settings.From, csv, "--from");
        double to = settings.To is null ? record.TimesS[^1] : ResolveTime(settings.To, csv, "--to");
        if (to < from)
        {
            throw new ArgumentException($"the window ends ({to} s) before it starts ({from} s)");
        }
        var window = new GrowthWindow(from, to);

        GrowthPlan? plan = null;
        if (settings.SetpointC is { } setpoint)
        {
            double planned = settings.PlannedS ?? window.DurationS;
            if (settings.PlannedS is null)
            {
                notes.Add($"no --planned-s given: L_nom uses the window length, {Format(planned)} s");
            }
            plan = new GrowthPlan(settings.Calibration.ToTrueC(setpoint), planned);
        }
        if (settings.DiffusivityIsExample)
        {
            notes.Add("no --d0/--ea given: using the built-in example process (invented: D = 3e-10 cm²/s at 500 °C, Ea = 1 eV); pass your process's values");
        }

        double[]? setpoints = SetpointsPerSample(csv, record, settings, out string? setpointSource);
        if (setpoints is null)
        {
            notes.Add("no setpoint (--setpoint-c or --setpoint-channel): deviation bands not checked");
        }
        var trueSetpoints = new double[record.Count];
        for (int i = 0; i < trueSetpoints.Length; i++)
        {
            trueSetpoints[i] = setpoints is null ? double.NaN : settings.Calibration.ToTrueC(setpoints[i]);
        }
        // The daemon's run-end evaluation: the whole log is the run, the window is its growth window.
        RunThermalEvaluation evaluation = RunThermalEvaluator.Evaluate(new RunThermalInput(
            record, trueSetpoints, window, settings.Diffusivity, settings.Calibration, settings.Length, settings.Excursions, plan));

        return new ThermalLogReport
        {
            Channel = channel,
            SampleCount = record.Count,
            Origin = csv.Origin,
            Length = evaluation.Length,
            Settings = settings,
            SetpointSource = setpointSource,
            Excursions = evaluation.Excursions,
            OtherAlarms = evaluation.OtherAlarms,
            Notes = notes,
        };
    }

    /// <summary>
    /// A window edge: plain seconds on the file's time axis (for ISO files, seconds after the first row), or an
    /// ISO-8601 time with offset when the file uses ISO times.
    /// </summary>
    public static double ResolveTime(string text, ThermalCsv csv, string option)
    {
        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double seconds) && double.IsFinite(seconds))
        {
            return seconds;
        }
        if (ThermalCsvReader.TryParseIso(text, out DateTimeOffset instant))
        {
            if (csv.Origin is not { } origin)
            {
                throw new ArgumentException($"{option} '{text}' is an ISO-8601 time but the file's times are plain seconds");
            }
            return (instant - origin).Ticks / (double)TimeSpan.TicksPerSecond;
        }
        throw new ArgumentException($"{option} '{text}' is neither seconds nor an ISO-8601 time with an offset");
    }

    private static double[]? SetpointsPerSample(ThermalCsv csv, ThermalRecord record, ThermalLogSettings settings, out string? source)
    {
        source = null;
        if (settings.SetpointChannel is { } name)
        {
            double[] column = csv.Column(name);
            // The setpoint is carried forward over rows where it is empty (controllers log it only on change).
            var byRow = new double[csv.RowCount];
            double last = double.NaN;
            for (int i = 0; i < byRow.Length; i++)
            {
                last = double.IsNaN(column[i]) ? last : column[i];
                byRow[i] = last;
            }
            double[] recordTimes = record.TimesS.ToArray();
            var result = new double[record.Count];
            int row = 0;
            for (int i = 0; i < result.Length; i++)
            {
                while (row < csv.RowCount - 1 && csv.TimesS[row] < recordTimes[i])
                {
                    row++;
                }
                result[i] = byRow[row];
            }
            source = $"column {name}";
            return result;
        }
        if (settings.SetpointC is { } constant)
        {
            source = $"{Format(constant)} °C (--setpoint-c)";
            return Enumerable.Repeat(constant, record.Count).ToArray();
        }
        return null;
    }

    internal static string Format(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
}
