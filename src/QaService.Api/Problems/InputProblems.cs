using Microsoft.AspNetCore.Mvc;
using QaService.Core.Assessment;

namespace QaService.Api.Problems;

/// <summary>The one error shape: RFC 9457 problem details, with an <c>errors</c> array for bad input (api-v1).</summary>
internal static class InputProblems
{
    /// <summary>Most errors listed in one response: enough to fix a file in a few rounds, small enough to read.</summary>
    public const int MaximumListedErrors = 100;

    public static IResult Invalid(IReadOnlyList<InputError> errors, string? detail = null)
    {
        var problem = new ProblemDetails
        {
            Status = StatusCodes.Status400BadRequest,
            Title = "The request has invalid input",
            Detail = detail ?? Summarise(errors),
        };
        problem.Extensions["errors"] = errors.Take(MaximumListedErrors).Select(e => new { pointer = e.Pointer, message = e.Message }).ToArray();
        if (errors.Count > MaximumListedErrors)
            problem.Extensions["errorsNotListed"] = errors.Count - MaximumListedErrors;
        return TypedResults.Problem(problem);
    }

    public static IResult Status(int status, string title, string detail) =>
        TypedResults.Problem(new ProblemDetails { Status = status, Title = title, Detail = detail });

    private static string Summarise(IReadOnlyList<InputError> errors)
    {
        var first = errors[0];
        var where = string.IsNullOrEmpty(first.Pointer) ? "the body" : first.Pointer;
        return errors.Count == 1
            ? $"{where}: {first.Message}"
            : $"{errors.Count} problems; the first is at {where}: {first.Message}";
    }
}
