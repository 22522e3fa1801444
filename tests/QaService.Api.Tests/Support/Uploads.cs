using System.Net.Http.Headers;
using System.Text;

namespace QaService.Api.Tests.Support;

/// <summary>Builds multipart/form-data assessment uploads (api-v1 "The same request as files").</summary>
public static class Uploads
{
    /// <summary>A neutral file name: the service must recognise the format from content.</summary>
    public const string NeutralName = "upload.dat";

    public static MultipartFormDataContent Form(string? options, byte[] marks, byte[] fixes)
    {
        var form = new MultipartFormDataContent();
        if (options is not null)
            form.Add(new StringContent(options, Encoding.UTF8, "application/json"), "options");
        form.Add(File(marks), "marks", NeutralName);
        form.Add(File(fixes), "fixes", NeutralName);
        return form;
    }

    public static MultipartFormDataContent Form(string? options, string marks, string fixes) =>
        Form(options, Encoding.UTF8.GetBytes(marks), Encoding.UTF8.GetBytes(fixes));

    public static ByteArrayContent File(byte[] bytes)
    {
        var content = new ByteArrayContent(bytes);
        content.Headers.ContentType = new MediaTypeHeaderValue("application/octet-stream");
        return content;
    }

    public static byte[] FieldFile(string name) => System.IO.File.ReadAllBytes(ReferenceData.PathOf(Path.Combine("field-files", name)));

    public static Task<HttpResponseMessage> PostFormAsync(this HttpClient client, HttpContent form) =>
        client.PostAsync("/v1/assessments", form);
}
