namespace RunWatch.Web.Components.Shared;

/// <summary>
/// Short explanations of the figures a newcomer cannot know, one place for every screen (<see cref="Explain"/>).
/// Each says what the figure is, how RunWatch computes it and where it comes from.
/// </summary>
public static class Glossary
{
    /// <summary>Term key → (name, explanation).</summary>
    public static IReadOnlyDictionary<string, (string Name, string Text)> Terms { get; } = new Dictionary<string, (string, string)>(StringComparer.Ordinal)
    {
        ["lambda"] = ("λ (diffusion length)",
            "How far an adatom travels on the substrate before it is captured or desorbs: λ = √(D·τ), with D the surface diffusivity and τ the lifetime before desorption. "
            + "It sets how large an area each wire collects material from. "
            + "On the run page, λ_eff of the accepted diffusion model is the constant λ that would collect the same material as the recorded temperature history."),
        ["lambda-eff"] = ("λ_eff (L_eff)",
            "In the runs table, the trends and the comparison: the diffusion length of what actually happened in the chamber, L_eff = √(c·∫D(T(t)) dt) over the growth window, with D(T) = D0·exp(−Ea/(k_B·T)) "
            + "evaluated at the recorded substrate temperature sample by sample, and c the convention factor shown on the run page. L_nom is the same from the setpoint and planned time."),
        ["t-eff"] = ("T_eff",
            "The constant temperature that would give the same ∫D dt over the same growth time: D(T_eff) = ∫D dt / t. One number that summarises a run's real thermal history."),
        ["a-hat"] = ("Â (normalised capture area)",
            "A wire's capture area A (the part of the substrate whose adatoms reach it, bounded at the diffusion length L) divided by π·L². "
            + "Â near 1 means a wire with no close neighbours; crowded wires have smaller Â and grow thinner."),
        ["clark-evans"] = ("Clark–Evans R",
            "Mean nearest-neighbour distance of the wires divided by the value expected for a random (Poisson) pattern of the same density, 1/(2√density). "
            + "R ≈ 1: random; R < 1: clustered; R > 1: more regular than random (Clark & Evans, 1954)."),
        ["verdict"] = ("Verdict",
            "PASS, WARN or FAIL: the worst outcome of the recipe's QC rules (wire count, mean radius, radius CV, density, vertical yield, prediction bias, excursions, "
            + "their effect on L, thermal coverage). Each rule has a fail window and a stricter warn window; limits are inclusive. A value that could not be measured warns. Specs are on Settings."),
        ["field-verdict"] = ("Field verdict",
            "A single field judged by the wafer's rules that apply to one field: mean radius, radius CV, density and vertical yield, with the recipe's own limits. "
            + "Wire count, prediction bias and the thermal rules belong to the whole wafer and its run."),
        ["mean-radius"] = ("Mean radius",
            "Mean radius of the wires that count: vertical, clear of the image edge and the excluded strip, with a measured radius (equivalent-circle radius of the facet outline). A run's value is the mean over its reported wafers."),
        ["cv"] = ("Radius CV",
            "Coefficient of variation: sample standard deviation of the wire radii divided by their mean, in percent. Lower is more uniform."),
        ["density"] = ("Density",
            "Wires per analysed area, in µm⁻² (1 µm⁻² = 10⁸ cm⁻²). On the wafer map, as the density rule judges it: every object found. "
            + "In the wafer statistics, the trends and the runs' figures: the wires that enter the radius statistics (vertical, clear of the edges), so it reads a little lower."),
        ["bias"] = ("Prediction bias",
            "Mean of (predicted − measured) radius over the wires compared, in nm: how far the accepted model's prediction sits from what the SEM measured. Positive: the model predicts too large."),
        ["uniformity"] = ("Non-uniformity U",
            "(max − min) / (2 · mean) of the field mean radii, in percent: half the spread across the wafer relative to the mean, quoted as ± U. "
            + "The CV of the field means (SD / mean) is given beside it. Only fields with a position and at least two counted wires enter."),
        ["radial-trend"] = ("Radial trend",
            "Each field's mean radius against its distance from the wafer centre, with the least-squares line through them; the slope (nm per mm) says whether wires grow thicker towards the edge (positive) or the centre (negative). "
            + "Field positions are the stage positions the SEM sidecar gave, taken relative to the wafer centre."),
        ["outline"] = ("Wafer outline",
            "The store does not record the wafer's size, so the outline drawn is the smallest standard diameter (50.8, 76.2, 100, 150, 200 or 300 mm) that holds every field."),
        ["control-limits"] = ("Centre line and control limits",
            "From the baseline only: centre line = mean of the baseline runs; σ̂ = mean moving range of consecutive baseline runs ÷ 1.128 (individuals chart); "
            + "limits = centre ± 3σ̂, with the 1σ and 2σ zones the run rules use. Runs after the baseline are judged against limits they did not set."),
        ["baseline"] = ("Baseline",
            "The first N runs, oldest first, of this process and chamber whose verdict is PASS and that have the figure. N is set on this screen (default 8). "
            + "With fewer than two such runs, or no spread among them, no limits are drawn and no rule is applied."),
        ["run-rules"] = ("Western Electric rules",
            "Published run rules for control charts (Western Electric Statistical Quality Control Handbook, 1956): 1 one point beyond 3σ; 2 two of three consecutive points beyond 2σ on one side; "
            + "3 four of five beyond 1σ on one side; 4 eight in a row on one side of the centre line. A flagged point is a reason to look, not a verdict."),
        ["excursions"] = ("Excursions",
            "Periods in which the substrate temperature left the warning or alarm band around the setpoint. Counted here: those inside the growth window and not on a ramp (ramps are suppressed by design)."),
    };

    /// <summary>The explanation of a term; throws for an unknown key so that a typo fails in tests, not on screen.</summary>
    public static (string Name, string Text) Of(string term) =>
        Terms.TryGetValue(term, out var entry) ? entry : throw new KeyNotFoundException($"No glossary entry '{term}'.");
}
