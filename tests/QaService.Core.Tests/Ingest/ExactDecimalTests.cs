using System.Globalization;
using QaService.Core.Ingest;

namespace QaService.Core.Tests.Ingest;

/// <summary>
/// The fast path for plain decimals must give the bits a correctly rounding parser gives. Reference: .NET's
/// <see cref="double.Parse(string, NumberStyles, IFormatProvider)"/>, correctly rounded (IEEE 754-2008 §5.12.2) since
/// .NET Core 3.0. Clinger 1990 §3 says when one division is exact enough; these cases sit on and past its limits.
/// </summary>
public sealed class ExactDecimalTests
{
    private const NumberStyles Styles = NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent;

    [Theory]
    [InlineData("50.012318496")]
    [InlineData("-0.25")]
    [InlineData("+3")]
    [InlineData(".5")]
    [InlineData("5.")]
    [InlineData("-0")]
    [InlineData("0.1")]
    [InlineData("9007199254740992")] // 2^53: still exact
    [InlineData("0.000000000000000001")] // 19 digits, the most taken
    [InlineData("5540000.000")]
    public void Plain_decimals_take_the_fast_path_with_the_framework_bits(string text)
    {
        Assert.True(ExactDecimal.TryRead(text, out var fast));
        Assert.Equal(BitConverter.DoubleToInt64Bits(double.Parse(text, Styles, CultureInfo.InvariantCulture)), BitConverter.DoubleToInt64Bits(fast));
    }

    [Theory]
    [InlineData("9007199254740993")] // 2^53 + 1 is not an exact double: division would round twice
    [InlineData("0.0000000000000000001")] // 20 digits
    [InlineData("12345678901234567890")] // 20 digits
    [InlineData("1e3")]
    [InlineData("1,5")]
    [InlineData(" 1")]
    [InlineData("")]
    [InlineData(".")]
    [InlineData("-")]
    [InlineData("1.2.3")]
    public void Anything_else_is_left_to_the_full_parser(string text) => Assert.False(ExactDecimal.TryRead(text, out _));

    [Fact]
    public void Seeded_random_decimals_match_the_framework_bit_for_bit()
    {
        var random = new Random(20260526);
        var checkedOnFastPath = 0;
        for (var i = 0; i < 20_000; i++)
        {
            var integer = random.Next(0, 1_000_000);
            var fraction = random.Next(0, 1_000_000_000).ToString(CultureInfo.InvariantCulture).PadLeft(random.Next(1, 10), '0');
            var text = (random.Next(2) == 0 ? "-" : "") + integer.ToString(CultureInfo.InvariantCulture) + "." + fraction;
            if (!ExactDecimal.TryRead(text, out var fast))
                continue;
            checkedOnFastPath++;
            Assert.Equal(BitConverter.DoubleToInt64Bits(double.Parse(text, Styles, CultureInfo.InvariantCulture)), BitConverter.DoubleToInt64Bits(fast));
            // The same text as UTF-8 bytes (a JSON number token): the same bits.
            Assert.True(ExactDecimal.TryRead(System.Text.Encoding.UTF8.GetBytes(text), out var fromBytes));
            Assert.Equal(BitConverter.DoubleToInt64Bits(fast), BitConverter.DoubleToInt64Bits(fromBytes));
        }
        Assert.True(checkedOnFastPath > 10_000, $"only {checkedOnFastPath} cases took the fast path");
    }
}
