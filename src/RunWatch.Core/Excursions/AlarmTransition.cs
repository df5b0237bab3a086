namespace RunWatch.Core.Excursions;

/// <summary>An alarm changed state.</summary>
/// <param name="Kind">Which alarm.</param>
/// <param name="From">State before.</param>
/// <param name="To">State after.</param>
/// <param name="TimeS">When, in seconds on the monitor's clock.</param>
/// <param name="ValueC">The last reading in °C at that time (NaN when there was none).</param>
public readonly record struct AlarmTransition(AlarmKind Kind, AlarmState From, AlarmState To, double TimeS, double ValueC);
