using System.Buffers;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>Grid (CRS unit) → geographic: inverse map projection; heights to metres. Exact up to the projection's own accuracy.</summary>
public sealed class InverseProjectionStep(IMapProjection projection, LinearUnit unit, string crsName) : IOperationStep
{
    public string Description => $"inverse {projection.MethodName} ({crsName}) to latitude/longitude" +
                                 (unit.MetresPerUnit == 1.0 ? "" : $", {unit.PluralName} to metres");

    public double AccuracyMetres => 0;

    public void Apply(CoordinateBuffer points)
    {
        var k = unit.MetresPerUnit;
        for (var i = 0; i < points.Count; i++)
        {
            try
            {
                var (lat, lon) = projection.Inverse(points.First[i] * k, points.Second[i] * k);
                points.First[i] = lat;
                points.Second[i] = lon;
                points.Third[i] *= k;
            }
            catch (ArgumentOutOfRangeException)
            {
                points.First[i] = points.Second[i] = double.NaN;
            }
        }
    }
}

/// <summary>Geographic → grid (CRS unit): forward map projection; heights from metres to the CRS unit.</summary>
public sealed class ForwardProjectionStep(IMapProjection projection, LinearUnit unit, string crsName) : IOperationStep
{
    public string Description => $"{projection.MethodName} ({crsName})" +
                                 (unit.MetresPerUnit == 1.0 ? "" : $", metres to {unit.PluralName}");

    public double AccuracyMetres => 0;

    /// <summary>Points per call of the batch projection (its output buffers are pooled at this size).</summary>
    private const int BatchPoints = 1024;

    public void Apply(CoordinateBuffer points)
    {
        var k = 1.0 / unit.MetresPerUnit;
        if (projection is TransverseMercator transverseMercator)
        {
            ApplyBatch(transverseMercator, points, k);
            return;
        }

        ApplyPointByPoint(points, 0, points.Count, k);
    }

    /// <summary>
    /// Transverse Mercator through its batch (vectorised) forward method, a block at a time; a point outside the domain
    /// becomes NaN on its own, and every other point gets the same bits wherever it sits in the request.
    /// </summary>
    private static void ApplyBatch(TransverseMercator transverseMercator, CoordinateBuffer points, double k)
    {
        var eastings = ArrayPool<double>.Shared.Rent(BatchPoints);
        var northings = ArrayPool<double>.Shared.Rent(BatchPoints);
        try
        {
            for (var start = 0; start < points.Count; start += BatchPoints)
            {
                var length = Math.Min(BatchPoints, points.Count - start);
                transverseMercator.ForwardOrNaN(points.First.AsSpan(start, length), points.Second.AsSpan(start, length), eastings, northings);
                for (var i = 0; i < length; i++)
                {
                    points.First[start + i] = eastings[i] * k;
                    points.Second[start + i] = northings[i] * k;
                    points.Third[start + i] *= k;
                }
            }
        }
        finally
        {
            ArrayPool<double>.Shared.Return(eastings);
            ArrayPool<double>.Shared.Return(northings);
        }
    }

    private void ApplyPointByPoint(CoordinateBuffer points, int start, int length, double k)
    {
        for (var i = start; i < start + length; i++)
        {
            try
            {
                var p = projection.Forward(points.First[i], points.Second[i]);
                points.First[i] = p.EastingMetres * k;
                points.Second[i] = p.NorthingMetres * k;
                points.Third[i] *= k;
            }
            catch (ArgumentOutOfRangeException)
            {
                points.First[i] = points.Second[i] = double.NaN;
            }
        }
    }
}

/// <summary>Geographic → geocentric on an ellipsoid (EPSG method 9602, GN 7-2 §4.1.1). Exact.</summary>
public sealed class GeographicToGeocentricStep(Ellipsoid ellipsoid) : IOperationStep
{
    public string Description => $"latitude/longitude/height to geocentric X/Y/Z ({ellipsoid.Name} ellipsoid)";

    public double AccuracyMetres => 0;

    public void Apply(CoordinateBuffer points)
    {
        for (var i = 0; i < points.Count; i++)
        {
            if (!double.IsFinite(points.First[i]) || !double.IsFinite(points.Second[i]) || Math.Abs(points.First[i]) > 90)
            {
                points.First[i] = points.Second[i] = points.Third[i] = double.NaN;
                continue;
            }
            var xyz = GeocentricConversion.ToGeocentric(new GeodeticCoordinate(points.First[i], points.Second[i], points.Third[i]), ellipsoid);
            points.First[i] = xyz.XMetres;
            points.Second[i] = xyz.YMetres;
            points.Third[i] = xyz.ZMetres;
        }
    }
}

/// <summary>Geocentric → geographic on an ellipsoid (EPSG method 9602; Vermeille 2011 closed form). Exact.</summary>
public sealed class GeocentricToGeographicStep(Ellipsoid ellipsoid) : IOperationStep
{
    public string Description => $"geocentric X/Y/Z to latitude/longitude/height ({ellipsoid.Name} ellipsoid)";

    public double AccuracyMetres => 0;

    public void Apply(CoordinateBuffer points)
    {
        for (var i = 0; i < points.Count; i++)
        {
            if (!double.IsFinite(points.First[i]) || !double.IsFinite(points.Second[i]) || !double.IsFinite(points.Third[i]))
            {
                points.First[i] = points.Second[i] = points.Third[i] = double.NaN;
                continue;
            }
            var p = GeocentricConversion.ToGeodetic(new GeocentricCoordinate(points.First[i], points.Second[i], points.Third[i]), ellipsoid);
            points.First[i] = p.LatitudeDegrees;
            points.Second[i] = p.LongitudeDegrees;
            points.Third[i] = p.EllipsoidalHeightMetres;
        }
    }
}
