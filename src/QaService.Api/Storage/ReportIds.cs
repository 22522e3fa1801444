using System.Buffers.Text;
using System.Security.Cryptography;

namespace QaService.Api.Storage;

/// <summary>Unguessable report ids: 128 random bits from the OS CSPRNG, base64url (22 characters).</summary>
internal static class ReportIds
{
    private const int RandomBytes = 16;

    public static string New() => Base64Url.EncodeToString(RandomNumberGenerator.GetBytes(RandomBytes));

    /// <summary>Ids are short and URL-safe; anything else cannot exist, so it is not looked up.</summary>
    public static bool IsPlausible(string id) =>
        id.Length is > 0 and <= 64 && id.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_');
}
