namespace QaService.Core.Geodesy;

/// <summary>
/// A vector expressed in a local east-north-up (topocentric) frame (EPSG Guidance Note 7-2 §4.1.2):
/// east along the parallel, north along the meridian, up along the ellipsoid normal at the frame origin.
/// </summary>
/// <param name="EastMetres">East component, metres.</param>
/// <param name="NorthMetres">North component, metres.</param>
/// <param name="UpMetres">Up component (along the ellipsoidal normal), metres.</param>
public readonly record struct EnuVector(double EastMetres, double NorthMetres, double UpMetres);
