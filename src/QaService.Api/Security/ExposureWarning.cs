using System.Net;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.Extensions.Options;

namespace QaService.Api.Security;

/// <summary>
/// With <c>Auth:Mode</c> = <c>none</c> the service is meant for one machine: the shipped settings
/// listen on loopback (http://localhost:5080). When it is told to listen elsewhere anyway, say so loudly.
/// </summary>
internal sealed class ExposureWarning(IServer server, IHostApplicationLifetime lifetime, IOptions<AuthOptions> auth, ILogger<ExposureWarning> logger) : IHostedService
{
    public Task StartAsync(CancellationToken cancellationToken)
    {
        lifetime.ApplicationStarted.Register(() =>
        {
            if (auth.Value.KeysRequired)
                return;
            var addresses = server.Features.Get<IServerAddressesFeature>()?.Addresses ?? [];
            foreach (var address in addresses.Where(a => !IsLoopback(a)))
                ExposureLog.OpenWithoutKeys(logger, address);
        });
        return Task.CompletedTask;
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    internal static bool IsLoopback(string address)
    {
        if (!Uri.TryCreate(address.Replace("://+", "://0.0.0.0", StringComparison.Ordinal).Replace("://*", "://0.0.0.0", StringComparison.Ordinal), UriKind.Absolute, out var uri))
            return false;
        return uri.IsLoopback || (IPAddress.TryParse(uri.Host.Trim('[', ']'), out var ip) && IPAddress.IsLoopback(ip));
    }
}

internal static partial class ExposureLog
{
    [LoggerMessage(EventId = 1301, EventName = "OpenWithoutKeys", Level = LogLevel.Warning,
        Message = "Auth:Mode is none but the service listens on {Address}: anyone who reaches it can read and create reports; set Auth:Mode=keys")]
    public static partial void OpenWithoutKeys(ILogger logger, string address);
}
