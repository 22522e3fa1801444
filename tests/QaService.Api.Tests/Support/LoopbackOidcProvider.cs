using System.Buffers.Text;
using System.Net;
using System.Net.Sockets;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;

namespace QaService.Api.Tests.Support;

/// <summary>
/// A minimal OpenID Connect provider on 127.0.0.1 for tests: the discovery document (OpenID Connect Discovery 1.0 §4)
/// and a JWKS with one RSA key (RFC 7517 §4, RFC 7518 §6.3.1). Tokens are built by hand as compact JWS (RFC 7515 §7.1)
/// signed RS256 (RFC 7518 §3.3), so the service's JwtBearer handler is checked against the RFCs, not against itself.
/// </summary>
public sealed class LoopbackOidcProvider : IDisposable
{
    private const string KeyId = "test-key-1";
    private readonly HttpListener listener = new();
    private readonly RSA signingKey = RSA.Create(2048);
    private readonly CancellationTokenSource stop = new();

    public LoopbackOidcProvider()
    {
        int port;
        using (var probe = new TcpListener(IPAddress.Loopback, 0))
        {
            probe.Start();
            port = ((IPEndPoint)probe.LocalEndpoint).Port;
        }
        Issuer = $"http://127.0.0.1:{port}";
        listener.Prefixes.Add(Issuer + "/");
        listener.Start();
        _ = ServeAsync();
    }

    public string Issuer { get; }

    /// <summary>Times the JWKS was fetched: proves the Authority path was used.</summary>
    public int JwksRequests { get; private set; }

    /// <summary>A token for <paramref name="audience"/> with <paramref name="claims"/>, valid from now − 1 min to now + <paramref name="lifetime"/>.</summary>
    public string Token(string audience, IDictionary<string, object> claims, TimeSpan? lifetime = null, RSA? signWith = null, string? issuer = null)
    {
        var now = DateTimeOffset.UtcNow;
        var payload = new Dictionary<string, object>(claims)
        {
            ["iss"] = issuer ?? Issuer,
            ["aud"] = audience,
            ["sub"] = "person-" + Guid.NewGuid().ToString("N")[..8],
            ["iat"] = now.AddMinutes(-1).ToUnixTimeSeconds(),
            ["nbf"] = now.AddMinutes(-1).ToUnixTimeSeconds(),
            ["exp"] = now.Add(lifetime ?? TimeSpan.FromMinutes(10)).ToUnixTimeSeconds(),
        };
        string header = Part(new Dictionary<string, object> { ["alg"] = "RS256", ["typ"] = "JWT", ["kid"] = KeyId });
        string body = Part(payload);
        var signature = (signWith ?? signingKey).SignData(Encoding.ASCII.GetBytes($"{header}.{body}"), HashAlgorithmName.SHA256, RSASignaturePadding.Pkcs1);
        return $"{header}.{body}.{Base64Url.EncodeToString(signature)}";
    }

    private static string Part(object value) => Base64Url.EncodeToString(JsonSerializer.SerializeToUtf8Bytes(value));

    private async Task ServeAsync()
    {
        while (!stop.IsCancellationRequested)
        {
            HttpListenerContext context;
            try
            {
                context = await listener.GetContextAsync();
            }
            catch (Exception) when (stop.IsCancellationRequested)
            {
                return;
            }
            catch (HttpListenerException)
            {
                return;
            }
            object? document = context.Request.Url!.AbsolutePath switch
            {
                "/.well-known/openid-configuration" => new Dictionary<string, object>
                {
                    ["issuer"] = Issuer,
                    ["jwks_uri"] = Issuer + "/jwks",
                    ["id_token_signing_alg_values_supported"] = new[] { "RS256" },
                },
                "/jwks" => Jwks(),
                _ => null,
            };
            context.Response.StatusCode = document is null ? 404 : 200;
            context.Response.ContentType = "application/json";
            if (document is not null)
                await context.Response.OutputStream.WriteAsync(JsonSerializer.SerializeToUtf8Bytes(document));
            context.Response.Close();
        }
    }

    private object Jwks()
    {
        JwksRequests++;
        var parameters = signingKey.ExportParameters(includePrivateParameters: false);
        return new Dictionary<string, object>
        {
            ["keys"] = new[]
            {
                new Dictionary<string, string>
                {
                    ["kty"] = "RSA", ["use"] = "sig", ["alg"] = "RS256", ["kid"] = KeyId,
                    ["n"] = Base64Url.EncodeToString(parameters.Modulus!), ["e"] = Base64Url.EncodeToString(parameters.Exponent!),
                },
            },
        };
    }

    public void Dispose()
    {
        stop.Cancel();
        listener.Close();
        signingKey.Dispose();
    }
}
