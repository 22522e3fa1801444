using System.Text;
using QaService.Core.Ingest;

namespace QaService.Core.Tests.Ingest;

internal static class ReaderTestSupport
{
    public static Stream Utf8(string text) => new MemoryStream(Encoding.UTF8.GetBytes(text));

    public static List<FieldRow> Rows(this IEnumerable<FieldRow> rows) => rows.ToList();
}
