using System.Text.Json;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace RunWatch.Ingest.Health;

/// <summary>Writes the health report as JSON: overall status and each check's status, description and data.</summary>
public static class HealthResponseWriter
{
    /// <summary>For <c>HealthCheckOptions.ResponseWriter</c>.</summary>
    public static async Task WriteAsync(HttpContext context, HealthReport report)
    {
        ArgumentNullException.ThrowIfNull(context);
        ArgumentNullException.ThrowIfNull(report);
        context.Response.ContentType = "application/json; charset=utf-8";
        var writer = new Utf8JsonWriter(context.Response.BodyWriter, new JsonWriterOptions { Indented = true });
        await using (writer.ConfigureAwait(false))
        {
            writer.WriteStartObject();
            writer.WriteString("status", report.Status.ToString());
            writer.WriteStartObject("checks");
            foreach (var (name, entry) in report.Entries)
            {
                writer.WriteStartObject(name);
                writer.WriteString("status", entry.Status.ToString());
                writer.WriteString("description", entry.Description);
                foreach (var (key, value) in entry.Data)
                {
                    writer.WritePropertyName(key);
                    JsonSerializer.Serialize(writer, value, value.GetType(), HealthJsonContext.Default);
                }
                writer.WriteEndObject();
            }
            writer.WriteEndObject();
            writer.WriteEndObject();
        }
    }
}
