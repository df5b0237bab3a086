namespace RunWatch.Storage;

/// <summary>Outcome of <see cref="IRunWatchStore.WriteBatchAsync"/>.</summary>
/// <param name="SamplesInserted">New samples stored.</param>
/// <param name="SampleDuplicates">Samples already stored (redeliveries), ignored.</param>
/// <param name="EventsInserted">New events stored.</param>
/// <param name="EventDuplicates">Events already stored, ignored.</param>
/// <param name="DeadLettersStored">Dead letters stored.</param>
public readonly record struct BatchWriteResult(int SamplesInserted, int SampleDuplicates, int EventsInserted, int EventDuplicates, int DeadLettersStored);
