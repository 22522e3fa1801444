namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// Points as three parallel arrays (structure of arrays), transformed in place by an operation's steps so a
/// batch needs no allocation per point. What the arrays hold changes along the way: geographic (latitude °,
/// longitude °, ellipsoidal height m), geocentric (X, Y, Z m) or projected (easting, northing, height in the CRS unit).
/// A point that cannot be transformed becomes NaN.
/// </summary>
public sealed class CoordinateBuffer
{
    /// <param name="count">Number of points.</param>
    /// <param name="withEpochs">True to hold an observation epoch (decimal year, NaN = none) per point.</param>
    public CoordinateBuffer(int count, bool withEpochs = false)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        First = new double[count];
        Second = new double[count];
        Third = new double[count];
        EpochYears = withEpochs ? new double[count] : null;
        if (EpochYears is not null)
            Array.Fill(EpochYears, double.NaN);
    }

    /// <summary>Latitude °, X m or easting.</summary>
    public double[] First { get; }

    /// <summary>Longitude °, Y m or northing.</summary>
    public double[] Second { get; }

    /// <summary>Height m, Z m, or height in the CRS unit.</summary>
    public double[] Third { get; }

    /// <summary>Observation epoch per point, decimal year; NaN where unknown; null when none was given.</summary>
    public double[]? EpochYears { get; }

    public int Count => First.Length;
}
