namespace QaService.Core.Geodesy.Projections;

/// <summary>EPSG coordinate-operation parameter codes used by the implemented methods (EPSG dataset, table "Coordinate_Operation Parameter").</summary>
public static class ProjectionParameterCodes
{
    /// <summary>Latitude of natural origin (degrees).</summary>
    public const int LatitudeOfNaturalOrigin = 8801;
    /// <summary>Longitude of natural origin (degrees).</summary>
    public const int LongitudeOfNaturalOrigin = 8802;
    /// <summary>Scale factor at natural origin (unity).</summary>
    public const int ScaleFactorAtNaturalOrigin = 8805;
    /// <summary>False easting (metres).</summary>
    public const int FalseEasting = 8806;
    /// <summary>False northing (metres).</summary>
    public const int FalseNorthing = 8807;
    /// <summary>Latitude of projection centre (degrees).</summary>
    public const int LatitudeOfProjectionCentre = 8811;
    /// <summary>Longitude of projection centre (degrees).</summary>
    public const int LongitudeOfProjectionCentre = 8812;
    /// <summary>Azimuth of initial line (degrees).</summary>
    public const int AzimuthOfInitialLine = 8813;
    /// <summary>Angle from Rectified to Skew Grid (degrees).</summary>
    public const int AngleFromRectifiedToSkewGrid = 8814;
    /// <summary>Scale factor on initial line (unity).</summary>
    public const int ScaleFactorOnInitialLine = 8815;
    /// <summary>Easting at projection centre (metres).</summary>
    public const int EastingAtProjectionCentre = 8816;
    /// <summary>Northing at projection centre (metres).</summary>
    public const int NorthingAtProjectionCentre = 8817;
    /// <summary>Latitude of false origin (degrees).</summary>
    public const int LatitudeOfFalseOrigin = 8821;
    /// <summary>Longitude of false origin (degrees).</summary>
    public const int LongitudeOfFalseOrigin = 8822;
    /// <summary>Latitude of 1st standard parallel (degrees).</summary>
    public const int LatitudeOf1stStandardParallel = 8823;
    /// <summary>Latitude of 2nd standard parallel (degrees).</summary>
    public const int LatitudeOf2ndStandardParallel = 8824;
    /// <summary>Easting at false origin (metres).</summary>
    public const int EastingAtFalseOrigin = 8826;
    /// <summary>Northing at false origin (metres).</summary>
    public const int NorthingAtFalseOrigin = 8827;
    /// <summary>Latitude of standard parallel (degrees).</summary>
    public const int LatitudeOfStandardParallel = 8832;
    /// <summary>Longitude of origin (degrees).</summary>
    public const int LongitudeOfOrigin = 8833;
    /// <summary>Initial longitude (degrees), Transverse Mercator Zoned Grid System.</summary>
    public const int InitialLongitude = 8830;
    /// <summary>Zone width (degrees), Transverse Mercator Zoned Grid System.</summary>
    public const int ZoneWidth = 8831;
    /// <summary>Projection plane origin height (metres), Colombia Urban.</summary>
    public const int ProjectionPlaneOriginHeight = 1039;
    /// <summary>Ellipsoid scaling factor (unity), Lambert Conic Conformal (2SP Michigan).</summary>
    public const int EllipsoidScalingFactor = 1038;
}
