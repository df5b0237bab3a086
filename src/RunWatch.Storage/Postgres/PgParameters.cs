using Npgsql;
using NpgsqlTypes;

namespace RunWatch.Storage.Postgres;

/// <summary>
/// Typed parameters: a null goes to the server with its type, so that <c>@x IS NULL OR ...</c> and inserts of nulls
/// never meet PostgreSQL's "could not determine data type of parameter".
/// </summary>
internal static class PgParameters
{
    public static void Text(NpgsqlCommand command, string name, string? value) =>
        command.Parameters.Add(new NpgsqlParameter(name, NpgsqlDbType.Text) { Value = (object?)value ?? DBNull.Value });

    public static void Long(NpgsqlCommand command, string name, long? value) =>
        command.Parameters.Add(new NpgsqlParameter(name, NpgsqlDbType.Bigint) { Value = value is { } v ? v : DBNull.Value });

    public static void Int(NpgsqlCommand command, string name, int? value) =>
        command.Parameters.Add(new NpgsqlParameter(name, NpgsqlDbType.Integer) { Value = value is { } v ? v : DBNull.Value });

    public static void Double(NpgsqlCommand command, string name, double? value) =>
        command.Parameters.Add(new NpgsqlParameter(name, NpgsqlDbType.Double) { Value = value is { } v ? v : DBNull.Value });

    public static void Bytes(NpgsqlCommand command, string name, byte[] value) =>
        command.Parameters.Add(new NpgsqlParameter(name, NpgsqlDbType.Bytea) { Value = value });

    public static void Micros(NpgsqlCommand command, string name, DateTimeOffset? value) =>
        Long(command, name, value is { } v ? UnixMicros.From(v) : null);
}
