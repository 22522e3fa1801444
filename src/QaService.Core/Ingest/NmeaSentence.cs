using System.Globalization;

namespace QaService.Core.Ingest;

/// <summary>
/// One NMEA 0183 sentence: <c>$</c> (or <c>!</c>), a two-letter talker (GP GPS, GL GLONASS, GA Galileo,
/// GB/BD BeiDou, GI NavIC, GQ QZSS, GN multi-constellation), a three-letter formatter, comma-separated
/// fields and <c>*hh</c>, the XOR of every character between <c>$</c> and <c>*</c> in hexadecimal
/// (NMEA 0183 v4.10 §5.3.1; also described in the receivers' manuals, e.g. u-blox M8 protocol spec §31.2).
/// </summary>
public sealed record NmeaSentence(string Talker, string Formatter, string[] Fields)
{
    /// <summary>Parses and verifies one line; a problem names what is wrong.</summary>
    public static (NmeaSentence? Sentence, string? Problem) Parse(string line)
    {
        var text = line.Trim();
        if (text.Length < 6 || text[0] is not ('$' or '!'))
            return (null, "not an NMEA 0183 sentence (it must start with $ or !)");
        var star = text.LastIndexOf('*');
        if (star < 0)
            return (null, "the sentence has no *hh checksum");
        if (star + 3 != text.Length || !byte.TryParse(text.AsSpan(star + 1, 2), NumberStyles.AllowHexSpecifier, CultureInfo.InvariantCulture, out var stated))
            return (null, "the checksum after * must be two hexadecimal digits at the end of the sentence");
        byte computed = 0;
        foreach (var c in text.AsSpan(1, star - 1))
        {
            if (c > 0x7E)
                return (null, "the sentence holds a character outside printable ASCII");
            computed ^= (byte)c;
        }
        if (computed != stated)
            return (null, InvariantText.Format($"checksum mismatch: the sentence says {stated:X2}, its characters give {computed:X2}"));
        var fields = text[1..star].Split(',');
        var address = fields[0];
        if (address.Length == 5 && address[0] != 'P')
            return (new NmeaSentence(address[..2], address[2..], fields), null);
        return (new NmeaSentence(address.Length > 0 && address[0] == 'P' ? "P" : address, address, fields), null);
    }

    /// <summary>Field <paramref name="index"/> (the address is field 0), or empty when absent.</summary>
    public string this[int index] => index < Fields.Length ? Fields[index] : "";
}
