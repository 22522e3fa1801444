using System.Globalization;
using QaService.Api.Problems;
using QaService.Core.Assessment;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Api.Crs;

/// <summary>Discovery of the CRS catalog: search and one CRS's definition. The catalog and its rules live in Core.</summary>
internal static class CrsApi
{
    /// <summary>Default and largest page size of a search.</summary>
    public const int DefaultLimit = 20, MaximumLimit = 100;

    /// <summary>Longest search text accepted, characters.</summary>
    public const int MaximumQueryLength = 200;

    public static RouteGroupBuilder MapCrs(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/crs").WithTags("CRS");

        group.MapGet("/", Search)
            .WithName("SearchCrs")
            .WithSummary("Search the CRS catalog by EPSG code or words of the name")
            .WithDescription("Entries whose code starts with q, or whose name holds every word of q (case-insensitive), ordered by code; paged by offset and limit (at most 100).")
            .Produces<CrsPage>()
            .ProducesProblem(StatusCodes.Status400BadRequest);

        group.MapGet("/{id}", Get)
            .WithName("GetCrs")
            .WithSummary("One CRS: kind, datum, ellipsoid, projection method and parameters, axes and units, area of use")
            .Produces<CrsDescription>()
            .ProducesProblem(StatusCodes.Status404NotFound);

        return group;
    }

    internal static IResult Search(string? q, string? offset, string? limit)
    {
        var errors = new List<InputError>();
        if (q is { Length: > MaximumQueryLength })
            errors.Add(new("/q", $"q is longer than {MaximumQueryLength} characters"));
        var skip = ReadInteger(offset, "offset", 0, 0, int.MaxValue, errors);
        var take = ReadInteger(limit, "limit", DefaultLimit, 1, MaximumLimit, errors);
        if (errors.Count > 0)
            return InputProblems.Invalid(errors);
        var page = CrsCatalog.Search(q, skip, take);
        return TypedResults.Ok(new CrsPage(page.Total, skip, take, page.Items.Select(CrsSummary.From).ToList()));
    }

    internal static IResult Get(string id)
    {
        var text = id.Trim();
        if (text.Length is > 0 and <= 9 && text.All(char.IsAsciiDigit))
            text = "EPSG:" + text;
        var resolution = text.StartsWith("EPSG:", StringComparison.OrdinalIgnoreCase) || text.StartsWith("urn:", StringComparison.OrdinalIgnoreCase)
            ? CrsCatalog.Resolve(text)
            : CrsResolution.Failed($"\"{Shorten(id)}\" is not a CRS identifier; use \"EPSG:<code>\" or the code alone");
        return resolution.Crs is { } crs
            ? TypedResults.Ok(CrsDescription.From(crs))
            : InputProblems.Status(StatusCodes.Status404NotFound, "CRS not found", resolution.Problem!);
    }

    private static int ReadInteger(string? text, string name, int fallback, int minimum, int maximum, List<InputError> errors)
    {
        if (text is null)
            return fallback;
        if (!int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out var value) || value < minimum || value > maximum)
        {
            errors.Add(new($"/{name}", string.Create(CultureInfo.InvariantCulture, $"{name} \"{Shorten(text)}\" must be a whole number in {minimum}..{maximum}")));
            return fallback;
        }

        return value;
    }

    private static string Shorten(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
