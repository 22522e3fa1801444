using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Vertical;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>The planned operation, or why there is none.</summary>
/// <param name="ProblemIsOperationCode">True when the problem is the caller's <c>operationCode</c> (unknown, not joining the CRSs, or its grid missing).</param>
public sealed record OperationPlan(CoordinateOperation? Operation, string? Problem, bool ProblemIsOperationCode = false);

/// <summary>
/// Finds the operation between two CRSs of the catalog, in the order PROJ builds its pipelines
/// (<c>projinfo -o PROJ</c>): inverse projection → geographic → (orthometric → ellipsoidal height with a geoid)
/// → geocentric → datum steps (Helmert / time-dependent Helmert / grid, through the WGS 84 ≈ ITRF hub) →
/// geographic → (ellipsoidal → orthometric) → forward projection; conversions are inserted only where a
/// step needs another coordinate form or ellipsoid.
/// </summary>
public static class CoordinateOperationPlanner
{
    /// <param name="sourceGeoid">When the source heights are orthometric: the geoid they refer to.</param>
    /// <param name="targetGeoid">When the target heights are to be orthometric: the geoid.</param>
    /// <param name="graph">Datum transformations to search; <see cref="DatumGraph.Default"/> when null.</param>
    /// <param name="pointsBox">The points' latitude/longitude box in the source datum, to prefer operations whose area covers it.</param>
    /// <param name="operationCode">An EPSG transformation code the caller chose; the path goes through it.</param>
    public static OperationPlan Plan(CoordinateReferenceSystem source, CoordinateReferenceSystem target,
        GeoidModel? sourceGeoid = null, GeoidModel? targetGeoid = null, DatumGraph? graph = null,
        AreaOfUse? pointsBox = null, int? operationCode = null)
    {
        graph ??= DatumGraph.Default;
        var route = graph.Route(source.Datum.Code, target.Datum.Code, pointsBox, operationCode);
        if (route.Problem is not null)
            return new OperationPlan(null, route.Problem, route.ProblemIsOperationCode);
        var path = route.Path;
        if (path is null)
            return new OperationPlan(null, $"no transformation is known between {source.Datum.Name} ({source.Datum.Code}) and {target.Datum.Name} ({target.Datum.Code})");

        var builder = new Builder(source);
        if (sourceGeoid is not null)
        {
            builder.EnsureGeographic(source.Ellipsoid);
            builder.Add(new GeoidHeightStep(sourceGeoid.Grid, toEllipsoidal: true, sourceGeoid.AccuracyMetres));
        }
        foreach (var edge in path)
        {
            if (edge.Domain == StepDomain.Geocentric)
                builder.EnsureGeocentric();
            else if (edge.Domain == StepDomain.Geographic)
                builder.EnsureGeographic(edge.SourceEllipsoid!.Value);
            builder.Add(edge.Step);
            if (edge.Domain == StepDomain.Geographic)
                builder.Ellipsoid = edge.TargetEllipsoid!.Value;
        }
        if (targetGeoid is not null)
        {
            builder.EnsureGeographic(target.Ellipsoid);
            builder.Add(new GeoidHeightStep(targetGeoid.Grid, toEllipsoidal: false, targetGeoid.AccuracyMetres));
        }
        switch (target.Kind)
        {
            case CrsKind.Geocentric:
                builder.EnsureGeocentric();
                break;
            case CrsKind.Projected:
                builder.EnsureGeographic(target.Ellipsoid);
                builder.Add(new ForwardProjectionStep(target.Projection!, target.Unit, target.Name));
                break;
            default:
                builder.EnsureGeographic(target.Ellipsoid);
                break;
        }
        return new OperationPlan(new CoordinateOperation(source, target, builder.Steps)
        {
            DatumEdges = path,
            Alternatives = path.Where(e => e.OperationCode != 0).ToDictionary(e => e, graph.Alternatives),
        }, null);
    }

    /// <summary>Tracks what the arrays hold after each step.</summary>
    private sealed class Builder
    {
        private StepDomain _domain;

        public Builder(CoordinateReferenceSystem source)
        {
            Ellipsoid = source.Ellipsoid;
            switch (source.Kind)
            {
                case CrsKind.Projected:
                    Steps.Add(new InverseProjectionStep(source.Projection!, source.Unit, source.Name));
                    _domain = StepDomain.Geographic;
                    break;
                case CrsKind.Geocentric:
                    _domain = StepDomain.Geocentric;
                    break;
                default:
                    _domain = StepDomain.Geographic;
                    break;
            }
        }

        public List<IOperationStep> Steps { get; } = [];

        /// <summary>The ellipsoid latitude/longitude refer to while the arrays are geographic.</summary>
        public Ellipsoid Ellipsoid { get; set; }

        public void Add(IOperationStep step) => Steps.Add(step);

        public void EnsureGeocentric()
        {
            if (_domain == StepDomain.Geocentric)
                return;
            Steps.Add(new GeographicToGeocentricStep(Ellipsoid));
            _domain = StepDomain.Geocentric;
        }

        public void EnsureGeographic(Ellipsoid ellipsoid)
        {
            if (_domain == StepDomain.Geographic && Ellipsoid == ellipsoid)
                return;
            EnsureGeocentric();
            Steps.Add(new GeocentricToGeographicStep(ellipsoid));
            Ellipsoid = ellipsoid;
            _domain = StepDomain.Geographic;
        }
    }
}
