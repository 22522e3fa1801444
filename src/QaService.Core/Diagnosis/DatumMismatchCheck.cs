using static QaService.Core.InvariantText;
using QaService.Core.Assessment;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;
using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Datum or frame mismatch: when the mean horizontal offset is significant (Hotelling's T², 5 %), it is compared with the
/// shift that a wrong frame label would cause at the marks' centroid and the fixes' epoch, for every frame the geodesy
/// engine knows (<see cref="CrsCatalog"/> datums, <see cref="CoordinateOperationPlanner"/> over <see cref="DatumGraph"/>
/// with the EPSG Helmert table). Two hypotheses per frame X: the fixes were really in X but labelled with their declared
/// frame (residual ≈ coords_X − coords_declared), or the marks were (residual ≈ coords_declared − coords_X). The closest
/// candidate within max(3·SE of the mean, 25 % of the candidate shift, 0.10 m) is named. Frames the engine treats as
/// equivalent (shift under <see cref="SmallestTellingShiftMetres"/>) cannot be told apart and are skipped. Status warn
/// (a likely cause, never proof).
/// </summary>
public sealed class DatumMismatchCheck : IDataCheck
{
    /// <summary>Candidate shifts below this (m) are indistinguishable from noise and equivalent frames.</summary>
    public const double SmallestTellingShiftMetres = 0.2;

    /// <summary>Smallest match tolerance, metres (engine accuracy of the Helmert sets is centimetres to decimetres).</summary>
    public const double MinimumToleranceMetres = 0.10;

    /// <summary>Share of the candidate shift allowed as mismatch (frames drift, epochs are approximate).</summary>
    public const double RelativeTolerance = 0.25;

    public string Id => "datum-mismatch";

    public CheckResult Evaluate(CheckContext context)
    {
        var included = context.Included;
        var test = context.Columns.MeanOffsetTest;
        if (test is null || !test.Significant)
            return new CheckResult(Id, CheckStatus.Pass, "no significant horizontal offset, so no frame mismatch to explain");
        var shift = Math.Sqrt(test.MeanE * test.MeanE + test.MeanN * test.MeanN);
        if (shift < SmallestTellingShiftMetres)
            return new CheckResult(Id, CheckStatus.Pass, Format($"the mean offset ({shift:F3} m) is smaller than any frame difference the service can tell apart"), shift, SmallestTellingShiftMetres, "m");

        var input = context.Input;
        var marks = context.Columns.TestedMarks.Select(m => m.Geodetic).ToList();
        var centroid = new GeodeticCoordinate(marks.Average(g => g.LatitudeDegrees), marks.Average(g => g.LongitudeDegrees), marks.Average(g => g.EllipsoidalHeightMetres));
        var epoch = input.FixesFrame.EpochDecimalYear ?? input.MarksFrame.EpochDecimalYear
                    ?? Assessment.FrameAlignment.TimesAsDecimalYears(Assessment.FixTable.Of(input.Fixes)).DefaultIfEmpty(double.NaN).Average();
        var sd = Math.Sqrt((Variance(context.Columns.East) + Variance(context.Columns.North)) / 2);
        var standardError = sd / Math.Sqrt(included.Count);

        var candidates = FrameShifts.Candidates(input.MarksFrame.Crs, input.FixesFrame.Crs, centroid, epoch)
            .Where(c => c.ShiftMetres >= SmallestTellingShiftMetres)
            .Select(c => (Candidate: c, Distance: Math.Sqrt(Math.Pow(c.East - test.MeanE, 2) + Math.Pow(c.North - test.MeanN, 2))))
            .Where(c => c.Distance <= Math.Max(Math.Max(3 * standardError, RelativeTolerance * c.Candidate.ShiftMetres), MinimumToleranceMetres))
            .OrderBy(c => c.Distance)
            .ToList();
        var epochText = double.IsNaN(epoch) ? "the frames' reference epochs" : Format($"epoch {epoch:0.0##}");
        if (candidates.Count == 0)
        {
            return new CheckResult(Id, CheckStatus.Pass,
                Format($"the {shift:F3} m offset (mean dE {test.MeanE:+0.000;-0.000}, dN {test.MeanN:+0.000;-0.000} m) matches no frame pair known to the service at the marks and {epochText}; look for another cause (wrong zone, shared typo, a local site calibration)"),
                shift, null, "m");
        }
        var best = candidates[0];
        var others = candidates.Skip(1).Take(3).Select(c => c.Candidate.Label).ToList();
        return new CheckResult(Id, CheckStatus.Warn,
            Format($"the {shift:F3} m offset (mean dE {test.MeanE:+0.000;-0.000}, dN {test.MeanN:+0.000;-0.000} m) matches {best.Candidate.Label}: that would shift positions by dE {best.Candidate.East:+0.000;-0.000}, dN {best.Candidate.North:+0.000;-0.000} m here at {epochText} (difference {best.Distance:F3} m)")
            + (others.Count > 0 ? "; also close: " + string.Join("; ", others) : "")
            + ". Fix: check which frame (and epoch) each side's coordinates really are in, and declare it in \"crs\"/\"epoch\"",
            best.Distance, Math.Max(Math.Max(3 * standardError, RelativeTolerance * best.Candidate.ShiftMetres), MinimumToleranceMetres), "m");
    }

    private static double Variance(double[] values)
    {
        var mean = values.Average();
        return values.Length < 2 ? 0 : values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1);
    }
}

/// <summary>Shifts a mislabelled frame would cause at one place and epoch, from the geodesy engine.</summary>
public static class FrameShifts
{
    /// <summary>One hypothesis: residual (fix − mark) expected if a side's coordinates were really in another frame.</summary>
    /// <param name="Label">E.g. "fixes in ITRF2014 labelled as NAD83(2011)".</param>
    /// <param name="East">Expected east residual, m.</param>
    /// <param name="North">Expected north residual, m.</param>
    public sealed record Candidate(string Label, double East, double North)
    {
        public double ShiftMetres => Math.Sqrt(East * East + North * North);
    }

    private static readonly Lazy<IReadOnlyList<CoordinateReferenceSystem>> GeographicByDatum = new(() =>
        CrsCatalog.All.Where(c => c.Kind == CrsKind.Geographic)
            .GroupBy(c => c.Datum.Code, StringComparer.Ordinal)
            .Select(g => g.First())
            .ToList());

    /// <summary>All hypotheses for marks declared in <paramref name="marksCrs"/> and fixes in <paramref name="fixesCrs"/>.</summary>
    /// <param name="centroid">Marks' centroid in the marks' frame (degrees, m).</param>
    /// <param name="epoch">Observation epoch, decimal year; NaN for the frames' reference epochs.</param>
    public static IReadOnlyList<Candidate> Candidates(CoordinateReferenceSystem marksCrs, CoordinateReferenceSystem fixesCrs, GeodeticCoordinate centroid, double epoch)
    {
        var result = new List<Candidate>();
        var marksGeographic = Geographic(marksCrs);
        var fixesGeographic = Geographic(fixesCrs);
        var atFixes = Transform(marksGeographic, fixesGeographic, centroid, epoch) ?? centroid;
        // Only frames used where the marks are: a national datum of another continent is no plausible mislabelling, and
        // planning against all ~400 catalog datums would cost more than the rest of the assessment.
        foreach (var other in GeographicByDatum.Value.Where(c => c.AreaOfUse is null || c.AreaOfUse.DegreesOutside(centroid.LatitudeDegrees, centroid.LongitudeDegrees) == 0))
        {
            if (other.Datum.Code != fixesCrs.Datum.Code && Transform(fixesGeographic, other, atFixes, epoch) is { } inOther)
            {
                // Fixes really in `other`, read as their declared frame: residual = coords_other − coords_declared.
                var (e, n) = EastNorth(atFixes, inOther, fixesCrs.Ellipsoid);
                result.Add(new Candidate($"fixes in {other.Datum.Name} labelled as {fixesCrs.Datum.Name}", e, n));
            }
            if (other.Datum.Code != marksCrs.Datum.Code && Transform(marksGeographic, other, centroid, epoch) is { } marksInOther)
            {
                // Marks really in `other`, read as their declared frame: residual = coords_declared − coords_other.
                var (e, n) = EastNorth(marksInOther, centroid, marksCrs.Ellipsoid);
                result.Add(new Candidate($"marks in {other.Datum.Name} labelled as {marksCrs.Datum.Name}", e, n));
            }
        }
        return result;
    }

    private static CoordinateReferenceSystem Geographic(CoordinateReferenceSystem crs) =>
        crs.Kind == CrsKind.Geographic && crs.Unit == LinearUnit.Metre
            ? crs
            : crs with { Kind = CrsKind.Geographic, Projection = null, Unit = LinearUnit.Metre, HasHeightAxis = true };

    private static GeodeticCoordinate? Transform(CoordinateReferenceSystem from, CoordinateReferenceSystem to, GeodeticCoordinate point, double epoch)
    {
        if (from.Datum.Code == to.Datum.Code)
            return point;
        var plan = CoordinateOperationPlanner.Plan(from, to);
        if (plan.Operation is null)
            return null;
        var buffer = new CoordinateBuffer(1, withEpochs: true);
        buffer.First[0] = point.LatitudeDegrees;
        buffer.Second[0] = point.LongitudeDegrees;
        buffer.Third[0] = point.EllipsoidalHeightMetres;
        buffer.EpochYears![0] = epoch;
        plan.Operation.Execute(buffer);
        return double.IsFinite(buffer.First[0]) ? new GeodeticCoordinate(buffer.First[0], buffer.Second[0], buffer.Third[0]) : null;
    }

    /// <summary>East/north of <paramref name="to"/> minus <paramref name="from"/>, both read on one ellipsoid, metres.</summary>
    private static (double East, double North) EastNorth(GeodeticCoordinate from, GeodeticCoordinate to, Ellipsoid ellipsoid)
    {
        var origin = GeocentricConversion.ToGeocentric(from, ellipsoid);
        var enu = LocalTangentPlane.Difference(origin, from, GeocentricConversion.ToGeocentric(to, ellipsoid));
        return (enu.EastMetres, enu.NorthMetres);
    }
}
