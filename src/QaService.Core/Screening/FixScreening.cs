using QaService.Core.Assessment;

namespace QaService.Core.Screening;

/// <summary>Validates a screening request (errors with JSON pointers) and screens every fix.</summary>
public static class FixScreening
{
    /// <summary>Most fixes in one request: screening is for uploads as they happen, not archives.</summary>
    public const int MaximumFixes = 10_000;

    /// <summary>Largest DOP accepted as a value (receivers report 99.99 for "no solution").</summary>
    public const double MaximumDop = 100.0;

    /// <param name="calibrationResiduals">The counted residuals of the stored assessments that <c>calibration.assessments</c> names
    /// (read by the caller, which owns storage), or of any stored reports (a project's); null when none were named.</param>
    /// <param name="calibrationSource">What those residuals are, for the reasons (e.g. "assessments a1, a2").</param>
    public static (ScreeningReport? Report, IReadOnlyList<InputError> Errors) Screen(ScreeningRequest? request,
        IEnumerable<Reporting.Residual>? calibrationResiduals = null, string? calibrationSource = null)
    {
        var errors = new List<InputError>();
        if (request is null)
            return (null, [new InputError("", "the body must be a JSON object with \"fixes\"")]);
        var profile = ScreeningProfiles.Find(request.Profile);
        if (profile is null)
            errors.Add(new("/profile", $"no profile \"{request.Profile}\"; the profiles are {string.Join(", ", ScreeningProfiles.All.Select(p => p.Name))}"));
        CheckThresholds(request.Thresholds, errors);
        CheckCalibration(request.Calibration, request.ProjectId is not null, errors);
        if (request.Fixes is null || request.Fixes.Count == 0)
            errors.Add(new("/fixes", "at least one fix is required"));
        else if (request.Fixes.Count > MaximumFixes)
            errors.Add(new("/fixes", InvariantText.Format($"{request.Fixes.Count} fixes; at most {MaximumFixes} per request")));
        else
        {
            for (var i = 0; i < request.Fixes.Count; i++)
                CheckFix(request.Fixes[i], InvariantText.Format($"/fixes/{i}"), errors);
        }
        if (errors.Count > 0)
            return (null, errors);

        var thresholds = ScreeningProfiles.Merge(profile!.Thresholds, request.Thresholds);
        var calibration = Calibration(request.Calibration, thresholds, calibrationResiduals, calibrationSource);
        var results = request.Fixes!.Select((fix, i) => ScreeningRules.Evaluate(i, fix!, thresholds, calibration)).ToList();
        return (new ScreeningReport(profile.Name, thresholds,
            results.Count(r => r.Decision == ScreeningDecision.Accept),
            results.Count(r => r.Decision == ScreeningDecision.Flag),
            results.Count(r => r.Decision == ScreeningDecision.Reject),
            results, calibration), []);
    }

    /// <summary>The calibration: from the stored residuals with the profile's UERE, or the inline entries; null without either.</summary>
    private static ReceiverCalibration? Calibration(ScreeningCalibrationInput? input, ScreeningThresholds thresholds, IEnumerable<Reporting.Residual>? residuals,
        string? source)
    {
        if (input is null && residuals is null)
            return null;
        var minimum = input?.MinimumPairs ?? ReceiverCalibration.DefaultMinimumPairs;
        var uere = thresholds.Uere95 ?? ScreeningProfiles.CaCodeUere95Metres;
        if (residuals is not null)
            return ReceiverCalibration.FromResiduals(residuals, source ?? "stored assessments", uere, minimum);
        if (input?.Entries is { } entries)
            return new ReceiverCalibration(entries.Select(e => e! with { Quality = ScreeningQuality.Normalise(e.Quality) }).ToList(), uere, minimum, "entries given with the request");
        return null;
    }

    /// <summary>Most assessments one calibration may name (each is read whole from storage).</summary>
    public const int MaximumCalibrationAssessments = 50;

    private static void CheckCalibration(ScreeningCalibrationInput? input, bool fromProject, List<InputError> errors)
    {
        if (input is null)
            return;
        if (fromProject && (input.Assessments is not null || input.Entries is not null))
            errors.Add(new("/calibration", "\"projectId\" already names the assessments that calibrate; leave out \"assessments\" and \"entries\" (minimumPairs may stay)"));
        else if (!fromProject && (input.Assessments is null) == (input.Entries is null))
            errors.Add(new("/calibration", "give either \"assessments\" (stored assessment ids) or \"entries\", not both and not neither"));
        if (input.MinimumPairs is < 2)
            errors.Add(new("/calibration/minimumPairs", "minimumPairs is a count of at least 2"));
        if (input.Assessments is { } ids)
        {
            if (ids.Count == 0 || ids.Count > MaximumCalibrationAssessments)
                errors.Add(new("/calibration/assessments", InvariantText.Format($"name 1 to {MaximumCalibrationAssessments} assessment ids")));
            for (var i = 0; i < ids.Count; i++)
            {
                if (string.IsNullOrWhiteSpace(ids[i]))
                    errors.Add(new(InvariantText.Format($"/calibration/assessments/{i}"), "an assessment id, as returned by POST /v1/assessments"));
            }
        }
        for (var i = 0; i < (input.Entries?.Count ?? 0); i++)
        {
            var e = input.Entries![i];
            var pointer = InvariantText.Format($"/calibration/entries/{i}");
            if (e is null)
            {
                errors.Add(new(pointer, "an entry must be an object"));
                continue;
            }
            if (string.IsNullOrWhiteSpace(e.Receiver) || e.Receiver.Length > FixAttributes.MaximumLength)
                errors.Add(new($"{pointer}/receiver", InvariantText.Format($"receiver is a name of 1 to {FixAttributes.MaximumLength} characters")));
            if (e.Quality is not null && ScreeningQuality.Normalise(e.Quality) is null)
                errors.Add(new($"{pointer}/quality", $"quality \"{e.Quality}\" is not one of {string.Join(", ", ScreeningQuality.All)}"));
            if (e.Basis is not (ReceiverCalibration.SigmaBasis or ReceiverCalibration.HdopBasis))
                errors.Add(new($"{pointer}/basis", "basis is \"sigma\" or \"hdop\""));
            if (e.Pairs < 1)
                errors.Add(new($"{pointer}/pairs", "pairs is the number of assessed pairs behind the ratio, at least 1"));
            if (!(double.IsFinite(e.Ratio) && e.Ratio > 0))
                errors.Add(new($"{pointer}/ratio", "ratio must be a positive number (observed / predicted RMS radial error)"));
        }
    }

    private static void CheckFix(ScreeningFix? fix, string pointer, List<InputError> errors)
    {
        if (fix is null)
        {
            errors.Add(new(pointer, "a fix must be an object, not null"));
            return;
        }
        if (fix.Quality is not null && ScreeningQuality.Normalise(fix.Quality) is null)
            errors.Add(new($"{pointer}/quality", $"quality \"{fix.Quality}\" is not one of {string.Join(", ", ScreeningQuality.All)}"));
        if (fix.Satellites is < 0 or > 200)
            errors.Add(new($"{pointer}/satellites", "satellites is a count between 0 and 200"));
        foreach (var (name, value) in new[] { ("pdop", fix.Pdop), ("hdop", fix.Hdop), ("vdop", fix.Vdop) })
        {
            if (value is { } v && (!double.IsFinite(v) || v <= 0 || v > MaximumDop))
                errors.Add(new($"{pointer}/{name}", InvariantText.Format($"{name} {v} is not a dilution of precision in (0, {MaximumDop}]")));
        }
        foreach (var (name, value) in new[] { ("horizontalError", fix.HorizontalError), ("verticalError", fix.VerticalError), ("correctionAge", fix.CorrectionAge) })
        {
            if (value is { } v && (!double.IsFinite(v) || v < 0))
                errors.Add(new($"{pointer}/{name}", InvariantText.Format($"{name} {v} must be a non-negative number")));
        }
        if (fix.ElevationMask is { } mask && (!double.IsFinite(mask) || mask < 0 || mask >= 90))
            errors.Add(new($"{pointer}/elevationMask", InvariantText.Format($"elevation mask {mask} is not an angle in [0, 90) degrees")));
    }

    private static void CheckThresholds(ScreeningThresholds? t, List<InputError> errors)
    {
        if (t is null)
            return;
        foreach (var (name, list) in new[] { ("rejectQualities", t.RejectQualities), ("flagQualities", t.FlagQualities) })
        {
            for (var i = 0; i < (list?.Count ?? 0); i++)
            {
                if (ScreeningQuality.Normalise(list![i]) is null)
                    errors.Add(new(InvariantText.Format($"/thresholds/{name}/{i}"), $"\"{list[i]}\" is not one of {string.Join(", ", ScreeningQuality.All)}"));
            }
        }
        if (t.MinimumSatellites is < ScreeningProfiles.SatellitesForThreeDimensionalFix)
            errors.Add(new("/thresholds/minimumSatellites", "a 3-D fix needs at least 4 satellites; the minimum cannot be lower"));
        var numbers = new[]
        {
            ("maximumPdop", t.MaximumPdop), ("maximumHdop", t.MaximumHdop), ("maximumVdop", t.MaximumVdop),
            ("flagHorizontalError", t.FlagHorizontalError), ("rejectHorizontalError", t.RejectHorizontalError),
            ("flagVerticalError", t.FlagVerticalError), ("rejectVerticalError", t.RejectVerticalError),
            ("maximumCorrectionAge", t.MaximumCorrectionAge), ("rejectCorrectionAge", t.RejectCorrectionAge),
            ("minimumElevationMask", t.MinimumElevationMask), ("uere95", t.Uere95),
        };
        foreach (var (name, value) in numbers)
        {
            if (value is { } v && (!double.IsFinite(v) || v < 0))
                errors.Add(new($"/thresholds/{name}", InvariantText.Format($"{name} {v} must be a non-negative number")));
        }
    }
}
