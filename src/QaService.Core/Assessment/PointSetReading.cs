using static QaService.Core.InvariantText;
using System.Globalization;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Assessment;

/// <summary>
/// Reads the points of one set into the common geodetic frame (<see cref="PointConversion"/>), with a JSON
/// pointer for every problem. A large set is read in slices on several threads; the slices' points and
/// problems are joined in point order, so the result and the order of the problems do not depend on it.
/// </summary>
internal static class PointSetReading
{
    /// <summary>
    /// Points from which a set is read in slices (common practice: below a few tens of thousands of points the
    /// work is a few milliseconds and not worth a thread hand-off, and small requests keep one thread each).
    /// </summary>
    private const int SlicedFromPoints = 65_536;

    /// <param name="markCheck">For fixes: the mark ids they may name, and where a fix naming another is reported. Null for marks.</param>
    public static List<FramedPoint> Read(PointSet set, PointSetFrame frame, string pointer, List<InputError> errors, MarkCheck? markCheck = null)
    {
        var count = set.Points?.Count ?? 0;
        if (set.Points is null)
            return [];
        var slices = count < SlicedFromPoints ? 1 : Math.Min(Environment.ProcessorCount, count / (SlicedFromPoints / 2));
        if (slices <= 1)
        {
            var result = new List<FramedPoint>(count);
            ReadSlice(set.Points, frame, pointer, markCheck, 0, count, result, errors, markCheck?.Unknown);
            return result;
        }
        var points = new List<FramedPoint>[slices];
        var problems = new List<InputError>[slices];
        var unknownMarks = new List<InputError>[slices];
        Parallel.For(0, slices, slice =>
        {
            var (from, to) = ((int)((long)count * slice / slices), (int)((long)count * (slice + 1) / slices));
            // The first slice's list takes the whole set, so joining adds the others to it rather than copying all into a third list.
            points[slice] = new List<FramedPoint>(slice == 0 ? count : to - from);
            problems[slice] = [];
            unknownMarks[slice] = [];
            ReadSlice(set.Points, frame, pointer, markCheck, from, to, points[slice], problems[slice], unknownMarks[slice]);
        });
        var joined = points[0];
        for (var slice = 0; slice < slices; slice++)
        {
            if (slice > 0)
                joined.AddRange(points[slice]);
            errors.AddRange(problems[slice]);
            markCheck?.Unknown.AddRange(unknownMarks[slice]);
        }
        return joined;
    }

    private static void ReadSlice(IReadOnlyList<PointRecord?> points, PointSetFrame frame, string pointer, MarkCheck? markCheck, int from, int to,
        List<FramedPoint> result, List<InputError> errors, List<InputError>? unknownMarks)
    {
        var isMark = markCheck is null;
        var useHeight = frame.Heights != HeightReference.None;
        var columns = points as IPointValueList;
        for (var i = from; i < to; i++)
        {
            var pointPointer = new PointPointer(pointer, i);
            PointValues point;
            var present = columns is not null ? columns.TryGetValues(i, out point) : TryCopy(points[i], out point);
            if (!present)
            {
                errors.Add(new(pointPointer, "a point must be an object, not null"));
                continue;
            }
            var id = ReadId(point, pointPointer, isMark, i, errors);
            if (!isMark && point.Mark is { } mark && string.IsNullOrWhiteSpace(mark))
                errors.Add(new($"{pointPointer}/mark", "mark must name a mark id, or be left out"));
            CheckSigma(point.SigmaH, pointPointer, "sigmaH", errors);
            CheckSigma(point.SigmaV, pointPointer, "sigmaV", errors);
            var geodetic = PointConversion.ToGeodetic(frame.Crs, point, pointPointer, useHeight, errors);
            if (geodetic is null || id is null)
                continue;
            var hasHeight = useHeight && (point.H is not null || frame.Crs.Kind == CrsKind.Geocentric);
            var markId = point.Mark?.Trim();
            var velocity = columns is null && points[i] is { } record ? ReadVelocity(record, pointPointer, isMark, errors) : null;
            result.Add(new FramedPoint(i, id, markId, geodetic.Value, hasHeight,
                point.SigmaH is { } sh ? sh * frame.Crs.Unit.MetresPerUnit : null,
                point.SigmaV is { } sv ? sv * frame.Crs.Unit.MetresPerUnit : null,
                point.Time) { VelocityMetresPerYear = velocity });
            if (markId is { Length: > 0 } && markCheck is not null && !markCheck.Known.Contains(markId))
                unknownMarks!.Add(new(Format($"{pointer}/points/{i}/mark"), $"no mark has the id \"{markId}\""));
        }
    }

    /// <summary>Largest velocity taken as plausible, metres per year (plates move up to ~0.15 m/yr; common practice).</summary>
    private const double MaximumVelocityMetresPerYear = 1.0;

    /// <summary>A mark's vE/vN/vU (all three or none; up may be left out as 0), metres per year.</summary>
    private static EnuVector? ReadVelocity(PointRecord record, PointPointer pointer, bool isMark, List<InputError> errors)
    {
        if (record.VE is null && record.VN is null && record.VU is null)
            return null;
        if (!isMark)
        {
            errors.Add(new($"{pointer}/vE", "velocities belong to marks (they carry a mark to the fixes' epoch); leave vE/vN/vU out of fixes"));
            return null;
        }
        var ok = true;
        foreach (var (value, field) in new[] { (record.VE, "vE"), (record.VN, "vN"), (record.VU ?? 0, "vU") })
        {
            if (value is null)
            {
                errors.Add(new($"{pointer}/{field}", "a velocity needs vE and vN (vU optional), metres per year"));
                ok = false;
            }
            else if (!double.IsFinite(value.Value) || Math.Abs(value.Value) > MaximumVelocityMetresPerYear)
            {
                errors.Add(new($"{pointer}/{field}", Format($"{field} {value} is not a velocity within ±{MaximumVelocityMetresPerYear} m/yr")));
                ok = false;
            }
        }
        return ok ? new EnuVector(record.VE!.Value, record.VN!.Value, record.VU ?? 0) : null;
    }

    private static bool TryCopy(PointRecord? record, out PointValues point)
    {
        point = record is null ? default : PointValues.Of(record);
        return record is not null;
    }

    private static string? ReadId(in PointValues point, PointPointer pointer, bool isMark, int index, List<InputError> errors)
    {
        if (string.IsNullOrWhiteSpace(point.Id))
        {
            if (!isMark)
                return string.Create(CultureInfo.InvariantCulture, $"#{index + 1}");
            errors.Add(new($"{pointer}/id", "every mark needs an id (fixes name it in \"mark\")"));
            return null;
        }
        if (point.Id.Length > RequestValidator.MaximumTextLength)
        {
            errors.Add(new($"{pointer}/id", $"id is longer than {RequestValidator.MaximumTextLength} characters"));
            return null;
        }
        return point.Id.Trim();
    }

    private static void CheckSigma(double? sigma, PointPointer point, string field, List<InputError> errors)
    {
        if (sigma is { } s && (!double.IsFinite(s) || s < 0))
            errors.Add(new($"{point}/{field}", Format($"{sigma} is not a standard deviation: give a non-negative number in the CRS unit")));
    }
}

/// <summary>The mark ids the fixes may name, and the problems of fixes that name another (in fix order).</summary>
internal sealed record MarkCheck(IReadOnlySet<string> Known, List<InputError> Unknown);
