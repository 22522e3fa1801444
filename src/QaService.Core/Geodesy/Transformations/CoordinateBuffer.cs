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

    /// <summary>A new buffer holding points <paramref name="start"/> … start + count − 1 of this one.</summary>
    public CoordinateBuffer Copy(int start, int count)
    {
        var copy = new CoordinateBuffer(count, EpochYears is not null);
        First.AsSpan(start, count).CopyTo(copy.First);
        Second.AsSpan(start, count).CopyTo(copy.Second);
        Third.AsSpan(start, count).CopyTo(copy.Third);
        EpochYears?.AsSpan(start, count).CopyTo(copy.EpochYears);
        return copy;
    }

    /// <summary>Writes this buffer's points into <paramref name="destination"/> from point <paramref name="start"/> on.</summary>
    public void CopyTo(CoordinateBuffer destination, int start)
    {
        First.CopyTo(destination.First, start);
        Second.CopyTo(destination.Second, start);
        Third.CopyTo(destination.Third, start);
        EpochYears?.CopyTo(destination.EpochYears!, start);
    }
}
