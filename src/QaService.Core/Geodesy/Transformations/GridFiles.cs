using System.Collections.Concurrent;

namespace QaService.Core.Geodesy.Transformations;

/// <summary>
/// PROJ's grid files, read from one folder at run time (configuration <c>Geodesy:GridDirectory</c>; Debian's
/// proj-data puts them in /usr/share/proj) and kept once read. Names are matched case-insensitively, because EPSG
/// and Debian spell some differently (EPSG "CHENyx06a.gsb", Debian "CHENYX06a.gsb").
/// </summary>
public static class GridFiles
{
    /// <summary>Debian's PROJ data folder, the default.</summary>
    public const string DefaultDirectory = "/usr/share/proj";

    private static readonly ConcurrentDictionary<string, Lazy<NtV2Grid>> Cache = new(StringComparer.OrdinalIgnoreCase);
    private static string _directory = DefaultDirectory;

    /// <summary>The folder grids are read from; set once at start-up.</summary>
    public static string Directory
    {
        get => _directory;
        set
        {
            _directory = value;
            Cache.Clear();
        }
    }

    /// <summary>The full path of a grid file in <see cref="Directory"/>, or null when it is not there.</summary>
    public static string? Find(string fileName)
    {
        var exact = Path.Combine(_directory, fileName);
        if (File.Exists(exact))
            return exact;
        if (!System.IO.Directory.Exists(_directory))
            return null;
        return System.IO.Directory.EnumerateFiles(_directory)
            .FirstOrDefault(f => string.Equals(Path.GetFileName(f), fileName, StringComparison.OrdinalIgnoreCase));
    }

    /// <summary>The grid, read on first use; throws <see cref="FileNotFoundException"/> when absent (planners check <see cref="Find"/> first).</summary>
    public static NtV2Grid Load(string fileName) => Cache.GetOrAdd(fileName, name => new Lazy<NtV2Grid>(() =>
    {
        var path = Find(name) ?? throw new FileNotFoundException($"grid file {name} is not in {_directory}", name);
        using var stream = File.OpenRead(path);
        return NtV2Grid.Read(stream, Path.GetFileName(path));
    })).Value;
}
