using Microsoft.AspNetCore.Antiforgery;
using Microsoft.Extensions.Options;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.Reporting.Html;

namespace QaService.Api.SignOff;

/// <summary>The report page's sign-off data: kept beside the stored report, handed to the renderer, never written into the JSON.</summary>
internal static class SignOffPanels
{
    public static async Task<SignOffPanel> ForAsync(HttpContext context, string tenant, string reportId, string reportSha256, CancellationToken cancellationToken)
    {
        var services = context.RequestServices;
        var decisions = await services.GetRequiredService<IDecisionStore>().ListAsync(tenant, reportId, cancellationToken);
        // A browser posts the form with cookies, not a Bearer key: with API keys required only a signed-in session has a tenant there.
        DecisionFormFields? form = null;
        if (!services.GetRequiredService<IOptions<AuthOptions>>().Value.KeysRequired || context.User.Identity?.IsAuthenticated == true)
        {
            var tokens = services.GetRequiredService<IAntiforgery>().GetAndStoreTokens(context);
            form = new DecisionFormFields(DecisionForm.PathOf(reportId), tokens.FormFieldName, tokens.RequestToken!);
        }
        return new SignOffPanel(reportSha256, decisions, form);
    }
}
