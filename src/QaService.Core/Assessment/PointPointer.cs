using System.Globalization;

namespace QaService.Core.Assessment;

/// <summary>
/// The JSON pointer of one request point (<c>/fixes/points/17</c>), formatted only when an error needs it:
/// a valid point of a large upload then costs no pointer string.
/// </summary>
/// <param name="Set"><c>/marks</c> or <c>/fixes</c>.</param>
/// <param name="Index">0-based position of the point in its set.</param>
internal readonly record struct PointPointer(string Set, int Index)
{
    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Set}/points/{Index}");

    public static implicit operator string(PointPointer pointer) => pointer.ToString();
}
