using System.Diagnostics.Metrics;

namespace QaService.Api.Observability;

/// <summary>
/// The service's own instruments (meter <c>QaService</c>), exported with ASP.NET Core's request
/// metrics (<c>http.server.request.duration</c>: count and duration per route and status) at
/// <c>/metrics</c> in Prometheus text format.
/// </summary>
internal sealed class QaMetrics
{
    public const string MeterName = "QaService";

    private readonly Counter<long> assessments;
    private readonly Counter<long> points;
    private double warmUpSeconds = double.NaN; // NaN until the warm-up has finished

    public QaMetrics(IMeterFactory meters)
    {
        var meter = meters.Create(MeterName);
        assessments = meter.CreateCounter<long>("qaservice.assessments", unit: "{assessment}", description: "Assessments stored, by verdict");
        meter.CreateObservableGauge("qaservice.warmup.duration", () => Volatile.Read(ref warmUpSeconds) is var seconds && !double.IsNaN(seconds) ? [new Measurement<double>(seconds)] : Array.Empty<Measurement<double>>(),
            unit: "s", description: "Time the start-up warm-up upload took; absent until it has finished");
        points = meter.CreateCounter<long>("qaservice.points.processed", unit: "{point}", description: "Marks and fixes read by stored assessments and transform requests");
    }

    public void AssessmentStored(string verdict, int pointCount)
    {
        assessments.Add(1, new KeyValuePair<string, object?>("verdict", verdict));
        points.Add(pointCount, new KeyValuePair<string, object?>("endpoint", "assessments"));
    }

    public void WarmUpFinished(double seconds) => Volatile.Write(ref warmUpSeconds, seconds);

    public void PointsTransformed(int pointCount) => points.Add(pointCount, new KeyValuePair<string, object?>("endpoint", "transform"));
}
