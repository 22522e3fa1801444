using System.Net.Sockets;
using System.Text;
using System.Text.Json;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>Limits:RequestTimeoutSeconds: a request still running after the limit is cancelled and answered 503 with a problem body.</summary>
public sealed class TimeoutTests
{
    /// <summary>
    /// On real Kestrel (the in-memory test server reads the whole body before the handler runs): the
    /// client sends the headers and one byte of a two-byte body, then waits.
    /// </summary>
    [Fact]
    public async Task A_body_that_stalls_past_the_timeout_gets_503_problem()
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { ["Limits:RequestTimeoutSeconds"] = "1" });
        factory.UseKestrel(0);
        factory.StartServer();
        var address = factory.ClientOptions.BaseAddress;

        using var socket = new TcpClient();
        await socket.ConnectAsync(address.Host, address.Port);
        var stream = socket.GetStream();
        await stream.WriteAsync(Encoding.ASCII.GetBytes("POST /v1/assessments HTTP/1.1\r\nHost: localhost\r\nContent-Type: application/json\r\nContent-Length: 2\r\n\r\n{"));
        using var reader = new StreamReader(stream, Encoding.UTF8);
        using var deadline = new CancellationTokenSource(TimeSpan.FromSeconds(20));
        var answer = new StringBuilder();
        while (!answer.ToString().Contains("Limits:RequestTimeoutSeconds") && await reader.ReadLineAsync(deadline.Token) is { } line)
            answer.AppendLine(line);

        var text = answer.ToString();
        Assert.StartsWith("HTTP/1.1 503", text);
        Assert.Contains("Content-Type: application/problem+json", text);
        var json = text[text.IndexOf('{')..(text.LastIndexOf('}') + 1)];
        Assert.Equal(503, JsonDocument.Parse(json).RootElement.GetProperty("status").GetInt32());
    }
}
