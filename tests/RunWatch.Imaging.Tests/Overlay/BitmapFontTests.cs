using RunWatch.Imaging.Overlay;
using Xunit;

namespace RunWatch.Imaging.Tests.Overlay;

public sealed class BitmapFontTests
{
    private static string Bitmap(char c) =>
        string.Concat(Enumerable.Range(0, BitmapFont.GlyphHeight * BitmapFont.GlyphWidth)
            .Select(i => BitmapFont.Ink(c, i % BitmapFont.GlyphWidth, i / BitmapFont.GlyphWidth) ? '#' : '.'));

    [Theory]
    [InlineData('m', 'M')]
    [InlineData('n', 'N')]
    [InlineData('p', 'P')]
    [InlineData('x', 'X')]
    public void Ink_UnitLetters_LowerCaseDrawnAsLowerCase(char lower, char upper)
    {
        // SI unit symbols are case-sensitive (BIPM, SI Brochure: "µm" micrometre; "µM" is read as micromolar) - COMMON PRACTICE.
        Assert.NotEqual(Bitmap(upper), Bitmap(lower));
        // A lower-case glyph leaves the top two rows empty (x-height below the capitals).
        Assert.DoesNotContain('#', Bitmap(lower)[..(2 * BitmapFont.GlyphWidth)]);
    }

    [Fact]
    public void Ink_OtherLowerCase_DrawnAsUpperCase()
    {
        Assert.Equal(Bitmap('A'), Bitmap('a'));
    }
}
