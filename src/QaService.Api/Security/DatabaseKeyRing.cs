using System.Xml.Linq;
using Microsoft.AspNetCore.DataProtection;
using Microsoft.AspNetCore.DataProtection.KeyManagement;
using Microsoft.AspNetCore.DataProtection.Repositories;
using QaService.Api.Storage;

namespace QaService.Api.Security;

/// <summary>
/// ASP.NET Core Data Protection keys (which encrypt the session cookie and the antiforgery tokens) kept in the service's
/// database, so every instance on one database reads the others' cookies: a browser signed in through one instance
/// stays signed in behind a load balancer. Like the share-link key they are as secret as the database itself
/// (no XML encryptor: whoever can read the database can read the reports anyway).
/// </summary>
internal sealed class DatabaseKeyRing(IShareLinkStore store) : IXmlRepository
{
    private const string Prefix = "data-protection-key:";

    public static void Register(IServiceCollection services)
    {
        services.AddDataProtection().SetApplicationName("QaService");
        services.AddOptions<KeyManagementOptions>().Configure<IShareLinkStore>((options, store) => options.XmlRepository = new DatabaseKeyRing(store));
    }

    // Data Protection asks synchronously, once per key-ring refresh (at first use, then about daily): a blocking call is acceptable here.
    public IReadOnlyCollection<XElement> GetAllElements() =>
        store.ListSecretsAsync(Prefix, CancellationToken.None).GetAwaiter().GetResult().Select(XElement.Parse).ToList();

    public void StoreElement(XElement element, string friendlyName) =>
        store.GetOrAddSecretAsync(Prefix + friendlyName, element.ToString(SaveOptions.DisableFormatting), CancellationToken.None).GetAwaiter().GetResult();
}
