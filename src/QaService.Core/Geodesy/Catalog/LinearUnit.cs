namespace QaService.Core.Geodesy.Catalog;

/// <summary>A length unit with its exact size in metres.</summary>
/// <param name="Name">Singular name as used in report statements ("meter", "foot").</param>
/// <param name="PluralName">Plural name for statements ("meters", "feet").</param>
/// <param name="MetresPerUnit">Exact conversion factor to metres.</param>
public sealed record LinearUnit(string Name, string PluralName, double MetresPerUnit)
{
    /// <summary>The SI metre.</summary>
    public static LinearUnit Metre { get; } = new("meter", "meters", 1.0);

    /// <summary>International foot, exactly 0.3048 m (1959 international yard and pound agreement).</summary>
    public static LinearUnit InternationalFoot { get; } = new("foot", "feet", 0.3048);

    /// <summary>US survey foot, exactly 1200/3937 m (NIST; deprecated 31 Dec 2022, still used in older state plane data).</summary>
    public static LinearUnit UsSurveyFoot { get; } = new("US survey foot", "US survey feet", 1200.0 / 3937.0);
}
