using System.Security.Cryptography;
using System.Text;
using Microsoft.AspNetCore.WebUtilities;

namespace QaService.Api.Upload;

/// <summary>
/// Tokens naming a staged upload: 256 random bits (RandomNumberGenerator), base64url, 43 characters. Only their
/// SHA-256 is stored, so reading the table does not hand out working links.
/// </summary>
internal static class StagingTokens
{
    private const int TokenBytes = 32;

    public static (string Token, string Hash) New()
    {
        var token = WebEncoders.Base64UrlEncode(RandomNumberGenerator.GetBytes(TokenBytes));
        return (token, Hash(token));
    }

    public static string Hash(string token) => Convert.ToHexStringLower(SHA256.HashData(Encoding.ASCII.GetBytes(token)));

    /// <summary>True when the text has a token's shape (checked before any lookup).</summary>
    public static bool IsPlausible(string? token) =>
        token is { Length: 43 } && token.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_');
}
