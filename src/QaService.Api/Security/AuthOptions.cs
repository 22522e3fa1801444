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

    public bool KeysRequired => string.Equals(Mode, KeysMode, StringComparison.OrdinalIgnoreCase);

    public bool AdminEnabled => !string.IsNullOrEmpty(AdminToken);

    public IEnumerable<ValidationResult> Validate(ValidationContext validationContext)
    {
        if (AdminEnabled && AdminToken!.Length < MinimumAdminTokenLength)
            yield return new ValidationResult($"Auth:AdminToken must be at least {MinimumAdminTokenLength} characters (or empty to disable the admin paths)", [nameof(AdminToken)]);
    }
}
