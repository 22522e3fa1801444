using System.Text;
using System.Text.Json;
using QaService.Core.Reporting;

namespace QaService.Core.Tests.Reporting;

/// <summary>Which accepted name a JSON property is: exactly, case-sensitively, as System.Text.Json compares names (RFC 8259 §7 escapes included).</summary>
public sealed class FieldNameTableTests
{
    private static readonly string[] Names = ["lat", "lon", "h", "receiver", "featureClass", "sigmaH", "longerThan8"];
    private static readonly FieldNameTable Table = new(Names);

    [Theory]
    [InlineData("lat", 0)]
    [InlineData("lon", 1)]
    [InlineData("h", 2)]
    [InlineData("receiver", 3)]          // exactly 8 bytes: packed
    [InlineData("featureClass", 4)]      // longer: compared as bytes
    [InlineData("sigmaH", 5)]
    [InlineData("longerThan8", 6)]
    [InlineData("la", -1)]               // a prefix is not the name
    [InlineData("lath", -1)]
    [InlineData("Lat", -1)]              // case-sensitive
    [InlineData("featureclass", -1)]
    [InlineData("receivers", -1)]
    [InlineData("", -1)]
    [InlineData("\\u006cat", 0)]         // escaped: unescaped by the reader
    [InlineData("featureCl\\u0061ss", 4)]
    [InlineData("\\u0068", 2)]
    [InlineData("lat\\u0000", -1)]       // an escaped NUL is not padding
    public void Finds_the_name_the_reader_is_at(string jsonName, int expected)
    {
        var reader = new Utf8JsonReader(Encoding.UTF8.GetBytes("{\"" + jsonName + "\": 1}"));
        reader.Read();
        reader.Read();
        Assert.Equal(expected, Table.IndexOf(ref reader));
    }
}
