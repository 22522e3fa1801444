namespace QaService.Api.Storage;

/// <summary>Text searched for literally inside a LIKE pattern: <c>%</c>, <c>_</c> and the escape character itself are escaped.</summary>
internal static class LikePattern
{
    /// <summary>The escape character named in <c>ESCAPE '\'</c> (SQLite) and PostgreSQL's default one.</summary>
    public const char Escape = '\\';

    /// <summary><c>%text%</c> with the wildcards of <paramref name="text"/> escaped: matches rows that contain it.</summary>
    public static string Containing(string text) =>
        "%" + text.Replace(@"\", @"\\", StringComparison.Ordinal).Replace("%", @"\%", StringComparison.Ordinal).Replace("_", @"\_", StringComparison.Ordinal) + "%";
}
