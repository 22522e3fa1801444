using static QaService.Core.InvariantText;
using System.Globalization;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Ingest;

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

    /// <summary>Reads the marks (no mark check: they are what the fixes name).</summary>
    public static List<FramedPoint> ReadMarks(PointSet set, PointSetFrame frame, string pointer, List<InputError> errors)
    {
        var target = new MarkSlots(set.Points?.Count ?? 0);
        ReadInto(set, frame, pointer, errors, null, target);
        return target.Joined();
    }

    /// <summary>Reads the fixes into columns.</summary>
    /// <param name="markCheck">The mark ids the fixes may name, and where a fix naming another is reported.</param>
    public static FixTable ReadFixes(PointSet set, PointSetFrame frame, string pointer, List<InputError> errors, MarkCheck markCheck)
    {
        var target = new FixColumns(set.Points?.Count ?? 0, (set.Points as PointColumns)?.Ids.Characters);
        ReadInto(set, frame, pointer, errors, markCheck, target);
        return target.Joined();
    }

    private static void ReadInto(PointSet set, PointSetFrame frame, string pointer, List<InputError> errors, MarkCheck? markCheck, PointTarget target)
    {
        var count = set.Points?.Count ?? 0;
        if (set.Points is null)
            return;
        var slices = count < SlicedFromPoints ? 1 : Math.Min(Environment.ProcessorCount, count / (SlicedFromPoints / 2));
        if (slices <= 1)
        {
            ReadSlice(set.Points, frame, pointer, markCheck, 0, count, target, errors, markCheck?.Unknown);
            return;
        }
        var problems = new List<InputError>[slices];
        var unknownMarks = new List<InputError>[slices];
        Parallel.For(0, slices, slice =>
        {
            var (from, to) = ((int)((long)count * slice / slices), (int)((long)count * (slice + 1) / slices));
            problems[slice] = [];
            unknownMarks[slice] = [];
            ReadSlice(set.Points, frame, pointer, markCheck, from, to, target, problems[slice], unknownMarks[slice]);
        });
        for (var slice = 0; slice < slices; slice++)
        {
            errors.AddRange(problems[slice]);
            markCheck?.Unknown.AddRange(unknownMarks[slice]);
        }
    }

    /// <summary>
    /// A read point's id: its string (a JSON point), or its place in the file's ids (a point read from a file, trimmed;
    /// <see cref="IdTexts.None"/> for a fix that gave none, whose id is then generated from its position).
    /// </summary>
    private readonly record struct PointId(string? Text, IdCharacters? Source, long Location)
    {
        public string ToString(int index) =>
            Text ?? (Location == IdTexts.None ? FixTable.GeneratedIdOf(index) : Source!.Memory(Location).ToString());
    }

    /// <summary>Where a read point goes: slot <c>index</c> (its position in the set), written by one thread only.</summary>
    private abstract class PointTarget
    {
        public abstract void Add(int index, PointId id, string? markId, GeodeticCoordinate geodetic, bool hasHeight, double? sigmaH, double? sigmaV,
            DateTimeOffset? time, EnuVector? velocity, FixAttributes? attributes);
    }

    /// <summary>Marks as point objects (a few thousand at most in practice), in set order.</summary>
    private sealed class MarkSlots(int count) : PointTarget
    {
        private readonly FramedPoint?[] slots = new FramedPoint?[count];

        public override void Add(int index, PointId id, string? markId, GeodeticCoordinate geodetic, bool hasHeight, double? sigmaH, double? sigmaV,
            DateTimeOffset? time, EnuVector? velocity, FixAttributes? attributes) =>
            slots[index] = new FramedPoint(index, id.ToString(index), markId, geodetic, hasHeight, sigmaH, sigmaV, time) { VelocityMetresPerYear = velocity, Attributes = attributes };

        public List<FramedPoint> Joined() => slots.OfType<FramedPoint>().ToList();
    }

    /// <summary>Fixes straight into columns (ids read from a file stay in its chunks); a point skipped for a problem leaves its row out.</summary>
    private sealed class FixColumns(int count, IdCharacters? fileIds) : PointTarget
    {
        private readonly FixTable table = new(count, fileIds);
        private readonly bool[] present = new bool[count];

        public override void Add(int index, PointId id, string? markId, GeodeticCoordinate geodetic, bool hasHeight, double? sigmaH, double? sigmaV,
            DateTimeOffset? time, EnuVector? velocity, FixAttributes? attributes)
        {
            if (fileIds is null)
                table.Set(index, index, id.ToString(index), markId, geodetic, hasHeight);
            else
                table.SetIdAt(index, index, id.Location, markId, geodetic, hasHeight);
            table.SetExtras(index, sigmaH, sigmaV, time, attributes);
            present[index] = true;
        }

        public FixTable Joined() =>
            Array.TrueForAll(present, p => p) ? table : table.Take(Enumerable.Range(0, present.Length).Where(i => present[i]).ToList());
    }

    private static void ReadSlice(IReadOnlyList<PointRecord?> points, PointSetFrame frame, string pointer, MarkCheck? markCheck, int from, int to,
        PointTarget result, List<InputError> errors, List<InputError>? unknownMarks)
    {
        var isMark = markCheck is null;
        var useHeight = frame.Heights != HeightReference.None;
        var columns = points as IPointValueList;
        var file = points as PointColumns;
        var shared = new Dictionary<FixAttributes, FixAttributes>();
        for (var i = from; i < to; i++)
        {
            var pointPointer = new PointPointer(pointer, i);
            PointValues point;
            var present = file is not null ? ValuesWithoutId(file, i, out point)
                : columns is not null ? columns.TryGetValues(i, out point) : TryCopy(points[i], out point);
            if (!present)
            {
                errors.Add(new(pointPointer, "a point must be an object, not null"));
                continue;
            }
            var id = file is not null ? ReadId(file.Ids, pointPointer, isMark, i, errors) : ReadId(point, pointPointer, isMark, i, errors);
            if (!isMark && point.Mark is { } mark && string.IsNullOrWhiteSpace(mark))
                errors.Add(new($"{pointPointer}/mark", "mark must name a mark id, or be left out"));
            CheckSigma(point.SigmaH, pointPointer, "sigmaH", errors);
            CheckSigma(point.SigmaV, pointPointer, "sigmaV", errors);
            var attributes = ReadAttributes(point, pointPointer, isMark, frame.Crs.Unit.MetresPerUnit, errors);
            // Fixes with the same attributes (a handful of classes, crews and receivers) share one object, up to a bound
            // (reported sigmas or HDOPs make most fixes' attributes distinct, and those are not worth a table).
            if (attributes is not null)
            {
                if (shared.TryGetValue(attributes, out var same))
                    attributes = same;
                else if (shared.Count < MaximumSharedAttributes)
                    shared[attributes] = attributes;
            }
            var geodetic = PointConversion.ToGeodetic(frame.Crs, point, pointPointer, useHeight, errors);
            if (geodetic is null || id is null)
                continue;
            var hasHeight = useHeight && (point.H is not null || frame.Crs.Kind == CrsKind.Geocentric);
            var markId = point.Mark?.Trim();
            var velocity = columns is null && points[i] is { } record ? ReadVelocity(record, pointPointer, isMark, errors) : null;
            result.Add(i, id.Value, markId, geodetic.Value, hasHeight,
                point.SigmaH is { } sh ? sh * frame.Crs.Unit.MetresPerUnit : null,
                point.SigmaV is { } sv ? sv * frame.Crs.Unit.MetresPerUnit : null,
                point.Time, velocity, attributes);
            if (markId is { Length: > 0 } && markCheck is not null && !markCheck.Known.Contains(markId))
                unknownMarks!.Add(new(Format($"{pointer}/points/{i}/mark"), $"no mark has the id \"{markId}\""));
        }
    }

    /// <summary>Distinct attribute sets shared per slice (common practice: a delivery has a few classes × crews × receivers).</summary>
    private const int MaximumSharedAttributes = 4_096;

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

    /// <summary>
    /// A fix's attributes, validated: names non-blank and at most <see cref="FixAttributes.MaximumLength"/> characters,
    /// HDOP in (0, 100] (receivers write 99.99 for "no solution"), quality one of the screening words. Marks carry none.
    /// </summary>
    private static FixAttributes? ReadAttributes(in PointValues point, PointPointer pointer, bool isMark, double metresPerUnit, List<InputError> errors)
    {
        var given = point.FeatureClass is not null || point.Crew is not null || point.Receiver is not null || point.Hdop is not null || point.Quality is not null;
        if (isMark)
        {
            if (given)
            {
                var field = point.FeatureClass is not null ? "featureClass" : point.Crew is not null ? "crew" : point.Receiver is not null ? "receiver"
                    : point.Hdop is not null ? "hdop" : "quality";
                errors.Add(new($"{pointer}/{field}", $"{field} describes a fix; marks do not carry it"));
            }
            return null;
        }
        if (!given && point.SigmaH is null)
            return null;
        var featureClass = Name(point.FeatureClass, pointer, "featureClass", errors);
        var crew = Name(point.Crew, pointer, "crew", errors);
        var receiver = Name(point.Receiver, pointer, "receiver", errors);
        if (point.Hdop is { } hdop && !(double.IsFinite(hdop) && hdop > 0 && hdop <= Screening.FixScreening.MaximumDop))
            errors.Add(new($"{pointer}/hdop", Format($"hdop {hdop} is not a dilution of precision in (0, {Screening.FixScreening.MaximumDop}]")));
        string? quality = null;
        if (point.Quality is { } q && (quality = Screening.ScreeningQuality.Normalise(q)) is null)
            errors.Add(new($"{pointer}/quality", $"quality \"{CsvShort(q)}\" is not one of {string.Join(", ", Screening.ScreeningQuality.All)}"));
        return new FixAttributes(featureClass, crew, receiver, point.SigmaH is { } s ? s * metresPerUnit : null, point.Hdop, quality);
    }

    private static string? Name(string? text, PointPointer pointer, string field, List<InputError> errors)
    {
        if (text is null)
            return null;
        var trimmed = text.Trim();
        if (trimmed.Length == 0)
            errors.Add(new($"{pointer}/{field}", $"{field} must be a non-empty name, or be left out"));
        else if (trimmed.Length > FixAttributes.MaximumLength)
            errors.Add(new($"{pointer}/{field}", $"{field} is longer than {FixAttributes.MaximumLength} characters (a class, crew or receiver name)"));
        else
            return trimmed;
        return null;
    }

    private static string CsvShort(string text) => text.Length <= 40 ? text : text[..40] + "…";

    private static bool TryCopy(PointRecord? record, out PointValues point)
    {
        point = record is null ? default : PointValues.Of(record);
        return record is not null;
    }

    private static bool ValuesWithoutId(PointColumns file, int index, out PointValues point)
    {
        file.ValuesWithoutId(index, out point);
        return true;
    }

    private static PointId? ReadId(in PointValues point, PointPointer pointer, bool isMark, int index, List<InputError> errors) =>
        CheckId(point.Id, pointer, isMark, errors) switch
        {
            IdState.Given => new PointId(point.Id!.Trim(), null, IdTexts.None),
            IdState.Generated => new PointId(FixTable.GeneratedIdOf(index), null, IdTexts.None),
            _ => null,
        };

    /// <summary>As for a JSON point, with the id read in place: its trimmed location, no string.</summary>
    private static PointId? ReadId(IdTexts ids, PointPointer pointer, bool isMark, int index, List<InputError> errors)
    {
        var text = ids.TextOf(index);
        switch (CheckId(text, pointer, isMark, errors))
        {
            case IdState.Given:
                var trimmedStart = text.TrimStart();
                var start = text.Length - trimmedStart.Length;
                return new PointId(null, ids.Characters, IdTexts.Slice(ids.LocationOf(index), start, trimmedStart.TrimEnd().Length));
            case IdState.Generated:
                return new PointId(null, ids.Characters, IdTexts.None);
            default:
                return null;
        }
    }

    private enum IdState { Given, Generated, Rejected }

    /// <summary>A blank id: generated for a fix, a problem for a mark; over <see cref="RequestValidator.MaximumTextLength"/> characters: a problem.</summary>
    private static IdState CheckId(ReadOnlySpan<char> id, PointPointer pointer, bool isMark, List<InputError> errors)
    {
        if (id.IsWhiteSpace())
        {
            if (!isMark)
                return IdState.Generated;
            errors.Add(new($"{pointer}/id", "every mark needs an id (fixes name it in \"mark\")"));
            return IdState.Rejected;
        }
        if (id.Length > RequestValidator.MaximumTextLength)
        {
            errors.Add(new($"{pointer}/id", $"id is longer than {RequestValidator.MaximumTextLength} characters"));
            return IdState.Rejected;
        }
        return IdState.Given;
    }

    private static void CheckSigma(double? sigma, PointPointer point, string field, List<InputError> errors)
    {
        if (sigma is { } s && (!double.IsFinite(s) || s < 0))
            errors.Add(new($"{point}/{field}", Format($"{sigma} is not a standard deviation: give a non-negative number in the CRS unit")));
    }
}

/// <summary>The mark ids the fixes may name, and the problems of fixes that name another (in fix order).</summary>
internal sealed record MarkCheck(IReadOnlySet<string> Known, List<InputError> Unknown);
