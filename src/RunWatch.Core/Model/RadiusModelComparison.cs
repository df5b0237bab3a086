namespace RunWatch.Core.Model;

/// <summary>Both radius models fitted to the same wires, and the one chosen by the stated criterion.</summary>
/// <param name="Linear">The linear fit r = a + b·Â.</param>
/// <param name="PowerLaw">The power-law fit r = k·Â^p.</param>
/// <param name="Selected">The chosen form: the smaller AIC (ties go to the linear model).</param>
/// <param name="Criterion">The criterion as text, for records and reports.</param>
public sealed record RadiusModelComparison(RadiusModelFit Linear, RadiusModelFit PowerLaw, RadiusModelKind Selected, string Criterion)
{
    /// <summary>The selected fit.</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public RadiusModelFit SelectedFit => Selected == RadiusModelKind.Linear ? Linear : PowerLaw;

    /// <summary>AIC(power law) − AIC(linear): negative favours the power law.</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public double AicDifference => PowerLaw.Aic - Linear.Aic;
}
