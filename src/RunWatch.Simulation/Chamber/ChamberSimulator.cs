namespace RunWatch.Simulation.Chamber;

/// <summary>
/// Demo growth chamber (invented data): a substrate heater with first-order thermal lag under PID control follows a
/// recipe (setpoint ramps and holds, Ga shutter per step), with one injected over-temperature excursion and
/// seeded thermocouple noise. Pure and deterministic: the same options give the same samples. Time is simulated;
/// a publisher replays it at <see cref="ChamberSimulatorOptions.Acceleration"/>.
/// </summary>
public sealed class ChamberSimulator
{
    private readonly ChamberSimulatorOptions _options;

    /// <exception cref="ArgumentException">Invalid options.</exception>
    public ChamberSimulator(ChamberSimulatorOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var problems = options.Validate();
        if (problems.Count > 0)
        {
            throw new ArgumentException(string.Join(" ", problems), nameof(options));
        }
        _options = options;
    }

    /// <summary>Start and end of each recipe step in simulated seconds (the setpoint schedule, independent of the plant).</summary>
    public IReadOnlyList<(RecipeStep Step, double StartS, double EndS)> Schedule()
    {
        var schedule = new List<(RecipeStep, double, double)>();
        double now = 0;
        double setpoint = _options.InitialC;
        foreach (RecipeStep step in _options.Recipe)
        {
            double duration = Math.Abs(step.TargetC - setpoint) / step.RampKPerS + step.HoldS;
            schedule.Add((step, now, now + duration));
            now += duration;
            setpoint = step.TargetC;
        }
        return schedule;
    }

    /// <summary>The samples of one run, from time 0 to the end of the last step.</summary>
    public IEnumerable<ChamberSample> Run()
    {
        double dt = _options.SampleInterval.TotalSeconds;
        var heater = new FirstOrderLag(_options.HeaterTimeConstant.TotalSeconds, _options.HeaterGainK, _options.AmbientC, _options.InitialC);
        var pid = new PidController(_options.Kp, _options.Ki, _options.Kd);
        var random = new Random(_options.Seed);
        var schedule = Schedule();
        double excursionStart = double.NaN;
        foreach (var (step, start, _) in schedule)
        {
            if (step.Name == _options.ExcursionStep)
            {
                excursionStart = start + _options.ExcursionAfter.TotalSeconds;
                break;
            }
        }
        double setpoint = _options.InitialC;
        double end = schedule[^1].EndS;
        long n = (long)Math.Floor(end / dt + 1e-9);
        int stepIndex = 0;
        for (long i = 0; i <= n; i++)
        {
            double t = i * dt;
            while (stepIndex < schedule.Count - 1 && t >= schedule[stepIndex].EndS)
            {
                stepIndex++;
            }
            RecipeStep step = schedule[stepIndex].Step;
            double reading = heater.TemperatureC + _options.NoiseK * Gaussian(random);
            yield return new ChamberSample(t, Math.Round(reading, 3), Math.Round(setpoint, 3), step.GaShutterOpen ? 1 : 0, step.Name);

            // Setpoint ramps toward the step target; the controller acts on the (noisy) reading.
            double toward = step.TargetC - setpoint;
            setpoint += Math.Sign(toward) * Math.Min(Math.Abs(toward), step.RampKPerS * dt);
            double power = pid.Update(setpoint, reading, dt);
            double disturbance = InjectedHeatK(t, excursionStart);
            heater.Advance(power, dt, disturbance);
        }
    }

    // A heater fault: the extra heat appears at once, holds, then fades out linearly, so the event is one
    // over-temperature excursion and not an over-and-under swing.
    private double InjectedHeatK(double t, double startS)
    {
        double since = t - startS;
        double hold = _options.ExcursionDuration.TotalSeconds;
        double fade = _options.ExcursionFade.TotalSeconds;
        if (!(since >= 0) || since >= hold + fade)
        {
            return 0;
        }
        return since < hold ? _options.ExcursionHeatK : _options.ExcursionHeatK * (1 - (since - hold) / fade);
    }

    // Box-Muller from the seeded generator, so runs are reproducible.
    private static double Gaussian(Random random)
    {
        double u1 = 1 - random.NextDouble();
        double u2 = random.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }
}
