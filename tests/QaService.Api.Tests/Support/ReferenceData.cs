namespace QaService.Api.Tests.Support;

/// <summary>Finds files under tests/reference-data by walking up to the repository root (QaService.sln).</summary>
public static class ReferenceData
{
    public static string PathOf(string fileName)
    {
        for (var folder = new DirectoryInfo(AppContext.BaseDirectory); folder is not null; folder = folder.Parent)
        {
            if (File.Exists(Path.Combine(folder.FullName, "QaService.sln")))
                return Path.Combine(folder.FullName, "tests", "reference-data", fileName);
        }
        throw new FileNotFoundException($"QaService.sln not found above {AppContext.BaseDirectory}");
    }
}
