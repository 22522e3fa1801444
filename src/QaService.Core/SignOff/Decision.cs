namespace QaService.Core.SignOff;

/// <summary>A QA lead's decision on one delivery as sent (<c>POST /v1/assessments/{id}/decisions</c>); checked by <see cref="DecisionValidator"/>.</summary>
/// <param name="Decision"><c>accepted</c> or <c>rejected</c>.</param>
/// <param name="By">Who decides (a name or sign), shown on the report.</param>
/// <param name="Comment">Optional reason or condition.</param>
public sealed record DecisionRequest(string? Decision = null, string? By = null, string? Comment = null);

/// <summary>One recorded decision. Decisions are append-only: a later one supersedes, none is edited.</summary>
/// <param name="Decision"><c>accepted</c> or <c>rejected</c>.</param>
/// <param name="By">Who decided.</param>
/// <param name="Comment">Reason or condition; null when none was given.</param>
/// <param name="At">When it was recorded (UTC, whole milliseconds).</param>
/// <param name="ReportSha256">Lower-case hex SHA-256 (FIPS 180-4) of the exact report bytes that <c>GET /v1/assessments/{id}</c> returned when it was recorded.</param>
public sealed record SignOffDecision(string Decision, string By, string? Comment, DateTimeOffset At, string ReportSha256);

/// <summary>The decision words and the state of a delivery that has none yet.</summary>
public static class DecisionWords
{
    public const string Accepted = "accepted", Rejected = "rejected";

    /// <summary>State of a delivery without any decision.</summary>
    public const string Awaiting = "awaiting decision";

    /// <summary>The delivery's acceptance state: its latest decision, or <see cref="Awaiting"/>.</summary>
    public static string StateOf(SignOffDecision? latest) => latest?.Decision ?? Awaiting;
}
