using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Knowledge;

public class CodeSetNameMatchingTests
{
    [Fact]
    public void MatchName_NameAtTheEndOfAVeryLongText_StillFound()
    {
        // A long free-text order must not make name matching give up and read as "no match" (a missed drug).
        var text = string.Concat(Enumerable.Repeat("take with food; ", 50_000)) + "citalopram 10 mg";
        Assert.Equal("citalopram", SomeDrugs.Ssri.MatchName(text));
    }

    [Theory]
    [InlineData("sodium citalopram-tablet", "citalopram")] // punctuation is a word boundary
    [InlineData("citalopram\n10 mg", "citalopram")]
    [InlineData("citalopramide", null)] // a longer word is not the name
    [InlineData("2citalopram", null)]   // a digit touching the name is not a boundary
    public void MatchName_WordBoundaries(string text, string? expected)
        => Assert.Equal(expected, SomeDrugs.Ssri.MatchName(text));
}
