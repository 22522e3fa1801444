using System.ComponentModel.DataAnnotations;

namespace QaService.Api.Security;

/// <summary>Tenants and keys (configuration section <c>Auth</c>, api-v1 "Tenants and keys").</summary>
public sealed class AuthOptions : IValidatableObject
{
    public const string Section = "Auth";

    /// <summary>Mode without keys: one tenant, the service listens on loopback unless told otherwise.</summary>
    public const string NoneMode = "none";

    /// <summary>Mode with keys: every <c>/v1/*</c> call carries <c>Authorization: Bearer &lt;key&gt;</c>.</summary>
    public const string KeysMode = "keys";

    /// <summary>Shortest admin token accepted: 32 characters, so a guess is as hopeless as for a tenant key (common practice).</summary>
    public const int MinimumAdminTokenLength = 32;

    /// <summary><c>none</c> (default) or <c>keys</c>.</summary>
    [RegularExpression("^(?i:none|keys)$", ErrorMessage = "Auth:Mode must be \"none\" or \"keys\"")]
    public string Mode { get; set; } = NoneMode;

    /// <summary>Secret for <c>/v1/admin/*</c>; when empty the admin paths are disabled.</summary>
    public string? AdminToken { get; set; }

    /// <summary>Idle lifetime of a browser session after sign-in, hours; each request within its second half renews it (sliding).</summary>
    [Range(0.05, 720, ErrorMessage = "Auth:SessionHours must be between 0.05 and 720")]
    public double SessionHours { get; set; } = 8;

    /// <summary>Longest share link a tenant may create, hours (POST /v1/assessments/{id}/share-links).</summary>
    [Range(0.001, 8760, ErrorMessage = "Auth:ShareLinkMaxHours must be between 0.001 and 8760")]
    public double ShareLinkMaxHours { get; set; } = 720;

    /// <summary>
    /// HMAC key of share links, base64 (at least 32 bytes). When empty the service generates one and keeps it in the
    /// database, so every instance on that database signs alike.
    /// </summary>
    public string? ShareLinkKey { get; set; }

    /// <summary>Bearer tokens from an organisation's OpenID Connect provider (off while <c>Auth:Jwt:Authority</c> is empty).</summary>
    public JwtOptions Jwt { get; set; } = new();

    public bool KeysRequired => string.Equals(Mode, KeysMode, StringComparison.OrdinalIgnoreCase);

    public bool AdminEnabled => !string.IsNullOrEmpty(AdminToken);

    public IEnumerable<ValidationResult> Validate(ValidationContext validationContext)
    {
        if (AdminEnabled && AdminToken!.Length < MinimumAdminTokenLength)
            yield return new ValidationResult($"Auth:AdminToken must be at least {MinimumAdminTokenLength} characters (or empty to disable the admin paths)", [nameof(AdminToken)]);
        if (!string.IsNullOrEmpty(ShareLinkKey) && Sharing.ShareLinkSigning.DecodeKey(ShareLinkKey) is null)
            yield return new ValidationResult($"Auth:ShareLinkKey must be base64 of at least {Sharing.ShareLinkSigning.MinimumKeyBytes} bytes (or empty to keep a generated key in the database)", [nameof(ShareLinkKey)]);
        if (Jwt.Enabled && string.IsNullOrWhiteSpace(Jwt.Audience))
            yield return new ValidationResult("Auth:Jwt:Audience is required when Auth:Jwt:Authority is set (the API's identifier at the identity provider)", ["Jwt.Audience"]);
        if (Jwt.Enabled && string.IsNullOrWhiteSpace(Jwt.TenantClaim))
            yield return new ValidationResult("Auth:Jwt:TenantClaim must name the claim that holds the tenant's name", ["Jwt.TenantClaim"]);
        if (Jwt.Enabled && !Uri.TryCreate(Jwt.Authority, UriKind.Absolute, out _))
            yield return new ValidationResult("Auth:Jwt:Authority must be an absolute URL (the issuer, e.g. https://login.example.org/realms/qa)", ["Jwt.Authority"]);
    }
}

/// <summary>Configuration section <c>Auth:Jwt</c>.</summary>
public sealed class JwtOptions
{
    /// <summary>The issuer; its <c>/.well-known/openid-configuration</c> names the signing keys (OpenID Connect Discovery 1.0).</summary>
    public string? Authority { get; set; }

    /// <summary>The <c>aud</c> a token must carry (RFC 7519 §4.1.3).</summary>
    public string? Audience { get; set; }

    /// <summary>The claim whose value is the tenant's name as created by <c>POST /v1/admin/tenants</c>.</summary>
    public string TenantClaim { get; set; } = "qaservice_tenant";

    /// <summary>Refuse an http:// Authority (default). Only a loopback test provider sets this false.</summary>
    public bool RequireHttpsMetadata { get; set; } = true;

    public bool Enabled => !string.IsNullOrWhiteSpace(Authority);
}
