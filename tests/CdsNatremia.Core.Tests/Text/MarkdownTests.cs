using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Tests.Text;

public class MarkdownTests
{
    [Theory]
    [InlineData("[click](http://evil)", "\\[click\\](http://evil)")]
    [InlineData("<script>", "\\<script\\>")]
    [InlineData("a*b_c", "a\\*b\\_c")]
    [InlineData("line1\nline2", "line1 line2")]
    [InlineData("na-3.1", "na-3.1")]
    public void Escape_NeutralisesMarkdownAndHtml(string input, string expected)
        => Assert.Equal(expected, Markdown.Escape(input));
}
