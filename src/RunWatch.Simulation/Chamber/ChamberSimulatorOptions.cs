namespace RunWatch.Simulation.Chamber;

/// <summary>The demo chamber (all values invented for the demo). Bound from the section <c>ChamberSimulator</c>.</summary>
public sealed class ChamberSimulatorOptions
{
    /// <summary>Seed of the thermocouple noise; the same seed gives the same samples.</summary>
    public int Seed { get; set; } = 412;

    /// <summary>Simulated time between samples.</summary>
    /// <value>Default 0.1 s (10 Hz).</value>
    public TimeSpan SampleInterval { get; set; } = TimeSpan.FromSeconds(0.1);

    /// <summary>How much faster than real time a publisher should replay the samples (the simulator itself only counts simulated time).</summary>
    /// <value>Default 60.</value>
    public double Acceleration { get; set; } = 60;

    /// <summary>Heater time constant τ.</summary>
    /// <value>Default 40 s.</value>
    public TimeSpan HeaterTimeConstant { get; set; } = TimeSpan.FromSeconds(40);

    /// <summary>Steady-state rise at full heater power, K.</summary>
    public double HeaterGainK { get; set; } = 1000;

    /// <summary>Ambient temperature, °C.</summary>
    public double AmbientC { get; set; } = 25;

    /// <summary>Starting substrate temperature, °C.</summary>
    public double InitialC { get; set; } = 200;

    /// <summary>Thermocouple noise, standard deviation in K.</summary>
    public double NoiseK { get; set; } = 0.1;

    /// <summary>PID gains (per K, per K·s, s per K).</summary>
    public double Kp { get; set; } = 0.004;

    public double Ki { get; set; } = 0.0001;

    public double Kd { get; set; }

    /// <summary>Name of the step during which an over-temperature excursion is injected; null injects none.</summary>
    public string? ExcursionStep { get; set; } = "growth";

    /// <summary>When the injected heat starts, after the start of that step.</summary>
    public TimeSpan ExcursionAfter { get; set; } = TimeSpan.FromSeconds(600);

    /// <summary>How long the injected heat holds at its peak.</summary>
    public TimeSpan ExcursionDuration { get; set; } = TimeSpan.FromSeconds(60);

    /// <summary>How long the injected heat then takes to fade out.</summary>
    public TimeSpan ExcursionFade { get; set; } = TimeSpan.FromSeconds(300);

    /// <summary>Peak injected heat as a steady-state rise, K (the controller rejects most of it).</summary>
    public double ExcursionHeatK { get; set; } = 100;

    /// <summary>The recipe; the default is an invented nanowire demo recipe.</summary>
    public IReadOnlyList<RecipeStep> Recipe { get; set; } = DemoRecipe;

    /// <summary>Invented demo recipe: oxide desorption, droplet pre-deposition, growth (shutter open), cool-down.</summary>
    public static IReadOnlyList<RecipeStep> DemoRecipe { get; } =
    [
        new("ramp-to-desorption", 640, 1.0, 300, false),
        new("cool-to-growth", 610, 0.5, 120, false),
        new("droplet-predeposition", 610, 1.0, 60, true),
        new("stabilise", 610, 1.0, 60, false),
        new("growth", 610, 1.0, 1800, true),
        new("cool-down", 250, 1.0, 0, false),
    ];

    /// <summary>Returns the problems with these options; empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        if (SampleInterval <= TimeSpan.Zero)
        {
            errors.Add("SampleInterval must be positive.");
        }
        if (!(Acceleration > 0))
        {
            errors.Add("Acceleration must be positive.");
        }
        if (HeaterTimeConstant <= TimeSpan.Zero)
        {
            errors.Add("HeaterTimeConstant must be positive.");
        }
        if (!(HeaterGainK > 0))
        {
            errors.Add("HeaterGainK must be positive.");
        }
        if (!(NoiseK >= 0))
        {
            errors.Add("NoiseK must not be negative.");
        }
        if (Recipe.Count == 0)
        {
            errors.Add("Recipe needs at least one step.");
        }
        foreach (RecipeStep step in Recipe)
        {
            if (!(step.RampKPerS > 0) || !(step.HoldS >= 0) || !double.IsFinite(step.TargetC))
            {
                errors.Add($"Recipe step '{step.Name}' needs a positive ramp, a non-negative hold and a finite target.");
            }
        }
        if (ExcursionDuration < TimeSpan.Zero || ExcursionFade <= TimeSpan.Zero)
        {
            errors.Add("ExcursionDuration must not be negative and ExcursionFade must be positive.");
        }
        if (ExcursionStep is { } name && Recipe.All(s => s.Name != name))
        {
            errors.Add($"ExcursionStep '{name}' is not a step of the recipe.");
        }
        return errors;
    }
}
