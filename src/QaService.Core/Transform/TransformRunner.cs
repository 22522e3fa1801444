using QaService.Core.Assessment;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;
using QaService.Core.Geodesy.Vertical;

namespace QaService.Core.Transform;

/// <summary>
/// Checks a <see cref="TransformRequest"/> (CRSs, epoch, geoids, every point's fields by CRS kind and range),
/// plans the operation (<see cref="CoordinateOperationPlanner"/>) and runs it on the whole batch at once.
/// Every bad point is reported with its pointer; a point the operation cannot carry (outside a projection's
/// domain or a grid) is reported too, never returned as NaN.
/// </summary>
public static class TransformRunner
{
    /// <summary>Latitude/longitude limits, degrees.</summary>
    private const double MaximumLatitudeDegrees = 90.0, MaximumLongitudeDegrees = 180.0;

    public static TransformOutcome Run(TransformRequest? request)
    {
        var errors = new List<InputError>();
        if (request is null)
            return Invalid(new InputError("", "the body must be a JSON object with \"from\", \"to\" and \"points\""));

        var source = ResolveCrs(request.From, "/from", errors);
        var target = ResolveCrs(request.To, "/to", errors);
        if (request.Epoch is { } epoch && (!double.IsFinite(epoch) || epoch < RequestValidator.MinimumEpochYear || epoch > RequestValidator.MaximumEpochYear))
            errors.Add(new("/epoch", InvariantText.Format($"epoch {epoch} is not a decimal year in {RequestValidator.MinimumEpochYear}..{RequestValidator.MaximumEpochYear}")));
        var sourceGeoid = ResolveGeoid(request.FromGeoid, "/fromGeoid", source, errors);
        var targetGeoid = ResolveGeoid(request.ToGeoid, "/toGeoid", target, errors);
        if (request.Points is null || request.Points.Count == 0)
            errors.Add(new("/points", "at least one point is required"));
        if (source is null || target is null || request.Points is null || request.Points.Count == 0)
            return new TransformOutcome(null, errors);

        var operationCode = OperationCodeText.Parse(request.OperationCode, "/operationCode", errors);
        var points = request.Points;
        var buffer = new CoordinateBuffer(points.Count, withEpochs: request.Epoch is not null);
        var hasHeight = new bool[points.Count];
        var columns = points as TransformPointColumns;
        for (var i = 0; i < points.Count; i++)
            Read(columns is null ? PointFields.Of(points[i]) : PointFields.Of(columns, i), i, source, buffer, hasHeight, errors);
        if (errors.Count > 0)
            return new TransformOutcome(null, errors);
        if (buffer.EpochYears is { } epochs)
            Array.Fill(epochs, request.Epoch!.Value);

        var (latitudes, longitudes) = SourceGeographic(source, buffer);
        var plan = CoordinateOperationPlanner.Plan(source, target, sourceGeoid, targetGeoid, null,
            AreaOfUse.Around(latitudes, longitudes), operationCode);
        if (plan.Operation is null)
        {
            errors.Add(new(plan.ProblemIsOperationCode ? "/operationCode" : "/to", plan.Problem!));
            return new TransformOutcome(null, errors);
        }

        var operation = plan.Operation;
        // Before the batch runs: for a geographic source the latitudes are the buffer's own first column, which the
        // batch overwrites with the output (a point at 50 N 15 E was once reported outside EPSG:4326's World).
        var warnings = operation.OutsideAreas(latitudes, longitudes);
        operation.Execute(buffer);
        for (var i = 0; i < buffer.Count; i++)
        {
            if (!double.IsFinite(buffer.First[i]) || !double.IsFinite(buffer.Second[i]) || !double.IsFinite(buffer.Third[i]))
                errors.Add(new(InvariantText.Format($"/points/{i}"), $"this point cannot be carried from {source.Identifier} to {target.Identifier}: it lies outside the area a step covers (projection domain, grid or geoid extent)"));
        }
        if (errors.Count > 0)
            return new TransformOutcome(null, errors);

        var epochNote = request.Epoch is { } t ? InvariantText.Format($"{t} (request epoch)") : null;
        return new TransformOutcome(new TransformResult(source, target, buffer, hasHeight, operation.Describe(epochNote), operation.AccuracyUnknown ? null : operation.AccuracyMetres)
        {
            Warnings = warnings,
        }, []);
    }

    /// <summary>Latitude/longitude of the points in the source datum (a copy through the conversion steps only), for areas of use.</summary>
    private static (double[] Latitudes, double[] Longitudes) SourceGeographic(CoordinateReferenceSystem source, CoordinateBuffer points)
    {
        if (source.Kind == CrsKind.Geographic)
            return (points.First, points.Second);
        var geographic = source with { Kind = CrsKind.Geographic, Projection = null, Unit = LinearUnit.Metre, HasHeightAxis = true };
        var copy = new CoordinateBuffer(points.Count);
        points.First.CopyTo(copy.First, 0);
        points.Second.CopyTo(copy.Second, 0);
        points.Third.CopyTo(copy.Third, 0);
        CoordinateOperationPlanner.Plan(source, geographic).Operation!.Execute(copy);
        return (copy.First, copy.Second);
    }

    private static CoordinateReferenceSystem? ResolveCrs(string? text, string pointer, List<InputError> errors)
    {
        var resolution = CrsCatalog.Resolve(text);
        if (!resolution.Succeeded)
            errors.Add(new(pointer, resolution.Problem!));
        return resolution.Crs;
    }

    private static GeoidModel? ResolveGeoid(string? name, string pointer, CoordinateReferenceSystem? crs, List<InputError> errors)
    {
        if (name is null)
            return null;
        var model = GeoidModel.Find(name);
        if (model is null)
            errors.Add(new(pointer, $"geoid \"{name}\" is not known; known: {GeoidModel.KnownNames}"));
        else if (crs is { Kind: CrsKind.Geocentric })
            errors.Add(new(pointer, "geocentric coordinates have no orthometric height; leave the geoid out for a geocentric CRS"));
        return model;
    }

    /// <summary>One point's fields, from a point object or straight from the columns (a value: no object per point).</summary>
    private readonly record struct PointFields(double? Lat, double? Lon, double? E, double? N, double? X, double? Y, double? Z, double? H)
    {
        public static PointFields? Of(TransformPoint? p) => p is null ? null : new(p.Lat, p.Lon, p.E, p.N, p.X, p.Y, p.Z, p.H);

        public static PointFields? Of(TransformPointColumns c, int i) => c.IsNull(i)
            ? null
            : new(c.Field(0, i), c.Field(1, i), c.Field(2, i), c.Field(3, i), c.Field(4, i), c.Field(5, i), c.Field(6, i), c.Field(7, i));
    }

    private static void Read(PointFields? given, int index, CoordinateReferenceSystem crs, CoordinateBuffer buffer, bool[] hasHeight, List<InputError> errors)
    {
        if (given is not { } point)
        {
            errors.Add(new(InvariantText.Format($"/points/{index}"), "a point must be an object, not null"));
            return;
        }
        var before = errors.Count;
        switch (crs.Kind)
        {
            case CrsKind.Geographic:
                Foreign(point.E, "e", index, crs, errors); Foreign(point.N, "n", index, crs, errors);
                Foreign(point.X, "x", index, crs, errors); Foreign(point.Y, "y", index, crs, errors); Foreign(point.Z, "z", index, crs, errors);
                var lat = Required(point.Lat, "lat", index, errors);
                var lon = Required(point.Lon, "lon", index, errors);
                if (lat is { } la && !(Math.Abs(la) <= MaximumLatitudeDegrees))
                    errors.Add(new(InvariantText.Format($"/points/{index}/lat"), InvariantText.Format($"latitude {la} is outside -90..90 degrees")));
                if (lon is { } lo && !(Math.Abs(lo) <= MaximumLongitudeDegrees))
                    errors.Add(new(InvariantText.Format($"/points/{index}/lon"), InvariantText.Format($"longitude {lo} is outside -180..180 degrees")));
                buffer.First[index] = lat ?? 0;
                buffer.Second[index] = lon ?? 0;
                break;
            case CrsKind.Projected:
                Foreign(point.Lat, "lat", index, crs, errors); Foreign(point.Lon, "lon", index, crs, errors);
                Foreign(point.X, "x", index, crs, errors); Foreign(point.Y, "y", index, crs, errors); Foreign(point.Z, "z", index, crs, errors);
                buffer.First[index] = Finite(Required(point.E, "e", index, errors), "e", index, errors);
                buffer.Second[index] = Finite(Required(point.N, "n", index, errors), "n", index, errors);
                break;
            default:
                Foreign(point.Lat, "lat", index, crs, errors); Foreign(point.Lon, "lon", index, crs, errors);
                Foreign(point.E, "e", index, crs, errors); Foreign(point.N, "n", index, crs, errors);
                if (point.H is not null)
                    errors.Add(new(InvariantText.Format($"/points/{index}/h"), "a geocentric CRS takes x, y, z only; the height is implied by them"));
                buffer.First[index] = Finite(Required(point.X, "x", index, errors), "x", index, errors);
                buffer.Second[index] = Finite(Required(point.Y, "y", index, errors), "y", index, errors);
                buffer.Third[index] = Finite(Required(point.Z, "z", index, errors), "z", index, errors);
                hasHeight[index] = true;
                return;
        }
        if (point.H is { } h)
        {
            var metres = h * crs.Unit.MetresPerUnit;
            if (!double.IsFinite(metres) || metres < PointLimits.MinimumHeightMetres || metres > PointLimits.MaximumHeightMetres)
                errors.Add(new(InvariantText.Format($"/points/{index}/h"), InvariantText.Format($"height {h} is outside {PointLimits.MinimumHeightMetres}..{PointLimits.MaximumHeightMetres} m (in the CRS unit, {crs.Unit.PluralName})")));
            buffer.Third[index] = h;
            hasHeight[index] = true;
        }
        if (errors.Count != before)
            buffer.First[index] = double.NaN;
    }

    private static double? Required(double? value, string field, int index, List<InputError> errors)
    {
        if (value is null)
            errors.Add(new(InvariantText.Format($"/points/{index}/{field}"), $"\"{field}\" is required"));
        return value;
    }

    private static double Finite(double? value, string field, int index, List<InputError> errors)
    {
        if (value is { } v && !double.IsFinite(v))
            errors.Add(new(InvariantText.Format($"/points/{index}/{field}"), $"\"{field}\" must be a finite number"));
        return value ?? 0;
    }

    private static void Foreign(double? value, string field, int index, CoordinateReferenceSystem crs, List<InputError> errors)
    {
        if (value is not null)
        {
            var expected = crs.Kind switch { CrsKind.Geographic => "lat, lon, h", CrsKind.Projected => "e, n, h", _ => "x, y, z" };
            errors.Add(new(InvariantText.Format($"/points/{index}/{field}"), $"{crs.Identifier} is a {crs.Kind.ToString().ToLowerInvariant()} CRS and takes {expected}; \"{field}\" does not fit it"));
        }
    }

    private static TransformOutcome Invalid(InputError error) => new(null, [error]);
}

/// <summary>Plausibility limits shared with the assessment's point reading.</summary>
internal static class PointLimits
{
    internal const double MinimumHeightMetres = PointConversion.MinimumHeightMetres;
    internal const double MaximumHeightMetres = PointConversion.MaximumHeightMetres;
}
