using QaService.Core.Standards;

namespace QaService.Core.Tests.Standards;

/// <summary>
/// Typed accuracies to metres. Definitions: international foot = 0.3048 m exactly (1959 international yard and pound
/// agreement; NIST SP 811 appendix B), US survey foot = 1200/3937 m exactly (NIST, Federal Register 24 FR 5348, 1959).
/// Expected values: the exact rational product rounded once to a double, computed with Python 3.11's
/// <c>fractions.Fraction</c> (<c>float(Fraction(v) * Fraction(1200, 3937))</c>; float() of a Fraction is correctly rounded).
/// </summary>
public sealed class LengthEntryTests
{
    [Theory]
    [InlineData("0.5", LengthEntry.Foot, 0.1524)]
    [InlineData("1.2", LengthEntry.Foot, 0.36576)]
    [InlineData("1", LengthEntry.UsSurveyFoot, 0.3048006096012192)]
    [InlineData("0.1", LengthEntry.UsSurveyFoot, 0.03048006096012192)]
    [InlineData("0.3", LengthEntry.UsSurveyFoot, 0.09144018288036576)]
    [InlineData("10", LengthEntry.UsSurveyFoot, 3.048006096012192)]
    [InlineData("3937", LengthEntry.UsSurveyFoot, 1200.0)]
    [InlineData("2.5", LengthEntry.Centimetre, 0.025)]
    [InlineData("10", LengthEntry.Centimetre, 0.1)]
    [InlineData("0,25", LengthEntry.Metre, 0.25)]
    [InlineData(" 1e-1 ", LengthEntry.Metre, 0.1)]
    public void Converts_by_the_exact_definitions_rounding_once(string typed, string unit, double metres)
    {
        var (value, problem) = LengthEntry.ToMetres(typed, unit);
        Assert.Null(problem);
        Assert.Equal(metres, value); // bit for bit: the one rounding of the exact value
    }

    [Fact]
    public void A_survey_foot_is_not_an_international_foot()
    {
        // The two feet differ by 2 parts per million: 1 m per 500 km (NIST/NOAA, the reason the survey foot was retired).
        var (survey, _) = LengthEntry.ToMetres("500000", LengthEntry.UsSurveyFoot);
        var (international, _) = LengthEntry.ToMetres("500000", LengthEntry.Foot);
        Assert.Equal(1200.0 * 500000 / 3937 - 152400.0, survey!.Value - international!.Value, 1e-9);
    }

    [Theory]
    [InlineData("", LengthEntry.Metre, "enter a number")]
    [InlineData("ten", LengthEntry.Metre, "is not a number")]
    [InlineData("1,000.5", LengthEntry.Metre, "is not a number")]
    [InlineData("0", LengthEntry.Metre, "greater than zero")]
    [InlineData("-1", LengthEntry.Foot, "greater than zero")]
    [InlineData("1", "yd", "is not one of")]
    public void Rejects_what_is_not_a_positive_length(string typed, string unit, string message)
    {
        var (value, problem) = LengthEntry.ToMetres(typed, unit);
        Assert.Null(value);
        Assert.Contains(message, problem);
    }
}
