using QaService.Core.Assessment;
using QaService.Core.Screening;

namespace QaService.Core.Ingest;

/// <summary>
/// What a receiver said (GPX fix/hdop, NMEA GGA/GST) put onto the point's own fields, so it reaches the residual and the
/// calibration of screening: HDOP, the solution kind in the screening words, and NMEA GST's latitude/longitude 1σ as the
/// per-axis σ the point's <c>sigmaH</c> means, √((σ_lat² + σ_lon²)/2) (the quadratic mean of the two axes: the same
/// radial σ, √(σ_lat² + σ_lon²), as the receiver's). A value the point already gives is kept.
/// </summary>
internal static class ReceiverFields
{
    public static PointRecord Onto(PointRecord point, ReceiverReport? receiver)
    {
        if (receiver is null)
            return point;
        double? sigma = receiver is { SigmaLatitudeMetres: { } la, SigmaLongitudeMetres: { } lo } ? Math.Sqrt((la * la + lo * lo) / 2) : null;
        return point with
        {
            Hdop = point.Hdop ?? receiver.Hdop,
            Quality = point.Quality ?? Word(receiver.Quality),
            SigmaH = point.SigmaH ?? sigma,
        };
    }

    /// <summary>The screening word of a receiver's solution kind. NMEA GGA 2 and GPX dgps do not tell SBAS from ground DGNSS: <c>dgnss</c>.</summary>
    public static string? Word(FixQuality? quality) => quality switch
    {
        FixQuality.Autonomous => ScreeningQuality.Names.Autonomous,
        FixQuality.Differential => ScreeningQuality.Names.Dgnss,
        FixQuality.Ppp => ScreeningQuality.Names.Ppp,
        FixQuality.RtkFloat => ScreeningQuality.Names.RtkFloat,
        FixQuality.RtkFixed => ScreeningQuality.Names.RtkFixed,
        FixQuality.NotMeasured => ScreeningQuality.Names.Invalid,
        _ => null,
    };
}
