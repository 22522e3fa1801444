namespace QaService.Core.Geodesy.Transformations;

/// <summary>One step of a coordinate operation, applied in place to a whole batch.</summary>
public interface IOperationStep
{
    /// <summary>What the step does, with its parameters, in words (shown in <c>operation</c>).</summary>
    string Description { get; }

    /// <summary>Accuracy of the step as EPSG states it, metres; 0 for exact conversions.</summary>
    double AccuracyMetres { get; }

    /// <summary>True when nobody states the step's accuracy (parameters given with a CRS): the route's accuracy is then unknown.</summary>
    bool AccuracyUnknown => false;

    /// <summary>True when the step's result depends on the observation epoch.</summary>
    bool UsesEpoch => false;

    void Apply(CoordinateBuffer points);
}
