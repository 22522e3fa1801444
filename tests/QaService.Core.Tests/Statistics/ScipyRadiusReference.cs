using System.Globalization;

namespace QaService.Core.Tests.Statistics;

/// <summary>
/// Rows of tests/reference-data/circular-radius-scipy.tsv, written by tests/reference-data/make-radius-reference.py
/// (scipy version in the file header). Read from the test output's reference-data folder (the csproj copies tests/reference-data/*.tsv there).
/// </summary>
internal sealed record ScipyRadiusReference(
    string Label, double MeanSquareE, double MeanSquareN, double MeanProductEN,
    double SigmaMajor, double SigmaMinor, double Probability, double Radius)
{
    public const string FileName = "circular-radius-scipy.tsv";

    public static IReadOnlyList<ScipyRadiusReference> Load()
    {
        string path = ReferenceFiles.PathOf(FileName);
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
        File.ReadLines(ReferenceFiles.PathOf(FileName)).First();

}
