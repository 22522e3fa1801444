using System.Globalization;
using System.Text.RegularExpressions;
using QaService.Core.Reporting.Html;

namespace QaService.Core.Tests.Reporting;

/// <summary>
/// Text contrast of the house style, measured from the colours in <see cref="PageStyle.Css"/> rather than chosen by eye.
/// Source: WCAG 2.2, success criterion 1.4.3 Contrast (Minimum) — at least 4.5:1 for text, 3:1 for large text — and its
/// definitions of "contrast ratio" ((L1 + 0.05) / (L2 + 0.05)) and "relative luminance" (sRGB channels linearised:
/// c ≤ 0.04045 ? c/12.92 : ((c + 0.055)/1.055)^2.4; L = 0.2126 R + 0.7152 G + 0.0722 B). The browser tests run axe-core's
/// color-contrast rule on the rendered pages as well.
/// </summary>
public sealed partial class PageContrastTests
{
    /// <summary>Normal text needs 4.5:1 (SC 1.4.3).</summary>
    private const double TextMinimum = 4.5;

    /// <summary>Large text (≥ 18 pt, or ≥ 14 pt bold) needs 3:1 (SC 1.4.3).</summary>
    private const double LargeTextMinimum = 3.0;

    [Theory]
    // The end points of the scale: black on white is (1 + 0.05)/(0 + 0.05) = 21 by the definition itself.
    [InlineData("#000000", "#ffffff", 21.0, 1e-12)]
    [InlineData("#ffffff", "#ffffff", 1.0, 1e-12)]
    // #777777 on white ≈ 4.48:1, just under the 4.5 threshold (a much-quoted example; value from memory, checked by hand:
    // 119/255 → 0.18447 linear, 1.05/0.23447 = 4.478).
    [InlineData("#777777", "#ffffff", 4.478, 0.001)]
    public void The_formula_gives_the_definitions_values(string text, string background, double expected, double tolerance) =>
        Assert.Equal(expected, ContrastRatio(Hex(text), Hex(background)), tolerance);

    /// <summary>Every text/background pair the pages use: what (CSS rule), text colour, background, large text or not.</summary>
    public static TheoryData<string, string, string, bool> Pairs() => new()
    {
        { "body text", "--ink", "--paper", false },
        { "body text in inputs, figures and the error summary", "--ink", "#fff", false },
        { "muted text (.meta, .small, .hint, footer)", "--muted", "--paper", false },
        { "muted text on panels (.counts dt, .reading)", "--muted", "--panel", false },
        { "muted text in figures (figcaption, ticks)", "--muted", "#fff", false },
        { "links", "#1d4f73", "--paper", false },
        { "buttons, a.button and step numbers", "--paper", "--ink", false },
        { "secondary buttons and statements", "--ink", "--panel", false },
        { "pass tag and verdict", "--pass", "--pass-bg", false },
        { "fail tag, verdict and field errors", "--fail", "--fail-bg", false },
        { "open tag and verdict", "--open", "--open-bg", false },
        { "error summary heading and links", "--fail", "#fff", false },
        { "fail colour on paper (excluded-row marks, plots' legends)", "--fail", "--paper", false },
        { "verdict word (2rem, bold: large text)", "--open", "--open-bg", true },
    };

    [Theory]
    [MemberData(nameof(Pairs))]
    public void Each_text_colour_meets_WCAG_1_4_3_on_its_background(string where, string text, string background, bool large)
    {
        var ratio = ContrastRatio(Colour(text), Colour(background));
        var minimum = large ? LargeTextMinimum : TextMinimum;
        Assert.True(ratio >= minimum, FormattableString.Invariant($"{where}: {text} on {background} is {ratio:F2}:1, below {minimum}:1"));
    }

    /// <summary>WCAG 2.2 "contrast ratio": lighter luminance + 0.05 over darker + 0.05.</summary>
    internal static double ContrastRatio((int R, int G, int B) a, (int R, int G, int B) b)
    {
        double la = RelativeLuminance(a), lb = RelativeLuminance(b);
        return (Math.Max(la, lb) + 0.05) / (Math.Min(la, lb) + 0.05);
    }

    /// <summary>WCAG 2.2 "relative luminance" of an sRGB colour (0 black … 1 white).</summary>
    internal static double RelativeLuminance((int R, int G, int B) colour)
    {
        static double Linear(int channel)
        {
            var c = channel / 255.0;
            return c <= 0.04045 ? c / 12.92 : Math.Pow((c + 0.055) / 1.055, 2.4);
        }
        return 0.2126 * Linear(colour.R) + 0.7152 * Linear(colour.G) + 0.0722 * Linear(colour.B);
    }

    /// <summary>A colour as written in the tests: a custom property of the page style (<c>--ink</c>) or a hex literal.</summary>
    private static (int, int, int) Colour(string name)
    {
        if (!name.StartsWith("--", StringComparison.Ordinal))
            return Hex(name);
        var match = Regex.Match(PageStyle.Css, Regex.Escape(name) + @":(#[0-9a-fA-F]{3,6})[;}]");
        Assert.True(match.Success, $"{name} is not defined in PageStyle.Css");
        return Hex(match.Groups[1].Value);
    }

    private static (int, int, int) Hex(string text)
    {
        var hex = text.TrimStart('#');
        if (hex.Length == 3)
            hex = string.Concat(hex.Select(c => new string(c, 2)));
        int Channel(int i) => int.Parse(hex.AsSpan(i, 2), NumberStyles.HexNumber, CultureInfo.InvariantCulture);
        return (Channel(0), Channel(2), Channel(4));
    }
}
