using System.Text;
using System.Text.Json;
using QaService.Core.Reporting.Plots;

namespace QaService.Core.Reporting.Exports;

/// <summary>
/// The residual vectors as an RFC 7946 FeatureCollection: one Point per pair at its mark, coordinates
/// [longitude, latitude] in WGS 84 degrees (RFC 7946 §3.1.1, §4); residual components in metres, flags and the fix's
/// featureClass/crew/receiver (when given) as properties.
/// </summary>
public static class ResidualGeoJson
{
    public const string MediaType = "application/geo+json";

    public static string Write(AssessmentReport report) => Write(report, ResidualFlags.For(report));

    public static string Write(AssessmentReport report, IReadOnlyList<IReadOnlyList<string>> flags)
    {
        using var buffer = new MemoryStream();
        using (var json = new Utf8JsonWriter(buffer))
        {
            json.WriteStartObject();
            json.WriteString("type", "FeatureCollection");
            json.WriteString("assessment", report.Id);
            json.WriteStartArray("features");
            for (int i = 0; i < report.Residuals.Count; i++)
            {
                var r = report.Residuals[i];
                json.WriteStartObject();
                json.WriteString("type", "Feature");
                json.WriteStartObject("geometry");
                json.WriteString("type", "Point");
                json.WriteStartArray("coordinates");
                json.WriteNumberValue(r.MarkLongitude);
                json.WriteNumberValue(r.MarkLatitude);
                json.WriteEndArray();
                json.WriteEndObject();
                json.WriteStartObject("properties");
                json.WriteString("mark", r.Mark);
                json.WriteString("fix", r.Fix);
                json.WriteString("pairedBy", r.PairedBy);
                json.WriteNumber("dE", r.DE);
                json.WriteNumber("dN", r.DN);
                if (r.DU is { } du)
                    json.WriteNumber("dU", du);
                else
                    json.WriteNull("dU");
                json.WriteNumber("dH", r.DH);
                if (r.Excluded is { } why)
                    json.WriteString("excluded", why);
                else
                    json.WriteNull("excluded");
                json.WriteStartArray("flags");
                foreach (var flag in flags[i])
                    json.WriteStringValue(flag);
                json.WriteEndArray();
                // The fix's name attributes, only when given (as in the report's residuals).
                if (r.FeatureClass is { } featureClass)
                    json.WriteString("featureClass", featureClass);
                if (r.Crew is { } crew)
                    json.WriteString("crew", crew);
                if (r.Receiver is { } receiver)
                    json.WriteString("receiver", receiver);
                json.WriteEndObject();
                json.WriteEndObject();
            }

            json.WriteEndArray();
            json.WriteEndObject();
        }

        return Encoding.UTF8.GetString(buffer.ToArray());
    }
}
