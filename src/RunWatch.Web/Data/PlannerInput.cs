namespace RunWatch.Web.Data;

/// <summary>What-if inputs for the next run: a temperature profile (minutes from start, °C), growth time and nucleation density.</summary>
public sealed record PlannerInput(string Process, IReadOnlyList<ProfilePoint> Profile, TimeSpan GrowthTime, double NucleationDensityPerSquareMicrometre);
