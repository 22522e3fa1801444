namespace QaService.Core.Tests;

/// <summary>
/// Where the reference files of tests/reference-data are found at test time: the csproj copies every
/// *.tsv there into the output's reference-data folder, so every test reads them one way.
/// </summary>
internal static class ReferenceFiles
{
    internal static string PathOf(string fileName) => Path.Combine(AppContext.BaseDirectory, "reference-data", fileName);
}
