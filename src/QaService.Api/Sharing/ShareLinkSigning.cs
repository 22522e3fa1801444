using System.Buffers.Text;
using System.Security.Cryptography;
using System.Text;
using Microsoft.Extensions.Options;
using QaService.Api.Security;
using QaService.Api.Storage;

namespace QaService.Api.Sharing;

/// <summary>
/// Share-link tokens: <c>{random}.{mac}</c>, where <c>random</c> is 128 bits from the OS CSPRNG and <c>mac</c> is
/// HMAC-SHA256 (RFC 2104, FIPS 198-1) of it under a key every instance shares. A forged or altered token fails the
/// MAC before the database is asked; the database keeps only SHA-256 of the whole token, so reading it gives no link.
/// The key comes from <c>Auth:ShareLinkKey</c>, or is generated once and kept in the database (first instance wins).
/// </summary>
internal sealed class ShareLinkSigning(IOptions<AuthOptions> options, IShareLinkStore store)
{
    public const int MinimumKeyBytes = 32;
    private const int RandomBytes = 16;
    private const string SecretName = "share-link-hmac-key";

    private readonly SemaphoreSlim gate = new(1, 1);
    private byte[]? key;

    /// <summary>The key from its base64 text, or null when it is not base64 of at least <see cref="MinimumKeyBytes"/> bytes.</summary>
    public static byte[]? DecodeKey(string text)
    {
        try
        {
            var bytes = Convert.FromBase64String(text.Trim());
            return bytes.Length >= MinimumKeyBytes ? bytes : null;
        }
        catch (FormatException)
        {
            return null;
        }
    }

    public async Task<string> NewTokenAsync(CancellationToken cancellationToken)
    {
        var random = Base64Url.EncodeToString(RandomNumberGenerator.GetBytes(RandomBytes));
        return $"{random}.{Mac(await KeyAsync(cancellationToken), random)}";
    }

    /// <summary>True when the token has the right shape and its MAC matches (compared in constant time).</summary>
    public async Task<bool> IsAuthenticAsync(string token, CancellationToken cancellationToken)
    {
        var dot = token.IndexOf('.', StringComparison.Ordinal);
        if (dot <= 0 || token.Length > 128)
            return false;
        var expected = Mac(await KeyAsync(cancellationToken), token[..dot]);
        return CryptographicOperations.FixedTimeEquals(Encoding.ASCII.GetBytes(expected), Encoding.ASCII.GetBytes(token[(dot + 1)..]));
    }

    /// <summary>What the store keeps of a token: SHA-256, lower-case hex.</summary>
    public static string Hash(string token) => ApiKeys.Hash(token);

    private static string Mac(byte[] key, string random) => Base64Url.EncodeToString(HMACSHA256.HashData(key, Encoding.ASCII.GetBytes(random)));

    private async Task<byte[]> KeyAsync(CancellationToken cancellationToken)
    {
        if (key is { } known)
            return known;
        await gate.WaitAsync(cancellationToken);
        try
        {
            if (key is null)
            {
                var configured = options.Value.ShareLinkKey;
                var text = string.IsNullOrEmpty(configured)
                    ? await store.GetOrAddSecretAsync(SecretName, Convert.ToBase64String(RandomNumberGenerator.GetBytes(MinimumKeyBytes)), cancellationToken)
                    : configured;
                key = DecodeKey(text) ?? throw new InvalidOperationException("the stored share-link key is not valid base64 of 32 bytes or more");
            }
            return key;
        }
        finally
        {
            gate.Release();
        }
    }
}
