using System.Globalization;

namespace QaService.Core.Tests.Statistics;

/// <summary>
/// Rows of tests/reference-data/circular-radius-scipy.tsv, written by tests/reference-data/make-radius-reference.py
/// (scipy version in the file header). Found by walking up from the test binaries to QaService.sln, so the test
/// project needs no item for it.
/// </summary>
internal sealed record ScipyRadiusReference(
    string Label, double MeanSquareE, double MeanSquareN, double MeanProductEN,
    double SigmaMajor, double SigmaMinor, double Probability, double Radius)
{
    public const string RelativePath = "tests/reference-data/circular-radius-scipy.tsv";

    public static IReadOnlyList<ScipyRadiusReference> Load()
    {
        string path = Path.Combine(RepositoryRoot(), RelativePath);
        var rows = new List<ScipyRadiusReference>();
        string[]? header = null;
        foreach (string line in File.ReadLines(path))
        {
            if (line.StartsWith('#') || line.Length == 0)
            {
                continue;
            }

            string[] fields = line.Split('\t');
            if (header is null)
            {
                header = fields;
                continue;
            }

            double Get(string name) => double.Parse(fields[Array.IndexOf(header, name)], NumberStyles.Float, CultureInfo.InvariantCulture);
            rows.Add(new ScipyRadiusReference(
                fields[0], Get("meanSquareE"), Get("meanSquareN"), Get("meanProductEN"),
                Get("sigmaMajor"), Get("sigmaMinor"), Get("p"), Get("radius")));
        }

        return rows;
    }

    public static string ScipyVersionLine() =>
        File.ReadLines(Path.Combine(RepositoryRoot(), RelativePath)).First();

    internal static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "QaService.sln")))
            {
                return dir.FullName;
            }
        }

        throw new InvalidOperationException("QaService.sln not found above " + AppContext.BaseDirectory);
    }
}
