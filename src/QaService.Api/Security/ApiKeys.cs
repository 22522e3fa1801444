using System.Buffers.Text;
using System.Security.Cryptography;
using System.Text;

namespace QaService.Api.Security;

/// <summary>
/// Tenant API keys: 256 random bits from the OS CSPRNG, shown once, stored only as their SHA-256
/// (FIPS 180-4). A key with 256 bits of entropy needs no salt or slow hash: there is no dictionary to
/// try (common practice for random API tokens, unlike passwords).
/// </summary>
internal static class ApiKeys
{
    /// <summary>Random bytes in a key: 32 bytes = 256 bits.</summary>
    private const int RandomBytes = 32;

    /// <summary>Prefix that makes a leaked key recognisable to secret scanners (common practice).</summary>
    private const string Prefix = "qak_";

    /// <summary>Longest Authorization value looked at; longer ones cannot be a key or the admin token.</summary>
    public const int MaximumPresentedLength = 512;

    public static string NewKey() => Prefix + Base64Url.EncodeToString(RandomNumberGenerator.GetBytes(RandomBytes));

    /// <summary>SHA-256 of the key's UTF-8 bytes, lower-case hex (64 characters): what the store keeps.</summary>
    public static string Hash(string key) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(key)));

    /// <summary>Compares two secrets in time independent of where they differ (hashes first, so lengths match too).</summary>
    public static bool SecretEquals(string presented, string expected) =>
        CryptographicOperations.FixedTimeEquals(
            SHA256.HashData(Encoding.UTF8.GetBytes(presented)),
            SHA256.HashData(Encoding.UTF8.GetBytes(expected)));

    /// <summary>Compares a stored hash with the hash of a presented key in constant time.</summary>
    public static bool HashEquals(string presentedHash, string storedHash) =>
        CryptographicOperations.FixedTimeEquals(Encoding.ASCII.GetBytes(presentedHash), Encoding.ASCII.GetBytes(storedHash));

    /// <summary>Longest Authorization value looked at when JWTs are accepted (a signed token with its claims, common practice).</summary>
    public const int MaximumJwtLength = 8192;

    /// <summary>The tenant whose key this is, or null; the lookup is by hash, then compared again in constant time.</summary>
    public static async Task<Storage.StoredTenant?> FindTenantAsync(Storage.ITenantStore tenants, string key, CancellationToken cancellationToken)
    {
        var hash = Hash(key);
        var tenant = await tenants.FindByKeyHashAsync(hash, cancellationToken);
        return tenant is not null && HashEquals(hash, tenant.KeyHash) ? tenant : null;
    }

    /// <summary>True for a compact JWS (RFC 7515 §7.1: three base64url parts joined by dots); API keys hold no dot.</summary>
    public static bool LooksLikeJwt(string token) => token.Count(c => c == '.') == 2;

    /// <summary>The bearer token of an Authorization header, or null when there is none.</summary>
    public static string? BearerToken(HttpRequest request, int maximumLength = MaximumPresentedLength)
    {
        var header = request.Headers.Authorization.ToString();
        const string scheme = "Bearer ";
        if (header.Length <= scheme.Length || header.Length > maximumLength
            || !header.StartsWith(scheme, StringComparison.OrdinalIgnoreCase))
            return null;
        var token = header[scheme.Length..].Trim();
        return token.Length == 0 ? null : token;
    }
}
