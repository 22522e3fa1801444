using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using Microsoft.Extensions.Options;
using QaService.Api.Problems;
using QaService.Core.Assessment;
using QaService.Core.Reporting;

namespace QaService.Api.Assessments;

/// <summary>
/// Reads a JSON request body into <typeparamref name="T"/>, turning every way it can fail into a 4xx
/// problem: wrong media type (415), too large (413), not JSON or wrong shape (400 with a pointer).
/// </summary>
internal sealed partial class JsonBodyReader<T>(IOptions<LimitsOptions> limits) where T : class
{
    /// <summary>Reads and deserialises the body; a large one as it streams in (a large assessment body is never held whole).</summary>
    public Task<(T? Value, IResult? Problem)> ReadAsync(HttpRequest request, CancellationToken cancellationToken) =>
        ReadAsync(request, locateFailure: null, cancellationToken);

    /// <summary>
    /// Reads the whole body first, then deserialises it in one synchronous pass: for bodies read into columns by a
    /// converter of a whole array (the transform's points), which the streaming path would first buffer anyway, and
    /// where a truncated array is then reported at the element it broke off at.
    /// </summary>
    /// <param name="locateFailure">Given the body, the pointer suffix of where a syntax error lies when the serializer
    /// gives only the enclosing member (e.g. <c>/1</c> for the second point of an array read by one converter).</param>
    /// <param name="quickRead">Optional shortcut tried first on the whole body (e.g. parsing parts side by side): the
    /// value the serializer would give, or null to leave the body to the serializer (which also reports every error).</param>
    public Task<(T? Value, IResult? Problem)> ReadWholeAsync(HttpRequest request, Func<ReadOnlyMemory<byte>, string?> locateFailure,
        CancellationToken cancellationToken, Func<ReadOnlyMemory<byte>, T?>? quickRead = null) =>
        ReadAsync(request, locateFailure, cancellationToken, quickRead);

    /// <summary>Largest body with a Content-Length that is read whole before deserialising (larger ones stream).</summary>
    private const long WholeBodyMaximumBytes = 256 * 1024;

    private async Task<(T? Value, IResult? Problem)> ReadAsync(HttpRequest request, Func<ReadOnlyMemory<byte>, string?>? locateFailure, CancellationToken cancellationToken,
        Func<ReadOnlyMemory<byte>, T?>? quickRead = null)
    {
        if (!request.HasJsonContentType())
        {
            var given = string.IsNullOrEmpty(request.ContentType) ? "no Content-Type" : $"Content-Type \"{request.ContentType}\"";
            var hint = request.HasFormContentType
                ? "send field files as multipart/form-data (parts options, marks, fixes), or the request as application/json"
                : "send the request as application/json";
            return (null, InputProblems.Status(StatusCodes.Status415UnsupportedMediaType, "Unsupported media type", $"{given}: {hint}"));
        }
        if (request.ContentLength > limits.Value.MaxBodyBytes)
            return (null, TooLarge());

        WholeBody? body = null;
        try
        {
            T? value;
            // A small body with a known length is read whole and deserialised in one synchronous pass: the resumable
            // streaming reader's state and buffers cost more than the body itself (a 24-point assessment is ~5 kB).
            if (locateFailure is not null || request.ContentLength <= WholeBodyMaximumBytes)
            {
                body = await WholeBody.ReadAsync(request.BodyReader, request.ContentLength, limits.Value.MaxBodyBytes, cancellationToken);
                if (body is null)
                    return (null, TooLarge());
                value = quickRead?.Invoke(body.Memory) ?? JsonSerializer.Deserialize<T>(body.Span, ReportJson.Read);
            }
            else
                value = await JsonSerializer.DeserializeAsync<T>(request.Body, ReportJson.Read, cancellationToken);
            return value is null
                ? (null, InputProblems.Invalid([new InputError("", "the body must be a JSON object, not null")]))
                : (value, null);
        }
        catch (JsonException exception)
        {
            var located = body is not null && locateFailure is not null && MemberSuffix(exception).Length == 0 ? locateFailure(body.Memory) : null;
            return (null, InputProblems.Invalid([new InputError(ToPointer(exception.Path) + (located ?? MemberSuffix(exception)), Describe(exception))]));
        }
        catch (BadHttpRequestException exception) when (exception.StatusCode == StatusCodes.Status413PayloadTooLarge)
        {
            return (null, TooLarge());
        }
        finally
        {
            body?.Dispose();
        }
    }

    private IResult TooLarge() => InputProblems.Status(StatusCodes.Status413PayloadTooLarge, "Request body too large",
        string.Create(CultureInfo.InvariantCulture, $"the body is larger than the limit of {limits.Value.MaxBodyBytes} bytes (Limits:MaxBodyBytes)"));

    /// <summary>The field a hand-written converter names (the serializer's path stops at the object it converts).</summary>
    private static string MemberSuffix(JsonException exception) =>
        (exception.Data[Core.Transform.TransformPointListJsonConverter.IndexKey] is int index ? string.Create(CultureInfo.InvariantCulture, $"/{index}") : "") +
        (exception.Data[Core.Transform.TransformPointJsonConverter.MemberKey] is string member ? "/" + member.Replace("~", "~0").Replace("/", "~1") : "");

    /// <summary>Messages without .NET type names: say what is wrong in JSON terms and where.</summary>
    private static string Describe(JsonException exception)
    {
        var where = exception.LineNumber is { } line
            ? string.Create(CultureInfo.InvariantCulture, $" (line {line + 1}, byte {exception.BytePositionInLine + 1})")
            : "";
        var unmapped = UnmappedProperty().Match(exception.Message);
        if (unmapped.Success)
            return $"\"{unmapped.Groups["name"].Value}\" is not a field here{where}; field names are camelCase as in the API contract";
        if (exception.Message.Contains("Duplicate", StringComparison.OrdinalIgnoreCase))
            return $"a field appears twice in the same object{where}";
        if (exception.Message.Contains("could not be converted", StringComparison.Ordinal))
            return $"the value has the wrong type{where}: coordinates and accuracies are JSON numbers, ids and CRSs strings, times ISO 8601 strings";
        return $"the body is not valid JSON{where}";
    }

    /// <summary>Turns System.Text.Json's path (<c>$.fixes.points[3].lat</c>) into an RFC 6901 pointer (<c>/fixes/points/3/lat</c>).</summary>
    internal static string ToPointer(string? path)
    {
        if (string.IsNullOrEmpty(path) || path == "$")
            return "";
        var pointer = new StringBuilder();
        foreach (Match segment in PathSegment().Matches(path))
        {
            var name = segment.Groups["name"].Success ? segment.Groups["name"].Value
                : segment.Groups["quoted"].Success ? segment.Groups["quoted"].Value
                : segment.Groups["index"].Value;
            pointer.Append('/').Append(name.Replace("~", "~0").Replace("/", "~1"));
        }
        return pointer.ToString();
    }

    [GeneratedRegex(@"\.(?<name>[^.\[]+)|\['(?<quoted>(?:[^']|'')*)'\]|\[(?<index>\d+)\]")]
    private static partial Regex PathSegment();

    [GeneratedRegex(@"JSON property '(?<name>.*?)' could not be mapped")]
    private static partial Regex UnmappedProperty();
}
