using System.Globalization;
using Microsoft.AspNetCore.Mvc;

namespace QaService.Api.Limits;

/// <summary>Limits:MaxPoints: a request with more points than the cap is answered 413 with a pointer to the biggest list.</summary>
internal static class PointCap
{
    /// <summary>Null when the points of all lists together are within the cap; otherwise the problem to return.</summary>
    /// <param name="lists">Each point list's JSON pointer and length.</param>
    public static IResult? Check(LimitsOptions limits, params (string Pointer, int Count)[] lists)
    {
        var total = lists.Sum(l => (long)l.Count);
        if (total <= limits.MaxPoints)
            return null;
        var largest = lists.MaxBy(l => l.Count);
        var message = string.Create(CultureInfo.InvariantCulture,
            $"{total} points in one request exceed the limit of {limits.MaxPoints} (Limits:MaxPoints); split the data into several requests");
        var problem = new ProblemDetails { Status = StatusCodes.Status413PayloadTooLarge, Title = "Too many points", Detail = message };
        problem.Extensions["errors"] = new[] { new { pointer = largest.Pointer, message } };
        return TypedResults.Problem(problem);
    }
}
