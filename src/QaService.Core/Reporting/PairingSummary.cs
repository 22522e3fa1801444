namespace QaService.Core.Reporting;

/// <summary>What pairing found beyond the residuals: ambiguous proximity pairings and repeat occupations.</summary>
/// <param name="Occupations"><c>each</c> (every fix tested) or <c>mean</c> (each mark's occupations averaged into one test point).</param>
/// <param name="Ambiguous">Fixes paired by proximity that lie within the radius of more than one mark (the nearest won).</param>
/// <param name="RepeatOccupations">Marks occupied more than once: precision (scatter about the mark's own mean), apart from accuracy.</param>
public sealed record PairingSummary(string Occupations, IReadOnlyList<AmbiguousPairing> Ambiguous, IReadOnlyList<OccupationPrecision> RepeatOccupations);

/// <summary>A fix within the pairing radius of several marks.</summary>
/// <param name="Fix">Fix id.</param>
/// <param name="Mark">The nearest mark, which it was paired with.</param>
/// <param name="AlsoWithin">The other marks within the radius.</param>
public sealed record AmbiguousPairing(string Fix, string Mark, IReadOnlyList<string> AlsoWithin);

/// <summary>
/// Precision of one mark's repeat occupations: the scatter of its fixes about their own mean (sample
/// standard deviations, divisor n − 1), reported apart from accuracy, which is measured against the mark.
/// The mean offset (<c>meanE</c>…) is the part of the error that repeating does not remove. Metres.
/// </summary>
/// <param name="Mark">Mark id.</param>
/// <param name="N">Occupations counted (excluded fixes left out).</param>
/// <param name="MeanE">Mean dE of the occupations, metres.</param>
/// <param name="MeanN">Mean dN, metres.</param>
/// <param name="MeanU">Mean dU, metres; null without heights.</param>
/// <param name="SdE">Sample standard deviation of dE about its mean (n − 1), metres.</param>
/// <param name="SdN">Sample standard deviation of dN about its mean (n − 1), metres.</param>
/// <param name="SdU">Sample standard deviation of dU about its mean (n − 1), metres; null without heights.</param>
/// <param name="SdH">Horizontal scatter sqrt(sdE² + sdN²), metres.</param>
public sealed record OccupationPrecision(string Mark, int N, double MeanE, double MeanN, double? MeanU, double SdE, double SdN, double? SdU, double SdH);
