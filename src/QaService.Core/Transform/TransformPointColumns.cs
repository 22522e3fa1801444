namespace QaService.Core.Transform;

/// <summary>
/// The points of a transform request as columns (struct of arrays): one array per field, made only once some point gives
/// that field, NaN where a point leaves it out (JSON has no NaN, so it cannot be a given value). A 200,000-point body is
/// read straight into these (<see cref="TransformPointListJsonConverter"/>) and handed to the batch without a point
/// object each; a <see cref="TransformPoint"/> is made only when one is asked for by index.
/// </summary>
public sealed class TransformPointColumns : IReadOnlyList<TransformPoint?>
{
    private readonly double[]?[] fields = new double[]?[TransformPointJsonConverter.FieldCount];
    private bool[]? isNull;
    private int count;
    private int capacity;

    public int Count => count;

    /// <summary>Adds the next point: the fields given (<paramref name="present"/>) with their values.</summary>
    internal void Add(ReadOnlySpan<double> values, ReadOnlySpan<bool> present)
    {
        Grow();
        for (var field = 0; field < fields.Length; field++)
        {
            if (present[field])
                (fields[field] ??= NewColumn())[count] = values[field];
            else if (fields[field] is { } column)
                column[count] = double.NaN;
        }
        count++;
    }

    /// <summary>Adds a JSON <c>null</c> in place of a point (the runner reports it at its index).</summary>
    internal void AddNull()
    {
        Grow();
        (isNull ??= new bool[capacity])[count] = true;
        foreach (var column in fields)
        {
            if (column is not null)
                column[count] = double.NaN;
        }
        count++;
    }

    /// <summary>True when point <paramref name="index"/> was <c>null</c>.</summary>
    public bool IsNull(int index) => isNull is { } n && n[index];

    /// <summary>Field <paramref name="field"/> (TransformPoint order: lat, lon, e, n, x, y, z, h) of point <paramref name="index"/>; null when not given.</summary>
    public double? Field(int field, int index) => fields[field] is { } column && !double.IsNaN(column[index]) ? column[index] : null;

    public TransformPoint? this[int index] => IsNull(index)
        ? null
        : new TransformPoint(Field(0, index), Field(1, index), Field(2, index), Field(3, index), Field(4, index), Field(5, index), Field(6, index), Field(7, index));

    public IEnumerator<TransformPoint?> GetEnumerator()
    {
        for (var i = 0; i < count; i++)
            yield return this[i];
    }

    System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => GetEnumerator();

    /// <summary>
    /// The points of <paramref name="parts"/> one after the other: the same columns as adding them all to one instance
    /// (a field's column exists once any point gives it, NaN where a point leaves it out; nulls kept).
    /// </summary>
    internal static TransformPointColumns Concatenate(IReadOnlyList<TransformPointColumns> parts)
    {
        var whole = new TransformPointColumns();
        whole.count = whole.capacity = parts.Sum(p => p.count);
        for (var field = 0; field < whole.fields.Length; field++)
        {
            if (!parts.Any(p => p.fields[field] is not null))
                continue;
            var column = whole.fields[field] = new double[whole.capacity];
            var at = 0;
            foreach (var part in parts)
            {
                if (part.fields[field] is { } source)
                    source.AsSpan(0, part.count).CopyTo(column.AsSpan(at));
                else
                    column.AsSpan(at, part.count).Fill(double.NaN);
                at += part.count;
            }
        }
        if (parts.Any(p => p.isNull is not null))
        {
            whole.isNull = new bool[whole.capacity];
            var at = 0;
            foreach (var part in parts)
            {
                part.isNull?.AsSpan(0, part.count).CopyTo(whole.isNull.AsSpan(at));
                at += part.count;
            }
        }
        return whole;
    }

    /// <summary>A new column for a field first given at point <see cref="count"/>: the points before it did not give it.</summary>
    private double[] NewColumn()
    {
        var column = new double[capacity];
        Array.Fill(column, double.NaN, 0, count);
        return column;
    }

    private void Grow()
    {
        if (count < capacity)
            return;
        capacity = Math.Max(1_024, capacity * 2);
        for (var field = 0; field < fields.Length; field++)
        {
            if (fields[field] is { } column)
                Array.Resize(ref fields[field], capacity);
        }
        if (isNull is not null)
            Array.Resize(ref isNull, capacity);
    }
}
