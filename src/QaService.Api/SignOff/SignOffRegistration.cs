namespace QaService.Api.SignOff;

/// <summary>Services of the sign-off endpoints and the report page's decision form.</summary>
internal static class SignOffRegistration
{
    public static IServiceCollection AddSignOff(this IServiceCollection services)
    {
        // AddAntiforgery registers with TryAdd, so other features may call it too.
        services.AddAntiforgery();
        services.AddSingleton<DecisionRecording>();
        return services;
    }
}
