using QaService.Core.Ingest;

namespace QaService.Core.Tests.Ingest;

/// <summary>
/// Point ids kept as characters in shared chunks (<see cref="IdTexts"/>): every id reads back as the text it was given,
/// across chunk boundaries, with texts long enough for a chunk of their own in between, and a slice (a trimmed id)
/// reads as that part of the text. The expected values are the inputs themselves.
/// </summary>
public sealed class IdTextsTests
{
    [Fact]
    public void Every_id_reads_back_across_chunks_and_own_chunk_texts()
    {
        var given = new List<string?>();
        var random = new Random(20261205);
        for (var i = 0; i < 40_000; i++)
        {
            // Mostly short ids (several 32,768-character chunks fill up), some empty, some longer than a shared chunk takes.
            var kind = random.Next(100);
            given.Add(kind switch
            {
                0 => null,
                1 => new string((char)('a' + (i % 26)), 4_097 + random.Next(30_000)),
                _ => $"F-{i:D6}-{new string('x', random.Next(12))}",
            });
        }
        var ids = new IdTexts();
        foreach (var id in given)
            ids.Add(id);

        Assert.Equal(given.Count, ids.Count);
        for (var i = 0; i < given.Count; i++)
        {
            Assert.Equal(given[i], ids.StringOf(i));
            Assert.Equal(given[i] ?? "", ids.TextOf(i).ToString());
            Assert.Equal(given[i] ?? "", ids.Characters.Memory(ids.LocationOf(i)).ToString());
        }
    }

    [Fact]
    public void A_text_over_the_length_field_is_kept_whole()
    {
        // 2^23 characters: one more than the location's length field holds.
        var huge = new string('Q', 1 << 23);
        var ids = new IdTexts();
        ids.Add("A");
        ids.Add(huge);
        ids.Add("B");
        Assert.Equal(huge, ids.StringOf(1));
        Assert.Equal("A", ids.StringOf(0));
        Assert.Equal("B", ids.StringOf(2));
    }

    [Fact]
    public void A_slice_is_that_part_of_the_text_and_stays_inside_it()
    {
        var ids = new IdTexts();
        ids.Add("first");
        ids.Add("  F 0001  ");
        var location = ids.LocationOf(1);
        Assert.Equal("F 0001", ids.Text(IdTexts.Slice(location, 2, 6)).ToString());
        Assert.Equal("  F 0001  ", ids.Text(IdTexts.Slice(location, 0, 10)).ToString());
        Assert.Throws<ArgumentOutOfRangeException>(() => IdTexts.Slice(location, 5, 6));
        Assert.Throws<ArgumentOutOfRangeException>(() => IdTexts.Slice(IdTexts.None, 0, 0));
    }

    [Fact]
    public void An_empty_id_is_not_given()
    {
        var ids = new IdTexts();
        ids.Add("");
        Assert.Equal(IdTexts.None, ids.LocationOf(0));
        Assert.Null(ids.StringOf(0));
        Assert.True(ids.TextOf(0).IsEmpty);
    }
}
