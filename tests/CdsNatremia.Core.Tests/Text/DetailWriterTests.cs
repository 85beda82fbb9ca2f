using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Tests.Text;

/// <summary>The report writer's shape, and its reused buffer: each text is its own, a finished writer stays finished.</summary>
public class DetailWriterTests
{
    [Fact]
    public void ToString_SectionsWithHeadingsBulletsAndSteps_OneLineBreakAtTheEnd()
    {
        var text = new DetailWriter()
            .Paragraph("Opening.")
            .Bullets("Findings", ["first", "second"])
            .Numbered("Reasoning", new[] { 1, 2 }, (b, n) => b.Append("step ").Append(n))
            .Bullets("Empty", Array.Empty<string>())
            .ToString();

        Assert.Equal("Opening.\n\n**Findings**\n\n- first\n- second\n\n**Reasoning**\n\n1. step 1\n2. step 2\n", text);
    }

    [Fact]
    public void ToString_TwoWritersOneAfterTheOther_TheSecondHoldsNothingOfTheFirst()
    {
        var first = new DetailWriter(16 * 1024).Paragraph(new string('a', 5000)).ToString();
        var second = new DetailWriter(16 * 1024).Paragraph("b").ToString();

        Assert.Equal(5001, first.Length);
        Assert.Equal("b\n", second);
    }

    [Fact]
    public void ToString_Twice_SameTextAndWritingAfterwardsRefused()
    {
        var writer = new DetailWriter().Paragraph("Once.");

        var text = writer.ToString();

        Assert.Same(text, writer.ToString());
        Assert.Throws<InvalidOperationException>(() => writer.Paragraph("Again."));
    }
}
