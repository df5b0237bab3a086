using System.CommandLine;
using System.Globalization;
using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;
using RunWatch.Thermal;

namespace RunWatch.Commands;

/// <summary>
/// <c>runwatch thermal LOG.csv</c>: diffusion length (L_nom, L_eff, T_eff), coverage and excursions of a recorded
/// thermal log. Exit codes: 0 done, 1 the log or an option value could not be used (the message names line and column).
/// </summary>
internal static class ThermalCommand
{
    // Invented example process: D(500 °C) = 3e-10 cm²/s (a 5-minute growth gives L ≈ 3 µm with c = 1), Ea = 1 eV.
    private static readonly ArrheniusDiffusivity Example = ArrheniusDiffusivity.FromReference(3e-10, 500 + PhysicalConstants.ZeroCelsiusK, 1.0);

    public static Command Create()
    {
        var log = new Argument<FileInfo>("log") { Description = "Thermal log in CSV: a timestamp column and one column per channel (see docs/thermal.md)." };
        var channel = new Option<string?>("--channel") { Description = "Channel to analyse (default: the first channel of the file)." };
        var from = new Option<string?>("--from") { Description = "Growth window start: seconds on the file's time axis, or an ISO-8601 time with offset." };
        var to = new Option<string?>("--to") { Description = "Growth window end, same forms as --from." };
        var setpoint = new Option<double?>("--setpoint-c") { Description = "Recipe setpoint in °C (instrument scale), for L_nom and the deviation bands." };
        var setpointChannel = new Option<string?>("--setpoint-channel") { Description = "Column with the setpoint per row (carried forward over empty cells), for the deviation bands." };
        var planned = new Option<double?>("--planned-s") { Description = "Planned growth duration in s, for L_nom (default: the window length)." };
        var d0 = new Option<double?>("--d0") { Description = "Arrhenius prefactor D0 in cm²/s (with --ea)." };
        var ea = new Option<double?>("--ea") { Description = "Activation energy Ea in eV (with --d0)." };
        var convention = new Option<double>("--convention") { Description = "Convention factor c in L = sqrt(c·∫D dt): 1 for sqrt(D·t), 4 for the 2-D mean-square displacement.", DefaultValueFactory = _ => 1.0 };
        var maxGap = new Option<double>("--max-gap-s") { Description = "Longest interval between samples still integrated; longer ones are reported as gaps.", DefaultValueFactory = _ => 10.0 };
        var calibrate = new Option<string[]>("--calibrate") { Description = "Calibration point READING=TRUE in °C, e.g. 560=580 (repeat for more points).", AllowMultipleArgumentsPerToken = false };
        var warning = new Option<double>("--warning-k") { Description = "Warning band ± around the setpoint, K.", DefaultValueFactory = _ => 5.0 };
        var alarm = new Option<double>("--alarm-k") { Description = "Alarm band ± around the setpoint, K.", DefaultValueFactory = _ => 15.0 };
        var minimum = new Option<double>("--min-duration-s") { Description = "Shortest deviation that counts as an excursion, s.", DefaultValueFactory = _ => 5.0 };
        var high = new Option<double?>("--high-c") { Description = "Absolute high limit, °C (true temperature)." };
        var low = new Option<double?>("--low-c") { Description = "Absolute low limit, °C (true temperature)." };
        var rate = new Option<double?>("--max-rate-k-per-s") { Description = "Largest allowed rate of change, K/s." };
        var json = new Option<bool>("--json") { Description = "Write JSON instead of text." };

        var command = new Command("thermal", "Diffusion length, coverage and excursions of a recorded thermal log.")
        {
            log, channel, from, to, setpoint, setpointChannel, planned, d0, ea, convention, maxGap, calibrate, warning, alarm, minimum, high, low, rate, json,
        };
        command.SetAction(parseResult =>
        {
            TextWriter output = parseResult.InvocationConfiguration.Output;
            TextWriter error = parseResult.InvocationConfiguration.Error;
            FileInfo file = parseResult.GetRequiredValue(log);
            try
            {
                double? d0Value = parseResult.GetValue(d0);
                double? eaValue = parseResult.GetValue(ea);
                if (d0Value.HasValue != eaValue.HasValue)
                {
                    throw new ArgumentException("give --d0 and --ea together");
                }
                var settings = new ThermalLogSettings
                {
                    Channel = parseResult.GetValue(channel),
                    From = parseResult.GetValue(from),
                    To = parseResult.GetValue(to),
                    SetpointC = parseResult.GetValue(setpoint),
                    SetpointChannel = parseResult.GetValue(setpointChannel),
                    PlannedS = parseResult.GetValue(planned),
                    Diffusivity = d0Value is { } dv && eaValue is { } ev ? new ArrheniusDiffusivity(dv, ev) : Example,
                    DiffusivityIsExample = !d0Value.HasValue,
                    Calibration = ParseCalibration(parseResult.GetValue(calibrate) ?? []),
                    Length = new DiffusionLengthOptions
                    {
                        ConventionFactor = parseResult.GetValue(convention),
                        MaxGap = TimeSpan.FromSeconds(parseResult.GetValue(maxGap)),
                    },
                    Excursions = new ExcursionOptions
                    {
                        WarningBandK = parseResult.GetValue(warning),
                        AlarmBandK = parseResult.GetValue(alarm),
                        MinimumDuration = TimeSpan.FromSeconds(parseResult.GetValue(minimum)),
                        HighLimitC = parseResult.GetValue(high),
                        LowLimitC = parseResult.GetValue(low),
                        MaxRateKPerS = parseResult.GetValue(rate),
                        MaxGap = TimeSpan.FromSeconds(parseResult.GetValue(maxGap)),
                        StaleAfter = null,
                    },
                };
                string[] problems = [.. settings.Length.Validate(), .. settings.Excursions.Validate(), .. settings.Diffusivity.Validate()];
                if (problems.Length > 0)
                {
                    throw new ArgumentException(string.Join(" ", problems));
                }

                ThermalCsv csv;
                using (var reader = new StreamReader(file.FullName))
                {
                    csv = ThermalCsvReader.Read(reader);
                }
                ThermalLogReport report = ThermalLogAnalysis.Analyze(csv, settings);
                if (parseResult.GetValue(json))
                {
                    ThermalReportJson.Write(report, file.Name, output);
                }
                else
                {
                    ThermalReportText.Write(report, file.Name, output);
                }
                return 0;
            }
            catch (ThermalCsvException ex)
            {
                error.WriteLine($"runwatch thermal: {file.Name} {ex.Message}");
                return 1;
            }
            catch (Exception ex) when (ex is ArgumentException or KeyNotFoundException or IOException or UnauthorizedAccessException)
            {
                error.WriteLine($"runwatch thermal: {file.Name}: {ex.Message}");
                return 1;
            }
        });
        return command;
    }

    private static TemperatureCalibration ParseCalibration(string[] points)
    {
        var parsed = new List<CalibrationPoint>();
        foreach (string point in points)
        {
            string[] parts = point.Split('=');
            if (parts.Length != 2
                || !double.TryParse(parts[0], NumberStyles.Float, CultureInfo.InvariantCulture, out double reading)
                || !double.TryParse(parts[1], NumberStyles.Float, CultureInfo.InvariantCulture, out double truth))
            {
                throw new ArgumentException($"--calibrate '{point}' is not READING=TRUE in °C (e.g. 560=580)");
            }
            parsed.Add(new CalibrationPoint(reading, truth));
        }
        return parsed.Count == 0 ? TemperatureCalibration.Identity : new TemperatureCalibration(parsed);
    }
}
