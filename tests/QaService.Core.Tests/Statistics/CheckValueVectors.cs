namespace QaService.Core.Tests.Statistics;

/// <summary>
/// Input vectors quoted from /work/shared/reference/check-values.md (the shared check-value sheet), section by section.
/// </summary>
internal static class CheckValueVectors
{
    /// <summary>§1 synthetic 20-point vector, east residuals (m), status C.</summary>
    public static readonly double[] SyntheticDE =
    [
        0.012, -0.020, 0.031, -0.008, 0.015, -0.027, 0.004, 0.022, -0.013, 0.009,
        -0.031, 0.018, 0.006, -0.016, 0.025, -0.005, 0.011, -0.022, 0.028, -0.010,
    ];

    /// <summary>§1 synthetic 20-point vector, north residuals (m), status C.</summary>
    public static readonly double[] SyntheticDN =
    [
        -0.015, 0.010, 0.021, -0.030, 0.005, 0.017, -0.022, 0.008, 0.026, -0.012,
        0.003, -0.019, 0.024, 0.014, -0.006, -0.025, 0.019, 0.002, -0.011, 0.020,
    ];

    /// <summary>§1 synthetic 20-point vector, vertical residuals (m), status C.</summary>
    public static readonly double[] SyntheticDU =
    [
        0.035, -0.041, 0.022, 0.058, -0.017, 0.030, -0.062, 0.011, 0.046, -0.025,
        0.009, -0.038, 0.051, -0.004, 0.027, -0.049, 0.016, 0.070, -0.033, 0.040,
    ];

    /// <summary>Half a unit in the 6th decimal: the printed precision of the §1 synthetic figures.</summary>
    public const double SixDecimals = 0.5e-6;
}
