using QaService.Core.Assessment;

namespace QaService.Core.SignOff;

/// <summary>Checks a <see cref="DecisionRequest"/>; every problem gets a JSON pointer into the request body.</summary>
public static class DecisionValidator
{
    /// <summary>Longest <c>by</c>, characters: a name or initials with a role, not a letter.</summary>
    public const int MaximumByLength = 200;

    /// <summary>Longest <c>comment</c>, characters: a reason or a condition of acceptance.</summary>
    public const int MaximumCommentLength = 2000;

    /// <summary>The checked decision (text trimmed; an empty comment becomes null), or the errors.</summary>
    public static (DecisionRequest? Valid, IReadOnlyList<InputError> Errors) Validate(DecisionRequest? request)
    {
        if (request is null)
            return (null, [new InputError("", "the body must be a JSON object with \"decision\" and \"by\"")]);
        var errors = new List<InputError>();
        var decision = request.Decision?.Trim();
        if (decision is not (DecisionWords.Accepted or DecisionWords.Rejected))
            errors.Add(new("/decision", request.Decision is null
                ? "\"decision\" is required: \"accepted\" or \"rejected\""
                : $"decision \"{Shorten(request.Decision)}\" is not \"accepted\" or \"rejected\""));

        var by = request.By?.Trim();
        if (string.IsNullOrEmpty(by))
            errors.Add(new("/by", "\"by\" is required: who takes the decision (a name or sign)"));
        else if (by.Length > MaximumByLength)
            errors.Add(new("/by", $"\"by\" is longer than {MaximumByLength} characters"));
        else if (by.Any(char.IsControl))
            errors.Add(new("/by", "\"by\" must be one line of text without control characters"));

        var comment = string.IsNullOrWhiteSpace(request.Comment) ? null : request.Comment.Trim();
        if (comment is { Length: > MaximumCommentLength })
            errors.Add(new("/comment", $"\"comment\" is longer than {MaximumCommentLength} characters"));
        else if (comment is not null && comment.Any(c => char.IsControl(c) && c is not ('\n' or '\r' or '\t')))
            errors.Add(new("/comment", "\"comment\" may hold line breaks and tabs but no other control characters"));

        return errors.Count > 0 ? (null, errors) : (new DecisionRequest(decision, by, comment), []);
    }

    private static string Shorten(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
