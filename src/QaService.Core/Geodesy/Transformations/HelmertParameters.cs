
namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// The seven Helmert parameters and, for a time-dependent (14-parameter) transformation, their rates
/// and reference epoch (EPSG Guidance Note 7-2 (IOGP 373-7-2) §4.3.3 "Helmert 7-parameter
/// transformations" and §4.3.5 "Time-dependent Helmert 7-parameter transformations", methods 1053/1056).
/// </summary>
/// <param name="Convention">Rotation sign convention.</param>
/// <param name="TxMetres">Translation X, metres.</param>
/// <param name="TyMetres">Translation Y, metres.</param>
/// <param name="TzMetres">Translation Z, metres.</param>
/// <param name="RxArcSeconds">Rotation about X, arc-seconds.</param>
/// <param name="RyArcSeconds">Rotation about Y, arc-seconds.</param>
/// <param name="RzArcSeconds">Rotation about Z, arc-seconds.</param>
/// <param name="ScalePpm">Scale difference dS, parts per million (M = 1 + dS·10⁻⁶).</param>
/// <param name="TxRateMetresPerYear">Rate of TX, metres per year (0 for a 7-parameter transformation).</param>
/// <param name="TyRateMetresPerYear">Rate of TY, metres per year.</param>
/// <param name="TzRateMetresPerYear">Rate of TZ, metres per year.</param>
/// <param name="RxRateArcSecondsPerYear">Rate of RX, arc-seconds per year.</param>
/// <param name="RyRateArcSecondsPerYear">Rate of RY, arc-seconds per year.</param>
/// <param name="RzRateArcSecondsPerYear">Rate of RZ, arc-seconds per year.</param>
/// <param name="ScaleRatePpmPerYear">Rate of dS, parts per million per year.</param>
/// <param name="ReferenceEpochYear">Parameter reference epoch t0, decimal year; null for a 7-parameter (static) transformation.</param>
/// <remarks>
/// GN 7-2 §4.3.5: each parameter at the observation epoch t is P(t) = P(t0) + Ṗ·(t − t0); the 7-parameter
/// formula is then applied with P(t). This is what PROJ's <c>+proj=helmert</c> does with <c>+t_epoch</c> and
/// the point's time coordinate.
/// </remarks>
public sealed record HelmertParameters(
    HelmertConvention Convention,
    double TxMetres, double TyMetres, double TzMetres,
    double RxArcSeconds, double RyArcSeconds, double RzArcSeconds,
    double ScalePpm,
    double TxRateMetresPerYear = 0, double TyRateMetresPerYear = 0, double TzRateMetresPerYear = 0,
    double RxRateArcSecondsPerYear = 0, double RyRateArcSecondsPerYear = 0, double RzRateArcSecondsPerYear = 0,
    double ScaleRatePpmPerYear = 0,
    double? ReferenceEpochYear = null)
{
    /// <summary>True for a 14-parameter (time-dependent) transformation.</summary>
    public bool IsTimeDependent => ReferenceEpochYear is not null;

    /// <summary>The rotation matrix, translation and scale at an observation epoch (ignored for static parameters).</summary>
    /// <param name="observationEpochYear">Decimal year; for a time-dependent set, null means the reference epoch (dt = 0, as PROJ does without a time coordinate).</param>
    public HelmertMatrix AtEpoch(double? observationEpochYear)
    {
        var dt = ReferenceEpochYear is { } t0 && observationEpochYear is { } t ? t - t0 : 0.0;
        return new HelmertMatrix(Convention,
            TxMetres + TxRateMetresPerYear * dt, TyMetres + TyRateMetresPerYear * dt, TzMetres + TzRateMetresPerYear * dt,
            RxArcSeconds + RxRateArcSecondsPerYear * dt, RyArcSeconds + RyRateArcSecondsPerYear * dt, RzArcSeconds + RzRateArcSecondsPerYear * dt,
            ScalePpm + ScaleRatePpmPerYear * dt);
    }

    /// <summary>The parameters in words, with units, for operation descriptions.</summary>
    public string Describe()
    {
        var convention = Convention == HelmertConvention.PositionVector ? "position vector" : "coordinate frame";
        var text = InvariantText.Format($"{convention} convention, tx {TxMetres:0.#####} m, ty {TyMetres:0.#####} m, tz {TzMetres:0.#####} m, rx {RxArcSeconds:0.########}″, ry {RyArcSeconds:0.########}″, rz {RzArcSeconds:0.########}″, ds {ScalePpm:0.#####} ppm");
        return ReferenceEpochYear is { } t0
            ? text + InvariantText.Format($"; rates dtx {TxRateMetresPerYear:0.#####} m/yr, dty {TyRateMetresPerYear:0.#####} m/yr, dtz {TzRateMetresPerYear:0.#####} m/yr, drx {RxRateArcSecondsPerYear:0.#########}″/yr, dry {RyRateArcSecondsPerYear:0.#########}″/yr, drz {RzRateArcSecondsPerYear:0.#########}″/yr, dds {ScaleRatePpmPerYear:0.######} ppm/yr; reference epoch {t0:0.0##}")
            : text;
    }
}
