namespace RunWatch.Storage.Postgres;

/// <summary>
/// How the PostgreSQL store writes a batch of samples idempotently. All three report, row by row, which samples were
/// new. Chosen by measurement (docs/fleet.md, benchmark <c>pg-write</c>); the others stay for the benchmark.
/// </summary>
public enum PostgresSampleWrite
{
    /// <summary>Arrays of the batch's columns bound as five parameters, <c>INSERT ... SELECT FROM unnest(...) ON CONFLICT DO NOTHING</c>.</summary>
    UnnestArrays,

    /// <summary>Binary <c>COPY</c> into a temporary staging table, then <c>INSERT ... SELECT ... ON CONFLICT DO NOTHING</c>.</summary>
    CopyStaging,

    /// <summary>Multi-row <c>INSERT ... VALUES (...), (...) ON CONFLICT DO NOTHING</c> in chunks of 1000 rows.</summary>
    MultiRowInsert,
}
