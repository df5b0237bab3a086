using System.Globalization;
using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Thermal;

/// <summary>Computes a <see cref="ThermalLogReport"/> from a parsed log: diffusion length over the window and the excursions in it.</summary>
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

        DiffusionLengthResult length = DiffusionLengthCalculator.Compute(record, settings.Diffusivity, window, settings.Length, settings.Calibration, plan);

        double[]? setpoints = SetpointsPerSample(csv, record, settings, out string? setpointSource);
        var observer = new CollectingObserver();
        if (setpoints is null)
        {
            notes.Add("no setpoint (--setpoint-c or --setpoint-channel): deviation bands not checked");
        }
        var monitor = new ExcursionMonitor(settings.Excursions, settings.Diffusivity, observer);
        monitor.BeginRun(from);
        ReadOnlySpan<double> times = record.TimesS;
        ReadOnlySpan<double> readings = record.ReadingsC;
        for (int i = 0; i < record.Count; i++)
        {
            if (times[i] < from || times[i] > to)
            {
                continue;
            }
            double sp = setpoints is null ? double.NaN : settings.Calibration.ToTrueC(setpoints[i]);
            monitor.Observe(times[i], settings.Calibration.ToTrueC(readings[i]), sp);
        }
        monitor.Flush(to);

        return new ThermalLogReport
        {
            Channel = channel,
            SampleCount = record.Count,
            Origin = csv.Origin,
            Length = length,
            Settings = settings,
            SetpointSource = setpointSource,
            Excursions = observer.Excursions,
            OtherAlarms = observer.Raised
                .Where(t => t.Kind is not (AlarmKind.DeviationWarning or AlarmKind.DeviationAlarm))
                .ToList(),
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

    private sealed class CollectingObserver : IExcursionObserver
    {
        public List<ExcursionSummary> Excursions { get; } = [];

        public List<AlarmTransition> Raised { get; } = [];

        public void OnAlarmChanged(in AlarmTransition transition)
        {
            if (transition.To == AlarmState.ActiveUnacknowledged)
            {
                Raised.Add(transition);
            }
        }

        public void OnExcursionEnded(in ExcursionSummary summary) => Excursions.Add(summary);
    }
}
