using System.Globalization;
using System.Text.Json;
using Microsoft.AspNetCore.WebUtilities;
using Microsoft.Extensions.Options;
using Microsoft.Net.Http.Headers;
using QaService.Api.Problems;
using QaService.Core.Assessment;
using QaService.Core.Ingest;
using QaService.Core.Reporting;

namespace QaService.Api.Assessments;

/// <summary>
/// Reads a <c>multipart/form-data</c> assessment (api-v1 "The same request as files"): parts
/// <c>options</c> (JSON), <c>marks</c> and <c>fixes</c> (files in any order). File parts are copied to
/// temporary files as they stream in (never held in memory), then read by the Core readers. Every way
/// it can fail is a 4xx problem with a pointer naming the part.
/// </summary>
internal sealed class MultipartUploadReader(IOptions<LimitsOptions> limits)
{
    public const string OptionsPart = "options", MarksPart = "marks", FixesPart = "fixes";

    /// <summary>Largest options part, bytes: it holds no points.</summary>
    private const int MaximumOptionsBytes = 1_048_576;

    private const int CopyBufferBytes = 81_920;

    public static bool IsMultipart(HttpRequest request) =>
        request.ContentType is { } type && type.StartsWith("multipart/form-data", StringComparison.OrdinalIgnoreCase);

    public async Task<(UploadOptions? Options, PartReading? Marks, PartReading? Fixes, IResult? Problem)> ReadAsync(HttpRequest request, CancellationToken cancellationToken)
    {
        if (!MediaTypeHeaderValue.TryParse(request.ContentType, out var mediaType)
            || HeaderUtilities.RemoveQuotes(mediaType.Boundary).Value is not { Length: > 0 and <= 200 } boundary)
            return Fail(new InputError("", "multipart/form-data needs a boundary parameter in Content-Type"));

        var files = new Dictionary<string, FileStream>(StringComparer.Ordinal);
        try
        {
            UploadOptions? options = null;
            var reader = new MultipartReader(boundary, request.Body) { BodyLengthLimit = limits.Value.MaxBodyBytes };
            while (await reader.ReadNextSectionAsync(cancellationToken) is { } section)
            {
                if (!ContentDispositionHeaderValue.TryParse(section.ContentDisposition, out var disposition)
                    || HeaderUtilities.RemoveQuotes(disposition.Name).Value is not { Length: > 0 } name)
                    return Fail(new InputError("", "every part needs Content-Disposition: form-data; name=\"options\", \"marks\" or \"fixes\""));
                if (name == OptionsPart)
                {
                    if (options is not null)
                        return Fail(new InputError($"/{OptionsPart}", "the options part appears twice"));
                    var (parsed, error) = await ReadOptionsAsync(section.Body, cancellationToken);
                    if (error is not null)
                        return Fail(error);
                    options = parsed;
                }
                else if (name is MarksPart or FixesPart)
                {
                    if (files.ContainsKey(name))
                        return Fail(new InputError($"/{name}", $"the {name} part appears twice: send one file per side"));
                    files[name] = await SpoolAsync(section.Body, cancellationToken);
                }
                else
                    return Fail(new InputError($"/{Shorten(name)}", "not a part of this request: the parts are \"options\", \"marks\" and \"fixes\""));
            }
            var missing = new[] { MarksPart, FixesPart }.Where(p => !files.ContainsKey(p))
                .Select(p => new InputError($"/{p}", $"the {p} part is required: a file (CSV, GeoJSON, GPX or NMEA 0183)")).ToList();
            if (missing.Count > 0)
                return (null, null, null, InputProblems.Invalid(missing));
            options ??= new UploadOptions();

            var (marks, marksError) = await FieldPartReader.ReadAsync(MarksPart, files[MarksPart], options.Marks, cancellationToken);
            var (fixes, fixesError) = await FieldPartReader.ReadAsync(FixesPart, files[FixesPart], options.Fixes, cancellationToken);
            var errors = new[] { marksError, fixesError }.OfType<InputError>().ToList();
            return errors.Count > 0 ? (null, null, null, InputProblems.Invalid(errors)) : (options, marks, fixes, null);
        }
        catch (BadHttpRequestException exception) when (exception.StatusCode == StatusCodes.Status413PayloadTooLarge)
        {
            return (null, null, null, InputProblems.Status(StatusCodes.Status413PayloadTooLarge, "Request body too large",
                string.Create(CultureInfo.InvariantCulture, $"the body is larger than the limit of {limits.Value.MaxBodyBytes} bytes (Limits:MaxBodyBytes)")));
        }
        catch (InvalidDataException exception)
        {
            return Fail(new InputError("", $"the multipart body cannot be read: {exception.Message}"));
        }
        catch (IOException exception) when (exception is not FileNotFoundException)
        {
            return Fail(new InputError("", "the multipart body ended before its closing boundary (truncated upload?)"));
        }
        finally
        {
            foreach (var file in files.Values)
                await file.DisposeAsync();
        }
    }

    private static (UploadOptions?, PartReading?, PartReading?, IResult?) Fail(InputError error) => (null, null, null, InputProblems.Invalid([error]));

    private static async Task<(UploadOptions? Options, InputError? Error)> ReadOptionsAsync(Stream body, CancellationToken cancellationToken)
    {
        using var buffer = new MemoryStream();
        var chunk = new byte[CopyBufferBytes];
        int read;
        while ((read = await body.ReadAsync(chunk, cancellationToken)) > 0)
        {
            if (buffer.Length + read > MaximumOptionsBytes)
                return (null, new InputError($"/{OptionsPart}", $"the options part is larger than {MaximumOptionsBytes} bytes: points belong in the marks and fixes files"));
            buffer.Write(chunk, 0, read);
        }
        try
        {
            var options = JsonSerializer.Deserialize<UploadOptions>(buffer.ToArray(), ReportJson.Read);
            return options is null ? (null, new InputError($"/{OptionsPart}", "options must be a JSON object, not null")) : (options, null);
        }
        catch (JsonException exception)
        {
            var pointer = $"/{OptionsPart}{JsonBodyReader<UploadOptions>.ToPointer(exception.Path)}";
            var where = exception.LineNumber is { } line ? string.Create(CultureInfo.InvariantCulture, $" (line {line + 1})") : "";
            var message = exception.Message.Contains("could not be mapped", StringComparison.Ordinal)
                ? $"not a field of the options{where}: the options are the JSON request without \"points\", plus columns, lengthUnit, decimalSeparator, delimiter and rowErrors"
                : $"the options part is not valid JSON of the expected shape{where}";
            return (null, new InputError(pointer, message));
        }
    }

    /// <summary>Copies a part to a temporary file that deletes itself when closed.</summary>
    private static async Task<FileStream> SpoolAsync(Stream body, CancellationToken cancellationToken)
    {
        var path = Path.Combine(Path.GetTempPath(), $"qaservice-upload-{Guid.NewGuid():N}.tmp");
        var file = new FileStream(path, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None, CopyBufferBytes, FileOptions.DeleteOnClose | FileOptions.Asynchronous);
        try
        {
            await body.CopyToAsync(file, CopyBufferBytes, cancellationToken);
            file.Position = 0;
            return file;
        }
        catch
        {
            await file.DisposeAsync();
            throw;
        }
    }

    private static string Shorten(string name) => name.Length <= 40 ? name : name[..40];
}
